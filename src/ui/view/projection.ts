import { projectToPlane, type SlicePlane } from '../../engine';
import type { TrajectoryBuffer } from '../../store/trajectory-buffer';

interface Projected {
  plane: SlicePlane;
  /** The buffer's generation the rows were projected from (thinning rewrites its rows). */
  generation: number;
  count: number;
  ab: Float64Array;
}

const cache = new WeakMap<TrajectoryBuffer, Projected>();

/**
 * A run's points projected onto a method plane (least squares on its two directions), as interleaved
 * (a, b) rows. Runs live in the full parameter space; only their shadow on the plane is drawn. Extended
 * incrementally while the run streams; recomputed when the plane changes or the buffer thins its rows.
 */
export function projectedTrajectory(buffer: TrajectoryBuffer, plane: SlicePlane): { points: Float64Array; count: number } {
  let p = cache.get(buffer);
  if (!p || p.plane !== plane || p.generation !== buffer.generation || p.count > buffer.count)
    p = { plane, generation: buffer.generation, count: 0, ab: new Float64Array(2 * Math.max(16, buffer.count)) };
  if (p.ab.length < 2 * buffer.count) {
    const grown = new Float64Array(2 * Math.max(buffer.count, p.ab.length));
    grown.set(p.ab.subarray(0, 2 * p.count));
    p.ab = grown;
  }
  for (let k = p.count; k < buffer.count; k++) {
    const q = projectToPlane(plane, buffer.point(k));
    p.ab[2 * k] = q.a;
    p.ab[2 * k + 1] = q.b;
  }
  p.count = buffer.count;
  cache.set(buffer, p);
  return { points: p.ab, count: p.count };
}
