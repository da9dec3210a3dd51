import type { Design } from './design';
import type { RegressionLoss } from './spec';

/**
 * Dense linear least squares, min_x |A x - b|^2 for an m x n matrix A (row-major, m >= n), by
 * Householder QR (Golub & Van Loan, Matrix Computations, 4th ed., Sec. 5.2 and 5.3) after scaling
 * each column of A to unit Euclidean norm. Solving the normal equations A^T A x = A^T b directly would
 * square the condition number (Longley's data: from about 1e9 to 1e18, beyond double precision); QR
 * works with A itself, and the column scaling removes the part of the conditioning that is only
 * about units. Throws when A is numerically rank deficient.
 */
export function solveLeastSquares(a: Float64Array, m: number, n: number, b: Float64Array): Float64Array {
  if (m < n) throw new Error(`least squares: need at least as many rows (${m}) as unknowns (${n})`);
  const r = Float64Array.from(a);
  const rhs = Float64Array.from(b);
  const colScale = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let i = 0; i < m; i++) s += r[i * n + j] * r[i * n + j];
    const norm = Math.sqrt(s);
    if (norm === 0) throw new Error(`least squares: column ${j + 1} is all zeros`);
    colScale[j] = 1 / norm;
    for (let i = 0; i < m; i++) r[i * n + j] *= colScale[j];
  }
  const v = new Float64Array(m);
  let largest = 0;
  for (let k = 0; k < n; k++) {
    // Householder vector for column k below the diagonal: H = I - 2 v v^T / (v^T v).
    let norm = 0;
    for (let i = k; i < m; i++) norm += r[i * n + k] * r[i * n + k];
    norm = Math.sqrt(norm);
    const alpha = r[k * n + k] > 0 ? -norm : norm;
    for (let i = k; i < m; i++) v[i] = r[i * n + k];
    v[k] -= alpha;
    let vv = 0;
    for (let i = k; i < m; i++) vv += v[i] * v[i];
    if (vv > 0) {
      for (let j = k; j < n; j++) {
        let s = 0;
        for (let i = k; i < m; i++) s += v[i] * r[i * n + j];
        const f = (2 * s) / vv;
        for (let i = k; i < m; i++) r[i * n + j] -= f * v[i];
      }
      let s = 0;
      for (let i = k; i < m; i++) s += v[i] * rhs[i];
      const f = (2 * s) / vv;
      for (let i = k; i < m; i++) rhs[i] -= f * v[i];
    }
    largest = Math.max(largest, Math.abs(r[k * n + k]));
  }
  const x = new Float64Array(n);
  for (let k = n - 1; k >= 0; k--) {
    const d = r[k * n + k];
    if (!(Math.abs(d) > 1e-13 * largest)) throw new Error(`least squares: the columns are linearly dependent (column ${k + 1} adds nothing)`);
    let s = rhs[k];
    for (let j = k + 1; j < n; j++) s -= r[k * n + j] * x[j];
    x[k] = s / d;
  }
  for (let j = 0; j < n; j++) x[j] *= colScale[j];
  return x;
}

/**
 * The minimiser of a linear regression surface in its own coordinates ([intercept, w...], standardised
 * units when the design is): with loss = scale |X~ w - y|^2 + lambda/2 |w_weights|^2 the normal
 * equations are (X~^T X~ + lambda / (2 scale) D) w = X~^T y, D = diag(0, 1, ..., 1); solved as the
 * least-squares problem of X~ stacked on sqrt(lambda / (2 scale)) D.
 */
export function linearLeastSquares(design: Design, loss: RegressionLoss, l2: number): Float64Array {
  const { x, y, p, rows } = design;
  const n = p + 1;
  const scale = loss === 'rss' ? 1 : 1 / rows;
  const extra = l2 > 0 ? p : 0;
  const m = rows + extra;
  const a = new Float64Array(m * n);
  const b = new Float64Array(m);
  for (let i = 0; i < rows; i++) {
    a[i * n] = 1;
    for (let j = 0; j < p; j++) a[i * n + j + 1] = x[i * p + j];
    b[i] = y[i];
  }
  const root = Math.sqrt(l2 / (2 * scale));
  for (let j = 0; j < extra; j++) a[(rows + j) * n + j + 1] = root;
  return solveLeastSquares(a, m, n, b);
}
