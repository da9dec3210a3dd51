/**
 * The machine-learning kernels of the formula language, written out (the others are `Math.*`), each
 * computed so it neither overflows nor loses precision for large |x|. The table of every function,
 * with these as kernels, is primitives.ts.
 */

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
