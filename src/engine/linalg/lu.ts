/**
 * LU factorisation with partial (row) pivoting, P A = L U, for square row-major n x n matrices that
 * need not be symmetric or definite (Golub & Van Loan, Matrix Computations, 4th ed., Alg. 3.4.1).
 * L (unit lower) and U are packed into one matrix; `pivots[i]` is the original row now in row i.
 */
export interface LuFactors {
  n: number;
  lu: Float64Array;
  pivots: Int32Array;
}

/**
 * Factorises `a` (not modified). Returns null when a pivot is exactly zero or not finite (the matrix
 * is singular to working precision in the sense of this elimination).
 */
export function luDecompose(a: ArrayLike<number>, n: number, out?: LuFactors): LuFactors | null {
  const f = out ?? { n, lu: new Float64Array(n * n), pivots: new Int32Array(n) };
  const lu = f.lu;
  for (let i = 0; i < n * n; i++) lu[i] = a[i];
  for (let i = 0; i < n; i++) f.pivots[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(lu[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (!(best > 0) || !Number.isFinite(best)) return null;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const tmp = lu[k * n + j];
        lu[k * n + j] = lu[p * n + j];
        lu[p * n + j] = tmp;
      }
      const tp = f.pivots[k];
      f.pivots[k] = f.pivots[p];
      f.pivots[p] = tp;
    }
    const pivot = lu[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const m = (lu[i * n + k] /= pivot);
      if (m !== 0) for (let j = k + 1; j < n; j++) lu[i * n + j] -= m * lu[k * n + j];
    }
  }
  return f;
}

/** Solves A x = b from the factors. `out` must not alias `b`. */
export function luSolve(f: LuFactors, b: ArrayLike<number>, out: Float64Array): Float64Array {
  const { n, lu, pivots } = f;
  for (let i = 0; i < n; i++) {
    let s = b[pivots[i]];
    for (let k = 0; k < i; k++) s -= lu[i * n + k] * out[k];
    out[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = out[i];
    for (let k = i + 1; k < n; k++) s -= lu[i * n + k] * out[k];
    out[i] = s / lu[i * n + i];
  }
  return out;
}
