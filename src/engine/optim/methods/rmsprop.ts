import { flag, number, unit } from '../settings';
import { scaleByRms } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';
import { epsilon, epsilonPlacement, momentum } from './sharedSettings';

/**
 * RMSProp (Tieleman & Hinton, course slides "Neural Networks for Machine Learning", Coursera, 2012, slide set 6e):
 *   v_t = rho v_{t-1} + (1 - rho) g_t^2,  x_t = x_{t-1} - lr_t g_t / (sqrt(v_t) + eps);
 * centred (Graves, "Generating Sequences With Recurrent Neural Networks", arXiv:1308.0850, 2013):
 * v_t is replaced by v_t - gbar_t^2 with gbar_t = rho gbar_{t-1} + (1 - rho) g_t; with momentum mu:
 * b_t = mu b_{t-1} + g_t / (sqrt(v_t) + eps), x_t = x_{t-1} - lr_t b_t.
 * Defaults: lr 0.01, rho 0.9 (the slides, Keras, Optax; PyTorch's alpha defaults to 0.99),
 * eps 1e-8 outside the root (PyTorch), v_0 = 0, not centred, no momentum.
 *
 * Library differences: Keras/TF and Optax (eps_in_sqrt=True) put eps inside, g / sqrt(v + eps); Keras
 * eps 1e-7; TF1's RMSPropOptimizer starts v at 1; tfjs puts eps (1e-7) inside and lr inside the
 * momentum buffer, and in its centred form subtracts eps: g / sqrt(v - gbar^2 - eps) (tfjs-core 4.22.0
 * source, rmsprop_optimizer.js). The slides have no epsilon.
 */
export const rmsprop = defineMethod({
    kind: 'rmsprop',
    label: 'RMSProp',
    defaultLearningRate: 0.01,
    family: 'first-order',
    settings: {
      decay: unit(0.9, { label: 'decay (rho)', help: 'Decay of the running mean of squared gradients (PyTorch calls it alpha, default 0.99; Keras rho 0.9).' }),
      epsilon: epsilon(1e-8),
      epsilonPlacement,
      initialMeanSquare: number(0, { label: 'initial mean square', min: 0, help: 'Starting value of the running mean of squared gradients (PyTorch, Keras 0; TF1 1).' }),
      centered: flag(false, { label: 'centred', help: 'Divide by an estimate of the gradient variance, v - gbar^2, instead of v.' }),
      momentum: momentum(0, 'Momentum applied to the scaled gradient (0 = none).'),
    },
    defaultWeightDecay: 0,
    summary: 'Divides each coordinate by the root of a running mean of its squared gradients.',
    source: 'T. Tieleman & G. Hinton, "Neural Networks for Machine Learning", Coursera course slides 6e, 2012.',
  build: (s, spec) =>
    firstOrderChain('RMSProp', spec, [
      scaleByRms({
        decay: s.decay,
        epsilon: s.epsilon,
        placement: s.epsilonPlacement,
        initialMeanSquare: s.initialMeanSquare,
        centered: s.centered,
        momentum: s.momentum,
      }),
    ]),
});
