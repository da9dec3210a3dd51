import type { RunOutcome } from './outcome';

/**
 * A contiguous block of recorded steps, as produced by one `advance` call and streamed to the page.
 * Row k describes step firstStep + k: the point after that step, the loss and exact gradient norm there,
 * and the learning rate the step used (NaN for step 0, the start).
 */
export interface TrajectoryBatch {
  firstStep: number;
  count: number;
  dimension: number;
  /** count x dimension, row-major. */
  points: Float64Array;
  loss: Float64Array;
  gradNorm: Float64Array;
  learningRate: Float64Array;
  /** Set on the batch in which the run ended. */
  outcome: RunOutcome | null;
  /**
   * Step number of each row, where rows are not consecutive steps (the page keeps every k-th step of
   * a very long run, see store/trajectory-buffer.ts); absent, row k is step firstStep + k.
   */
  steps?: Float64Array;
}

/** The step number row `k` of a batch describes. */
export function stepOfRow(b: Pick<TrajectoryBatch, 'firstStep' | 'steps'>, k: number): number {
  return b.steps ? b.steps[k] : b.firstStep + k;
}

export function allocateBatch(firstStep: number, capacity: number, dimension: number): TrajectoryBatch {
  return {
    firstStep,
    count: 0,
    dimension,
    points: new Float64Array(capacity * dimension),
    loss: new Float64Array(capacity),
    gradNorm: new Float64Array(capacity),
    learningRate: new Float64Array(capacity),
    outcome: null,
  };
}

/** A batch trimmed to its filled rows (views, no copy). */
export function trimBatch(b: TrajectoryBatch): TrajectoryBatch {
  return {
    ...b,
    points: b.points.subarray(0, b.count * b.dimension),
    loss: b.loss.subarray(0, b.count),
    gradNorm: b.gradNorm.subarray(0, b.count),
    learningRate: b.learningRate.subarray(0, b.count),
  };
}

/** Joins consecutive batches into one (for tests, export and the command line). */
export function concatBatches(batches: readonly TrajectoryBatch[], dimension: number): TrajectoryBatch {
  const count = batches.reduce((n, b) => n + b.count, 0);
  const out = allocateBatch(batches.length ? batches[0].firstStep : 0, count, dimension);
  let row = 0;
  for (const b of batches) {
    if (b.firstStep !== out.firstStep + row) throw new Error(`concatBatches: batch starting at step ${b.firstStep} does not follow step ${out.firstStep + row - 1}`);
    out.points.set(b.points.subarray(0, b.count * dimension), row * dimension);
    out.loss.set(b.loss.subarray(0, b.count), row);
    out.gradNorm.set(b.gradNorm.subarray(0, b.count), row);
    out.learningRate.set(b.learningRate.subarray(0, b.count), row);
    row += b.count;
    if (b.outcome) out.outcome = b.outcome;
  }
  out.count = count;
  return out;
}
