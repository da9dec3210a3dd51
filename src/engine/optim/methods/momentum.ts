import { traceMomentum } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { unit } from '../settings';
import { defineMethod } from './method';
import { momentum as momentumSetting } from './sharedSettings';

/**
 * Heavy-ball momentum (Polyak 1964), PyTorch buffer form:
 *   b_1 = g_1,  b_t = mu b_{t-1} + (1 - tau) g_t,  x_t = x_{t-1} - lr_t b_t.
 * Defaults mu = 0.9, dampening tau = 0, lr 0.01.
 *
 * Polyak's form x_{t+1} = x_t - lr g_t + mu (x_t - x_{t-1}) (with x_{-1} = x_0), Sutskever et al.'s
 * v_t = mu v_{t-1} - lr g_t, x_t = x_{t-1} + v_t (also Keras SGD), Optax's m_t = g_t + mu m_{t-1} and
 * tfjs's accumulation all give identical iterates for a constant learning rate and tau = 0. They differ
 * when lr changes: PyTorch, Optax and tfjs keep lr outside the buffer, so a schedule rescales the whole
 * accumulated velocity at once; Sutskever/Keras keep it inside. Dampening (PyTorch only) scales the new
 * gradient by 1 - tau except on the first step. On a quadratic, per eigenvalue lambda the iteration is
 * stable iff 0 < lr lambda < 2 (1 + mu) for 0 <= mu < 1.
 * Source: B. T. Polyak, "Some methods of speeding up the convergence of iteration methods", USSR
 * Comput. Math. & Math. Phys. 4(5), 1964.
 */
export const momentum = defineMethod({
    kind: 'momentum',
    label: 'Momentum (heavy ball)',
    defaultLearningRate: 0.01,
    family: 'first-order',
    settings: {
      momentum: momentumSetting(0.9, 'Fraction of the previous step direction kept (mu).'),
      dampening: unit(0, { help: 'PyTorch dampening tau: new gradients enter the buffer as (1 - tau) g, except on the first step.' }),
    },
    defaultWeightDecay: 0,
    summary: 'Gradient descent that keeps a running sum of past steps, rolling through narrow valleys.',
    source: 'B. T. Polyak, "Some methods of speeding up the convergence of iteration methods", USSR Comput. Math. & Math. Phys. 4(5), 1964.',
  build: (s, spec) => firstOrderChain('Momentum (heavy ball)', spec, [traceMomentum(s.momentum, s.dampening)]),
});
