import { scaleByAdam } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';
import { adamEpsilonForm, beta1, beta2, epsilon } from './sharedSettings';

/**
 * Adam (Kingma & Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015, Algorithm 1):
 *   m_t = b1 m_{t-1} + (1 - b1) g_t,  v_t = b2 v_{t-1} + (1 - b2) g_t^2,
 *   mhat_t = m_t / (1 - b1^t),  vhat_t = v_t / (1 - b2^t),  x_t = x_{t-1} - lr_t mhat_t / (sqrt(vhat_t) + eps),
 * with m_0 = v_0 = 0 and t from 1. Defaults lr 0.001, b1 0.9, b2 0.999, eps 1e-8 (the paper's).
 *
 * Library differences: PyTorch and Optax (eps_root = 0) are Algorithm 1; Keras/TF use the paper's
 * "efficient" form lr sqrt(1 - b2^t)/(1 - b1^t) m_t / (sqrt(v_t) + eps_hat) with eps_hat 1e-7
 * (epsilonForm 'eps-before-correction'); tfjs is Algorithm 1 with eps 1e-7. PyTorch's weight_decay is our coupled
 * l2Penalty; Optax's eps_root (inside the root) is not offered here.
 */
export const adam = defineMethod({
    kind: 'adam',
    label: 'Adam',
    defaultLearningRate: 0.001,
    family: 'first-order',
    settings: { beta1: beta1(), beta2: beta2(), epsilon: epsilon(1e-8), epsilonForm: adamEpsilonForm },
    defaultWeightDecay: 0,
    summary: 'Momentum on the gradient divided by the root of a running mean of squared gradients, both bias-corrected.',
    source: 'D. P. Kingma & J. Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015.',
  build: (s, spec) => firstOrderChain('Adam', spec, [scaleByAdam(s.beta1, s.beta2, s.epsilon, s.epsilonForm)]),
});
