import type { Design } from './design';
import { affineAt, AffineModelSurface } from './affine-model';
import { sigmoid, softplus } from './stable';

/**
 * Logistic regression: logit z_i = b + w . x_i, P(y_i = 1) = sigmoid(z_i); per-row loss the binary
 * cross-entropy l_i = softplus(z_i) - y_i z_i (stable form, stable.ts), averaged over rows, plus
 * lambda/2 |w|^2 on the weights. Gradient (1/N) sum_i (sigmoid(z_i) - y_i) x~_i, Hessian
 * (1/N) sum_i sigmoid(z_i) (1 - sigmoid(z_i)) x~_i x~_i^T with x~_i = (1, x_i). Targets are 0 or 1.
 * On separable data the loss has no minimiser (it falls towards 0 as |w| grows); an L2 penalty gives
 * it one.
 */
export class LogisticRegressionSurface extends AffineModelSurface {
  readonly model = 'logistic' as const;
  readonly lossName = 'mean binary cross-entropy';

  constructor(design: Design, l2: number) {
    super(design, 'mean', l2);
  }

  protected sumValue(w: Float64Array, rows: Int32Array | null, count: number): number {
    const { x, y, p } = this.design;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      let z = w[0];
      for (let j = 0; j < p; j++) z += w[j + 1] * x[o + j];
      s += softplus(z) - y[i] * z;
    }
    return s;
  }

  /** Per row: l' = sigmoid(z) - y, l'' = sigmoid(z) (1 - sigmoid(z)). */
  protected accumulate(w: Float64Array, g: Float64Array, h: Float64Array | null, rows: Int32Array | null, count: number): number {
    const { x, y, p } = this.design;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      let z = w[0];
      for (let j = 0; j < p; j++) z += w[j + 1] * x[o + j];
      s += softplus(z) - y[i] * z;
      const q = sigmoid(z);
      const d = q - y[i];
      g[0] += d;
      for (let j = 0; j < p; j++) g[j + 1] += d * x[o + j];
      if (h !== null) {
        const c = q * (1 - q);
        const n = p + 1;
        h[0] += c;
        for (let a = 0; a < p; a++) {
          const cx = c * x[o + a];
          h[a + 1] += cx;
          for (let b = a; b < p; b++) h[(a + 1) * n + b + 1] += cx * x[o + b];
        }
      }
    }
    return s;
  }

  /** H v = sum_i sigmoid(z_i) (1 - sigmoid(z_i)) x~_i (x~_i . v): one pass over the rows, O(N p). */
  protected sumHessianVector(w: Float64Array, v: Float64Array, out: Float64Array): void {
    const { x, p, rows } = this.design;
    for (let i = 0; i < rows; i++) {
      const o = i * p;
      let z = w[0];
      let t = v[0];
      for (let j = 0; j < p; j++) {
        z += w[j + 1] * x[o + j];
        t += v[j + 1] * x[o + j];
      }
      const q = sigmoid(z);
      const ct = q * (1 - q) * t;
      out[0] += ct;
      for (let j = 0; j < p; j++) out[j + 1] += ct * x[o + j];
    }
  }

  /** P(y = 1) for one row of raw inputs. */
  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number {
    return sigmoid(affineAt(this.design, params, 1, 0, inputRow));
  }
}
