import { distance } from '../run/recent';

/**
 * The basin of attraction a run ended in, read from its end point: the index of the nearest known
 * minimum within Euclidean distance `tolerance` of the end point, or -1 (no known minimum that close,
 * or a non-finite end point). Ties go to the lower index.
 */
export function basinOf(endPoint: ArrayLike<number>, knownMinima: readonly ArrayLike<number>[], tolerance: number): number {
  let best = -1;
  let bestDistance = Infinity;
  for (let k = 0; k < knownMinima.length; k++) {
    const d = distance(endPoint, knownMinima[k]);
    if (d <= tolerance && d < bestDistance) {
      best = k;
      bestDistance = d;
    }
  }
  return best;
}

/** basinOf for every row of `endPoints` (count x n). */
export function basinsOf(endPoints: Float64Array, n: number, knownMinima: readonly ArrayLike<number>[], tolerance: number): Int32Array {
  const count = endPoints.length / n;
  const labels = new Int32Array(count);
  for (let r = 0; r < count; r++) labels[r] = basinOf(endPoints.subarray(r * n, (r + 1) * n), knownMinima, tolerance);
  return labels;
}

export interface EndPointClusters {
  /** Cluster of each run (-1 for a non-finite end point). */
  labels: Int32Array;
  /** clusters x n: each cluster's first member (its leader), in order of first appearance. */
  leaders: Float64Array;
  /** Members per cluster. */
  sizes: Int32Array;
  count: number;
}

/**
 * Groups end points for a surface without known minima, by the leader rule (Hartigan, "Clustering
 * Algorithms", Wiley 1975, ch. 3): in run order, an end point joins the first existing cluster whose
 * leader lies within Euclidean distance `radius` of it, otherwise it becomes the leader of a new
 * cluster. Every member is therefore within `radius` of its cluster's leader, and leaders are more
 * than `radius` apart. The result depends on run order only for points that lie within `radius` of
 * two leaders; choose `radius` well below the distance between the minima you expect. Cost O(count x
 * clusters x n).
 */
export function clusterEndPoints(endPoints: Float64Array, n: number, radius: number): EndPointClusters {
  if (!(radius >= 0)) throw new Error(`clusterEndPoints: radius must be a number >= 0, got ${radius}`);
  const count = endPoints.length / n;
  const labels = new Int32Array(count);
  const leaders: number[] = [];
  const sizes: number[] = [];
  for (let r = 0; r < count; r++) {
    const p = endPoints.subarray(r * n, (r + 1) * n);
    let finite = true;
    for (let i = 0; i < n; i++) if (!Number.isFinite(p[i])) finite = false;
    if (!finite) {
      labels[r] = -1;
      continue;
    }
    let label = -1;
    for (let c = 0; c < sizes.length && label < 0; c++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += (p[i] - leaders[c * n + i]) ** 2;
      if (Math.sqrt(s) <= radius) label = c;
    }
    if (label < 0) {
      label = sizes.length;
      sizes.push(0);
      for (let i = 0; i < n; i++) leaders.push(p[i]);
    }
    sizes[label] += 1;
    labels[r] = label;
  }
  return { labels, leaders: Float64Array.from(leaders), sizes: Int32Array.from(sizes), count: sizes.length };
}
