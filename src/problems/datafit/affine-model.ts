import type { Design } from './design';
import { OnePassRowLossSurface, penaltyMask } from './row-loss';
import { unitToOriginal, unitToStandardised } from './units';

/**
 * An affine model with one output (linear and logistic regression): z_i = b + w . x_i and a per-row
 * loss l(z_i, y_i). Layout [intercept, w_<input 1>, ..., w_<input p>]; the weights are penalised, the
 * intercept is not. Groups: the weight vector (one filter) and the intercept. By the chain rule, with
 * x~_i = (1, x_i), a row adds l'(z_i) x~_i to the gradient and l''(z_i) x~_i x~_i^T to the Hessian.
 *
 * Each model writes its row loops out in full (the value sum, and the gradient with the optional
 * Hessian): they are the heavy path of grid slices and data-fit runs. A shared loop calling back into
 * the model per row measured 1.3x to 1.6x slower on the two-input linear gradient, and a shared helper
 * for the x~ x~^T term 1.1x to 1.6x slower on the Hessians (node 20, 1,000 rows).
 */
export abstract class AffineModelSurface extends OnePassRowLossSurface {
  constructor(design: Design, normalisation: 'sum' | 'mean', l2: number) {
    const p = design.p;
    super(
      design,
      ['intercept', ...design.inputs.map((c) => `w_${c}`)],
      [
        { name: 'weights', indices: Array.from({ length: p }, (_, j) => j + 1), kind: 'weights' },
        { name: 'intercept', indices: [0], kind: 'bias' },
      ],
      normalisation,
      l2,
      penaltyMask(p + 1, [0]),
    );
  }

  /** Units conversion of [intercept, w...] (see units.ts); a copy when the design is not standardised. */
  toOriginalUnits(params: ArrayLike<number>): number[] {
    const out = Array.from(params);
    if (this.design.standardised) unitToOriginal(out, 1, 0, this.design.means, this.design.sds);
    return out;
  }

  fromOriginalUnits(params: ArrayLike<number>): number[] {
    const out = Array.from(params);
    if (this.design.standardised) unitToStandardised(out, 1, 0, this.design.means, this.design.sds);
    return out;
  }
}

/** b + w . x for one raw input row, with the design's standardisation applied to x. */
export function affineAt(design: Design, params: ArrayLike<number>, weightStart: number, biasIndex: number, inputRow: ArrayLike<number>): number {
  let z = params[biasIndex];
  for (let j = 0; j < design.p; j++) {
    const v = design.standardised ? (inputRow[j] - design.means[j]) / design.sds[j] : inputRow[j];
    z += params[weightStart + j] * v;
  }
  return z;
}
