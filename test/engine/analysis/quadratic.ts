import { createRng, nextGaussian, type Surface } from '../../../src/engine';

/**
 * f(x) = 1/2 (x - c)^T A (x - c) with A = U diag(lambda) U^T, U = I - 2 u u^T / |u|^2 a Householder
 * reflection (symmetric and orthogonal) from a seeded Gaussian u: a test surface whose Hessian has
 * exactly the eigenvalues `lambda`, at every point. Products cost O(n) (no matrix is formed unless the
 * full Hessian is asked for); `withProducts: false` leaves out hessianVector.
 */
export function householderQuadratic(lambda: ArrayLike<number>, seed: number, withProducts = true): Surface & { products: number; hessians: number } {
  const n = lambda.length;
  const rng = createRng(seed);
  const u = Float64Array.from({ length: n }, () => nextGaussian(rng));
  const centre = Float64Array.from({ length: n }, () => nextGaussian(rng));
  let uu = 0;
  for (const t of u) uu += t * t;
  const tmp = new Float64Array(n);
  const d = new Float64Array(n);
  /** out = A v. */
  const multiply = (v: ArrayLike<number>, out: Float64Array) => {
    let c = 0;
    for (let i = 0; i < n; i++) c += u[i] * v[i];
    c *= 2 / uu;
    for (let i = 0; i < n; i++) tmp[i] = lambda[i] * (v[i] - c * u[i]);
    let e = 0;
    for (let i = 0; i < n; i++) e += u[i] * tmp[i];
    e *= 2 / uu;
    for (let i = 0; i < n; i++) out[i] = tmp[i] - e * u[i];
  };
  const gradientAt = (x: ArrayLike<number>, grad: Float64Array) => {
    for (let i = 0; i < n; i++) d[i] = x[i] - centre[i];
    multiply(d, grad);
    let f = 0;
    for (let i = 0; i < n; i++) f += 0.5 * d[i] * grad[i];
    return f;
  };
  const surface: Surface & { products: number; hessians: number } = {
    products: 0,
    hessians: 0,
    dimension: n,
    variables: Array.from({ length: n }, (_, i) => `x${i + 1}`),
    value: (x) => gradientAt(x, new Float64Array(n)),
    valueGradient: (x, grad) => gradientAt(x, grad),
    valueGradientHessian: (x, grad, hessian) => {
      surface.hessians++;
      const e = new Float64Array(n);
      const column = new Float64Array(n);
      for (let j = 0; j < n; j++) {
        e.fill(0);
        e[j] = 1;
        multiply(e, column);
        for (let i = 0; i < n; i++) hessian[i * n + j] = column[i];
      }
      return gradientAt(x, grad);
    },
  };
  if (withProducts)
    surface.hessianVector = (_x, v, out) => {
      surface.products++;
      multiply(v, out);
    };
  return surface;
}
