import { scaleByNadam, type NadamForm } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { num, str, type MethodDefinition } from './method';
import { beta1Info, beta2Info, epsilonInfo } from './sharedSettings';

/**
 * NAdam (T. Dozat, "Incorporating Nesterov Momentum into Adam", ICLR 2016 workshop), PyTorch form:
 *   mu_t = b1 (1 - 0.5 * 0.96^(t psi)),  m_t = b1 m_{t-1} + (1 - b1) g_t,  v_t = b2 v_{t-1} + (1 - b2) g_t^2,
 *   mhat_t = mu_{t+1} m_t / (1 - prod_{i<=t+1} mu_i) + (1 - mu_t) g_t / (1 - prod_{i<=t} mu_i),
 *   x_t = x_{t-1} - lr_t mhat_t / (sqrt(v_t/(1 - b2^t)) + eps).
 * Defaults (PyTorch): lr 0.002, b1 0.9, b2 0.999, eps 1e-8, psi (momentumDecay) 0.004.
 * 'constant-momentum' is Optax's nadam, without the momentum schedule (mu_t = b1 at every step):
 *   mhat_t = b1 m_t / (1 - b1^(t+1)) + (1 - b1) g_t / (1 - b1^t).
 * Keras Nadam uses a 0.96^(0.004 t) schedule too (from memory, not checked). Whether Dozat's EMA uses
 * the scheduled mu_t or the constant b1 is not settled in our reference; PyTorch uses b1.
 */
export const nadam: MethodDefinition = {
  info: {
    kind: 'nadam',
    label: 'NAdam',
    defaultLearningRate: 0.002,
    hyperparameters: [
      beta1Info(),
      beta2Info(),
      epsilonInfo(1e-8),
      {
        name: 'momentumDecay',
        label: 'momentum decay (psi)',
        default: 0.004,
        min: 0,
        help: 'psi in the momentum schedule mu_t = beta1 (1 - 0.5 * 0.96^(t psi)) (rising-momentum form only).',
      },
      {
        name: 'form',
        label: 'form',
        default: 'rising-momentum',
        choices: ['rising-momentum', 'constant-momentum'],
        help: "'rising-momentum': the momentum coefficient rises towards beta1 as mu_t = beta1 (1 - 0.5 * 0.96^(t psi)) (Dozat 2016); 'constant-momentum': mu_t = beta1 at every step.",
      },
    ],
    usesSchedule: true,
    defaultWeightDecay: 0,
    summary: 'Adam with a Nesterov-style look-ahead in the first moment.',
    source: 'T. Dozat, "Incorporating Nesterov Momentum into Adam", ICLR 2016 workshop track.',
  },
  build: (spec) =>
    firstOrderChain('NAdam', spec, [
      scaleByNadam(num(spec, 'beta1'), num(spec, 'beta2'), num(spec, 'epsilon'), num(spec, 'momentumDecay'), str<NadamForm>(spec, 'form')),
    ]),
};
