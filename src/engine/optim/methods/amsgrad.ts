import { scaleByAmsgrad, type AmsgradForm } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { num, str, type MethodDefinition } from './method';
import { beta1Info, beta2Info, epsilonInfo } from './sharedSettings';

/**
 * AMSGrad (Reddi, Kale & Kumar, "On the Convergence of Adam and Beyond", ICLR 2018, Algorithm 2):
 * Adam whose denominator uses the running maximum of the second moment, so no coordinate's effective
 * step grows.
 *   'max-raw-moment' (default; PyTorch Adam(amsgrad=True)): vmax_t = max(vmax_{t-1}, v_t),
 *       x_t = x_{t-1} - lr_t [m_t/(1 - b1^t)] / (sqrt(vmax_t/(1 - b2^t)) + eps);
 *   'max-corrected-moment' (optax.amsgrad): bias-correct first, then the maximum: vmax_t = max(vmax_{t-1}, v_t/(1 - b2^t));
 *   'no-bias-correction' (the paper's Algorithm 2): vmax_t = max(vmax_{t-1}, v_t), x_t = x_{t-1} - lr_t m_t / (sqrt(vmax_t) + eps), no bias
 *       correction; the paper has no eps (set epsilon 0) and analyses lr_t = alpha / sqrt(t)
 *       (inverse-time schedule, decayRate 1, power 0.5).
 * The two bias-corrected forms differ from t = 2 on when the bias-corrected v falls. Defaults as Adam.
 */
export const amsgrad: MethodDefinition = {
  info: {
    kind: 'amsgrad',
    label: 'AMSGrad',
    defaultLearningRate: 0.001,
    hyperparameters: [
      beta1Info(),
      beta2Info(),
      epsilonInfo(1e-8),
      {
        name: 'form',
        label: 'form',
        default: 'max-raw-moment',
        choices: ['max-raw-moment', 'max-corrected-moment', 'no-bias-correction'],
        help: "'max-raw-moment': maximum of the raw second moment, then bias correction; 'max-corrected-moment': maximum of the bias-corrected second moment; 'no-bias-correction': maximum of the raw moment and no bias correction at all (Reddi, Kale & Kumar 2018, Algorithm 2).",
      },
    ],
    usesSchedule: true,
    defaultWeightDecay: 0,
    summary: "Adam with a non-decreasing second-moment estimate, fixing Adam's non-convergence examples.",
    source: 'S. J. Reddi, S. Kale & S. Kumar, "On the Convergence of Adam and Beyond", ICLR 2018.',
  },
  build: (spec) =>
    firstOrderChain('AMSGrad', spec, [scaleByAmsgrad(num(spec, 'beta1'), num(spec, 'beta2'), num(spec, 'epsilon'), str<AmsgradForm>(spec, 'form'))]),
};
