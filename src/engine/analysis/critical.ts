import { choleskyDecompose, choleskySolve, luDecompose, luSolve, type LuFactors } from '../linalg';
import type { Surface } from '../surface';
import { allFinite } from '../vector';
import { classifyPoint, type ClassifyOptions, type PointClass } from './classify';

/**
 * Critical points (grad f = 0) of a surface from many starts, each classified.
 *
 * From each start, Newton's method on the system g(x) = grad f(x) = 0, whose Jacobian is the exact
 * Hessian H: the step solves H d = -g (LU with partial pivoting, linalg/lu.ts). Unlike Newton for
 * minimisation it is attracted to saddles and maxima as much as to minima, which is the point here.
 * Globalisation: the merit function phi(x) = |g(x)|^2 / 2, whose gradient is H g; the Newton step is
 * its Gauss-Newton step (the Jacobian H is square), so phi'(0) along d is -|g|^2 < 0 and a
 * backtracking (Armijo) line search, phi(x + t d) <= phi(x) + 1e-4 t phi'(0) with t halved from 1,
 * makes progress far from a root and takes full steps (quadratic convergence) near a nondegenerate
 * one (Dennis & Schnabel, Numerical Methods for Unconstrained Optimization and Nonlinear Equations,
 * 1983, Ch. 6). When H is singular to working precision (a pivot below 1e-13 of the largest), or the
 * Newton step fails the line search, the step is the damped least-squares (Levenberg-Marquardt) step
 * on phi, (H^T H + mu I) d = -H^T g with mu = 1e-8 trace(H^T H) / n, raised tenfold until the line
 * search accepts (Levenberg 1944, Marquardt 1963).
 *
 * A start ends at a critical point when |g| <= gradientTolerance and the last step moved at most
 * stepTolerance (1 + |x|_inf) (default 1e-9; at a degenerate point such as x^4's, where Newton
 * converges only linearly and |g| is small long before x is, the step test is what pins the point
 * down), or when no step reduces phi or a step is below 1e-15 (1 + |x|_inf) and
 * |g| <= acceptTolerance (rounding has been reached); it fails
 * when the iterate leaves the box |x|_inf <= maxRadius, a value is not finite, or the iteration limit
 * passes with |g| above acceptTolerance.
 *
 * De-duplication rule: two end points a, b are the same critical point when
 * |a - b|_inf <= distanceTolerance (1 + max(|a|_inf, |b|_inf)) (default 1e-6); each group keeps the
 * point with the smallest gradient norm and counts its starts in `hits`. Points are returned by value,
 * ascending. Every point is classified with classifyPoint (which states its zero rule).
 *
 * Dense: the Hessian is formed and factorised, O(n^2) memory and O(n^3) per step, so n is limited
 * (maxDimension, default 400).
 */
export interface CriticalPointOptions {
  /** Newton steps per start; default 100. */
  maxIterations?: number;
  /** |grad f| at which a start may stop as converged (with the step test); default 1e-10. */
  gradientTolerance?: number;
  /** Relative step length for the convergence test; default 1e-9. */
  stepTolerance?: number;
  /** Largest |grad f| accepted as a critical point when rounding stops progress; default 1e-6. */
  acceptTolerance?: number;
  /** Relative distance for the de-duplication rule; default 1e-6. */
  distanceTolerance?: number;
  /** Iterates beyond this |x|_inf count as diverged; default 1e8. */
  maxRadius?: number;
  /** Largest dimension accepted; default 400. */
  maxDimension?: number;
  /** Passed to classifyPoint. */
  classify?: ClassifyOptions;
}

export interface CriticalPoint {
  point: number[];
  value: number;
  /** |grad f| at the point. */
  gradientNorm: number;
  /** Null only where classifyPoint declines (dimension past its limits). */
  classification: PointClass | null;
  /** Starts that ended here. */
  hits: number;
  /** Newton steps taken by the start that supplied `point`. */
  iterations: number;
}

export interface CriticalPointSearch {
  points: CriticalPoint[];
  /** Starts that ended at a critical point (before de-duplication). */
  converged: number;
  /** Starts that diverged, met a non-finite value, or stalled away from a critical point. */
  failed: number;
}

interface Solver {
  n: number;
  grad: Float64Array;
  hessian: Float64Array;
  step: Float64Array;
  rhs: Float64Array;
  trial: Float64Array;
  trialGrad: Float64Array;
  normal: Float64Array;
  chol: Float64Array;
  lu: LuFactors;
}

export function findCriticalPoints(surface: Surface, starts: readonly ArrayLike<number>[], options: CriticalPointOptions = {}): CriticalPointSearch {
  const n = surface.dimension;
  const maxDimension = options.maxDimension ?? 400;
  if (n > maxDimension) throw new RangeError(`findCriticalPoints: dimension ${n} is above maxDimension ${maxDimension} (the search forms and factorises the Hessian)`);
  const distanceTolerance = options.distanceTolerance ?? 1e-6;
  const s: Solver = {
    n,
    grad: new Float64Array(n),
    hessian: new Float64Array(n * n),
    step: new Float64Array(n),
    rhs: new Float64Array(n),
    trial: new Float64Array(n),
    trialGrad: new Float64Array(n),
    normal: new Float64Array(n * n),
    chol: new Float64Array(n * n),
    lu: { n, lu: new Float64Array(n * n), pivots: new Int32Array(n) },
  };
  const found: Omit<CriticalPoint, 'classification'>[] = [];
  let converged = 0;
  let failed = 0;
  for (const start of starts) {
    if (start.length !== n) throw new RangeError(`findCriticalPoints: a start has length ${start.length}, expected ${n}`);
    const end = newtonFrom(surface, start, s, options);
    if (end === null) {
      failed++;
      continue;
    }
    converged++;
    const same = found.find((p) => maxAbsDiff(p.point, end.point) <= distanceTolerance * (1 + Math.max(maxAbs(p.point), maxAbs(end.point))));
    if (!same) found.push({ ...end, hits: 1 });
    else {
      same.hits++;
      if (end.gradientNorm < same.gradientNorm) Object.assign(same, { point: end.point, value: end.value, gradientNorm: end.gradientNorm, iterations: end.iterations });
    }
  }
  found.sort((a, b) => a.value - b.value || compareLex(a.point, b.point));
  return { points: found.map((p) => ({ ...p, classification: classifyPoint(surface, p.point, options.classify) })), converged, failed };
}

/** Newton on grad f = 0 from one start; null when the start fails. */
function newtonFrom(surface: Surface, start: ArrayLike<number>, s: Solver, options: CriticalPointOptions): { point: number[]; value: number; gradientNorm: number; iterations: number } | null {
  const { n, grad, hessian, step, trial, trialGrad } = s;
  const maxIterations = options.maxIterations ?? 100;
  const gradientTolerance = options.gradientTolerance ?? 1e-10;
  const acceptTolerance = options.acceptTolerance ?? 1e-6;
  const maxRadius = options.maxRadius ?? 1e8;
  const stepTolerance = options.stepTolerance ?? 1e-9;
  let lastMove = Infinity;
  const x = Float64Array.from(start);
  let value = surface.valueGradientHessian(x, grad, hessian);
  let iterations = 0;
  for (;;) {
    if (!Number.isFinite(value) || !allFinite(grad) || !allFinite(hessian) || maxAbs(x) > maxRadius) return null;
    const gn = norm(grad);
    const done = (): { point: number[]; value: number; gradientNorm: number; iterations: number } | null =>
      gn <= acceptTolerance ? { point: Array.from(x), value, gradientNorm: gn, iterations } : null;
    if (gn === 0 || (gn <= gradientTolerance && lastMove <= stepTolerance * (1 + maxAbs(x)))) return done();
    if (iterations >= maxIterations) return done();
    const phi = 0.5 * gn * gn;
    let accepted = false;
    let t = 1;
    // Newton step first, then damped least-squares steps with growing damping.
    for (let attempt = 0; attempt < 12 && !accepted; attempt++) {
      const slope = attempt === 0 ? newtonStep(s) : dampedStep(s, 1e-8 * 10 ** (attempt - 1));
      if (slope === null || !(slope < 0)) continue;
      for (t = 1; t >= 2 ** -40; t *= 0.5) {
        for (let i = 0; i < n; i++) trial[i] = x[i] + t * step[i];
        const fTrial = surface.valueGradient(trial, trialGrad);
        if (!Number.isFinite(fTrial)) continue;
        const trialNorm = norm(trialGrad);
        if (0.5 * trialNorm * trialNorm <= phi + 1e-4 * t * slope) {
          accepted = true;
          break;
        }
      }
    }
    if (!accepted) return done();
    let moved = 0;
    for (let i = 0; i < n; i++) {
      moved = Math.max(moved, Math.abs(t * step[i]));
      x[i] = trial[i];
    }
    iterations++;
    lastMove = moved;
    value = surface.valueGradientHessian(x, grad, hessian);
    if (moved <= 1e-15 * (1 + maxAbs(x))) {
      if (!Number.isFinite(value) || !allFinite(grad)) return null;
      const g = norm(grad);
      return g <= acceptTolerance ? { point: Array.from(x), value, gradientNorm: g, iterations } : null;
    }
  }
}

/** d = -H^{-1} g when H is safely non-singular; returns phi'(0) = g^T H d (= -|g|^2) or null. */
function newtonStep(s: Solver): number | null {
  const { n, grad, hessian, step, rhs, lu } = s;
  if (luDecompose(hessian, n, lu) === null) return null;
  let lo = Infinity;
  let hi = 0;
  for (let k = 0; k < n; k++) {
    const u = Math.abs(lu.lu[k * n + k]);
    lo = Math.min(lo, u);
    hi = Math.max(hi, u);
  }
  if (!(lo > 1e-13 * hi)) return null;
  for (let i = 0; i < n; i++) rhs[i] = -grad[i];
  luSolve(lu, rhs, step);
  if (!allFinite(step)) return null;
  return directionalSlope(s);
}

/** (H^T H + mu I) d = -H^T g with mu = factor * trace(H^T H) / n (plus a floor); returns phi'(0). */
function dampedStep(s: Solver, factor: number): number | null {
  const { n, grad, hessian, step, rhs, normal, chol } = s;
  let trace = 0;
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      let c = 0;
      for (let k = 0; k < n; k++) c += hessian[k * n + i] * hessian[k * n + j];
      normal[i * n + j] = c;
      normal[j * n + i] = c;
      if (i === j) trace += c;
    }
  const mu = factor * (trace / n) + 1e-300;
  for (let i = 0; i < n; i++) normal[i * n + i] += mu;
  if (!choleskyDecompose(normal, n, chol)) return null;
  for (let i = 0; i < n; i++) {
    let c = 0;
    for (let k = 0; k < n; k++) c += hessian[k * n + i] * grad[k];
    rhs[i] = -c;
  }
  choleskySolve(chol, n, rhs, step);
  if (!allFinite(step)) return null;
  return directionalSlope(s);
}

/** phi'(0) along the step: (H g) . d. */
function directionalSlope(s: Solver): number {
  const { n, grad, hessian, step } = s;
  let slope = 0;
  for (let i = 0; i < n; i++) {
    let hg = 0;
    for (let k = 0; k < n; k++) hg += hessian[i * n + k] * grad[k];
    slope += hg * step[i];
  }
  return slope;
}

function norm(a: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * a[i];
  return Math.sqrt(s);
}

function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

function compareLex(a: number[], b: number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return 0;
}
