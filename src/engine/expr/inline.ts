import { body, operand } from './codegen';
import type { Graph, NodeId } from './graph';
import { isKernelName } from './primitives';

/**
 * A surface's value and gradient as straight-line statements for other generated code to inline (the
 * sweep's fused kernel, sweep/fused.ts), instead of a call through the surface per point.
 *
 * The same emission as the kernels (codegen.ts, the same graph and the same operations, so the same
 * doubles), with the variables read from locals `x0, x1, ...` that the host code sets, the named
 * constants from its array `c`, and the kernels through aliases `m_<kernel>` the host binds from
 * the kernel table. The safety guarantee carries over: the statements are made from the graph only,
 * and `assertSafeInline` checks every token before the code leaves this module.
 */
export interface InlineGradient {
  /** Kernel names the statements call as `m_<name>` (sorted, each a key of the kernel table). */
  readonly kernels: readonly string[];
  /** Statements `const t<id> = ...;` computing the value and every gradient entry. */
  readonly statements: readonly string[];
  /** The value: a temporary `t<id>` or a number literal. */
  readonly value: string;
  /** Gradient entry i: a temporary or a number literal. */
  readonly gradient: readonly string[];
}

const localRead = (i: number) => `x${i}`;

/** The value and gradient of `value` (gradient nodes `gradient`) as inlinable statements. */
export function inlineGradient(g: Graph, value: NodeId, gradient: readonly NodeId[]): InlineGradient {
  const kernels = new Set<string>();
  const statements = body(g, [value, ...gradient], kernels, localRead);
  const code: InlineGradient = {
    kernels: [...kernels].sort(),
    statements,
    value: operand(g, value),
    gradient: gradient.map((id) => operand(g, id)),
  };
  assertSafeInline(code);
  return code;
}

const TOKEN = /[ ]+|[A-Za-z_][A-Za-z0-9_]*|\d+(?:\.\d+)?(?:e[+-]\d+)?|<=|[()[\];,=+\-*/?:<]/y;
const INTEGER = /^\d+$/;

function isAllowedWord(word: string): boolean {
  return word === 'const' || word === 'c' || /^[tx]\d+$/.test(word) || (word.startsWith('m_') && isKernelName(word.slice(2)));
}

/**
 * Throws unless every statement and operand is made only of: spaces, `const`, temporaries `t<digits>`,
 * variable locals `x<digits>`, kernel aliases `m_<kernel>`, `c[<integer>]`, unsigned decimal numbers
 * and the punctuation `( ) [ ] ; , = + - * / ? : < <=`; and every kernel name is one of the table's. No
 * string, no property access, no other name can pass.
 */
export function assertSafeInline(code: InlineGradient): void {
  for (const k of code.kernels) if (!isKernelName(k)) throw new Error(`inline: '${k}' is not a kernel`);
  for (const text of [...code.statements, code.value, ...code.gradient]) {
    const tokens: string[] = [];
    let at = 0;
    while (at < text.length) {
      TOKEN.lastIndex = at;
      const match = TOKEN.exec(text);
      if (!match) throw new Error(`inline: disallowed character at offset ${at} of '${text}'`);
      at += match[0].length;
      if (match[0].trim() !== '') tokens.push(match[0]);
    }
    tokens.forEach((token, i) => {
      if (/^[A-Za-z_]/.test(token) && !isAllowedWord(token)) throw new Error(`inline: disallowed name '${token}'`);
      if (token === '[' && !(tokens[i - 1] === 'c' && INTEGER.test(tokens[i + 1] ?? '') && tokens[i + 2] === ']')) throw new Error("inline: '[' only in c[<integer>]");
    });
  }
}
