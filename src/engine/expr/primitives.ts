/**
 * The one table of the formula language's functions: per function its name (the key), its numeric
 * kernel, a one-line summary for help texts, its derivative rule and whether it is smooth. The parser
 * and evaluator (functions.ts), the compiler's kernel table (kernels.ts), the graph's constant folding
 * (graph.ts), the differentiator (derive.ts) and the tests all read this table, so adding a function
 * is one entry here.
 *
 * A unary rule gives f'(u) for f = the function, in terms of u and of `self`, the node f(u) (reused
 * where the derivative is a function of the value: exp' = exp, tanh' = 1 - tanh^2). The chain-rule
 * factor u' is applied by the differentiator. Conventions at kinks (abs'(0) = 0, relu'(0) = 0,
 * elu'(0) = 1, ties of min/max follow the first argument) are described in derive.ts.
 */
import { power } from '../power';
import { elu, relu, sigmoid, softplus } from './kernels';

/** The derivative-term constructors a rule builds with (derive.ts's Differentiator provides them). */
export interface DerivativeTerms<Id> {
  readonly zero: Id;
  readonly one: Id;
  constant(value: number): Id;
  /** f(u) for a function of this table. Typed as a string (the table cannot name its own keys while
   * being defined); the differentiator refuses a name that is not a key. */
  call(fn: string, u: Id): Id;
  add(a: Id, b: Id): Id;
  sub(a: Id, b: Id): Id;
  mul(a: Id, b: Id): Id;
  div(a: Id, b: Id): Id;
  neg(a: Id): Id;
  /** `a <test> b ? then : otherwise`. */
  select(test: '<=' | '<', a: Id, b: Id, then: Id, otherwise: Id): Id;
}

export interface UnaryPrimitive {
  readonly kernel: (x: number) => number;
  readonly summary: string;
  /** Differentiable everywhere on its domain (false for the kinked abs, sign, relu, elu). */
  readonly smooth: boolean;
  /** f'(u), where `self` is the node f(u). */
  readonly derivative: <Id>(d: DerivativeTerms<Id>, u: Id, self: Id) => Id;
}

function unary(kernel: (x: number) => number, summary: string, derivative: UnaryPrimitive['derivative'], smooth = true): UnaryPrimitive {
  return { kernel, summary, smooth, derivative };
}

/** 1 / sqrt(1 - u^2), shared by asin and acos. */
const arcSineSlope = <Id>(d: DerivativeTerms<Id>, u: Id): Id => d.div(d.one, d.call('sqrt', d.sub(d.one, d.mul(u, u))));

export const UNARY_PRIMITIVES = {
  sin: unary(Math.sin, 'sine (radians)', (d, u) => d.call('cos', u)),
  cos: unary(Math.cos, 'cosine (radians)', (d, u) => d.neg(d.call('sin', u))),
  tan: unary(Math.tan, 'tangent (radians)', (d, _u, self) => d.add(d.one, d.mul(self, self))), // 1 + tan^2
  asin: unary(Math.asin, 'inverse sine, argument in [-1, 1]', (d, u) => arcSineSlope(d, u)),
  acos: unary(Math.acos, 'inverse cosine, argument in [-1, 1]', (d, u) => d.neg(arcSineSlope(d, u))),
  atan: unary(Math.atan, 'inverse tangent', (d, u) => d.div(d.one, d.add(d.one, d.mul(u, u)))),
  sinh: unary(Math.sinh, 'hyperbolic sine', (d, u) => d.call('cosh', u)),
  cosh: unary(Math.cosh, 'hyperbolic cosine', (d, u) => d.call('sinh', u)),
  tanh: unary(Math.tanh, 'hyperbolic tangent', (d, _u, self) => d.sub(d.one, d.mul(self, self))), // 1 - tanh^2
  exp: unary(Math.exp, 'exponential e^x', (_d, _u, self) => self),
  expm1: unary(Math.expm1, 'exp(x) - 1, accurate near 0', (d, u) => d.call('exp', u)),
  log: unary(Math.log, 'natural logarithm', (d, u) => d.div(d.one, u)),
  log1p: unary(Math.log1p, 'log(1 + x), accurate near 0', (d, u) => d.div(d.one, d.add(d.one, u))),
  sqrt: unary(Math.sqrt, 'square root', (d, _u, self) => d.div(d.constant(0.5), self)),
  abs: unary(Math.abs, 'absolute value (derivative 0 at 0)', (d, u) => d.call('sign', u), false),
  sign: unary(Math.sign, 'sign: -1, 0 or 1 (derivative 0)', (d) => d.zero, false),
  sigmoid: unary(sigmoid, 'logistic 1 / (1 + exp(-x))', (d, _u, self) => d.mul(self, d.sub(d.one, self))), // s (1 - s)
  softplus: unary(softplus, 'log(1 + exp(x)), computed without overflow', (d, u) => d.call('sigmoid', u)),
  relu: unary(relu, 'max(x, 0) (derivative 0 at 0)', (d, u) => d.select('<', d.zero, u, d.one, d.zero), false),
  elu: unary(elu, 'x for x > 0, exp(x) - 1 otherwise', (d, u) => d.select('<', d.zero, u, d.one, d.call('exp', u)), false),
} satisfies Record<string, UnaryPrimitive>;

export type UnaryKernelName = keyof typeof UNARY_PRIMITIVES;

export interface VariadicPrimitive {
  /** The pairwise kernel; n-ary calls are nested pairs from the left. */
  readonly kernel: (a: number, b: number) => number;
  readonly summary: string;
  /** d(f(a, b)) from the operands and their derivatives da, db. */
  readonly derivative: <Id>(d: DerivativeTerms<Id>, a: Id, b: Id, da: Id, db: Id) => Id;
}

/** The functions of two or more arguments. */
export const VARIADIC_PRIMITIVES = {
  min: {
    kernel: Math.min,
    summary: 'smallest argument (the derivative follows the first smallest one)',
    derivative: (d, a, b, da, db) => d.select('<=', a, b, da, db),
  },
  max: {
    kernel: Math.max,
    summary: 'largest argument (the derivative follows the first largest one)',
    derivative: (d, a, b, da, db) => d.select('<=', b, a, da, db),
  },
} satisfies Record<string, VariadicPrimitive>;

export type VariadicPrimitiveName = keyof typeof VARIADIC_PRIMITIVES;

/** Every one-argument kernel by its name in the language. */
export const UNARY_KERNELS = Object.fromEntries(Object.entries(UNARY_PRIMITIVES).map(([name, p]) => [name, p.kernel])) as Record<
  UnaryKernelName,
  (x: number) => number
>;

/** Kernels of two arguments used by the compiled code: `^`, and the binary steps of `min`/`max`. */
export const BINARY_KERNELS = {
  pow: power,
  min: VARIADIC_PRIMITIVES.min.kernel,
  max: VARIADIC_PRIMITIVES.max.kernel,
} as const satisfies Record<string, (a: number, b: number) => number>;

export type BinaryKernelName = keyof typeof BINARY_KERNELS;

/**
 * The table handed to generated code; frozen and without a prototype, so only these names resolve.
 * Compiled formulas call exactly these function objects, and the tree-walking evaluator calls them
 * too, so both agree on every value.
 */
export const KERNEL_TABLE: Readonly<Record<UnaryKernelName | BinaryKernelName, (...args: number[]) => number>> =
  Object.freeze(Object.assign(Object.create(null), UNARY_KERNELS, BINARY_KERNELS));

/** Whether `name` is a key of the kernel table (own keys only: `constructor` and `toString` are not). */
export function isKernelName(name: string): name is UnaryKernelName | BinaryKernelName {
  return Object.prototype.hasOwnProperty.call(KERNEL_TABLE, name);
}

/** Whether `name` is a one-argument function of the table (own keys only). */
export function isUnaryKernelName(name: string): name is UnaryKernelName {
  return Object.prototype.hasOwnProperty.call(UNARY_PRIMITIVES, name);
}
