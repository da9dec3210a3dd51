/**
 * Eigenvalues of a symmetric tridiagonal matrix T (diagonal d[0..m), off-diagonal e[0..m-1), e[i]
 * coupling rows i and i + 1) by the implicit QL method with Wilkinson-type shifts (Bowdler, Martin,
 * Reinsch & Wilkinson, "The QR and QL algorithms for symmetric matrices", Numer. Math. 11, 1968, the
 * EISPACK routine tql2; Golub & Van Loan, Matrix Computations, 4th ed., Sec. 8.3).
 *
 * Each QL sweep is a chain of plane rotations T <- G^T T G; the eigenvector matrix Z is their product.
 * Lanczos needs only the last component of each eigenvector (the Ritz residual is
 * beta_m |z_{m-1,i}|, Paige 1972), so only the last row of Z is carried: each rotation on columns
 * (i, i + 1) updates two entries of that row, O(1), and the whole decomposition costs O(m^2) instead
 * of O(m^3). Deflation: e[k] is dropped when |e[k]| <= eps (|d[k]| + |d[k + 1]|).
 */
export interface TridiagonalScratch {
  d: Float64Array;
  e: Float64Array;
  lastRow: Float64Array;
}

export function tridiagonalScratch(m: number): TridiagonalScratch {
  return { d: new Float64Array(m), e: new Float64Array(m), lastRow: new Float64Array(m) };
}

/**
 * Decomposes T of order m (alpha: diagonal, beta: off-diagonal, both read only). On return
 * `s.d[0..m)` holds the eigenvalues (unordered) and `s.lastRow[i]` the last component of the unit
 * eigenvector for `s.d[i]`.
 */
export function tridiagonalEigen(alpha: ArrayLike<number>, beta: ArrayLike<number>, m: number, s: TridiagonalScratch): void {
  const { d, e, lastRow: z } = s;
  for (let i = 0; i < m; i++) {
    d[i] = alpha[i];
    e[i] = i < m - 1 ? beta[i] : 0;
    z[i] = i === m - 1 ? 1 : 0;
  }
  for (let l = 0; l < m; l++) {
    let iterations = 0;
    let mm: number;
    do {
      for (mm = l; mm < m - 1; mm++) {
        const dd = Math.abs(d[mm]) + Math.abs(d[mm + 1]);
        if (Math.abs(e[mm]) <= Number.EPSILON * dd) break;
      }
      if (mm === l) break;
      if (iterations++ === 60) throw new Error('tridiagonalEigen: no convergence after 60 QL iterations');
      let g = (d[l + 1] - d[l]) / (2 * e[l]);
      let r = Math.hypot(g, 1);
      g = d[mm] - d[l] + e[l] / (g + (g >= 0 ? r : -r));
      let sn = 1;
      let c = 1;
      let p = 0;
      let i = mm - 1;
      for (; i >= l; i--) {
        const f = sn * e[i];
        const b = c * e[i];
        r = Math.hypot(f, g);
        e[i + 1] = r;
        if (r === 0) {
          // Underflow: T splits here; recover and restart the sweep.
          d[i + 1] -= p;
          e[mm] = 0;
          break;
        }
        sn = f / r;
        c = g / r;
        g = d[i + 1] - p;
        r = (d[i] - g) * sn + 2 * c * b;
        p = sn * r;
        d[i + 1] = g + p;
        g = c * r - b;
        const zf = z[i + 1];
        z[i + 1] = sn * z[i] + c * zf;
        z[i] = c * z[i] - sn * zf;
      }
      if (r === 0 && i >= l) continue;
      d[l] -= p;
      e[l] = g;
      e[mm] = 0;
    } while (mm !== l);
  }
}
