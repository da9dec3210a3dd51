import { choice, number } from '../settings';
import { NADAM_FORMS, scaleByNadam } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';
import { beta1, beta2, epsilon } from './sharedSettings';

/**
 * NAdam (T. Dozat, "Incorporating Nesterov Momentum into Adam", ICLR 2016 workshop), PyTorch form:
 *   mu_t = b1 (1 - 0.5 * 0.96^(t psi)),  m_t = b1 m_{t-1} + (1 - b1) g_t,  v_t = b2 v_{t-1} + (1 - b2) g_t^2,
 *   mhat_t = mu_{t+1} m_t / (1 - prod_{i<=t+1} mu_i) + (1 - mu_t) g_t / (1 - prod_{i<=t} mu_i),
 *   x_t = x_{t-1} - lr_t mhat_t / (sqrt(v_t/(1 - b2^t)) + eps).
 * Defaults (PyTorch): lr 0.002, b1 0.9, b2 0.999, eps 1e-8, psi (momentumDecay) 0.004.
 * 'constant-momentum' is Optax's nadam, without the momentum schedule:
 *   mhat_t = b1 m_t / (1 - b1^(t+1)) + (1 - b1) g_t / (1 - b1^t).
 * Keras Nadam uses a 0.96^(0.004 t) schedule too (from memory, not checked). Whether Dozat's EMA uses
 * the scheduled mu_t or the constant b1 is not settled in our reference; PyTorch uses b1.
 */
export const nadam = defineMethod({
    kind: 'nadam',
    label: 'NAdam',
    defaultLearningRate: 0.002,
    family: 'first-order',
    settings: {
      beta1: beta1(),
      beta2: beta2(),
      epsilon: epsilon(1e-8),
      momentumDecay: number(0.004, {
        label: 'momentum decay (psi)',
        min: 0,
        help: 'psi in the momentum schedule mu_t = beta1 (1 - 0.5 * 0.96^(t psi)) (rising-momentum form only).',
      }),
      form: choice(NADAM_FORMS, { help: "'rising-momentum': the momentum coefficient rises towards beta1 as mu_t = beta1 (1 - 0.5 * 0.96^(t psi)) (Dozat 2016); 'constant-momentum': mu_t = beta1 at every step." }),
    },
    defaultWeightDecay: 0,
    summary: 'Adam with a Nesterov-style look-ahead in the first moment.',
    source: 'T. Dozat, "Incorporating Nesterov Momentum into Adam", ICLR 2016 workshop track.',
  build: (s, spec) => firstOrderChain('NAdam', spec, [scaleByNadam(s.beta1, s.beta2, s.epsilon, s.momentumDecay, s.form)]),
});
