import { dot } from '../../vector';

/**
 * The m most recent curvature pairs of L-BFGS, s_i = x_{i+1} - x_i and y_i = grad_{i+1} - grad_i, with
 * rho_i = 1 / (y_i . s_i), in a ring buffer (plain data: part of the optimizer state).
 */
export interface CurvatureHistory {
  capacity: number;
  dimension: number;
  /** capacity x dimension, row i = pair slot i. */
  s: Float64Array;
  y: Float64Array;
  rho: Float64Array;
  /** Pairs held, <= capacity. */
  count: number;
  /** Slot of the newest pair (meaningless when count = 0). */
  newest: number;
}

export function createHistory(capacity: number, dimension: number): CurvatureHistory {
  return {
    capacity,
    dimension,
    s: new Float64Array(capacity * dimension),
    y: new Float64Array(capacity * dimension),
    rho: new Float64Array(capacity),
    count: 0,
    newest: capacity - 1,
  };
}

export function clearHistory(h: CurvatureHistory): void {
  h.count = 0;
  h.newest = h.capacity - 1;
}

/** Stores (s, y) over the oldest pair. The caller has checked y . s > 0. */
export function pushPair(h: CurvatureHistory, s: ArrayLike<number>, y: ArrayLike<number>, ys: number): void {
  const slot = (h.newest + 1) % h.capacity;
  const n = h.dimension;
  for (let i = 0; i < n; i++) {
    h.s[slot * n + i] = s[i];
    h.y[slot * n + i] = y[i];
  }
  h.rho[slot] = 1 / ys;
  h.newest = slot;
  h.count = Math.min(h.count + 1, h.capacity);
}

/**
 * The L-BFGS search direction p = -H_k g by the two-loop recursion (Nocedal & Wright, Numerical
 * Optimization, 2nd ed., Alg. 7.4) with the initial matrix H_k^0 = gamma_k I,
 * gamma_k = s_{k-1}^T y_{k-1} / y_{k-1}^T y_{k-1} (eq. 7.20):
 *   q = g; for i = newest..oldest: alpha_i = rho_i s_i^T q, q -= alpha_i y_i;
 *   r = gamma q; for i = oldest..newest: beta = rho_i y_i^T r, r += (alpha_i - beta) s_i;  p = -r.
 * With no pairs, p = -g. `alpha` is scratch of length capacity.
 */
export function twoLoopDirection(h: CurvatureHistory, g: ArrayLike<number>, out: Float64Array, alpha: Float64Array): Float64Array {
  const n = h.dimension;
  for (let i = 0; i < n; i++) out[i] = g[i];
  if (h.count === 0) {
    for (let i = 0; i < n; i++) out[i] = -out[i];
    return out;
  }
  const slot = (k: number) => (h.newest - k + h.capacity) % h.capacity; // k = 0 is the newest
  for (let k = 0; k < h.count; k++) {
    const j = slot(k);
    const sj = h.s.subarray(j * n, j * n + n);
    const yj = h.y.subarray(j * n, j * n + n);
    const a = h.rho[j] * dot(sj, out);
    alpha[j] = a;
    for (let i = 0; i < n; i++) out[i] -= a * yj[i];
  }
  const newestY = h.y.subarray(h.newest * n, h.newest * n + n);
  const gamma = 1 / (h.rho[h.newest] * dot(newestY, newestY));
  for (let i = 0; i < n; i++) out[i] *= gamma;
  for (let k = h.count - 1; k >= 0; k--) {
    const j = slot(k);
    const sj = h.s.subarray(j * n, j * n + n);
    const yj = h.y.subarray(j * n, j * n + n);
    const beta = h.rho[j] * dot(yj, out);
    const c = alpha[j] - beta;
    for (let i = 0; i < n; i++) out[i] += c * sj[i];
  }
  for (let i = 0; i < n; i++) out[i] = -out[i];
  return out;
}
