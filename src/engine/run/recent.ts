/**
 * The little of a run's past that the end-state judgement needs, as plain data (part of RunState):
 * the last RECENT_POINTS points and losses in a ring (for cycle detection), and the distance from the
 * start at steps 1, 2, 4, 8, ... (for growth without bound). Recording costs one copy of x per step.
 */
export const RECENT_POINTS = 9;
/** Distance milestones kept: after steps 2^0 .. 2^31. */
export const MILESTONES = 32;

export interface RecentPath {
  /** RECENT_POINTS x n, row (t mod RECENT_POINTS) holds the point after step t. */
  points: Float64Array;
  loss: Float64Array;
  /** Points recorded so far (capped at RECENT_POINTS). */
  filled: number;
  /** distanceAt[k]: Euclidean distance from the start after step 2^k (NaN until reached). */
  distanceAt: Float64Array;
}

export function createRecentPath(x0: Float64Array, loss0: number): RecentPath {
  const path: RecentPath = {
    points: new Float64Array(RECENT_POINTS * x0.length),
    loss: new Float64Array(RECENT_POINTS),
    filled: 0,
    distanceAt: new Float64Array(MILESTONES).fill(Number.NaN),
  };
  recordRecent(path, 0, x0, loss0, x0);
  return path;
}

export function recordRecent(path: RecentPath, t: number, x: Float64Array, loss: number, x0: Float64Array): void {
  recordRecentAt(path.points, 0, x.length, path.loss, 0, 1, path.distanceAt, 0, t, x, 0, x.length, loss, x0, 0);
  if (path.filled < RECENT_POINTS) path.filled += 1;
}

/**
 * recordRecent on flat storage, for a sweep's structure-of-arrays state: slot s (= t mod
 * RECENT_POINTS) of the ring is points[pointsAt + s * pointStride ...] (n values) and
 * loss[lossAt + s * lossStride], the milestones start at distanceAt[milestonesAt] (MILESTONES of
 * them), the point is x[xAt..xAt+n), the start x0[x0At..x0At+n). With strides n and 1 this is one
 * run's RecentPath; a sweep stores slot by slot across runs (stride count x n and count), so a round
 * writes each slot plane in order. The caller keeps `filled` (min(RECENT_POINTS, t + 1) for a run
 * recorded at every step from 0).
 */
export function recordRecentAt(
  points: Float64Array,
  pointsAt: number,
  pointStride: number,
  loss: Float64Array,
  lossAt: number,
  lossStride: number,
  distanceAt: Float64Array,
  milestonesAt: number,
  t: number,
  x: Float64Array,
  xAt: number,
  n: number,
  lossValue: number,
  x0: Float64Array,
  x0At: number,
): void {
  const slot = t % RECENT_POINTS;
  // A plain loop: for the few coordinates of a typical surface it is much cheaper than TypedArray#set.
  const base = pointsAt + slot * pointStride;
  for (let i = 0; i < n; i++) points[base + i] = x[xAt + i];
  loss[lossAt + slot * lossStride] = lossValue;
  recordMilestoneAt(distanceAt, milestonesAt, t, x, xAt, n, x0, x0At);
}

/** The milestone part of recordRecentAt: at t = 2^k, the distance from the start (nothing at other t). */
export function recordMilestoneAt(distanceAt: Float64Array, milestonesAt: number, t: number, x: Float64Array, xAt: number, n: number, x0: Float64Array, x0At: number): void {
  if (t > 0 && (t & (t - 1)) === 0) {
    const k = Math.log2(t);
    if (k < MILESTONES) {
      let s = 0;
      for (let i = 0; i < n; i++) s += (x[xAt + i] - x0[x0At + i]) ** 2;
      distanceAt[milestonesAt + k] = Math.sqrt(s);
    }
  }
}

/**
 * The distance between the points recorded `backA` and `backB` steps before step t (each < filled),
 * read in place: no views are made (the end judgement asks for several at every run's end).
 */
export function recentDistance(path: RecentPath, t: number, backA: number, backB: number, n: number): number {
  const a = ((((t - backA) % RECENT_POINTS) + RECENT_POINTS) % RECENT_POINTS) * n;
  const b = ((((t - backB) % RECENT_POINTS) + RECENT_POINTS) % RECENT_POINTS) * n;
  const p = path.points;
  let s = 0;
  for (let i = 0; i < n; i++) s += (p[a + i] - p[b + i]) ** 2;
  return Math.sqrt(s);
}

export function distance(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] - b[i]) ** 2;
  return Math.sqrt(s);
}
