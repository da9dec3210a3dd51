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

/** 2^-54: 1 - x rounds to exactly 1 for every 0 <= x <= 2^-54 (the tie at 2^-54 goes to the even 1). */
const ONE_MINUS_ROUNDS_TO_ONE = 2 ** -54;

/**
 * `t => 1 - power(beta, t)` for whole t >= 1 (Adam's bias corrections), the same double for every t,
 * with less work per call. `power` squares its base once per bit of t; here those squares are
 * computed once (sq[k] = beta^(2^k), by the same repeated squaring, so each product is the same) and a
 * call only multiplies the ones for t's set bits, lowest first, as `power` does.
 *
 * Saturation, for 0 <= beta < 1: every partial product of `power` lies in [0, 1] (rounding is
 * monotone and 1 is a double), so power(beta, t) <= sq[k] for the top bit k of t, and sq[k] never
 * grows with k. Once sq[K] <= 2^-54, every t >= 2^K gives 1 - power(beta, t) = 1 exactly, and the
 * function returns 1 without multiplying (beta 0.999: from t = 65,536; 0.9: from t = 512).
 */
export function biasCorrection(beta: number): (t: number) => number {
  const squares = new Float64Array(32);
  let base = beta;
  for (let k = 0; k < 32; k++) {
    squares[k] = base;
    base *= base;
  }
  let saturatedFrom = Infinity;
  if (beta >= 0 && beta < 1)
    for (let k = 0; k < 32; k++)
      if (squares[k] <= ONE_MINUS_ROUNDS_TO_ONE) {
        saturatedFrom = 2 ** k;
        break;
      }
  return (t) => {
    if (!(Number.isInteger(t) && t >= 1 && t <= MAX_INTEGER_EXPONENT)) return 1 - power(beta, t);
    if (t >= saturatedFrom) return 1;
    // The set bits of t from the lowest up (n & -n isolates the lowest; clz32 gives its position).
    let n = t >>> 0;
    let result = 1;
    while (n !== 0) {
      result *= squares[31 - Math.clz32(n & -n)];
      n &= n - 1;
    }
    return 1 - result;
  };
}

/** The squares a^(2^k), k < 32, of the last few bases `cachedPower` saw (rules alternate beta1 and beta2). */
const SQUARE_SLOTS = 4;
const slotBases: number[] = [];
const slotSquares: Float64Array[] = [];
let nextSlot = 0;

function squaresOf(a: number): Float64Array {
  for (let i = 0; i < slotBases.length; i++) if (Object.is(slotBases[i], a)) return slotSquares[i];
  const squares = new Float64Array(32);
  let base = a;
  for (let k = 0; k < 32; k++) {
    squares[k] = base;
    base *= base;
  }
  slotBases[nextSlot] = a;
  slotSquares[nextSlot] = squares;
  nextSlot = (nextSlot + 1) % SQUARE_SLOTS;
  return squares;
}

/**
 * `power(a, b)`, the same double for every a and b, faster when the same few bases are raised to many
 * whole exponents (an update rule's beta^t each step): the repeated squares of a are kept, so a call
 * only multiplies those for b's set bits, lowest first, as `power` does. Other exponents go to `power`.
 */
export function cachedPower(a: number, b: number): number {
  if (!(Number.isInteger(b) && b >= 1 && b <= MAX_INTEGER_EXPONENT)) return power(a, b);
  const squares = squaresOf(a);
  let n = b >>> 0;
  let result = 1;
  while (n !== 0) {
    result *= squares[31 - Math.clz32(n & -n)];
    n &= n - 1;
  }
  return result;
}
