import type { Surface } from '../surface';

/** Regularly spaced alphas: from, from + h, ..., to with h = (to - from) / (count - 1). */
export interface AlphaRange {
  from: number;
  to: number;
  count: number;
}

/** Default alphas: a little past both ends of the segment, so the behaviour beyond them shows. */
export const DEFAULT_ALPHAS: Readonly<AlphaRange> = Object.freeze({ from: -0.5, to: 1.5, count: 101 });

export interface LineProfile {
  alphas: Float64Array;
  values: Float64Array;
}

/**
 * The loss along the straight line through two parameter vectors (Goodfellow, Vinyals & Saxe,
 * "Qualitatively characterizing neural network optimization problems", ICLR 2015):
 * J(alpha) = f((1 - alpha) theta0 + alpha theta1). alpha = 0 is theta0 (say the initial point),
 * alpha = 1 is theta1 (the solution); the point is formed exactly as written, so both ends are hit
 * without rounding. `alphas` is a list or a regular range (default -0.5 to 1.5, 101 values).
 */
export function lineProfile(
  surface: Surface,
  from: ArrayLike<number>,
  to: ArrayLike<number>,
  alphas: ArrayLike<number> | AlphaRange = DEFAULT_ALPHAS,
): LineProfile {
  const n = surface.dimension;
  if (from.length !== n || to.length !== n)
    throw new Error(`lineProfile: the end points have ${from.length} and ${to.length} coordinates but the surface has ${n}`);
  const a = alphaValues(alphas);
  const values = new Float64Array(a.length);
  const p = new Float64Array(n);
  for (let s = 0; s < a.length; s++) {
    const t = a[s];
    for (let k = 0; k < n; k++) p[k] = (1 - t) * from[k] + t * to[k];
    values[s] = surface.value(p);
  }
  return { alphas: a, values };
}

function alphaValues(alphas: ArrayLike<number> | AlphaRange): Float64Array {
  if (isRange(alphas)) {
    const { from, to, count } = alphas;
    if (!Number.isInteger(count) || count < 2) throw new Error(`lineProfile: count must be a whole number of at least 2, got ${count}`);
    if (!(Number.isFinite(from) && Number.isFinite(to) && from < to))
      throw new Error(`lineProfile: the alpha range must be two finite numbers, from < to, got [${from}, ${to}]`);
    return Float64Array.from({ length: count }, (_, s) => from + (s * (to - from)) / (count - 1));
  }
  const a = Float64Array.from(alphas);
  for (let s = 0; s < a.length; s++) if (!Number.isFinite(a[s])) throw new Error(`lineProfile: alpha ${s + 1} is ${a[s]}`);
  return a;
}

function isRange(x: ArrayLike<number> | AlphaRange): x is AlphaRange {
  return typeof (x as AlphaRange).count === 'number' && typeof (x as AlphaRange).from === 'number';
}
