import type { ParameterGroup } from '../../engine';
import type { Design } from './design';
import { affineAt } from './affine-model';
import { OnePassRowLossSurface, penaltyMask } from './row-loss';
import { logSumExp, logSumExpSoftmax } from './stable';
import { unitToOriginal, unitToStandardised } from './units';

/**
 * Softmax (multinomial logistic) regression over K classes: logits z_ik = b_k + w_k . x_i,
 * P(y_i = k) = pi_ik = softmax_k(z_i); per-row loss the cross-entropy l_i = logsumexp(z_i) - z_i,y_i
 * (stable, stable.ts), averaged over rows, plus lambda/2 sum_k |w_k|^2 (intercepts not penalised).
 * Gradient (1/N) sum_i (pi_ik - [y_i = k]) x~_i for class k; Hessian blocks
 * (1/N) sum_i pi_ik ([k = l] - pi_il) x~_i x~_i^T, with x~_i = (1, x_i).
 *
 * Layout: class by class, [b_k, w_k1, ..., w_kp], named '<class>.intercept', '<class>.w_<input>'. All
 * K classes carry parameters (no reference class), so with lambda = 0 adding one vector to every
 * class leaves the loss unchanged: the minimum is a line, not a point, and the Hessian is singular
 * along it (Newton falls back or needs the penalty). Groups: each class's weight vector, and the
 * intercepts together.
 */
export class SoftmaxRegressionSurface extends OnePassRowLossSurface {
  readonly model = 'softmax' as const;
  readonly lossName = 'mean cross-entropy';
  readonly classes: number;
  readonly classLabels: readonly string[];
  private readonly z: Float64Array;
  private readonly probs: Float64Array;
  private readonly xt: Float64Array;
  /** x~_i . v_k per class (Hessian-vector products). */
  private readonly classDots: Float64Array;

  constructor(design: Design, classLabels: readonly string[], l2: number) {
    const p = design.p;
    const q = p + 1;
    const k = classLabels.length;
    const names = classLabels.flatMap((label) => [`${label}.intercept`, ...design.inputs.map((c) => `${label}.w_${c}`)]);
    const groups: ParameterGroup[] = classLabels.map((label, c) => ({
      name: label,
      indices: Array.from({ length: p }, (_, j) => c * q + 1 + j),
      kind: 'weights',
    }));
    groups.push({ name: 'intercepts', indices: classLabels.map((_, c) => c * q), kind: 'bias' });
    super(design, names, groups, 'mean', l2, penaltyMask(k * q, classLabels.map((_, c) => c * q)));
    this.classes = k;
    this.classLabels = Object.freeze([...classLabels]);
    this.z = new Float64Array(k);
    this.probs = new Float64Array(k);
    this.xt = new Float64Array(q);
    this.classDots = new Float64Array(k);
  }

  /** Writes the row's logits into this.z. */
  private logits(w: Float64Array, i: number): void {
    const { x, p } = this.design;
    const q = p + 1;
    const o = i * p;
    for (let c = 0; c < this.classes; c++) {
      let zc = w[c * q];
      for (let j = 0; j < p; j++) zc += w[c * q + 1 + j] * x[o + j];
      this.z[c] = zc;
    }
  }

  protected sumValue(w: Float64Array, rows: Int32Array | null, count: number): number {
    const { y } = this.design;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      this.logits(w, i);
      s += logSumExp(this.z, this.classes) - this.z[y[i]];
    }
    return s;
  }

  protected accumulate(w: Float64Array, g: Float64Array, h: Float64Array | null, rows: Int32Array | null, count: number): number {
    const { x, y, p } = this.design;
    const q = p + 1;
    const K = this.classes;
    const n = K * q;
    const { z, probs, xt } = this;
    xt[0] = 1;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      for (let j = 0; j < p; j++) xt[j + 1] = x[o + j];
      this.logits(w, i);
      const yi = y[i];
      s += logSumExpSoftmax(z, K, probs) - z[yi];
      for (let c = 0; c < K; c++) {
        const d = probs[c] - (c === yi ? 1 : 0);
        for (let a = 0; a < q; a++) g[c * q + a] += d * xt[a];
      }
      if (h) {
        for (let c = 0; c < K; c++) {
          for (let l = c; l < K; l++) {
            const coef = probs[c] * ((c === l ? 1 : 0) - probs[l]);
            for (let a = 0; a < q; a++) {
              const ca = coef * xt[a];
              const row = (c * q + a) * n + l * q;
              for (let b = l === c ? a : 0; b < q; b++) h[row + b] += ca * xt[b];
            }
          }
        }
      }
    }
    return s;
  }

  /**
   * H v one row at a time without the K q x K q blocks: with u_k = x~_i . v_k (v_k the class-k slice
   * of v) and s = sum_l pi_il u_l, the row adds pi_ik (u_k - s) x~_i to class k. O(N K q).
   */
  protected sumHessianVector(w: Float64Array, v: Float64Array, out: Float64Array): void {
    const { x, p, rows } = this.design;
    const q = p + 1;
    const K = this.classes;
    const { z, probs } = this;
    const u = this.classDots;
    for (let i = 0; i < rows; i++) {
      const o = i * p;
      this.logits(w, i);
      logSumExpSoftmax(z, K, probs);
      let s = 0;
      for (let c = 0; c < K; c++) {
        let t = v[c * q];
        for (let j = 0; j < p; j++) t += v[c * q + 1 + j] * x[o + j];
        u[c] = t;
        s += probs[c] * t;
      }
      for (let c = 0; c < K; c++) {
        const coef = probs[c] * (u[c] - s);
        out[c * q] += coef;
        for (let j = 0; j < p; j++) out[c * q + 1 + j] += coef * x[o + j];
      }
    }
  }

  toOriginalUnits(params: ArrayLike<number>): number[] {
    const out = Array.from(params);
    const q = this.design.p + 1;
    if (this.design.standardised) for (let c = 0; c < this.classes; c++) unitToOriginal(out, c * q + 1, c * q, this.design.means, this.design.sds);
    return out;
  }

  fromOriginalUnits(params: ArrayLike<number>): number[] {
    const out = Array.from(params);
    const q = this.design.p + 1;
    if (this.design.standardised) for (let c = 0; c < this.classes; c++) unitToStandardised(out, c * q + 1, c * q, this.design.means, this.design.sds);
    return out;
  }

  /** Class probabilities for one row of raw inputs. */
  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number[] {
    const q = this.design.p + 1;
    const z = new Float64Array(this.classes);
    for (let c = 0; c < this.classes; c++) z[c] = affineAt(this.design, params, c * q + 1, c * q, inputRow);
    const probs = new Float64Array(this.classes);
    logSumExpSoftmax(z, this.classes, probs);
    return Array.from(probs);
  }
}
