import { symmetricEigen } from '../linalg';
import type { Surface } from '../surface';
import { multiplyDense } from './hessian-vector';
import { extremeEigenvalues, type LanczosOptions } from './lanczos';

/**
 * The kind of a point from the eigenvalues of the exact Hessian there (the second-order test): all
 * positive, a (strict local) minimum; all negative, a maximum; both signs, a saddle (its index, the
 * number of negative eigenvalues, is `negative`); otherwise, with some eigenvalue counted as zero and
 * no sign change, 'degenerate' (the second-order test cannot decide: x^4 + y^2 at 0 is a minimum,
 * x^3 + y^2 at 0 is not). The test only makes sense at a stationary point; elsewhere the result
 * describes the local curvature.
 *
 * Zero rule: an eigenvalue lambda counts as zero when |lambda| <= zeroTolerance * max_i |lambda_i|,
 * i.e. relative to the largest curvature at the point; when the Hessian is zero every eigenvalue
 * counts as zero. zeroTolerance defaults to n * eps, the numerical-rank rule (NumPy's matrix_rank
 * default; Press et al., Numerical Recipes, 3rd ed., Sec. 2.6): loose enough only for rounding, so an
 * ill-conditioned but definite Hessian (NIST Misra1a at its solution, condition ~1e13) stays definite.
 *
 * Methods by dimension n:
 * - n <= denseLimit (200): 'exact', every eigenvalue by Jacobi on the full exact Hessian
 *   (linalg/jacobi.ts); all three counts known.
 * - denseLimit < n <= lanczosLimit (100,000): 'lanczos', the two extreme eigenvalues by Lanczos
 *   (lanczos.ts) on exact Hessian-vector products: the surface's `hessianVector`, or, for a surface
 *   without one and n <= formedHessianLimit (2,000), its full Hessian formed once. Only the extremes
 *   are known, so the counts are undefined and the kind comes from the extremes by the same zero rule
 *   with max |lambda| = max(|smallest|, |largest|): smallest < -band and largest > band a saddle,
 *   smallest > band a minimum, largest < -band a maximum, otherwise degenerate (band = zeroTolerance
 *   times that maximum). `converged` says whether Lanczos met its residual test; when it did not,
 *   smallest is only an upper bound on lambda_min and largest a lower bound on lambda_max.
 * - beyond those limits: null (not classified).
 */
export type PointKind = 'minimum' | 'saddle' | 'maximum' | 'degenerate';

export interface ExactPointClass {
  kind: PointKind;
  method: 'exact';
  /** Eigenvalues counted negative (the saddle index), zero and positive by the zero rule. */
  negative: number;
  zero: number;
  positive: number;
  smallest: number;
  largest: number;
  /** Every eigenvalue, ascending. */
  eigenvalues: number[];
}

export interface LanczosPointClass {
  kind: PointKind;
  method: 'lanczos';
  /** Not known from the extremes alone. */
  negative: undefined;
  zero: undefined;
  positive: undefined;
  smallest: number;
  largest: number;
  /** Lanczos steps (Hessian-vector products) and whether the residual test was met. */
  iterations: number;
  converged: boolean;
}

export type PointClass = ExactPointClass | LanczosPointClass;

export interface ClassifyOptions {
  /** Largest n for the dense exact path; default 200. */
  denseLimit?: number;
  /** Largest n for the Lanczos path; default 100,000. */
  lanczosLimit?: number;
  /** Largest n for which a surface without hessianVector gets its Hessian formed; default 2,000. */
  formedHessianLimit?: number;
  /** Relative zero band (see the zero rule); default n * eps. */
  zeroTolerance?: number;
  /** Passed to Lanczos (iterations, tolerance, seed). */
  lanczos?: LanczosOptions;
}

export function classifyPoint(surface: Surface, x: ArrayLike<number>, options: ClassifyOptions = {}): PointClass | null {
  const n = surface.dimension;
  if (x.length !== n) throw new RangeError(`classifyPoint: expected a point of length ${n}, got ${x.length}`);
  const zeroTolerance = options.zeroTolerance ?? surface.dimension * Number.EPSILON;
  if (!(zeroTolerance >= 0)) throw new RangeError(`classifyPoint: zeroTolerance must be >= 0, got ${zeroTolerance}`);
  const point = Float64Array.from(x);
  if (n <= (options.denseLimit ?? 200)) return classifyDense(surface, point, zeroTolerance);
  if (n > (options.lanczosLimit ?? 100_000)) return null;
  let apply: (v: Float64Array, out: Float64Array) => void;
  if (surface.hessianVector) {
    const product = surface.hessianVector.bind(surface);
    apply = (v, out) => product(point, v, out);
  } else {
    if (n > (options.formedHessianLimit ?? 2000)) return null;
    const hessian = new Float64Array(n * n);
    surface.valueGradientHessian(point, new Float64Array(n), hessian);
    apply = (v, out) => multiplyDense(hessian, n, v, out);
  }
  const r = extremeEigenvalues(apply, n, options.lanczos);
  return {
    kind: kindFromExtremes(r.smallest, r.largest, zeroTolerance),
    method: 'lanczos',
    negative: undefined,
    zero: undefined,
    positive: undefined,
    smallest: r.smallest,
    largest: r.largest,
    iterations: r.iterations,
    converged: r.converged,
  };
}

/**
 * classifyDense's buffers for the last dimension asked (the end judgement of a sweep classifies
 * thousands of points of one dimension); zeroed or filled before each read, and none is returned.
 */
let denseScratch: { n: number; grad: Float64Array; hessian: Float64Array; eigen: { values: Float64Array; vectors: Float64Array; work: Float64Array } } | null = null;

function classifyDense(surface: Surface, point: Float64Array, zeroTolerance: number): ExactPointClass {
  const n = surface.dimension;
  if (denseScratch?.n !== n)
    denseScratch = { n, grad: new Float64Array(n), hessian: new Float64Array(n * n), eigen: { values: new Float64Array(n), vectors: new Float64Array(n * n), work: new Float64Array(n * n) } };
  const { grad, hessian, eigen } = denseScratch;
  grad.fill(0);
  hessian.fill(0);
  surface.valueGradientHessian(point, grad, hessian);
  const values = symmetricEigen(hessian, n, eigen).values;
  const { negative, zero, positive } = countSigns(values, zeroTolerance);
  const kind: PointKind = negative > 0 && positive > 0 ? 'saddle' : zero > 0 ? 'degenerate' : negative === n ? 'maximum' : 'minimum';
  return { kind, method: 'exact', negative, zero, positive, smallest: values[0], largest: values[n - 1], eigenvalues: Array.from(values) };
}

/** Counts by the zero rule: |lambda| <= zeroTolerance * max |lambda| is zero. */
export function countSigns(values: ArrayLike<number>, zeroTolerance: number): { negative: number; zero: number; positive: number } {
  let top = 0;
  for (let i = 0; i < values.length; i++) top = Math.max(top, Math.abs(values[i]));
  const band = zeroTolerance * top;
  let negative = 0;
  let zero = 0;
  for (let i = 0; i < values.length; i++) {
    if (Math.abs(values[i]) <= band) zero++;
    else if (values[i] < 0) negative++;
  }
  return { negative, zero, positive: values.length - negative - zero };
}

function kindFromExtremes(smallest: number, largest: number, zeroTolerance: number): PointKind {
  const band = zeroTolerance * Math.max(Math.abs(smallest), Math.abs(largest));
  if (smallest < -band && largest > band) return 'saddle';
  if (smallest > band) return 'minimum';
  if (largest < -band) return 'maximum';
  return 'degenerate';
}
