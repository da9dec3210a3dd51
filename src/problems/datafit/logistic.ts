import type { Design } from './design';
import { addAffineRowTerms, affineAt, AffineModelSurface } from './affine-model';
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

  /** Slope sigmoid(z_i) - y_i and curvature sigmoid(z_i) (1 - sigmoid(z_i)) in z_i for every row. */
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
      addAffineRowTerms(g, h, x, o, p, q - y[i], q * (1 - q));
    }
    return s;
  }

  /** P(y = 1) for one row of raw inputs. */
  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number {
    return sigmoid(affineAt(this.design, params, 1, 0, inputRow));
  }
}
