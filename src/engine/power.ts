/** Largest |exponent| that `power` computes by repeated squaring (at most 62 products). */
const MAX_INTEGER_EXPONENT = 2 ** 31;

/**
 * a^b. For a whole exponent (|b| <= 2^31) by binary exponentiation: products only, so every IEEE-754
 * engine gives the same double, and the page in a browser and the command line in Node write the same
 * numbers (relative error within about 2|b| machine epsilons, far inside every tolerance used). Otherwise Math.pow.
 * JavaScript engines do not agree on Math.pow to the last bit: Chromium 156 and Node 20 differ for
 * x^3, x^4 and for Adam's bias corrections beta^t.
 */
export function power(a: number, b: number): number {
  if (!Number.isInteger(b) || Math.abs(b) > MAX_INTEGER_EXPONENT) return Math.pow(a, b);
  // |b| <= 2^31 fits an unsigned 32-bit integer, so the bit tests are exact (and much faster than
  // % and Math.floor in the run loop, where Adam's bias corrections call this twice a step).
  let n = Math.abs(b) >>> 0;
  let base = a;
  let result = 1;
  while (n !== 0) {
    if (n & 1) result *= base;
    n >>>= 1;
    if (n !== 0) base *= base;
  }
  return b < 0 ? 1 / result : result;
}
