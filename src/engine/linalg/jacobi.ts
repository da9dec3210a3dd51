/**
 * Eigen-decomposition of a real symmetric matrix by the cyclic Jacobi method
 * (Jacobi 1846; Golub & Van Loan, Matrix Computations, 4th ed., Sec. 8.5, Alg. 8.5.3).
 *
 * Each rotation J(p, q, theta) zeroes the off-diagonal entry a_pq of A <- J^T A J:
 *   tau = (a_qq - a_pp) / (2 a_pq),  t = sign(tau) / (|tau| + sqrt(1 + tau^2))  (the smaller root),
 *   c = 1 / sqrt(1 + t^2),  s = t c,
 *   a_pp <- a_pp - t a_pq,  a_qq <- a_qq + t a_pq,  a_pq <- 0,
 *   a_kp <- c a_kp - s a_kq,  a_kq <- s a_kp + c a_kq  (k != p, q),
 * and the eigenvector matrix accumulates V <- V J. Sweeps over all pairs p < q repeat until the
 * off-diagonal Frobenius norm is negligible next to the whole matrix's; convergence is quadratic
 * once the off-diagonal part is small. O(n^3) per sweep: meant for the small matrices here (Hessians
 * of a few to a few dozen parameters), where its accuracy (small relative errors in the eigenvalues)
 * and simplicity beat the QR algorithm's speed.
 */

export interface SymmetricEigen {
  /** Eigenvalues in ascending order. */
  values: Float64Array;
  /** Row-major n x n; column k (entries vectors[i * n + k]) is the unit eigenvector for values[k]. */
  vectors: Float64Array;
  /** Sweeps used. */
  sweeps: number;
}

const MAX_SWEEPS = 100;

/**
 * Decomposes the symmetric row-major matrix `a` (not modified; only read as symmetric, i.e. both
 * triangles should agree). `work` (n x n) may be passed to avoid allocation.
 */
export function symmetricEigen(
  a: ArrayLike<number>,
  n: number,
  out?: { values: Float64Array; vectors: Float64Array; work?: Float64Array },
): SymmetricEigen {
  const values = out?.values ?? new Float64Array(n);
  const v = out?.vectors ?? new Float64Array(n * n);
  const m = out?.work ?? new Float64Array(n * n);
  let total = 0;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      // Symmetrise so a slightly asymmetric input (rounding in a Hessian) is handled consistently.
      const x = 0.5 * (a[i * n + j] + a[j * n + i]);
      m[i * n + j] = x;
      total += x * x;
      v[i * n + j] = i === j ? 1 : 0;
    }
  if (!Number.isFinite(total)) throw new Error('symmetricEigen: the matrix has a non-finite entry');
  let sweeps = 0;
  for (; sweeps < MAX_SWEEPS; sweeps++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += m[p * n + q] * m[p * n + q];
    if (off <= 1e-32 * total || off === 0) break;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = m[p * n + q];
        if (apq === 0) continue;
        const app = m[p * n + p];
        const aqq = m[q * n + q];
        const tau = (aqq - app) / (2 * apq);
        const t = Math.abs(tau) > 1e150 ? 1 / (2 * tau) : Math.sign(tau || 1) / (Math.abs(tau) + Math.sqrt(1 + tau * tau));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          if (k === p || k === q) continue;
          const akp = m[k * n + p];
          const akq = m[k * n + q];
          const nkp = c * akp - s * akq;
          const nkq = s * akp + c * akq;
          m[k * n + p] = m[p * n + k] = nkp;
          m[k * n + q] = m[q * n + k] = nkq;
        }
        m[p * n + p] = app - t * apq;
        m[q * n + q] = aqq + t * apq;
        m[p * n + q] = m[q * n + p] = 0;
        for (let k = 0; k < n; k++) {
          const vkp = v[k * n + p];
          const vkq = v[k * n + q];
          v[k * n + p] = c * vkp - s * vkq;
          v[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  sortAscending(m, v, values, n);
  return { values, vectors: v, sweeps };
}

/** Copies the diagonal into `values` in ascending order, permuting the columns of `v` to match. */
function sortAscending(m: Float64Array, v: Float64Array, values: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) values[i] = m[i * n + i];
  for (let i = 0; i < n - 1; i++) {
    let k = i;
    for (let j = i + 1; j < n; j++) if (values[j] < values[k]) k = j;
    if (k === i) continue;
    const tmp = values[i];
    values[i] = values[k];
    values[k] = tmp;
    for (let r = 0; r < n; r++) {
      const x = v[r * n + i];
      v[r * n + i] = v[r * n + k];
      v[r * n + k] = x;
    }
  }
}
