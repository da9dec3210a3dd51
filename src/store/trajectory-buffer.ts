import type { TrajectoryBatch } from '../engine';

/** Most bytes reserved up front for one run, points and per-step numbers (beyond, the buffer doubles). */
export const UPFRONT_BYTES = 32 * 2 ** 20;

/**
 * Rows to reserve for a run of at most `maxSteps` steps in `dimension` coordinates: all of them (step 0
 * included) while they fit in UPFRONT_BYTES, so a network's run never copies its
 * trajectory (doubling a buffer of a thousand-parameter run copied tens of megabytes on the page at
 * once, and the garbage set off long collections); at least 16 rows.
 */
export function upfrontCapacity(dimension: number, maxSteps: number): number {
  const fits = Math.floor(UPFRONT_BYTES / (8 * (Math.max(1, dimension) + 3)));
  return Math.max(16, Math.min(Number.isFinite(maxSteps) ? Math.floor(maxSteps) + 1 : fits, fits));
}

/**
 * A run's recorded steps on the page, grown by appending streamed batches. Lives outside React state:
 * canvas layers read it directly when they redraw, so streaming never re-renders components.
 */
export class TrajectoryBuffer {
  count = 0;
  points: Float64Array;
  loss: Float64Array;
  gradNorm: Float64Array;
  learningRate: Float64Array;

  constructor(readonly dimension: number, capacity = 1024) {
    this.points = new Float64Array(capacity * dimension);
    this.loss = new Float64Array(capacity);
    this.gradNorm = new Float64Array(capacity);
    this.learningRate = new Float64Array(capacity);
  }

  /** Appends a batch; it must continue exactly where the buffer ends. */
  append(batch: TrajectoryBatch): void {
    if (batch.count === 0) return;
    if (batch.dimension !== this.dimension) throw new Error(`trajectory: batch has ${batch.dimension} coordinates, buffer ${this.dimension}`);
    if (batch.firstStep !== this.count) throw new Error(`trajectory: batch starts at step ${batch.firstStep}, expected ${this.count}`);
    this.reserve(this.count + batch.count);
    this.points.set(batch.points.subarray(0, batch.count * this.dimension), this.count * this.dimension);
    this.loss.set(batch.loss.subarray(0, batch.count), this.count);
    this.gradNorm.set(batch.gradNorm.subarray(0, batch.count), this.count);
    this.learningRate.set(batch.learningRate.subarray(0, batch.count), this.count);
    this.count += batch.count;
  }

  /** Coordinates of step k (a view, valid until the next append). */
  point(k: number): Float64Array {
    return this.points.subarray(k * this.dimension, (k + 1) * this.dimension);
  }

  /** The whole trajectory as one batch-shaped record (views). */
  asBatch(): TrajectoryBatch {
    return {
      firstStep: 0,
      count: this.count,
      dimension: this.dimension,
      points: this.points.subarray(0, this.count * this.dimension),
      loss: this.loss.subarray(0, this.count),
      gradNorm: this.gradNorm.subarray(0, this.count),
      learningRate: this.learningRate.subarray(0, this.count),
      outcome: null,
    };
  }

  private reserve(rows: number): void {
    const capacity = this.loss.length;
    if (rows <= capacity) return;
    const next = Math.max(rows, capacity * 2);
    const grow = (a: Float64Array, width: number) => {
      const b = new Float64Array(next * width);
      b.set(a);
      return b;
    };
    this.points = grow(this.points, this.dimension);
    this.loss = grow(this.loss, 1);
    this.gradNorm = grow(this.gradNorm, 1);
    this.learningRate = grow(this.learningRate, 1);
  }
}
