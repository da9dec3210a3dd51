import type { RuleExample } from './example';

/**
 * AdaBelief (Zhuang et al., NeurIPS 2020, Algorithm 2):
 *   m_t = b1 m_{t-1} + (1 - b1) g_t,  s_t = b2 s_{t-1} + (1 - b2) (g_t - m_t)^2 + eps,
 *   mhat = m_t / (1 - b1^t),  shat = s_t / (1 - b2^t),  x_t = x_{t-1} - lr mhat / (sqrt(shat) + eps).
 * Defaults lr 1e-3, b1 0.9, b2 0.999, eps 1e-16 (the authors' released code; the algorithm box adds
 * eps inside s_t as well as in the denominator, as here).
 */
export const adabeliefRule: RuleExample = {
  id: 'adabelief',
  label: 'AdaBelief',
  defaultLearningRate: 1e-3,
  source: 'J. Zhuang et al., "AdaBelief Optimizer: Adapting Stepsizes by the Belief in Observed Gradients", NeurIPS 2020, Algorithm 2.',
  text: `# AdaBelief: Zhuang et al., NeurIPS 2020, Algorithm 2
hyper beta1 = 0.9
hyper beta2 = 0.999
hyper eps = 1e-16
state m = 0
state s = 0    # belief: running mean of (g - m)^2
m = beta1 * m + (1 - beta1) * g
s = beta2 * s + (1 - beta2) * (g - m)^2 + eps
x = x - lr * (m / (1 - beta1^t)) / (sqrt(s / (1 - beta2^t)) + eps)
`,
};
