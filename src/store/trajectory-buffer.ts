import type { TrajectoryBatch } from '../engine';

/**
 * Most bytes one run's recorded steps may hold on the page (points, the three per-step numbers and
 * the step number). Reserved up front when the run's step budget needs it, so a buffer is never
 * copied to grow past this; a run that would need more keeps every other step instead (see below).
 */
export const KEPT_BYTES = 32 * 2 ** 20;

/** Bytes one kept row takes: the coordinates, loss, gradient norm, learning rate and step number. */
const rowBytes = (dimension: number) => 8 * (Math.max(1, dimension) + 4);

/** Rows a run keeps at most: as many as fit in KEPT_BYTES, an even number, at least 16. */
export function keptRowsLimit(dimension: number): number {
  return Math.max(16, 2 * Math.floor(KEPT_BYTES / rowBytes(dimension) / 2));
}

/**
 * Rows to reserve for a run of at most `maxSteps` steps in `dimension` coordinates: all of them (step 0
 * included) while they fit, else the kept-rows limit, so neither a network's run nor a long one ever
 * copies its trajectory to grow (doubling a buffer of a thousand-parameter run copied tens of megabytes
 * on the page at once, and the garbage set off long collections); at least 16 rows.
 */
export function upfrontCapacity(dimension: number, maxSteps: number): number {
  const limit = keptRowsLimit(dimension);
  return Math.max(16, Math.min(Number.isFinite(maxSteps) ? Math.floor(maxSteps) + 1 : limit, limit));
}

/**
 * A run's recorded steps on the page, grown by appending streamed batches. Lives outside React state:
 * canvas layers read it directly when they redraw, so streaming never re-renders components.
 *
 * Memory is bounded: every step is kept until the rows fill keptRowsLimit; then the rows are thinned
 * to the steps divisible by 2 (then 4, 8, ...: `keepEvery`) and later steps are kept only at those
 * multiples, so four runs of 10^7 steps hold about 130 MB, not 1.9 GB, and the page stays responsive.
 * The run's last step is always kept once the run has ended. `steps` holds each kept row's step
 * number, which is what every reader labels and plots by; the run's summary (final loss and point,
 * best loss, steps) is folded from the full stream, not from the kept rows.
 * Thinning writes new arrays and bumps `generation`, so a reader caching work per array or per
 * generation starts over.
 */
export class TrajectoryBuffer {
  /** Rows kept. */
  count = 0;
  points: Float64Array;
  loss: Float64Array;
  gradNorm: Float64Array;
  learningRate: Float64Array;
  /** Step number of each kept row. */
  steps: Float64Array;
  /** Steps are kept at multiples of this (1 until the rows first fill up; then 2, 4, ...). */
  keepEvery = 1;
  /** The step the next batch must start at. */
  nextStep = 0;
  /** Bumped each time the rows are thinned. */
  generation = 0;
  readonly rowLimit: number;

  /** Rows the first batch reserves (the arrays are empty until then). */
  private readonly firstRows: number;

  constructor(readonly dimension: number, capacity = 1024, rowLimit = keptRowsLimit(dimension)) {
    this.rowLimit = Math.max(4, 2 * Math.floor(rowLimit / 2));
    this.firstRows = Math.min(Math.max(1, capacity), this.rowLimit);
    // Reserved at the first batch, not here: launching three runs of a network reserved 85 MB in the
    // click's task, and the collection it set off made that task long.
    this.points = new Float64Array(0);
    this.loss = new Float64Array(0);
    this.gradNorm = new Float64Array(0);
    this.learningRate = new Float64Array(0);
    this.steps = new Float64Array(0);
  }

  /** Appends a batch; it must continue exactly where the previous one ended. */
  append(batch: TrajectoryBatch): void {
    if (batch.dimension !== this.dimension) throw new Error(`trajectory: batch has ${batch.dimension} coordinates, buffer ${this.dimension}`);
    if (batch.firstStep !== this.nextStep) throw new Error(`trajectory: batch starts at step ${batch.firstStep}, expected ${this.nextStep}`);
    if (batch.count === 0) return;
    this.nextStep = batch.firstStep + batch.count;
    if (this.keepEvery === 1 && this.count + batch.count <= this.rowLimit) return this.appendAll(batch);
    const last = batch.count - 1;
    for (let k = 0; k <= last; k++) {
      const step = batch.firstStep + k;
      if (step % this.keepEvery === 0 || (k === last && batch.outcome)) this.keepRow(batch, k, step);
    }
  }

  /** Coordinates of kept row k (a view, valid until the next append). */
  point(k: number): Float64Array {
    return this.points.subarray(k * this.dimension, (k + 1) * this.dimension);
  }

  /** Step number of kept row k. */
  stepOf(k: number): number {
    return this.steps[k];
  }

  /** The kept rows as one batch-shaped record (views); `steps` is set once rows were thinned. */
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
      ...(this.keepEvery > 1 ? { steps: this.steps.subarray(0, this.count) } : {}),
    };
  }

  private appendAll(batch: TrajectoryBatch): void {
    this.reserve(this.count + batch.count);
    this.points.set(batch.points.subarray(0, batch.count * this.dimension), this.count * this.dimension);
    this.loss.set(batch.loss.subarray(0, batch.count), this.count);
    this.gradNorm.set(batch.gradNorm.subarray(0, batch.count), this.count);
    this.learningRate.set(batch.learningRate.subarray(0, batch.count), this.count);
    for (let k = 0; k < batch.count; k++) this.steps[this.count + k] = batch.firstStep + k;
    this.count += batch.count;
  }

  private keepRow(batch: TrajectoryBatch, k: number, step: number): void {
    if (this.count === this.rowLimit) this.thin();
    this.reserve(this.count + 1);
    const n = this.dimension;
    this.points.set(batch.points.subarray(k * n, (k + 1) * n), this.count * n);
    this.loss[this.count] = batch.loss[k];
    this.gradNorm[this.count] = batch.gradNorm[k];
    this.learningRate[this.count] = batch.learningRate[k];
    this.steps[this.count] = step;
    this.count += 1;
  }

  /** Keeps the rows at multiples of twice `keepEvery`, in new arrays of the same size. */
  private thin(): void {
    const every = 2 * this.keepEvery;
    const n = this.dimension;
    const size = this.loss.length;
    const points = new Float64Array(size * n);
    const loss = new Float64Array(size);
    const gradNorm = new Float64Array(size);
    const learningRate = new Float64Array(size);
    const steps = new Float64Array(size);
    let kept = 0;
    for (let r = 0; r < this.count; r++) {
      if (this.steps[r] % every !== 0) continue;
      points.set(this.points.subarray(r * n, (r + 1) * n), kept * n);
      loss[kept] = this.loss[r];
      gradNorm[kept] = this.gradNorm[r];
      learningRate[kept] = this.learningRate[r];
      steps[kept] = this.steps[r];
      kept += 1;
    }
    this.points = points;
    this.loss = loss;
    this.gradNorm = gradNorm;
    this.learningRate = learningRate;
    this.steps = steps;
    this.count = kept;
    this.keepEvery = every;
    this.generation += 1;
  }

  /** Grows the arrays (doubling, up to the row limit) to hold `rows` rows. */
  private reserve(rows: number): void {
    const capacity = this.loss.length;
    if (rows <= capacity) return;
    const next = Math.min(this.rowLimit, Math.max(rows, capacity * 2, this.firstRows));
    const grow = (a: Float64Array, width: number) => {
      const b = new Float64Array(next * width);
      b.set(a);
      return b;
    };
    this.points = grow(this.points, this.dimension);
    this.loss = grow(this.loss, 1);
    this.gradNorm = grow(this.gradNorm, 1);
    this.learningRate = grow(this.learningRate, 1);
    this.steps = grow(this.steps, 1);
  }
}
