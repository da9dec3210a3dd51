import type { RunOutcome, TrajectoryBatch } from '../engine';

/** A known stationary point the summary can measure distance to (minima of the catalogue surfaces). */
export interface ReferenceMinimum {
  point: number[];
  value: number;
}

/** What the run table shows for one run; every field is computed from the streamed trajectory. */
export interface RunSummary {
  steps: number;
  finalLoss: number;
  finalPoint: number[];
  bestLoss: number;
  outcome: RunOutcome | null;
  /** Distance from the final point to the nearest reference minimum, and which one (index). */
  nearestMinimum: { index: number; distance: number } | null;
  /**
   * First step whose loss is within `tolerance` of the lowest reference minimum's value
   * (loss - f_min <= tolerance); null while not reached or without reference minima.
   */
  stepsToTolerance: number | null;
}

export function emptySummary(): RunSummary {
  return { steps: 0, finalLoss: Number.NaN, finalPoint: [], bestLoss: Number.NaN, outcome: null, nearestMinimum: null, stepsToTolerance: null };
}

/** Folds one more batch into a summary (returns a new object; the input is not changed). */
export function updateSummary(
  previous: RunSummary,
  batch: TrajectoryBatch,
  minima: readonly ReferenceMinimum[],
  tolerance: number,
): RunSummary {
  if (batch.count === 0) return batch.outcome ? { ...previous, outcome: batch.outcome } : previous;
  const n = batch.dimension;
  const last = batch.count - 1;
  let best = previous.bestLoss;
  let reached = previous.stepsToTolerance;
  const target = lowestValue(minima);
  for (let k = 0; k < batch.count; k++) {
    const f = batch.loss[k];
    if (Number.isFinite(f) && !(f >= best)) best = f; // also replaces the initial NaN
    if (reached === null && target !== null && f - target <= tolerance) reached = batch.firstStep + k;
  }
  const finalPoint = Array.from(batch.points.subarray(last * n, (last + 1) * n));
  return {
    steps: batch.firstStep + last,
    finalLoss: batch.loss[last],
    finalPoint,
    bestLoss: best,
    outcome: batch.outcome ?? previous.outcome,
    nearestMinimum: nearest(finalPoint, minima),
    stepsToTolerance: reached,
  };
}

/** Recomputes `stepsToTolerance` from a whole trajectory (when the user changes the tolerance). */
export function stepsToTolerance(loss: ArrayLike<number>, count: number, minima: readonly ReferenceMinimum[], tolerance: number): number | null {
  const target = lowestValue(minima);
  if (target === null) return null;
  for (let k = 0; k < count; k++) if (loss[k] - target <= tolerance) return k;
  return null;
}

function lowestValue(minima: readonly ReferenceMinimum[]): number | null {
  return minima.length ? Math.min(...minima.map((m) => m.value)) : null;
}

function nearest(x: number[], minima: readonly ReferenceMinimum[]): RunSummary['nearestMinimum'] {
  let result: RunSummary['nearestMinimum'] = null;
  minima.forEach((m, index) => {
    if (m.point.length !== x.length) return;
    const distance = Math.hypot(...x.map((v, i) => v - m.point[i]));
    if (Number.isFinite(distance) && (!result || distance < result.distance)) result = { index, distance };
  });
  return result;
}
