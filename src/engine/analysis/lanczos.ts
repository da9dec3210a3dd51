import { createRng, nextGaussian, type RngState } from '../rng';
import { tridiagonalEigen, tridiagonalScratch } from './tridiagonal';

/**
 * The extreme eigenvalues of a symmetric linear operator A of order n, given only products A v, by
 * the Lanczos method (C. Lanczos, "An iteration method for the solution of the eigenvalue problem of
 * linear differential and integral operators", J. Res. Nat. Bur. Standards 45, 1950).
 *
 * From a unit start vector q_1 the three-term recurrence
 *   w = A q_j - beta_{j-1} q_{j-1},  alpha_j = q_j . w,  w <- w - alpha_j q_j,
 *   beta_j = |w|,  q_{j+1} = w / beta_j
 * builds an orthonormal basis Q_k of the Krylov space span{q_1, A q_1, ..., A^{k-1} q_1} with
 * Q_k^T A Q_k = T_k, tridiagonal (alpha on the diagonal, beta beside it). The eigenvalues of T_k (Ritz
 * values) approach A's extreme eigenvalues first (Kaniel-Paige theory).
 *
 * Full reorthogonalisation: in floating point the q_j lose orthogonality as soon as a Ritz value
 * converges (C. C. Paige, "Computational variants of the Lanczos method for the eigenproblem", J.
 * Inst. Maths Applics 10, 1972), and copies of converged eigenvalues appear. Each new w is therefore
 * orthogonalised against every earlier q_i by classical Gram-Schmidt, done twice ("twice is enough",
 * Golub & Van Loan, Matrix Computations, 4th ed., Sec. 10.3.1 and 5.2.8). Cost per step: one product
 * plus O(n k); memory: the basis, k n numbers.
 *
 * Convergence test (on the Ritz residual): with T_k = S diag(theta) S^T and Ritz vector y_i = Q_k s_i,
 * |A y_i - theta_i y_i| = beta_k |s_{k,i}| (the last component of s_i; Paige 1972). The run stops when
 * both extreme Ritz pairs satisfy beta_k |s_{k,i}| <= tolerance * max(|theta_min|, |theta_max|); for a
 * symmetric A each then lies within that residual of an eigenvalue of A (and typically within
 * residual^2 / gap). When the Krylov space becomes invariant (beta_k tiny next to the largest |theta|),
 * the run continues from a fresh random vector orthogonal to the basis (T gets a zero off-diagonal,
 * i.e. a new block), so eigenvalues outside the start's invariant subspace are not missed. After n
 * steps T_n is similar to A: every eigenvalue is exact to rounding and the run reports convergence.
 *
 * The start vector is Gaussian from the seeded generator (rng.ts), so results repeat exactly.
 */
export interface LanczosOptions {
  /**
   * Steps (products) at most; default min(n, 200, max(30, floor(2^23 / n))), which keeps the basis
   * under 64 MiB. Capped at n.
   */
  maxIterations?: number;
  /** Relative Ritz-residual tolerance (see above); default 1e-10. */
  tolerance?: number;
  /** Seed of the start vector; default 1. */
  seed?: number;
}

export interface ExtremeEigenvalues {
  /** Smallest Ritz value (an estimate of lambda_min from above). */
  smallest: number;
  /** Largest Ritz value (an estimate of lambda_max from below). */
  largest: number;
  /** Lanczos steps taken, i.e. operator products. */
  iterations: number;
  /** Whether both extreme Ritz residuals met the tolerance (or the whole space was spanned). */
  converged: boolean;
  /**
   * The larger of the two extreme Ritz residual norms |A y - theta y| at the end (0 when the last step
   * closed an invariant subspace or spanned R^n).
   */
  residual: number;
}

/** `apply(v, out)` writes A v into out (length n); it must not keep either array. */
export type SymmetricOperator = (v: Float64Array, out: Float64Array) => void;

export function defaultLanczosIterations(n: number): number {
  return Math.max(1, Math.min(n, 200, Math.max(30, Math.floor(2 ** 23 / n))));
}

export function extremeEigenvalues(apply: SymmetricOperator, n: number, options: LanczosOptions = {}): ExtremeEigenvalues {
  if (!(Number.isInteger(n) && n >= 1)) throw new RangeError(`extremeEigenvalues: n must be a whole number >= 1, got ${n}`);
  const m = Math.min(n, options.maxIterations ?? defaultLanczosIterations(n));
  if (!(Number.isInteger(m) && m >= 1)) throw new RangeError(`extremeEigenvalues: maxIterations must be a whole number >= 1, got ${options.maxIterations}`);
  const tolerance = options.tolerance ?? 1e-10;
  if (!(tolerance >= 0)) throw new RangeError(`extremeEigenvalues: tolerance must be >= 0, got ${tolerance}`);
  const rng = createRng(options.seed ?? 1);

  const basis = new Float64Array(m * n);
  const w = new Float64Array(n);
  const alpha = new Float64Array(m);
  const beta = new Float64Array(m);
  const tri = tridiagonalScratch(m);

  if (!freshDirection(rng, basis, 0, n, w)) throw new Error('extremeEigenvalues: could not draw a start vector');
  basis.set(w, 0);

  let smallest = NaN;
  let largest = NaN;
  let residual = Infinity;
  let converged = false;
  let k = 0;
  while (k < m) {
    const q = basis.subarray(k * n, (k + 1) * n);
    apply(q, w);
    for (let i = 0; i < n; i++) if (!Number.isFinite(w[i])) throw new Error(`extremeEigenvalues: the operator gave a non-finite entry at step ${k + 1}`);
    let a = 0;
    for (let i = 0; i < n; i++) a += q[i] * w[i];
    alpha[k] = a;
    // Three-term recurrence, then two passes of classical Gram-Schmidt against the whole basis; the
    // first pass's coefficient on q_k corrects alpha_k.
    const bPrev = k > 0 ? beta[k - 1] : 0;
    const prev = k > 0 ? (k - 1) * n : 0;
    for (let i = 0; i < n; i++) w[i] -= a * q[i] + (k > 0 ? bPrev * basis[prev + i] : 0);
    for (let pass = 0; pass < 2; pass++) {
      for (let j = 0; j <= k; j++) {
        const o = j * n;
        let c = 0;
        for (let i = 0; i < n; i++) c += basis[o + i] * w[i];
        for (let i = 0; i < n; i++) w[i] -= c * basis[o + i];
        if (j === k) alpha[k] += c;
      }
    }
    let b = 0;
    for (let i = 0; i < n; i++) b += w[i] * w[i];
    b = Math.sqrt(b);
    k++;

    tridiagonalEigen(alpha, beta, k, tri);
    let iMin = 0;
    let iMax = 0;
    for (let i = 1; i < k; i++) {
      if (tri.d[i] < tri.d[iMin]) iMin = i;
      if (tri.d[i] > tri.d[iMax]) iMax = i;
    }
    smallest = tri.d[iMin];
    largest = tri.d[iMax];
    const radius = Math.max(Math.abs(smallest), Math.abs(largest));
    const invariant = b <= 1e-12 * radius || b === 0;
    if (k === n) {
      // T_n is similar to A: every Ritz value is an eigenvalue to rounding.
      residual = 0;
      converged = true;
      break;
    }
    if (!invariant) {
      residual = Math.max(b * Math.abs(tri.lastRow[iMin]), b * Math.abs(tri.lastRow[iMax]));
      if (residual <= tolerance * radius) {
        converged = true;
        break;
      }
      if (k === m) break;
      beta[k - 1] = b;
      const next = k * n;
      for (let i = 0; i < n; i++) basis[next + i] = w[i] / b;
    } else {
      // The Krylov space is invariant: start a new block orthogonal to everything so far.
      beta[k - 1] = 0;
      residual = 0;
      if (k === m) break;
      if (!freshDirection(rng, basis, k, n, w)) {
        // The basis already spans R^n to working precision.
        converged = true;
        break;
      }
      basis.set(w, k * n);
    }
  }
  return { smallest, largest, iterations: k, converged, residual };
}

/**
 * A Gaussian vector orthogonalised (twice) against basis rows 0..count-1 and normalised, into `out`;
 * false when nothing is left after orthogonalisation.
 */
function freshDirection(rng: RngState, basis: Float64Array, count: number, n: number, out: Float64Array): boolean {
  for (let attempt = 0; attempt < 3; attempt++) {
    for (let i = 0; i < n; i++) out[i] = nextGaussian(rng);
    let before = 0;
    for (let i = 0; i < n; i++) before += out[i] * out[i];
    for (let pass = 0; pass < 2; pass++)
      for (let j = 0; j < count; j++) {
        const o = j * n;
        let c = 0;
        for (let i = 0; i < n; i++) c += basis[o + i] * out[i];
        for (let i = 0; i < n; i++) out[i] -= c * basis[o + i];
      }
    let after = 0;
    for (let i = 0; i < n; i++) after += out[i] * out[i];
    if (after > 1e-20 * before) {
      const scale = 1 / Math.sqrt(after);
      for (let i = 0; i < n; i++) out[i] *= scale;
      return true;
    }
  }
  return false;
}
