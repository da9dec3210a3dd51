import { symmetricEigen } from '../linalg';
import type { SlicePlane } from './plane';

export interface PcaPlaneOptions {
  /**
   * Subtract the mean difference before the decomposition (textbook PCA: variance about the path's
   * mean). Default false: the directions then describe the displacement from the final point, which is
   * the plot's origin, so a path heading straight in has that heading as its first direction, and the
   * explained ratios are shares of the total squared distance from the final point. Li et al. (2018)
   * form rows theta_i - theta_final; whether they then centre we could not confirm, hence the option.
   */
  subtractMean?: boolean;
}

export interface PcaPlane {
  /** origin = the final point; u, v = the first two principal directions (orthonormal). */
  plane: SlicePlane;
  /** Share of the total (squared distance or variance) along u and along v, each in [0, 1]. */
  explained: [number, number];
  /** count x 2, row-major: (a_i, b_i) = (<theta_i - theta_final, u>, <theta_i - theta_final, v>). */
  projected: Float64Array;
  /**
   * How many of the two directions the path determines: 2 normally; 1 for a straight path (v is then
   * any unit vector orthogonal to u, explained[1] = 0); 0 when every point equals the final one (u, v
   * are the first two coordinate axes, explained [0, 0]).
   */
  rank: 0 | 1 | 2;
}

/**
 * A second eigenvalue below this share of the first counts as zero: the Gram route squares singular
 * values, so rounding leaves eigenvalues near 1e-16 of the largest where the true ones are 0.
 */
const RANK_TOLERANCE = 1e-10;

/**
 * The plane of a trajectory's first two principal directions (Li, Xu, Taylor, Studer & Goldstein,
 * "Visualizing the Loss Landscape of Neural Nets", NeurIPS 2018, Sec. 7): with snapshots theta_0 ...
 * theta_{count-1} (row-major in `points`, n per row) and M the (count - 1) x n matrix of rows
 * theta_i - theta_final, the directions are M's top two right singular vectors. They are computed from
 * the smaller of the two symmetric matrices, M M^T (then d = M^T w / |M^T w|) or M^T M, with the
 * engine's Jacobi eigen-solver; cost O(min(count, n)^3), so decimate very long runs of large models
 * first. Signs, arbitrary in PCA, are fixed so that the first snapshot projects to a <= 0 and b <= 0
 * (the run travels towards +a, +b; if it projects to 0, the largest entry of the direction is positive).
 */
export function pcaPlane(points: ArrayLike<number>, count: number, n: number, options: PcaPlaneOptions = {}): PcaPlane {
  if (!Number.isInteger(n) || n < 2) throw new Error(`pcaPlane: a plane needs at least 2 parameters, got ${n}`);
  if (!Number.isInteger(count) || count < 1) throw new Error(`pcaPlane: count must be a whole number of at least 1, got ${count}`);
  if (points.length !== count * n) throw new Error(`pcaPlane: expected ${count} x ${n} = ${count * n} numbers, got ${points.length}`);
  for (let k = 0; k < points.length; k++)
    if (!Number.isFinite(points[k])) throw new Error(`pcaPlane: point ${Math.floor(k / n)} has a non-finite coordinate ${(k % n) + 1}`);

  const last = (count - 1) * n;
  const m = count - 1;
  const rows = differences(points, m, n, last, options.subtractMean ?? false);
  let total = 0;
  for (let k = 0; k < rows.length; k++) total += rows[k] * rows[k];

  let u: Float64Array, v: Float64Array, rank: 0 | 1 | 2;
  let explained: [number, number];
  if (!(total > 0)) {
    u = axis(n, 0);
    v = axis(n, 1);
    rank = 0;
    explained = [0, 0];
  } else {
    const top = topTwo(rows, m, n);
    u = top.first;
    const secondCounts = top.second !== null && top.lambda2 > RANK_TOLERANCE * top.lambda1;
    v = secondCounts ? orthonormalised(top.second!, u) : complement(u);
    rank = secondCounts ? 2 : 1;
    explained = [clamp01(top.lambda1 / total), secondCounts ? clamp01(top.lambda2 / total) : 0];
  }
  fixSign(u, points, last, n);
  fixSign(v, points, last, n);

  const projected = new Float64Array(2 * count);
  for (let i = 0; i < count; i++) {
    let a = 0, b = 0;
    for (let k = 0; k < n; k++) {
      const d = points[i * n + k] - points[last + k];
      a += d * u[k];
      b += d * v[k];
    }
    projected[2 * i] = a;
    projected[2 * i + 1] = b;
  }
  return { plane: { origin: Array.from({ length: n }, (_, k) => points[last + k]), u: Array.from(u), v: Array.from(v) }, explained, projected, rank };
}

/** Rows theta_i - theta_final (i < m), optionally with their column means removed. */
function differences(points: ArrayLike<number>, m: number, n: number, last: number, subtractMean: boolean): Float64Array {
  const rows = new Float64Array(m * n);
  for (let i = 0; i < m; i++) for (let k = 0; k < n; k++) rows[i * n + k] = points[i * n + k] - points[last + k];
  if (subtractMean && m > 0) {
    for (let k = 0; k < n; k++) {
      let mean = 0;
      for (let i = 0; i < m; i++) mean += rows[i * n + k];
      mean /= m;
      for (let i = 0; i < m; i++) rows[i * n + k] -= mean;
    }
  }
  return rows;
}

/** Top two eigenpairs of M^T M as unit vectors in R^n, through whichever Gram matrix is smaller. */
function topTwo(rows: Float64Array, m: number, n: number): { first: Float64Array; second: Float64Array | null; lambda1: number; lambda2: number } {
  if (m <= n) {
    const g = new Float64Array(m * m);
    for (let i = 0; i < m; i++)
      for (let j = 0; j <= i; j++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += rows[i * n + k] * rows[j * n + k];
        g[i * m + j] = g[j * m + i] = s;
      }
    const { values, vectors } = symmetricEigen(g, m);
    const lift = (c: number) => {
      const d = new Float64Array(n);
      for (let i = 0; i < m; i++) {
        const w = vectors[i * m + c];
        for (let k = 0; k < n; k++) d[k] += w * rows[i * n + k];
      }
      return normalised(d);
    };
    return {
      first: lift(m - 1),
      second: m >= 2 ? lift(m - 2) : null,
      lambda1: Math.max(0, values[m - 1]),
      lambda2: m >= 2 ? Math.max(0, values[m - 2]) : 0,
    };
  }
  const c = new Float64Array(n * n);
  for (let p = 0; p < n; p++)
    for (let q = 0; q <= p; q++) {
      let s = 0;
      for (let i = 0; i < m; i++) s += rows[i * n + p] * rows[i * n + q];
      c[p * n + q] = c[q * n + p] = s;
    }
  const { values, vectors } = symmetricEigen(c, n);
  const column = (k: number) => normalised(Float64Array.from({ length: n }, (_, r) => vectors[r * n + k]));
  return { first: column(n - 1), second: column(n - 2), lambda1: Math.max(0, values[n - 1]), lambda2: Math.max(0, values[n - 2]) };
}

function normalised(d: Float64Array): Float64Array {
  let s = 0;
  for (let k = 0; k < d.length; k++) s += d[k] * d[k];
  const r = Math.sqrt(s);
  if (r > 0) for (let k = 0; k < d.length; k++) d[k] /= r;
  return d;
}

/** d with its component along the unit vector u removed, normalised (one Gram-Schmidt step). */
function orthonormalised(d: Float64Array, u: Float64Array): Float64Array {
  let s = 0;
  for (let k = 0; k < d.length; k++) s += d[k] * u[k];
  for (let k = 0; k < d.length; k++) d[k] -= s * u[k];
  return normalised(d);
}

/** A unit vector orthogonal to the unit vector u: the coordinate axis least aligned with u, Gram-Schmidt. */
function complement(u: Float64Array): Float64Array {
  let best = 0;
  for (let k = 1; k < u.length; k++) if (Math.abs(u[k]) < Math.abs(u[best])) best = k;
  return orthonormalised(axis(u.length, best), u);
}

function axis(n: number, k: number): Float64Array {
  const e = new Float64Array(n);
  e[k] = 1;
  return e;
}

/** Flips d so the first snapshot projects to <= 0 on it (ties: the largest entry positive). */
function fixSign(d: Float64Array, points: ArrayLike<number>, last: number, n: number): void {
  let s = 0;
  for (let k = 0; k < n; k++) s += (points[k] - points[last + k]) * d[k];
  let flip = s > 0;
  if (s === 0) {
    let big = 0;
    for (let k = 1; k < n; k++) if (Math.abs(d[k]) > Math.abs(d[big])) big = k;
    flip = d[big] < 0;
  }
  if (flip) for (let k = 0; k < n; k++) d[k] = -d[k];
}

function clamp01(x: number): number {
  return Math.min(1, Math.max(0, x));
}
