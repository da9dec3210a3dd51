import type { Graph, GraphNode, NodeId } from './graph';
import { KERNEL_TABLE, isKernelName } from './primitives';

/**
 * Code generation: straight-line JavaScript for the value, gradient and Hessian of an expression graph,
 * built into functions with `new Function`.
 *
 * The safety guarantee: no character of the user's text reaches the generated source. The source is
 * made only from the graph, whose nodes hold numbers, array indices and kernel names from our own
 * table; variables, inputs and constants are emitted as indexed reads (`x[0]`, `v[1]`, `c[2]`), kernels
 * as local aliases `m_<name>` of entries of the kernel table `K`, numbers by `formatNumber` (finite
 * only, round-tripping), temporaries as `t<id>`. Before anything is built, `assertSafeSource` checks the
 * whole source against a token allowlist and throws if anything else appears, so even a bug upstream
 * cannot turn into arbitrary code.
 *
 * Shapes: a surface's functions take the point `x` (then `g` for the gradient, `h` for the Hessian); a
 * model's take the parameters `x` and the data row `v`. The named constants `c` are bound once per
 * instantiation (a Float64Array), so new constant values reuse the compiled code.
 */

export type CodeShape = 'surface' | 'model';

export interface CodeOutputs {
  readonly value: NodeId;
  readonly gradient: readonly NodeId[];
  /** Upper triangle of the Hessian, row-major (see Differentiator.hessianUpper). */
  readonly hessianUpper: readonly NodeId[];
}

type Reader = ArrayLike<number>;

/** The three functions of a surface-shaped program. */
export interface SurfaceKernels {
  value(x: Reader): number;
  valueGradient(x: Reader, g: Float64Array): number;
  valueGradientHessian(x: Reader, g: Float64Array, h: Float64Array): number;
}

/** The three functions of a model-shaped program. */
export interface ModelKernels {
  value(x: Reader, v: Reader): number;
  valueGradient(x: Reader, v: Reader, g: Float64Array): number;
  valueGradientHessian(x: Reader, v: Reader, g: Float64Array, h: Float64Array): number;
}

const PLAIN_NUMBER = /^\d+(?:\.\d+)?(?:e[+-]\d+)?$/;

/**
 * A JavaScript literal for a finite number that reads back as the same double: String() gives the
 * shortest round-tripping decimal; negatives and -0 are parenthesised, `(-2.5)`, `(-0)`.
 */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`codegen: refusing to emit the non-finite number ${value}`);
  const negative = value < 0 || Object.is(value, -0);
  const digits = String(negative ? -value : value);
  if (!PLAIN_NUMBER.test(digits)) throw new RangeError(`codegen: unexpected number format '${digits}'`);
  return negative ? `(-${digits})` : digits;
}

export function operand(g: Graph, id: NodeId): string {
  const value = g.constantValue(id);
  return value !== undefined ? formatNumber(value) : `t${id}`;
}

/** How a variable is read: `x[i]` in the kernels; locals `x<i>` in code inlined elsewhere (inline.ts). */
export type VariableReader = (index: number) => string;
const indexedRead: VariableReader = (i) => `x[${i}]`;

function expressionFor(g: Graph, node: GraphNode, readVariable: VariableReader): string {
  const o = (id: NodeId) => operand(g, id);
  switch (node.op) {
    case 'const':
      return formatNumber(node.value);
    case 'var':
      return readVariable(node.index);
    case 'input':
      return `v[${node.index}]`;
    case 'param':
      return `c[${node.index}]`;
    case 'add':
      return `${o(node.a)} + ${o(node.b)}`;
    case 'sub':
      return `${o(node.a)} - ${o(node.b)}`;
    case 'mul':
      return `${o(node.a)} * ${o(node.b)}`;
    case 'div':
      return `${o(node.a)} / ${o(node.b)}`;
    case 'neg':
      return `-${o(node.a)}`;
    case 'pow':
      // Math.pow(u, 2) and u * u are the same double (both correctly rounded), and the product is faster.
      return g.constantValue(node.b) === 2 ? `${o(node.a)} * ${o(node.a)}` : `m_pow(${o(node.a)}, ${o(node.b)})`;
    case 'min':
    case 'max':
      return `m_${node.op}(${o(node.a)}, ${o(node.b)})`;
    case 'call':
      return `m_${node.fn}(${o(node.a)})`;
    case 'select':
      return `${o(node.a)} ${node.test} ${o(node.b)} ? ${o(node.then)} : ${o(node.otherwise)}`;
  }
}

function kernelsUsed(node: GraphNode, g: Graph): string[] {
  switch (node.op) {
    case 'call':
      return [node.fn];
    case 'min':
    case 'max':
      return [node.op];
    case 'pow':
      return g.constantValue(node.b) === 2 ? [] : ['pow'];
    default:
      return [];
  }
}

/** Statements computing every node `roots` need, in id order (operands before uses). */
export function body(g: Graph, roots: readonly NodeId[], kernels: Set<string>, readVariable: VariableReader = indexedRead): string[] {
  const needed = g.reachable(roots);
  const lines: string[] = [];
  for (let id = 0; id < needed.length; id++) {
    if (!needed[id]) continue;
    const node = g.node(id);
    if (node.op === 'const') continue;
    for (const k of kernelsUsed(node, g)) kernels.add(k);
    lines.push(`const t${id} = ${expressionFor(g, node, readVariable)};`);
  }
  return lines;
}

/** The source of a factory `(K, c) => ({ value, valueGradient, valueGradientHessian })`. */
export function generateSource(g: Graph, outputs: CodeOutputs, shape: CodeShape): string {
  const n = outputs.gradient.length;
  if (outputs.hessianUpper.length !== (n * (n + 1)) / 2) throw new Error('codegen: Hessian triangle has the wrong length');
  const kernels = new Set<string>();
  const head = shape === 'model' ? 'x, v' : 'x';
  const o = (id: NodeId) => operand(g, id);

  const valueLines = body(g, [outputs.value], kernels);
  const gradientLines = body(g, [outputs.value, ...outputs.gradient], kernels);
  const hessianLines = body(g, [outputs.value, ...outputs.gradient, ...outputs.hessianUpper], kernels);

  const gradientStores = outputs.gradient.map((id, i) => `g[${i}] = ${o(id)};`);
  const hessianStores: string[] = [];
  let entry = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const id = outputs.hessianUpper[entry++];
      hessianStores.push(`h[${i * n + j}] = ${o(id)};`);
      if (j !== i) hessianStores.push(`h[${j * n + i}] = ${o(id)};`);
    }
  }
  const result = `return ${o(outputs.value)};`;
  const fn = (name: string, params: string, lines: string[]) => [`${name}: function (${params}) {`, ...lines, '},'];
  const source = [
    '"use strict";',
    ...[...kernels].sort().map((k) => `const m_${k} = K.${k};`),
    'return {',
    ...fn('value', head, [...valueLines, result]),
    ...fn('valueGradient', `${head}, g`, [...gradientLines, ...gradientStores, result]),
    ...fn('valueGradientHessian', `${head}, g, h`, [...hessianLines, ...gradientStores, ...hessianStores, result]),
    '};',
  ].join('\n');
  assertSafeSource(source);
  return source;
}

const TOKEN = /[ \n]+|"use strict"|[A-Za-z_][A-Za-z0-9_]*|\d+(?:\.\d+)?(?:e[+-]\d+)?|<=|[()[\]{};,=+\-*/?:<.]/y;
const FIXED_WORDS = new Set(['const', 'return', 'function', 'K', 'c', 'x', 'v', 'g', 'h', 'value', 'valueGradient', 'valueGradientHessian']);
const ARRAYS = new Set(['x', 'v', 'c', 'g', 'h']);
const INTEGER = /^\d+$/;

function isAllowedWord(word: string): boolean {
  if (FIXED_WORDS.has(word) || /^t\d+$/.test(word)) return true;
  return word.startsWith('m_') && isKernelName(word.slice(2));
}

/**
 * Throws unless `source` is made only of allowed tokens: spaces and newlines, the one `"use strict"` prologue,
 * the fixed words above, temporaries `t<digits>`, kernel aliases `m_<kernel>`, unsigned decimal
 * numbers, and the punctuation `( ) [ ] { } ; , = + - * / ? : < <= .`. Further, `.` may only appear
 * as `K.<kernel>`, and `[` only as `<x|v|c|g|h>[<integer>]`. No string, no other name, no other
 * property access can pass.
 */
export function assertSafeSource(source: string): void {
  const tokens: string[] = [];
  let at = 0;
  while (at < source.length) {
    TOKEN.lastIndex = at;
    const match = TOKEN.exec(source);
    if (!match) throw new Error(`codegen: disallowed character at offset ${at}`);
    at += match[0].length;
    if (!/^[ \n]+$/.test(match[0])) tokens.push(match[0]);
  }
  tokens.forEach((token, i) => {
    const fail = (why: string) => {
      throw new Error(`codegen: disallowed token '${token}' at token ${i}: ${why}`);
    };
    if (token === '"use strict"') {
      if (i !== 0) fail('the prologue may only open the source');
    } else if (/^[A-Za-z_]/.test(token)) {
      const isKernelProperty = tokens[i - 1] === '.' && isKernelName(token);
      if (!isAllowedWord(token) && !isKernelProperty) fail('not an allowed name');
    } else if (token === '.') {
      if (tokens[i - 1] !== 'K' || !isKernelName(tokens[i + 1] ?? '')) fail("'.' only in K.<kernel>");
    } else if (token === '[') {
      if (!ARRAYS.has(tokens[i - 1] ?? '') || !INTEGER.test(tokens[i + 1] ?? '') || tokens[i + 2] !== ']') {
        fail("'[' only in <array>[<integer>]");
      }
    }
  });
}

/** Builds the factory once; each call binds a constants array and returns the three functions. */
export function buildFactory<T extends SurfaceKernels | ModelKernels>(source: string): (constants: Float64Array) => T {
  assertSafeSource(source);
  // The source is generated from the graph only and has passed the allowlist above.
  const factory = new Function('K', 'c', source) as (kernels: typeof KERNEL_TABLE, constants: Float64Array) => T;
  return (constants) => factory(KERNEL_TABLE, constants);
}
