import { choice } from '../settings';
import { scaleByAdam } from '../transforms';
import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';
import { adamEpsilonForm, beta1, beta2, epsilon } from './sharedSettings';

/**
 * AdamW (Loshchilov & Hutter, "Decoupled Weight Decay Regularization", ICLR 2019, Algorithm 2):
 * Adam's moments from the raw gradient, with the decay kept out of them:
 *   'times-learning-rate' (default; PyTorch AdamW, Optax adamw, Keras AdamW):
 *       x_t = x_{t-1} - lr_t ( mhat_t / (sqrt(vhat_t) + eps) + lambda x_{t-1} ),
 *   'times-schedule': x_t = x_{t-1} - eta_t ( alpha mhat_t / (sqrt(vhat_t) + eps) + lambda x_{t-1} ),
 *       alpha = the base learning rate, eta_t = lr_t / alpha the schedule multiplier: the decay
 *       follows the schedule but is not multiplied by alpha.
 * So PyTorch's lambda is the paper's lambda / alpha. lambda is the spec's weightDecay, default 0.01
 * (PyTorch; Optax 1e-4, Keras 0.004 from memory). Other defaults as Adam (lr 0.001).
 */
export const adamw = defineMethod({
    kind: 'adamw',
    label: 'AdamW',
    defaultLearningRate: 0.001,
    family: 'first-order',
    settings: {
      beta1: beta1(),
      beta2: beta2(),
      epsilon: epsilon(1e-8),
      epsilonForm: adamEpsilonForm,
      decayForm: choice(['times-learning-rate', 'times-schedule'], {
        label: 'decay form',
        help: "'times-learning-rate': the decay lambda x is multiplied by the learning rate lr_t; 'times-schedule': multiplied by the schedule's multiplier lr_t / lr only, not by the base rate (Loshchilov & Hutter 2019, Algorithm 2).",
      }),
    },
    defaultWeightDecay: 0.01,
    summary: 'Adam with weight decay applied to the parameters directly rather than through the gradient.',
    source: 'I. Loshchilov & F. Hutter, "Decoupled Weight Decay Regularization", ICLR 2019.',
  build: (s, spec) => {
    const paper = s.decayForm === 'times-schedule';
    const core = [scaleByAdam(s.beta1, s.beta2, s.epsilon, s.epsilonForm)];
    // Paper form: lr_t (lambda / alpha) x = eta_t lambda x.
    const decay = paper ? spec.weightDecay / spec.learningRate : spec.weightDecay;
    return firstOrderChain(paper ? 'AdamW (decay times schedule)' : 'AdamW', spec, core, decay);
  },
});
