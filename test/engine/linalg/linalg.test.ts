import { CholeskyDecomposition, EigenvalueDecomposition, LuDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { choleskyDecompose, choleskySolve, luDecompose, luSolve, symmetricEigen } from '../../../src/engine/linalg';
import { createRng, nextGaussian, type RngState } from '../../../src/engine/rng';

// Reference library: ml-matrix 6.15.1 (npm), its CholeskyDecomposition, LuDecomposition and
// EigenvalueDecomposition (symmetric path: Householder tridiagonalisation + QL, from JAMA).

function randomSymmetric(rng: RngState, n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = nextGaussian(rng);
  return a;
}

/** B B^T + n I: symmetric positive definite. */
function randomSpd(rng: RngState, n: number): Float64Array {
  const b = randomSymmetric(rng, n);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = i === j ? n : 0;
      for (let k = 0; k < n; k++) s += b[i * n + k] * b[j * n + k];
      a[i * n + j] = s;
    }
  return a;
}

const toMatrix = (a: Float64Array, n: number) => new Matrix(Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n))));
const sizes = [1, 2, 3, 5, 8, 12];

describe('choleskyDecompose / choleskySolve', () => {
  it.each(sizes)('matches ml-matrix CholeskyDecomposition on random SPD %i x %i matrices', (n) => {
    const rng = createRng(100 + n);
    for (let trial = 0; trial < 5; trial++) {
      const a = randomSpd(rng, n);
      const l = new Float64Array(n * n);
      expect(choleskyDecompose(a, n, l)).toBe(true);
      const ref = new CholeskyDecomposition(toMatrix(a, n));
      expect(ref.isPositiveDefinite()).toBe(true);
      const refL = ref.lowerTriangularMatrix;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(l[i * n + j]).toBeCloseTo(refL.get(i, j), 10);
      const b = Float64Array.from({ length: n }, () => nextGaussian(rng));
      const x = choleskySolve(l, n, b, new Float64Array(n));
      const refX = ref.solve(Matrix.columnVector(Array.from(b)));
      for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(refX.get(i, 0), 9);
    }
  });

  it('reports an indefinite matrix (diag(1, -1)) and a singular one as not positive definite', () => {
    expect(choleskyDecompose([1, 0, 0, -1], 2, new Float64Array(4))).toBe(false);
    expect(choleskyDecompose([1, 1, 1, 1], 2, new Float64Array(4))).toBe(false);
    expect(new CholeskyDecomposition(new Matrix([[1, 0], [0, -1]])).isPositiveDefinite()).toBe(false);
  });
});

describe('luDecompose / luSolve', () => {
  it.each(sizes)('solves random general %i x %i systems like ml-matrix LuDecomposition', (n) => {
    const rng = createRng(200 + n);
    for (let trial = 0; trial < 5; trial++) {
      const a = Float64Array.from({ length: n * n }, () => nextGaussian(rng));
      const b = Float64Array.from({ length: n }, () => nextGaussian(rng));
      const f = luDecompose(a, n);
      expect(f).not.toBeNull();
      const x = luSolve(f!, b, new Float64Array(n));
      const refX = new LuDecomposition(toMatrix(a, n)).solve(Matrix.columnVector(Array.from(b)));
      for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(refX.get(i, 0), 8);
    }
  });

  it('returns null for a singular matrix', () => {
    expect(luDecompose([1, 2, 2, 4], 2)).toBeNull();
  });
});

describe('symmetricEigen (cyclic Jacobi)', () => {
  it.each(sizes)('matches ml-matrix EigenvalueDecomposition on random symmetric %i x %i matrices', (n) => {
    const rng = createRng(300 + n);
    for (let trial = 0; trial < 5; trial++) {
      const a = randomSymmetric(rng, n);
      const { values, vectors } = symmetricEigen(a, n);
      const ref = new EigenvalueDecomposition(toMatrix(a, n), { assumeSymmetric: true });
      const refValues = [...ref.realEigenvalues].sort((p, q) => p - q);
      for (let k = 0; k < n; k++) expect(values[k]).toBeCloseTo(refValues[k], 11);
      // Eigenvectors up to sign: |<v_k, w_k>| = 1 (random eigenvalues are distinct almost surely).
      const refOrder = [...ref.realEigenvalues.keys()].sort((p, q) => ref.realEigenvalues[p] - ref.realEigenvalues[q]);
      for (let k = 0; k < n; k++) {
        let d = 0;
        for (let i = 0; i < n; i++) d += vectors[i * n + k] * ref.eigenvectorMatrix.get(i, refOrder[k]);
        expect(Math.abs(d)).toBeCloseTo(1, 9);
      }
      // A V = V diag(values) and V^T V = I.
      for (let i = 0; i < n; i++)
        for (let k = 0; k < n; k++) {
          let av = 0;
          let vtv = 0;
          for (let j = 0; j < n; j++) {
            av += a[i * n + j] * vectors[j * n + k];
            vtv += vectors[j * n + i] * vectors[j * n + k];
          }
          expect(av).toBeCloseTo(values[k] * vectors[i * n + k], 11);
          expect(vtv).toBeCloseTo(i === k ? 1 : 0, 12);
        }
    }
  });

  it('returns ascending eigenvalues of a known matrix: [[2, 1], [1, 2]] has 1 and 3 (hand-computed)', () => {
    const { values, vectors } = symmetricEigen([2, 1, 1, 2], 2);
    expect(values[0]).toBeCloseTo(1, 14);
    expect(values[1]).toBeCloseTo(3, 14);
    expect(Math.abs(vectors[0])).toBeCloseTo(Math.SQRT1_2, 14);
  });

  it('handles a diagonal matrix with repeated eigenvalues without rotating', () => {
    const { values, vectors, sweeps } = symmetricEigen([5, 0, 0, 0, -1, 0, 0, 0, 5], 3);
    expect(Array.from(values)).toEqual([-1, 5, 5]);
    expect(sweeps).toBe(0);
    expect(Math.abs(vectors[1 * 3 + 0])).toBe(1);
  });
});
