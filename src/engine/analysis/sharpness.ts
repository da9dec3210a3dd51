import { symmetricEigen } from '../linalg';
import type { Surface } from '../surface';
import { multiplyDense } from './hessian-vector';
import { extremeEigenvalues, type LanczosOptions } from './lanczos';

/**
 * Sharpness along a path: the largest eigenvalue lambda_max(H(x_k)) of the exact Hessian at each of
 * `count` points (row-major, count x n, e.g. a run's trajectory). lambda_max is the top curvature; for
 * gradient descent with learning rate eta on a quadratic, steps are stable only while
 * eta lambda_max < 2, so this is the quantity to watch beside the learning rate.
 *
 * For n <= denseLimit (200) each value is exact: the full Hessian and Jacobi (linalg/jacobi.ts), into
 * buffers reused from point to point. Above it, Lanczos (lanczos.ts) on the surface's exact
 * Hessian-vector products, or, for a surface without `hessianVector` and n <= formedHessianLimit
 * (2,000), on its Hessian formed once per point; values it could not certify (residual test not met)
 * are still its best lower bound on lambda_max. Beyond the limits the value is NaN, as it is for a
 * point where the Hessian is not finite.
 */
export interface SharpnessOptions {
  denseLimit?: number;
  lanczosLimit?: number;
  formedHessianLimit?: number;
  lanczos?: LanczosOptions;
}

export function sharpnessAlong(surface: Surface, points: Float64Array, count: number, options: SharpnessOptions = {}): Float64Array {
  const n = surface.dimension;
  if (!(Number.isInteger(count) && count >= 0 && count * n <= points.length))
    throw new RangeError(`sharpnessAlong: ${count} points of dimension ${n} need ${count * n} numbers, got ${points.length}`);
  const out = new Float64Array(count);
  const dense = n <= (options.denseLimit ?? 200);
  const products = typeof surface.hessianVector === 'function';
  const formed = !dense && !products && n <= (options.formedHessianLimit ?? 2000);
  if (!dense && (n > (options.lanczosLimit ?? 100_000) || (!products && !formed))) return out.fill(NaN);

  const grad = new Float64Array(n);
  const hessian = dense || formed ? new Float64Array(n * n) : null;
  const eig = dense ? { values: new Float64Array(n), vectors: new Float64Array(n * n), work: new Float64Array(n * n) } : null;
  const x = new Float64Array(n);
  const apply = formed
    ? (v: Float64Array, o: Float64Array) => multiplyDense(hessian!, n, v, o)
    : (v: Float64Array, o: Float64Array) => surface.hessianVector!(x, v, o);

  for (let k = 0; k < count; k++) {
    for (let i = 0; i < n; i++) x[i] = points[k * n + i];
    try {
      if (dense) {
        surface.valueGradientHessian(x, grad, hessian!);
        out[k] = symmetricEigen(hessian!, n, eig!).values[n - 1];
      } else {
        if (formed) surface.valueGradientHessian(x, grad, hessian!);
        out[k] = extremeEigenvalues(apply, n, options.lanczos).largest;
      }
    } catch {
      // A non-finite Hessian (or product) at this point.
      out[k] = NaN;
    }
  }
  return out;
}
