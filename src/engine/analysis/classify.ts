import { symmetricEigen } from '../linalg';
import type { Surface } from '../surface';

/**
 * What kind of point x is, from the eigenvalues of the exact Hessian there.
 * An eigenvalue counts as zero when |lambda| <= n eps max_i |lambda_i|, the numerical-rank rule (NumPy's
 * matrix_rank default tolerance; Press et al., Numerical Recipes, 3rd ed., Sec. 2.6): relative, so it
 * does not depend on the loss's units, and loose enough only for rounding, so an ill-conditioned but
 * definite Hessian (NIST Misra1a, condition ~1e10) is still definite. All zero: degenerate. Any zero eigenvalue with no negative one:
 * degenerate (a flat valley or plateau); negative and positive ones: saddle, its index the count of
 * negative eigenvalues; all negative: maximum; all positive: minimum.
 */
export type PointKind = 'minimum' | 'saddle' | 'maximum' | 'degenerate';

export interface PointClass {
  kind: PointKind;
  /** Counts of negative, zero and positive eigenvalues (all known on the exact path). */
  negative?: number;
  zero?: number;
  positive?: number;
  smallest: number;
  largest: number;
  method: 'exact' | 'lanczos';
}


/** Largest dimension for the dense eigen-decomposition. */
export const EXACT_CLASSIFY_LIMIT = 200;

export function classifyPoint(surface: Surface, x: ArrayLike<number>): PointClass | null {
  const n = surface.dimension;
  if (n > EXACT_CLASSIFY_LIMIT) return null;
  const grad = new Float64Array(n);
  const hessian = new Float64Array(n * n);
  surface.valueGradientHessian(x, grad, hessian);
  if (!hessian.every(Number.isFinite)) return null;
  const values = new Float64Array(n);
  symmetricEigen(hessian, n, { values, vectors: new Float64Array(n * n), work: new Float64Array(n * n) });
  return classifyEigenvalues(values, 'exact');
}

export function classifyEigenvalues(values: ArrayLike<number>, method: PointClass['method']): PointClass {
  let scale = 0;
  let smallest = Infinity;
  let largest = -Infinity;
  for (let i = 0; i < values.length; i++) {
    scale = Math.max(scale, Math.abs(values[i]));
    smallest = Math.min(smallest, values[i]);
    largest = Math.max(largest, values[i]);
  }
  const zeroBand = values.length * Number.EPSILON * scale;
  let negative = 0;
  let zero = 0;
  let positive = 0;
  for (let i = 0; i < values.length; i++) {
    if (Math.abs(values[i]) <= zeroBand) zero++;
    else if (values[i] < 0) negative++;
    else positive++;
  }
  const kind: PointKind = negative > 0 && positive > 0 ? 'saddle' : negative > 0 ? (zero > 0 ? 'saddle' : 'maximum') : zero > 0 ? 'degenerate' : 'minimum';
  return { kind, negative, zero, positive, smallest, largest, method };
}
