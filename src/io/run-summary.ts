import { stepOfRow, type RunOutcome, type ToleranceTarget, type TrajectoryBatch } from '../engine';

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
  /**
   * Set when stepsToTolerance is only an upper bound: the tolerance changed after the run, and the
   * page had kept only every k-th step of it (store/trajectory-buffer.ts).
   */
  stepsToToleranceIsBound?: true;
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
    if (reached === null && target !== null && f - target <= tolerance) reached = stepOfRow(batch, k);
  }
  const finalPoint = Array.from(batch.points.subarray(last * n, (last + 1) * n));
  return {
    steps: stepOfRow(batch, last),
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

/**
 * A summary for new reference minima or a new tolerance, from the summary folded over the full stream
 * and the trajectory's kept rows. Where the rows skip steps, the first kept row within tolerance only
 * bounds the first such step from above, and so does the last step when only the (exact) best loss
 * says the tolerance was met: the result is then marked as a bound.
 */
export function resummarise(previous: RunSummary, kept: TrajectoryBatch, minima: readonly ReferenceMinimum[], tolerance: number): RunSummary {
  const nearestMinimum = previous.finalPoint.length ? nearest(previous.finalPoint, minima) : null;
  const { stepsToToleranceIsBound: _, ...rest } = previous;
  const target = lowestValue(minima);
  if (target === null || !(previous.bestLoss - target <= tolerance)) return { ...rest, nearestMinimum, stepsToTolerance: null };
  const row = stepsToTolerance(kept.loss, kept.count, minima, tolerance);
  if (row !== null) {
    const step = stepOfRow(kept, row);
    const exact = row === 0 || stepOfRow(kept, row - 1) === step - 1;
    return { ...rest, nearestMinimum, stepsToTolerance: step, ...(exact ? {} : { stepsToToleranceIsBound: true as const }) };
  }
  return { ...rest, nearestMinimum, stepsToTolerance: previous.steps, stepsToToleranceIsBound: true };
}

/**
 * What steps to tolerance are measured against, for the run table and the studies alike: the lowest
 * reference minimum's value (referenceMinima: none unless the surface lists a global minimum), or
 * null where there is none.
 */
export function toleranceTarget(minima: readonly ReferenceMinimum[], tolerance: number): ToleranceTarget | null {
  const value = lowestValue(minima);
  return value === null ? null : { value, tolerance };
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
