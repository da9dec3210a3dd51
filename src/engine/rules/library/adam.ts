import type { RuleExample } from './example';

/**
 * Adam (Kingma & Ba, ICLR 2015, Algorithm 1) as a rule. The arithmetic is written in the order of the
 * built-in `scaleByAdam` + `scaleByLearningRate` chain ((1 - b2) * g * g, m / c1 / d, x - lr * u), so
 * the iterates equal the built-in Adam's bit for bit.
 */
export const adamRule: RuleExample = {
  id: 'adam',
  label: 'Adam (rule)',
  defaultLearningRate: 0.001,
  source: 'D. P. Kingma & J. Ba, "Adam: A Method for Stochastic Optimization", ICLR 2015, Algorithm 1.',
  text: `# Adam: Kingma & Ba, ICLR 2015, Algorithm 1
hyper beta1 = 0.9
hyper beta2 = 0.999
hyper eps = 1e-8
state m = 0    # first moment
state v = 0    # second moment
m = beta1 * m + (1 - beta1) * g
v = beta2 * v + (1 - beta2) * g * g
x = x - lr * (m / (1 - beta1^t) / (sqrt(v / (1 - beta2^t)) + eps))
`,
};
