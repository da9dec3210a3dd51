import type { RuleExample } from './example';

/**
 * Heavy-ball momentum (Polyak 1964) in the built-in's PyTorch buffer form: b_1 = g_1,
 * b_t = mu b_{t-1} + (1 - tau) g_t, x_t = x_{t-1} - lr b_t. The first step's undamped gradient is
 * written without a conditional: min(t - 1, 1) is 0 at t = 1 and 1 afterwards.
 */
export const heavyBallRule: RuleExample = {
  id: 'heavy-ball',
  label: 'Heavy ball (rule)',
  defaultLearningRate: 0.01,
  source: 'B. T. Polyak, "Some methods of speeding up the convergence of iteration methods", USSR Comput. Math. & Math. Phys. 4(5), 1964.',
  text: `# Heavy-ball momentum: Polyak 1964 (PyTorch buffer form, dampening skipped on step 1)
hyper momentum = 0.9
hyper dampening = 0
state b = 0    # momentum buffer
b = momentum * b + (1 - dampening * min(t - 1, 1)) * g
x = x - lr * b
`,
};
