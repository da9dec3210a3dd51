import type { Design } from './design';
import { OnePassRowLossSurface, penaltyMask } from './row-loss';
import { unitToOriginal, unitToStandardised } from './units';

/**
 * An affine model with one output (linear and logistic regression): z_i = b + w . x_i. Layout
 * [intercept, w_<input 1>, ..., w_<input p>]; the weights are penalised, the intercept is not. Groups:
 * the weight vector (one filter) and the intercept. With x~_i = (1, x_i), a row whose loss has slope
 * d_i and curvature c_i in z_i adds d_i x~_i to the gradient and c_i x~_i x~_i^T to the Hessian
 * (addAffineRowTerms).
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

/**
 * Adds one row's terms to an affine model's sums: d x~ into g and, when h is given, c x~ x~^T into the
 * upper triangle of h (n = p + 1, row-major), where x~ = (1, x[o..o+p)).
 */
export function addAffineRowTerms(g: Float64Array, h: Float64Array | null, x: Float64Array, o: number, p: number, d: number, c: number): void {
  g[0] += d;
  for (let j = 0; j < p; j++) g[j + 1] += d * x[o + j];
  if (h === null) return;
  const n = p + 1;
  h[0] += c;
  for (let a = 0; a < p; a++) {
    const cx = c * x[o + a];
    h[a + 1] += cx;
    for (let b = a; b < p; b++) h[(a + 1) * n + b + 1] += cx * x[o + b];
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
