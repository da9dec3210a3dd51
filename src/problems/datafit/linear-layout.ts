import type { ParameterGroup } from '../../engine';
import type { Design } from './design';
import { unitToOriginal, unitToStandardised } from './units';

/**
 * The parameter layout of an affine model with one output (linear and logistic regression):
 * [intercept, w_<input 1>, ..., w_<input p>]. Groups: the weight vector (one filter) and the intercept.
 */
export function affineNames(inputs: readonly string[]): string[] {
  return ['intercept', ...inputs.map((c) => `w_${c}`)];
}

export function affineGroups(p: number): ParameterGroup[] {
  return [
    { name: 'weights', indices: Array.from({ length: p }, (_, j) => j + 1), kind: 'weights' },
    { name: 'intercept', indices: [0], kind: 'bias' },
  ];
}

/** Units conversion of [intercept, w...] (see units.ts); a copy when the design is not standardised. */
export function affineToOriginal(design: Design, params: ArrayLike<number>): number[] {
  const out = Array.from(params);
  if (design.standardised) unitToOriginal(out, 1, 0, design.means, design.sds);
  return out;
}

export function affineFromOriginal(design: Design, params: ArrayLike<number>): number[] {
  const out = Array.from(params);
  if (design.standardised) unitToStandardised(out, 1, 0, design.means, design.sds);
  return out;
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
