/**
 * Minimiser of the cubic that matches phi and phi' at a and b (Nocedal & Wright, Numerical
 * Optimization, 2nd ed., eq. 3.59):
 *   d1 = phi'(a) + phi'(b) - 3 (phi(a) - phi(b)) / (a - b),
 *   d2 = sign(b - a) sqrt(d1^2 - phi'(a) phi'(b)),
 *   x  = b - (b - a) (phi'(b) + d2 - d1) / (phi'(b) - phi'(a) + 2 d2).
 * Returns NaN when the cubic has no real minimiser (negative discriminant) or the formula breaks down.
 */
export function cubicMinimizer(a: number, fa: number, da: number, b: number, fb: number, db: number): number {
  const d1 = da + db - (3 * (fa - fb)) / (a - b);
  const disc = d1 * d1 - da * db;
  if (!(disc >= 0)) return Number.NaN;
  const d2 = Math.sign(b - a) * Math.sqrt(disc);
  const x = b - ((b - a) * (db + d2 - d1)) / (db - da + 2 * d2);
  return Number.isFinite(x) ? x : Number.NaN;
}

/**
 * A trial step inside the interval between a and b: the cubic minimiser, pulled in to at least
 * `margin` of the interval's width from either end; the midpoint when the cubic has no minimiser.
 * The margin keeps every trial informative (N&W Sec. 3.5 ask for a safeguard of this kind; 10 % is
 * common practice, and clamping rather than bisecting is what minFunc and PyTorch do). The zoom loop
 * adds the guarantee of progress by bisecting when the interval stops shrinking.
 */
export function safeguardedCubic(a: number, fa: number, da: number, b: number, fb: number, db: number, margin = 0.1): number {
  const left = Math.min(a, b);
  const right = Math.max(a, b);
  const w = right - left;
  const x = cubicMinimizer(a, fa, da, b, fb, db);
  if (!Number.isFinite(x)) return left + 0.5 * w;
  return Math.min(right - margin * w, Math.max(left + margin * w, x));
}
