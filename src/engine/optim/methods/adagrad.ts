import { number } from '../settings';
import { scaleByAdagrad } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';
import { epsilon, epsilonPlacement } from './sharedSettings';

/**
 * AdaGrad (Duchi, Hazan & Singer, "Adaptive Subgradient Methods for Online Learning and Stochastic
 * Optimization", JMLR 12, 2011), diagonal form:
 *   G_t = G_{t-1} + g_t^2,  x_t = x_{t-1} - lr_t g_t / (sqrt(G_t) + eps).
 * Defaults (PyTorch): lr 0.01, eps 1e-10 outside the square root, initial accumulator 0.
 *
 * Library differences: Keras uses lr 1e-3, eps 1e-7, initial accumulator 0.1; Optax eps 1e-7 inside
 * the square root, g / sqrt(G + eps), initial accumulator 0.1; tfjs eps 1e-7 (its float32 backend
 * epsilon) inside, initial accumulator 0.1; PyTorch's lr_decay is our inverse-time schedule with
 * decaySteps 1. The paper adds delta outside the root.
 */
export const adagrad = defineMethod({
    kind: 'adagrad',
    label: 'AdaGrad',
    defaultLearningRate: 0.01,
    family: 'first-order',
    settings: {
      epsilon: epsilon(1e-10),
      epsilonPlacement,
      initialAccumulator: number(0, { label: 'initial accumulator', min: 0, help: 'Starting value of the sum of squared gradients (PyTorch 0; Keras, Optax, tfjs 0.1).' }),
    },
    defaultWeightDecay: 0,
    summary: 'Divides each coordinate by the root of its summed squared gradients: large early steps, then ever smaller.',
    source: 'Duchi, Hazan & Singer, "Adaptive Subgradient Methods for Online Learning and Stochastic Optimization", JMLR 12, 2011.',
  build: (s, spec) => firstOrderChain('AdaGrad', spec, [scaleByAdagrad(s.epsilon, s.epsilonPlacement, s.initialAccumulator)]),
});
