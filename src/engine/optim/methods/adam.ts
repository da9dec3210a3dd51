import type { HyperparameterInfo } from '../settings';
import { scaleByAdam, type AdamEpsilonForm } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { num, str, type MethodDefinition } from './method';
import { beta1Info, beta2Info, epsilonInfo } from './sharedSettings';

export const adamEpsilonFormInfo: HyperparameterInfo = {
  name: 'epsilonForm',
  label: 'epsilon form',
  default: 'algorithm1',
  choices: ['algorithm1', 'hat'],
  help: "'algorithm1': mhat / (sqrt(vhat) + eps) (PyTorch, Optax, tfjs); 'hat': lr sqrt(1 - b2^t)/(1 - b1^t) m / (sqrt(v) + eps) (Keras/TF's epsilon-hat).",
};

/**
 * Adam (Kingma & Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015, Algorithm 1):
 *   m_t = b1 m_{t-1} + (1 - b1) g_t,  v_t = b2 v_{t-1} + (1 - b2) g_t^2,
 *   mhat_t = m_t / (1 - b1^t),  vhat_t = v_t / (1 - b2^t),  x_t = x_{t-1} - lr_t mhat_t / (sqrt(vhat_t) + eps),
 * with m_0 = v_0 = 0 and t from 1. Defaults lr 0.001, b1 0.9, b2 0.999, eps 1e-8 (the paper's).
 *
 * Library differences: PyTorch and Optax (eps_root = 0) are Algorithm 1; Keras/TF use the paper's
 * "efficient" form lr sqrt(1 - b2^t)/(1 - b1^t) m_t / (sqrt(v_t) + eps_hat) with eps_hat 1e-7
 * (epsilonForm 'hat'); tfjs is Algorithm 1 with eps 1e-7. PyTorch's weight_decay is our coupled
 * l2Penalty; Optax's eps_root (inside the root) is not offered here.
 */
export const adam: MethodDefinition = {
  info: {
    kind: 'adam',
    label: 'Adam',
    defaultLearningRate: 0.001,
    hyperparameters: [beta1Info(), beta2Info(), epsilonInfo(1e-8), adamEpsilonFormInfo],
    usesSchedule: true,
    defaultWeightDecay: 0,
    summary: 'Momentum on the gradient divided by the root of a running mean of squared gradients, both bias-corrected.',
    source: 'D. P. Kingma & J. Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015.',
  },
  build: (spec) =>
    firstOrderChain('Adam', spec, [
      scaleByAdam(num(spec, 'beta1'), num(spec, 'beta2'), num(spec, 'epsilon'), str<AdamEpsilonForm>(spec, 'epsilonForm')),
    ]),
};
