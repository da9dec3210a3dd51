import type { OutcomeKind } from '../run';
import { distance } from '../run/recent';
import { basinOf } from '../sweep/basins';

/**
 * Which basin each run of a study ended in. A run whose outcome is `converged` (or `stationary`, a flat
 * end) belongs to the known point nearest its end point when that is within `radius` (sweep/basins.ts
 * `basinOf`); otherwise to a cluster of such end points by the leader rule of sweep/basins.ts
 * `clusterEndPoints`, applied one run at a time as results arrive (the first end point farther than
 * `radius` from every leader so far leads a new cluster; the result depends only on the arrival order). Runs with
 * any other outcome get no basin (-1): their outcome is their legend entry.
 * Basin ids: 0..known-1 are the known points in order, then clusters in order of discovery.
 */
export interface KnownPoint {
  point: ArrayLike<number>;
  label: string;
}

export interface BasinAssignment {
  basin: Int32Array;
  labels: string[];
  /** Centres of the clusters (after the known points), row-major. */
  centres: number[][];
}

const BASIN_KINDS = new Set<OutcomeKind>(['converged', 'stationary']);

/** The same rule one run at a time, for results that arrive in batches (ids never change once given). */
export class BasinTracker {
  readonly labels: string[];
  readonly centres: number[][] = [];

  constructor(
    private readonly known: readonly KnownPoint[],
    private readonly radius: number,
    private readonly formatPoint: (p: ArrayLike<number>) => string = (p) => `(${Array.from(p, (v) => v.toPrecision(4)).join(', ')})`,
  ) {
    if (!(radius > 0 && Number.isFinite(radius))) throw new RangeError(`basins: radius must be a finite number > 0, got ${radius}`);
    this.labels = known.map((k) => k.label);
    this.knownPoints = known.map((k) => k.point);
  }

  private readonly knownPoints: ArrayLike<number>[];

  /** The basin of a run that ended at `end` with outcome `kind` (-1: none). */
  assign(end: ArrayLike<number>, kind: OutcomeKind): number {
    if (!BASIN_KINDS.has(kind)) return -1;
    const best = basinOf(end, this.knownPoints, this.radius);
    if (best >= 0) return best;
    const c = this.centres.findIndex((p) => distance(p, end) <= this.radius);
    if (c >= 0) return this.known.length + c;
    const centre = Array.from(end);
    this.centres.push(centre);
    this.labels.push(`end point ${this.formatPoint(centre)}`);
    return this.known.length + this.centres.length - 1;
  }
}

export function assignBasins(
  endPoints: Float64Array,
  n: number,
  kinds: readonly OutcomeKind[],
  known: readonly KnownPoint[],
  radius: number,
  formatPoint?: (p: ArrayLike<number>) => string,
): BasinAssignment {
  const tracker = new BasinTracker(known, radius, formatPoint);
  const basin = Int32Array.from(kinds, (kind, r) => tracker.assign(endPoints.subarray(r * n, (r + 1) * n), kind));
  return { basin, labels: tracker.labels, centres: tracker.centres };
}
