import { formatNumber } from '../expr';
import type { CheckedRule, Node, Ref, StepStatement } from './ir';
import { isElementwise } from './ir';
import { isRuleKernel, RULE_KERNELS } from './kernels';
import type { StepPlan } from './plan';

/**
 * Code generation for update rules: one JavaScript function for the step and one for the initial
 * state, built once per rule text with `new Function`.
 *
 * No character of the rule text reaches the source. It is made only from the checked rule (ir.ts):
 * the point, gradient, state arrays, scratch arrays and settings are `x[i]`, `g[i]`, `s<k>[i]`,
 * `w<k>[i]`, `h<k>`; let values are `l<k>`, hoisted per-step numbers `k<j>`, reductions `r<j>`;
 * kernels are aliases `m_<name>` of the frozen table RULE_KERNELS; numbers are printed by the formula
 * language's `formatNumber` (finite, round-tripping). Every operation is fully parenthesised, so the
 * arithmetic runs in the order the rule is written, and `a^2` is `a * a` as in compiled formulas.
 * Sub-expressions that are the same for every parameter (`1 - beta1^t`) are computed once per step
 * before the loop: the same operations on the same numbers, so the same doubles.
 * `assertSafeRuleSource` checks the result against a token allowlist before anything is built.
 *
 * Shapes: `step(x, g, s, w, h, t, lr)` moves `x` in place and updates the state arrays `s`;
 * `init(x, s, h)` fills the state arrays from the start point.
 */

export interface RuleKernels {
  step(x: Float64Array, g: Float64Array, s: Float64Array[], w: Float64Array[], h: Float64Array, t: number, lr: number): void;
  init(x: Float64Array, s: Float64Array[], h: Float64Array): void;
}

class Emitter {
  readonly pre: string[] = [];
  private readonly hoisted = new Map<string, string>();

  /** `kernels` and `counters` are shared by the emitters of one source, so names never repeat. */
  constructor(
    private readonly localInArray: readonly boolean[],
    private readonly kernels: Set<string>,
    private readonly counters: { reductions: number; hoisted: number },
  ) {}

  ref(ref: Ref): string {
    switch (ref.kind) {
      case 'grad':
        return 'g[i]';
      case 'point':
        return 'x[i]';
      case 'state':
        return `s${ref.index}[i]`;
      case 'local':
        return this.localInArray[ref.index] ? `w${ref.index}[i]` : `l${ref.index}`;
      case 'hyper':
        return `h${ref.index}`;
      case 'step':
        return 't';
      case 'rate':
        return 'lr';
    }
  }

  kernel(name: string): string {
    if (!isRuleKernel(name)) throw new Error('rule codegen: unknown kernel');
    this.kernels.add(name);
    return `m_${name}`;
  }

  /** An expression for `node`, inside the per-parameter loop; per-step parts are hoisted before it. */
  element(node: Node): string {
    if (node.op !== 'num' && node.op !== 'ref' && node.op !== 'reduce' && !isElementwise(node)) return this.hoist(node);
    return this.expression(node, (n) => this.element(n));
  }

  private hoist(node: Node): string {
    const source = this.expression(node, (n) => this.expression(n, (m) => this.scalar(m)));
    const known = this.hoisted.get(source);
    if (known) return known;
    const name = `k${this.counters.hoisted++}`;
    this.hoisted.set(source, name);
    this.pre.push(`const ${name} = ${source};`);
    return name;
  }

  private scalar(node: Node): string {
    return this.expression(node, (n) => this.scalar(n));
  }

  private expression(node: Node, sub: (n: Node) => string): string {
    switch (node.op) {
      case 'num':
        return formatNumber(node.value);
      case 'ref':
        return this.ref(node.ref);
      case 'neg':
        return `(-${sub(node.a)})`;
      case 'bin':
        if (node.o === '^') {
          if (node.b.op === 'num' && node.b.value === 2) {
            const a = sub(node.a);
            return node.a.op === 'num' || node.a.op === 'ref' || /^[kr]\d+$/.test(a) ? `(${a} * ${a})` : `${this.kernel('pow')}(${a}, 2)`;
          }
          return `${this.kernel('pow')}(${sub(node.a)}, ${sub(node.b)})`;
        }
        return `(${sub(node.a)} ${node.o} ${sub(node.b)})`;
      case 'call': {
        const args = node.args.map(sub);
        if (node.fn === 'min' || node.fn === 'max') return args.slice(1).reduce((acc, a) => `${this.kernel(node.fn)}(${acc}, ${a})`, args[0]);
        return `${this.kernel(node.fn)}(${args.join(', ')})`;
      }
      case 'reduce':
        return this.reduction(node);
    }
  }

  /** Emits the loop computing a reduction (before the segment's loop) and returns its name. */
  private reduction(node: Node & { op: 'reduce' }): string {
    const r = `r${this.counters.reductions++}`;
    const args = node.args.map((a) => this.element(a));
    switch (node.fn) {
      case 'sum':
        this.pre.push(`let ${r} = 0;`, `for (let i = 0; i < n; i++) { ${r} += ${args[0]}; }`);
        return r;
      case 'dot':
        this.pre.push(`let ${r} = 0;`, `for (let i = 0; i < n; i++) { ${r} += ${args[0]} * ${args[1]}; }`);
        return r;
      case 'norm': {
        this.pre.push(`let ${r} = 0;`, `for (let i = 0; i < n; i++) { const k = ${args[0]}; ${r} += k * k; }`);
        const root = `r${this.counters.reductions++}`;
        this.pre.push(`const ${root} = ${this.kernel('sqrt')}(${r});`);
        return root;
      }
      case 'largest':
        this.pre.push(`let ${r} = -1 / 0;`, `for (let i = 0; i < n; i++) { ${r} = ${this.kernel('max')}(${r}, ${args[0]}); }`);
        return r;
    }
  }
}

function assignment(statement: StepStatement, localInArray: readonly boolean[], value: string): string {
  const t = statement.target;
  if (t.kind === 'point') return `x[i] = ${value};`;
  if (t.kind === 'state') return `s${t.index}[i] = ${value};`;
  return localInArray[t.index] ? `w${t.index}[i] = ${value};` : `const l${t.index} = ${value};`;
}

export function generateRuleSource(rule: CheckedRule, plan: StepPlan): string {
  const kernels = new Set<string>();
  const counters = { reductions: 0, hoisted: 0 };
  const head = [
    'const n = x.length;',
    ...rule.states.map((_, k) => `const s${k} = s[${k}];`),
    ...rule.hypers.map((_, k) => `const h${k} = h[${k}];`),
  ];
  const stepLines = [...head, ...plan.localInArray.flatMap((inArray, k) => (inArray ? [`const w${k} = w[${k}];`] : []))];
  for (const segment of plan.segments) {
    const e = new Emitter(plan.localInArray, kernels, counters);
    const body = segment.statements.map((s) => assignment(s, plan.localInArray, e.element(s.value)));
    stepLines.push(...e.pre, 'for (let i = 0; i < n; i++) {', ...body, '}');
  }
  const init = new Emitter(plan.localInArray, kernels, counters);
  const initBody = rule.states.map((s, k) => `s${k}[i] = ${init.element(s.init)};`);
  const initLines = [...head, ...init.pre, 'for (let i = 0; i < n; i++) {', ...initBody, '}'];
  const source = [
    '"use strict";',
    ...[...kernels].sort().map((k) => `const m_${k} = K.${k};`),
    'return {',
    'step: function (x, g, s, w, h, t, lr) {',
    ...stepLines,
    '},',
    'init: function (x, s, h) {',
    ...initLines,
    '},',
    '};',
  ].join('\n');
  assertSafeRuleSource(source);
  return source;
}

const TOKEN = /[ \n]+|"use strict"|[A-Za-z_][A-Za-z0-9_]*|\d+(?:\.\d+)?(?:e[+-]\d+)?|\+\+|\+=|[()[\]{};,=+\-*/<.:]/y;
const FIXED_WORDS = new Set(['const', 'let', 'for', 'return', 'function', 'step', 'init', 'K', 'n', 'i', 'k', 'x', 'g', 's', 'w', 'h', 't', 'lr']);
const NUMBERED = /^[swhklr]\d+$/;
const ARRAYS = /^(?:[xgswh]|[sw]\d+)$/;
const INDEX = /^(?:\d+|i)$/;

function isAllowedWord(word: string): boolean {
  return FIXED_WORDS.has(word) || NUMBERED.test(word) || (word.startsWith('m_') && isRuleKernel(word.slice(2)));
}

/**
 * Throws unless `source` is made only of allowed tokens: spaces and newlines, the one `"use strict"`
 * prologue, the fixed words above, numbered names `s3 w0 h1 k2 l0 r4`, kernel aliases `m_<kernel>`,
 * unsigned decimal numbers and the punctuation `( ) [ ] { } ; , : = + - * / < ++ += .`; `.` only in
 * `K.<kernel>` and `x.length`, `[` only in `<array>[<integer or i>]`. No string, no other name and no
 * other property access can pass.
 */
export function assertSafeRuleSource(source: string): void {
  const tokens: string[] = [];
  let at = 0;
  while (at < source.length) {
    TOKEN.lastIndex = at;
    const match = TOKEN.exec(source);
    if (!match) throw new Error(`rule codegen: disallowed character at offset ${at}`);
    at += match[0].length;
    if (!/^[ \n]+$/.test(match[0])) tokens.push(match[0]);
  }
  tokens.forEach((token, i) => {
    const fail = (why: string) => {
      throw new Error(`rule codegen: disallowed token '${token}' at token ${i}: ${why}`);
    };
    const before = tokens[i - 1] ?? '';
    const after = tokens[i + 1] ?? '';
    if (token === '"use strict"') {
      if (i !== 0) fail('the prologue may only open the source');
    } else if (/^[A-Za-z_]/.test(token)) {
      const property = before === '.';
      if (property ? !((tokens[i - 2] === 'K' && isRuleKernel(token)) || (tokens[i - 2] === 'x' && token === 'length')) : !isAllowedWord(token)) fail('not an allowed name');
    } else if (token === '.') {
      if (!((before === 'K' && isRuleKernel(after)) || (before === 'x' && after === 'length'))) fail("'.' only in K.<kernel> and x.length");
    } else if (token === '[') {
      if (!ARRAYS.test(before) || !INDEX.test(after) || tokens[i + 2] !== ']') fail("'[' only in <array>[<integer or i>]");
    }
  });
}

/** Builds the two functions of a generated source. */
export function buildRuleKernels(source: string): RuleKernels {
  assertSafeRuleSource(source);
  // The source is generated from the checked rule only and has passed the allowlist above.
  return new Function('K', source)(RULE_KERNELS) as RuleKernels;
}
