import type { Design } from './design';
import { affineAt, AffineModelSurface } from './affine-model';
import type { RegressionLoss } from './spec';

/**
 * Linear regression with intercept: f_i = b + sum_j w_j x_ij, residual r_i = f_i - y_i, per-row loss
 * l_i = r_i^2; the loss is their sum (RSS) or mean (MSE), plus lambda/2 |w|^2 on the weights (not the
 * intercept). Exact derivatives, with x~_i = (1, x_i): gradient 2 scale sum_i r_i x~_i, Hessian
 * 2 scale sum_i x~_i x~_i^T (constant: the surface is a quadratic bowl); the Hessian-vector product
2 scale sum_i x~_i (x~_i . v) needs one pass over the rows.
 */
export class LinearRegressionSurface extends AffineModelSurface {
  readonly model = 'linear' as const;
  readonly lossName: string;

  constructor(
    design: Design,
    readonly loss: RegressionLoss,
    l2: number,
  ) {
    super(design, loss === 'rss' ? 'sum' : 'mean', l2);
    this.lossName = loss === 'rss' ? 'residual sum of squares' : 'mean squared error';
  }

  protected sumValue(w: Float64Array, rows: Int32Array | null, count: number): number {
    const { x, y, p } = this.design;
    const b = w[0];
    let s = 0;
    if (p === 1) {
      const w1 = w[1];
      for (let k = 0; k < count; k++) {
        const i = rows === null ? k : rows[k];
        const r = b + w1 * x[i] - y[i];
        s += r * r;
      }
      return s;
    }
    if (p === 2) {
      // Written out for two inputs as well: grid slices of small models are the heavy path, and a
      // loop over j with loads of w[j] costs about twice the arithmetic here.
      const w1 = w[1];
      const w2 = w[2];
      for (let k = 0; k < count; k++) {
        const i = rows === null ? k : rows[k];
        const r = b + w1 * x[2 * i] + w2 * x[2 * i + 1] - y[i];
        s += r * r;
      }
      return s;
    }
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      let f = b;
      for (let j = 0; j < p; j++) f += w[j + 1] * x[o + j];
      const r = f - y[i];
      s += r * r;
    }
    return s;
  }

  /** Per row: l' = 2 r in f, l'' = 2. The Hessian, constant, in a second pass so the gradient loop stays lean. */
  protected accumulate(w: Float64Array, g: Float64Array, h: Float64Array | null, rows: Int32Array | null, count: number): number {
    const { x, y, p } = this.design;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      let f = w[0];
      for (let j = 0; j < p; j++) f += w[j + 1] * x[o + j];
      const r = f - y[i];
      s += r * r;
      const r2 = 2 * r;
      g[0] += r2;
      for (let j = 0; j < p; j++) g[j + 1] += r2 * x[o + j];
    }
    if (h === null) return s;
    const n = p + 1;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      h[0] += 2;
      for (let a = 0; a < p; a++) {
        const xa = x[o + a];
        h[a + 1] += 2 * xa;
        for (let c = a; c < p; c++) h[(a + 1) * n + c + 1] += 2 * xa * x[o + c];
      }
    }
    return s;
  }

  /** H v = 2 sum_i x~_i (x~_i . v): one pass over the rows, O(N p), without forming the (constant) Hessian. */
  protected sumHessianVector(_w: Float64Array, v: Float64Array, out: Float64Array): void {
    const { x, p, rows } = this.design;
    for (let i = 0; i < rows; i++) {
      const o = i * p;
      let t = v[0];
      for (let j = 0; j < p; j++) t += v[j + 1] * x[o + j];
      const t2 = 2 * t;
      out[0] += t2;
      for (let j = 0; j < p; j++) out[j + 1] += t2 * x[o + j];
    }
  }

  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number {
    return affineAt(this.design, params, 1, 0, inputRow);
  }
}
