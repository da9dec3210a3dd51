import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createRng, extremeEigenvalues, nextGaussian, symmetricEigen } from '../../../src/engine';
import { buildDataFitSurface, initialNetworkParameters, MlpSurface } from '../../../src/problems';

/**
 * Lanczos with full reorthogonalisation against dense eigen-decompositions: ml-matrix 6.15.1's
 * EigenvalueDecomposition (symmetric path: Householder tridiagonalisation and QL, after EISPACK /
 * JAMA) on the exact Hessian of a data-fit network, and the engine's Jacobi on small matrices.
 */

/** A network with 265 parameters: 2 inputs, tanh layers of 16 and 12 units, a binary head. */
function networkSurface(): MlpSurface {
  const surface = buildDataFitSurface({
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'wave-boundary', rows: 60 },
    model: { kind: 'mlp', inputs: ['u', 'v'], target: 'kind', hidden: [16, 12], activation: 'tanh', head: 'binary' },
    l2: 0.001,
  });
  if (!(surface instanceof MlpSurface)) throw new Error('expected a network surface');
  return surface;
}

describe('extremeEigenvalues (Lanczos)', () => {
  it('matches ml-matrix on the exact Hessian of a 265-parameter network to 1e-8 relative', () => {
    const surface = networkSurface();
    const n = surface.dimension;
    expect(n).toBe(265);
    const x = initialNetworkParameters(surface, 11);
    const hessian = new Float64Array(n * n);
    surface.valueGradientHessian(x, new Float64Array(n), hessian);
    const rows = Array.from({ length: n }, (_, i) => Array.from(hessian.subarray(i * n, (i + 1) * n)));
    const dense = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true }).realEigenvalues;
    const lo = Math.min(...dense);
    const hi = Math.max(...dense);
    expect(lo).toBeLessThan(0); // an indefinite Hessian: both ends matter

    let products = 0;
    const result = extremeEigenvalues(
      (v, out) => {
        products++;
        surface.hessianVector(x, v, out);
      },
      n,
      { maxIterations: n, tolerance: 1e-10, seed: 3 },
    );
    expect(result.converged).toBe(true);
    expect(products).toBe(result.iterations);
    expect(Math.abs(result.largest - hi)).toBeLessThanOrEqual(1e-8 * Math.abs(hi));
    expect(Math.abs(result.smallest - lo)).toBeLessThanOrEqual(1e-8 * Math.abs(lo));
  });

  it('finds both ends of a matrix with a known spectrum and stops early on the residual test', () => {
    // A = U diag(lambda) U^T with U a Householder reflection I - 2 u u^T / |u|^2: eigenvalues known exactly.
    const n = 400;
    const rng = createRng(5);
    const u = Float64Array.from({ length: n }, () => nextGaussian(rng));
    let uu = 0;
    for (const t of u) uu += t * t;
    const lambda = Float64Array.from({ length: n }, (_, i) => (i === 0 ? -7 : i === n - 1 ? 50 : 1 + (30 * i) / n));
    const tmp = new Float64Array(n);
    const apply = (v: Float64Array, out: Float64Array) => {
      // out = U diag(lambda) U v, U symmetric and orthogonal.
      let c = 0;
      for (let i = 0; i < n; i++) c += u[i] * v[i];
      c *= 2 / uu;
      for (let i = 0; i < n; i++) tmp[i] = lambda[i] * (v[i] - c * u[i]);
      let d = 0;
      for (let i = 0; i < n; i++) d += u[i] * tmp[i];
      d *= 2 / uu;
      for (let i = 0; i < n; i++) out[i] = tmp[i] - d * u[i];
    };
    const result = extremeEigenvalues(apply, n, { maxIterations: 200, tolerance: 1e-10, seed: 1 });
    expect(result.converged).toBe(true);
    expect(result.iterations).toBeLessThan(200);
    expect(result.residual).toBeLessThanOrEqual(1e-10 * 50);
    expect(Math.abs(result.smallest + 7)).toBeLessThanOrEqual(1e-12 * 50);
    expect(Math.abs(result.largest - 50)).toBeLessThanOrEqual(1e-12 * 50);
  });

  it('repeats exactly for a seed', () => {
    const a = Float64Array.from([4, 1, 0, 1, 3, 1, 0, 1, 2]);
    const apply = (v: Float64Array, out: Float64Array) => {
      for (let i = 0; i < 3; i++) out[i] = a[3 * i] * v[0] + a[3 * i + 1] * v[1] + a[3 * i + 2] * v[2];
    };
    const first = extremeEigenvalues(apply, 3, { seed: 9, maxIterations: 2 });
    const second = extremeEigenvalues(apply, 3, { seed: 9, maxIterations: 2 });
    expect(second).toEqual(first);
  });

  it('carries on when the Krylov space closes before n steps (repeated eigenvalues)', () => {
    // Three distinct eigenvalues: the Krylov space of any start is invariant after 3 steps (beta ~ 0);
    // the run continues in a fresh orthogonal block instead of dividing by that beta.
    const n = 6;
    const diag = [2, 2, 2, -1, 5, 5];
    const apply = (v: Float64Array, out: Float64Array) => {
      for (let i = 0; i < n; i++) out[i] = diag[i] * v[i];
    };
    const result = extremeEigenvalues(apply, n, { maxIterations: n, seed: 2 });
    expect(result.converged).toBe(true);
    expect(result.smallest).toBeCloseTo(-1, 12);
    expect(result.largest).toBeCloseTo(5, 12);
  });

  it('agrees with Jacobi on random symmetric matrices of every small order when run to n steps', () => {
    for (let n = 1; n <= 12; n++) {
      const rng = createRng(100 + n);
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j <= i; j++) {
          const t = nextGaussian(rng);
          a[i * n + j] = t;
          a[j * n + i] = t;
        }
      const eig = symmetricEigen(a, n);
      const apply = (v: Float64Array, out: Float64Array) => {
        for (let i = 0; i < n; i++) {
          let s = 0;
          for (let j = 0; j < n; j++) s += a[i * n + j] * v[j];
          out[i] = s;
        }
      };
      const result = extremeEigenvalues(apply, n, { maxIterations: n, seed: n });
      const scale = Math.max(Math.abs(eig.values[0]), Math.abs(eig.values[n - 1]));
      expect(Math.abs(result.smallest - eig.values[0]), `n = ${n}`).toBeLessThanOrEqual(1e-12 * scale);
      expect(Math.abs(result.largest - eig.values[n - 1]), `n = ${n}`).toBeLessThanOrEqual(1e-12 * scale);
    }
  });
});
