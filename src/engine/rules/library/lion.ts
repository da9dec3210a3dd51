import type { RuleExample } from './example';

/**
 * Lion (Chen et al. 2023, Algorithm 2, "EvoLved Sign Momentum"):
 *   c_t = b1 m_{t-1} + (1 - b1) g_t,  x_t = x_{t-1} - lr (sign(c_t) + lambda x_{t-1}),
 *   m_t = b2 m_{t-1} + (1 - b2) g_t.
 * Defaults b1 = 0.9, b2 = 0.99, lambda = 0; the paper suggests a learning rate 3-10x smaller than
 * AdamW's (1e-4 here).
 */
export const lionRule: RuleExample = {
  id: 'lion',
  label: 'Lion',
  defaultLearningRate: 1e-4,
  source: 'X. Chen et al., "Symbolic Discovery of Optimization Algorithms", NeurIPS 2023, Algorithm 2.',
  text: `# Lion: Chen et al. 2023, "Symbolic Discovery of Optimization Algorithms", Algorithm 2
hyper beta1 = 0.9
hyper beta2 = 0.99
hyper decay = 0     # decoupled weight decay (lambda)
state m = 0
let c = beta1 * m + (1 - beta1) * g
x = x - lr * (sign(c) + decay * x)
m = beta2 * m + (1 - beta2) * g
`,
};
