/**
 * The numeric kernels behind every function of the formula language. Compiled formulas call exactly
 * these function objects (passed into the generated code as a table), and the tree-walking evaluator
 * calls them too, so both agree on every value.
 *
 * Most are `Math.*`. The machine-learning ones are written out here, each computed so it neither
 * overflows nor loses precision for large |x|.
 */
import { power } from '../power';

/**
 * Logistic sigmoid 1 / (1 + exp(-x)). For x < 0 it is computed as exp(x) / (1 + exp(x)) so exp never
 * overflows: sigmoid(-800) is 0 (not 0/Infinity), sigmoid(800) is 1.
 */
export function sigmoid(x: number): number {
  if (x >= 0) return 1 / (1 + Math.exp(-x));
  const z = Math.exp(x);
  return z / (1 + z);
}

/**
 * Softplus log(1 + exp(x)), computed as max(x, 0) + log1p(exp(-|x|)): exact-to-rounding for large
 * positive x (softplus(1000) = 1000, where the naive form overflows to Infinity) and for large negative
 * x (softplus(-40) = 4.25e-18, where log(1 + exp(x)) rounds to 0 because 1 + 4.25e-18 rounds to 1).
 */
export function softplus(x: number): number {
  return Math.max(x, 0) + Math.log1p(Math.exp(-Math.abs(x)));
}

/** Rectified linear unit max(x, 0); NaN stays NaN. */
export function relu(x: number): number {
  return Math.max(x, 0);
}

/**
 * Exponential linear unit with alpha = 1 (Clevert, Unterthiner, Hochreiter 2016, "Fast and accurate
 * deep network learning by exponential linear units"): x for x > 0, exp(x) - 1 otherwise (via expm1,
 * accurate near 0). Common libraries expose alpha as a setting; here it is fixed at 1.
 */
export function elu(x: number): number {
  return x > 0 ? x : Math.expm1(x);
}

/**
 * Every one-argument kernel by its name in the language. Adding a function starts here (see
 * DEVELOPERS.md, "The formula language").
 */
export const UNARY_KERNELS = {
  sin: Math.sin,
  cos: Math.cos,
  tan: Math.tan,
  asin: Math.asin,
  acos: Math.acos,
  atan: Math.atan,
  sinh: Math.sinh,
  cosh: Math.cosh,
  tanh: Math.tanh,
  exp: Math.exp,
  expm1: Math.expm1,
  log: Math.log,
  log1p: Math.log1p,
  sqrt: Math.sqrt,
  abs: Math.abs,
  sign: Math.sign,
  sigmoid,
  softplus,
  relu,
  elu,
} as const satisfies Record<string, (x: number) => number>;

export type UnaryKernelName = keyof typeof UNARY_KERNELS;

/** Kernels of two arguments used by the compiled code: `^`, and the binary steps of `min`/`max`. */
export const BINARY_KERNELS = {
  pow: power,
  min: Math.min,
  max: Math.max,
} as const satisfies Record<string, (a: number, b: number) => number>;

export type BinaryKernelName = keyof typeof BINARY_KERNELS;

/** The table handed to generated code; frozen and without a prototype, so only these names resolve. */
export const KERNEL_TABLE: Readonly<Record<UnaryKernelName | BinaryKernelName, (...args: number[]) => number>> =
  Object.freeze(Object.assign(Object.create(null), UNARY_KERNELS, BINARY_KERNELS));

/** Whether `name` is a key of the kernel table (own keys only: `constructor` and `toString` are not). */
export function isKernelName(name: string): name is UnaryKernelName | BinaryKernelName {
  return Object.prototype.hasOwnProperty.call(KERNEL_TABLE, name);
}
