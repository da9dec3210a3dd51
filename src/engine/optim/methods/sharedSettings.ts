import type { HyperparameterInfo } from '../settings';

/** Settings shared by several methods, described once. */
export const beta1Info = (def = 0.9): HyperparameterInfo => ({
  name: 'beta1',
  label: 'beta1',
  default: def,
  min: 0,
  max: 1,
  maxExclusive: true,
  help: 'Decay of the running mean of the gradient (first moment).',
});

export const beta2Info = (def = 0.999): HyperparameterInfo => ({
  name: 'beta2',
  label: 'beta2',
  default: def,
  min: 0,
  max: 1,
  maxExclusive: true,
  help: 'Decay of the running mean of the squared gradient (second moment).',
});

export const epsilonInfo = (def: number, help = 'Added to the denominator for numerical safety.'): HyperparameterInfo => ({
  name: 'epsilon',
  label: 'epsilon',
  default: def,
  min: 0,
  help,
});

export const momentumInfo = (def: number, help: string): HyperparameterInfo => ({
  name: 'momentum',
  label: 'momentum',
  default: def,
  min: 0,
  max: 1,
  maxExclusive: true,
  help,
});

export const placementInfo: HyperparameterInfo = {
  name: 'epsilonPlacement',
  label: 'epsilon placement',
  default: 'outside',
  choices: ['outside', 'inside'],
  help: "'outside': g / (sqrt(s) + eps) (PyTorch); 'inside': g / sqrt(s + eps) (Keras/TF, Optax, tfjs).",
};
