import { choice } from '../settings';
import { AMSGRAD_FORMS, scaleByAmsgrad } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';
import { beta1, beta2, epsilon } from './sharedSettings';

/**
 * AMSGrad (Reddi, Kale & Kumar, "On the Convergence of Adam and Beyond", ICLR 2018, Algorithm 2):
 * Adam whose denominator uses the running maximum of the second moment, so no coordinate's effective
 * step grows.
 *   'max-raw-moment' (default; Adam(amsgrad=True)): vmax_t = max(vmax_{t-1}, v_t),
 *       x_t = x_{t-1} - lr_t [m_t/(1 - b1^t)] / (sqrt(vmax_t/(1 - b2^t)) + eps);
 *   'max-corrected-moment' (optax.amsgrad): bias-correct first, then the maximum: vmax_t = max(vmax_{t-1}, v_t/(1 - b2^t));
 *   'no-bias-correction': vmax_t = max(vmax_{t-1}, v_t), x_t = x_{t-1} - lr_t m_t / (sqrt(vmax_t) + eps), no bias
 *       correction; the paper has no eps (set epsilon 0) and analyses lr_t = alpha / sqrt(t)
 *       (inverse-time schedule, decayRate 1, power 0.5).
 * The PyTorch and Optax forms differ from t = 2 on when the bias-corrected v falls. Defaults as Adam.
 */
export const amsgrad = defineMethod({
    kind: 'amsgrad',
    label: 'AMSGrad',
    defaultLearningRate: 0.001,
    family: 'first-order',
    settings: {
      beta1: beta1(),
      beta2: beta2(),
      epsilon: epsilon(1e-8),
      form: choice(AMSGRAD_FORMS, {
        help: "'max-raw-moment': maximum of the raw second moment, then bias correction; 'max-corrected-moment': maximum of the bias-corrected second moment; 'no-bias-correction': maximum of the raw moment and no bias correction at all (Reddi, Kale & Kumar 2018, Algorithm 2).",
      }),
    },
    defaultWeightDecay: 0,
    summary: "Adam with a non-decreasing second-moment estimate, fixing Adam's non-convergence examples.",
    source: 'S. J. Reddi, S. Kale & S. Kumar, "On the Convergence of Adam and Beyond", ICLR 2018.',
  build: (s, spec) => firstOrderChain('AMSGrad', spec, [scaleByAmsgrad(s.beta1, s.beta2, s.epsilon, s.form)]),
});
