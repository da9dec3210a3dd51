import type { RuleExample } from './example';

/**
 * RMSProp (Tieleman & Hinton 2012) as a rule, epsilon outside the root (the built-in default, PyTorch's
 * form), in the built-in transform's order of operations.
 */
export const rmspropRule: RuleExample = {
  id: 'rmsprop',
  label: 'RMSProp (rule)',
  defaultLearningRate: 0.01,
  source: 'T. Tieleman & G. Hinton, "Neural Networks for Machine Learning", Coursera course slides 6e, 2012.',
  text: `# RMSProp: Tieleman & Hinton, course slides 6e, 2012 (eps outside the root)
hyper decay = 0.9
hyper eps = 1e-8
state v = 0    # running mean of g^2
v = decay * v + (1 - decay) * g * g
x = x - lr * (g / (sqrt(v) + eps))
`,
};
