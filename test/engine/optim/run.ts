import { buildOptimizer, concatBatches, RunCursor, type OptimizerSpec, type StopRules, type Surface, type TrajectoryBatch } from '../../../src/engine';

/** Runs a spec through the real run loop and returns the whole trajectory. */
export function runSpec(surface: Surface, spec: OptimizerSpec, start: number[], stop: StopRules): { batch: TrajectoryBatch; cursor: RunCursor } {
  const cursor = new RunCursor(surface, buildOptimizer(spec), { start, seed: 1, stop });
  const batch = concatBatches(cursor.runToEnd(1000), surface.dimension);
  return { batch, cursor };
}

/** Row k of a batch's points. */
export function pointAt(b: TrajectoryBatch, k: number): number[] {
  return Array.from(b.points.subarray(k * b.dimension, (k + 1) * b.dimension));
}

export function lastPoint(b: TrajectoryBatch): number[] {
  return pointAt(b, b.count - 1);
}

export function distance(a: number[], b: number[]): number {
  return Math.hypot(...a.map((v, i) => v - b[i]));
}
