/**
 * Cholesky factorisation A = L L^T of a symmetric positive-definite matrix, row-major n x n.
 *
 * Column-by-column (Cholesky-Banachiewicz) form: for j = 0..n-1,
 *   L_jj = sqrt(A_jj - sum_{k<j} L_jk^2),  L_ij = (A_ij - sum_{k<j} L_ik L_jk) / L_jj  (i > j).
 * Only the lower triangle of A is read. The factorisation fails (returns false) as soon as a pivot
 * A_jj - sum L_jk^2 is not a finite number > 0, which is the standard test for positive definiteness
 * (Golub & Van Loan, Matrix Computations, 4th ed., Sec. 4.2).
 */
export function choleskyDecompose(a: ArrayLike<number>, n: number, out: Float64Array): boolean {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= out[i * n + k] * out[j * n + k];
      if (i === j) {
        if (!(s > 0) || !Number.isFinite(s)) return false;
        out[i * n + i] = Math.sqrt(s);
      } else {
        out[i * n + j] = s / out[j * n + j];
      }
    }
    for (let j = i + 1; j < n; j++) out[i * n + j] = 0;
  }
  return true;
}

/**
 * Solves L L^T x = b given the factor from `choleskyDecompose`: forward substitution L z = b, then
 * back substitution L^T x = z. `out` may alias `b`.
 */
export function choleskySolve(l: ArrayLike<number>, n: number, b: ArrayLike<number>, out: Float64Array): Float64Array {
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i * n + k] * out[k];
    out[i] = s / l[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = out[i];
    for (let k = i + 1; k < n; k++) s -= l[k * n + i] * out[k];
    out[i] = s / l[i * n + i];
  }
  return out;
}
