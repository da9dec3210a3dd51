import { safeguardedCubic } from './cubic';

/** One evaluation of phi(a) = f(x + a p) and phi'(a) = grad f(x + a p) . p, written into `out`. */
export type LineFunction = (a: number, out: LinePoint) => void;

export interface LinePoint {
  a: number;
  f: number;
  d: number;
}

export interface StrongWolfeOptions {
  /** Sufficient-decrease constant, 0 < c1 < c2. */
  c1: number;
  /** Curvature constant, c1 < c2 < 1 (0.9 for quasi-Newton directions). */
  c2: number;
  /** Budget of phi evaluations for the whole search. */
  maxEvaluations: number;
  /** Largest step the bracketing phase may try. */
  maxStep?: number;
}

export interface LineSearchResult {
  /**
   * 'wolfe': `point` satisfies the strong Wolfe conditions and is the last point evaluated;
   * 'decrease': the budget ran out, `point` is the best step found with sufficient decrease (not
   * necessarily the last point evaluated); 'failed': no step with sufficient decrease was found.
   */
  status: 'wolfe' | 'decrease' | 'failed';
  point: LinePoint;
  evaluations: number;
}

/**
 * Line search for a step a > 0 satisfying the strong Wolfe conditions (Nocedal & Wright, Numerical
 * Optimization, 2nd ed., eq. 3.7, Algorithms 3.5 and 3.6):
 *   phi(a) <= phi(0) + c1 a phi'(0)   and   |phi'(a)| <= c2 |phi'(0)|.
 * Bracketing phase (Alg. 3.5) from the trial `a1`: stop at a point meeting both conditions; zoom into
 * [a_{i-1}, a_i] when a_i breaks sufficient decrease or does not improve on a_{i-1}, or into
 * [a_i, a_{i-1}] when phi'(a_i) >= 0; otherwise double the trial (SciPy's extrapolation, capped at
 * maxStep). zoom (Alg. 3.6) keeps a_lo as the best sufficient-decrease point, picks trials by
 * safeguarded cubic interpolation between a_lo and a_hi (cubic.ts) with a bisection whenever two
 * trials have not shrunk the interval enough, and maintains an interval that contains a strong-Wolfe
 * step. `phi'(0)` must be negative (a descent direction).
 */
export function strongWolfeSearch(phi: LineFunction, phi0: number, dphi0: number, a1: number, o: StrongWolfeOptions): LineSearchResult {
  const maxStep = o.maxStep ?? 1e10;
  const sufficient = (p: LinePoint) => p.f <= phi0 + o.c1 * p.a * dphi0;
  const curvature = (p: LinePoint) => Math.abs(p.d) <= -o.c2 * dphi0;
  let evaluations = 0;
  const evaluate = (a: number): LinePoint => {
    const p: LinePoint = { a, f: Number.NaN, d: Number.NaN };
    phi(a, p);
    evaluations++;
    return p;
  };

  const zoom = (lo: LinePoint, hi: LinePoint): LineSearchResult => {
    // Widths before the last two trials: when two trials have not shrunk the interval to 0.66 of its
    // width, bisect (More & Thuente, ACM TOMS 20(3), 1994, use this rule to guarantee progress).
    let widthTwoAgo = Infinity;
    let widthOneAgo = Infinity;
    while (evaluations < o.maxEvaluations) {
      const width = Math.abs(hi.a - lo.a);
      if (width <= 1e-14 * Math.max(1, Math.abs(lo.a))) break;
      const bisect = width > 0.66 * widthTwoAgo || !Number.isFinite(hi.f) || !Number.isFinite(hi.d);
      widthTwoAgo = widthOneAgo;
      widthOneAgo = width;
      const trial = evaluate(bisect ? 0.5 * (lo.a + hi.a) : safeguardedCubic(lo.a, lo.f, lo.d, hi.a, hi.f, hi.d));
      if (!Number.isFinite(trial.f) || !sufficient(trial) || trial.f >= lo.f) {
        hi = trial;
      } else {
        if (curvature(trial)) return { status: 'wolfe', point: trial, evaluations };
        if (trial.d * (hi.a - lo.a) >= 0) hi = lo;
        lo = trial;
      }
    }
    return lo.a > 0 ? { status: 'decrease', point: lo, evaluations } : { status: 'failed', point: lo, evaluations };
  };

  let prev: LinePoint = { a: 0, f: phi0, d: dphi0 };
  let a = Math.min(a1, maxStep);
  for (let i = 1; ; i++) {
    const cur = evaluate(a);
    if (!Number.isFinite(cur.f) || !sufficient(cur) || (i > 1 && cur.f >= prev.f)) return zoom(prev, cur);
    if (curvature(cur)) return { status: 'wolfe', point: cur, evaluations };
    if (cur.d >= 0) return zoom(cur, prev);
    if (evaluations >= o.maxEvaluations || a >= maxStep) return { status: 'decrease', point: cur, evaluations };
    prev = cur;
    a = Math.min(2 * a, maxStep);
  }
}
