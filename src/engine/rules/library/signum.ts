import type { RuleExample } from './example';

/**
 * signSGD with momentum, "Signum" (Bernstein, Wang, Azizzadenesheli & Anandkumar, ICML 2018,
 * Algorithm 1): m_t = b m_{t-1} + (1 - b) g_t, x_t = x_{t-1} - lr sign(m_t). Default b = 0.9.
 */
export const signumRule: RuleExample = {
  id: 'signum',
  label: 'signSGD with momentum (Signum)',
  defaultLearningRate: 1e-3,
  source: 'J. Bernstein, Y.-X. Wang, K. Azizzadenesheli & A. Anandkumar, "signSGD: Compressed Optimisation for Non-Convex Problems", ICML 2018.',
  text: `# signSGD with momentum (Signum): Bernstein et al., ICML 2018
hyper beta = 0.9
state m = 0
m = beta * m + (1 - beta) * g
x = x - lr * sign(m)
`,
};
