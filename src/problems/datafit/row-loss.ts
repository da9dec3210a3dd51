import type { ParameterGroup } from '../../engine';
import type { Design } from './design';
import type { ModelKind } from './spec';
import type { DataFitSurface } from './types';

/**
 * What every data-fit surface shares: the loss is a sum of one term per row, times a normalisation,
 * plus an L2 penalty on some parameters,
 *
 *   L(w) = scale * sum_i l_i(w) + lambda/2 sum_j mask_j w_j^2,    scale = 1 (a sum) or 1/N (a mean),
 *
 * and the minibatch estimate on a batch B of rows is scale * (N / |B|) * sum_{i in B} l_i(w) + the same
 * penalty (see RowwiseSurface), which is L itself when B is every row.
 *
 * A model supplies the raw row sums (value only; value and gradient; value, gradient and Hessian)
 * over either all rows (`rows` null) or the listed ones; the gradient and Hessian arrive zeroed and
 * the model adds into them. The parameters arrive copied into a Float64Array, so the loops read one
 * kind of array whatever the caller passed.
 */
export abstract class RowLossSurface implements DataFitSurface {
  abstract readonly model: ModelKind;
  abstract readonly lossName: string;
  readonly rows: number;
  readonly dimension: number;
  readonly standardised: boolean;
  readonly inputs: readonly string[];
  readonly target: string;
  /** 1 for a sum, 1 / N for a mean. */
  protected readonly scale: number;
  private readonly w: Float64Array;
  private readonly vLoaded: Float64Array;

  constructor(
    protected readonly design: Design,
    readonly variables: readonly string[],
    readonly parameterGroups: readonly ParameterGroup[],
    /** Whether the data term is a sum over rows (scale 1) or a mean (scale 1/N). */
    readonly normalisation: 'sum' | 'mean',
    protected readonly l2: number,
    /** 1 where a parameter is penalised. */
    protected readonly penalised: Uint8Array,
  ) {
    this.rows = design.rows;
    this.scale = normalisation === 'mean' ? 1 / design.rows : 1;
    this.dimension = variables.length;
    this.standardised = design.standardised;
    this.inputs = design.inputs;
    this.target = design.target;
    this.w = new Float64Array(this.dimension);
    this.vLoaded = new Float64Array(this.dimension);
  }

  /** sum_i l_i(w) over all rows (rows null) or rows[0..count). */
  protected abstract sumValue(w: Float64Array, rows: Int32Array | null, count: number): number;
  /** Also adds sum_i grad l_i into g. */
  protected abstract sumGradient(w: Float64Array, g: Float64Array, rows: Int32Array | null, count: number): number;
  /** Also adds sum_i grad l_i into g and sum_i Hessian l_i into h (row-major, both triangles). */
  protected abstract sumHessian(w: Float64Array, g: Float64Array, h: Float64Array, rows: Int32Array | null, count: number): number;

  /**
   * Adds sum_i (Hessian l_i) v into `out` (arrives zeroed) over every row, without forming the
   * Hessian; `v` arrives copied into a Float64Array of length n.
   */
  protected abstract sumHessianVector(w: Float64Array, v: Float64Array, out: Float64Array): void;

  abstract toOriginalUnits(params: ArrayLike<number>): number[];
  abstract fromOriginalUnits(params: ArrayLike<number>): number[];
  abstract predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number | number[];

  value(x: ArrayLike<number>): number {
    const w = this.load(x);
    return this.scale * this.sumValue(w, null, this.rows) + this.penalty(w);
  }

  valueGradient(x: ArrayLike<number>, grad: Float64Array): number {
    const w = this.load(x);
    grad.fill(0);
    return this.finish(w, this.sumGradient(w, grad, null, this.rows), this.scale, grad, null);
  }

  valueGradientHessian(x: ArrayLike<number>, grad: Float64Array, hessian: Float64Array): number {
    const w = this.load(x);
    grad.fill(0);
    hessian.fill(0);
    return this.finish(w, this.sumHessian(w, grad, hessian, null, this.rows), this.scale, grad, hessian);
  }

  /**
   * H(x) v exactly, for the full loss: scale * sum_i (Hessian l_i) v + lambda mask .* v. Allocates
   * nothing; `out` must not alias `v` or `x`.
   */
  hessianVector(x: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array): void {
    const w = this.load(x);
    const n = w.length;
    if (v.length !== n || out.length !== n) throw new RangeError(`data-fit surface: expected vectors of length ${n}, got ${v.length} and ${out.length}`);
    const u = this.vLoaded;
    for (let j = 0; j < n; j++) u[j] = v[j];
    out.fill(0);
    this.sumHessianVector(w, u, out);
    const scale = this.scale;
    for (let j = 0; j < n; j++) out[j] = scale * out[j] + (this.penalised[j] ? this.l2 * u[j] : 0);
  }

  valueGradientOnRows(x: ArrayLike<number>, grad: Float64Array, rowIndices: Int32Array, count: number): number {
    const w = this.load(x);
    const factor = this.batchFactor(rowIndices, count);
    grad.fill(0);
    return this.finish(w, this.sumGradient(w, grad, rowIndices, count), factor, grad, null);
  }

  valueGradientHessianOnRows(x: ArrayLike<number>, grad: Float64Array, hessian: Float64Array, rowIndices: Int32Array, count: number): number {
    const w = this.load(x);
    const factor = this.batchFactor(rowIndices, count);
    grad.fill(0);
    hessian.fill(0);
    return this.finish(w, this.sumHessian(w, grad, hessian, rowIndices, count), factor, grad, hessian);
  }

  /** lambda/2 sum_j mask_j w_j^2. */
  protected penalty(w: Float64Array): number {
    if (this.l2 === 0) return 0;
    let s = 0;
    for (let j = 0; j < w.length; j++) if (this.penalised[j]) s += w[j] * w[j];
    return 0.5 * this.l2 * s;
  }

  private load(x: ArrayLike<number>): Float64Array {
    const w = this.w;
    if (x.length !== w.length) throw new RangeError(`data-fit surface: expected ${w.length} parameters, got ${x.length}`);
    for (let j = 0; j < w.length; j++) w[j] = x[j];
    return w;
  }

  private batchFactor(rowIndices: Int32Array, count: number): number {
    if (!(Number.isInteger(count) && count >= 1 && count <= rowIndices.length))
      throw new RangeError(`data-fit surface: batch count must be a whole number from 1 to ${rowIndices.length}, got ${count}`);
    for (let k = 0; k < count; k++) {
      const i = rowIndices[k];
      if (!(i >= 0 && i < this.rows)) throw new RangeError(`data-fit surface: row index ${i} is outside 0..${this.rows - 1}`);
    }
    // scale * N / count, written so that a batch of every row gets exactly the full loss's factor.
    return this.normalisation === 'mean' ? 1 / count : this.rows / count;
  }

  /** Scales the raw sums by `factor` and adds the penalty's value, gradient and Hessian. */
  private finish(w: Float64Array, sum: number, factor: number, grad: Float64Array, hessian: Float64Array | null): number {
    const n = w.length;
    for (let j = 0; j < n; j++) grad[j] = factor * grad[j] + (this.penalised[j] ? this.l2 * w[j] : 0);
    if (hessian) {
      for (let k = 0; k < n * n; k++) hessian[k] *= factor;
      if (this.l2 !== 0) for (let j = 0; j < n; j++) if (this.penalised[j]) hessian[j * n + j] += this.l2;
    }
    return factor * sum + this.penalty(w);
  }
}

/**
 * A row loss whose gradient and Hessian sums come from one loop over the rows (linear, logistic and
 * softmax regression). `accumulate` adds sum_i grad l_i into g and, when h is given, sum_i Hessian l_i
 * into the upper triangle of h only (row <= column); sumHessian then mirrors it onto the lower one.
 */
export abstract class OnePassRowLossSurface extends RowLossSurface {
  protected abstract accumulate(w: Float64Array, g: Float64Array, h: Float64Array | null, rows: Int32Array | null, count: number): number;

  protected sumGradient(w: Float64Array, g: Float64Array, rows: Int32Array | null, count: number): number {
    return this.accumulate(w, g, null, rows, count);
  }

  protected sumHessian(w: Float64Array, g: Float64Array, h: Float64Array, rows: Int32Array | null, count: number): number {
    const s = this.accumulate(w, g, h, rows, count);
    const n = this.dimension;
    for (let a = 0; a < n; a++) for (let b = 0; b < a; b++) h[a * n + b] = h[b * n + a];
    return s;
  }
}

/** A penalty mask from the indices that are not penalised (intercepts and biases). */
export function penaltyMask(dimension: number, unpenalised: readonly number[]): Uint8Array {
  const mask = new Uint8Array(dimension).fill(1);
  for (const j of unpenalised) mask[j] = 0;
  return mask;
}
