import type { RuleExample } from './example';

/**
 * Adadelta (Zeiler 2012, Algorithm 1):
 *   E[g^2]_t = rho E[g^2]_{t-1} + (1 - rho) g_t^2,
 *   dx_t = -(RMS[dx]_{t-1} / RMS[g]_t) g_t with RMS[y] = sqrt(E[y^2] + eps),
 *   E[dx^2]_t = rho E[dx^2]_{t-1} + (1 - rho) dx_t^2,  x_{t+1} = x_t + dx_t.
 * The paper has no learning rate (lr = 1, our default); tfjs, PyTorch and Keras multiply the step by
 * one (tfjs default 0.001, PyTorch 1.0). Defaults rho = 0.95, eps = 1e-6 (the paper's experiments).
 * tfjs-core 4.22.0 forms the step with E[g^2]_{t-1}, before adding g_t^2 (its first step is lr g); that
 * order is this rule with the `sq = ...` line moved below `let d = ...` (test/engine/rules/tfjs.test.ts).
 */
export const adadeltaRule: RuleExample = {
  id: 'adadelta',
  label: 'Adadelta',
  defaultLearningRate: 1,
  source: 'M. D. Zeiler, "ADADELTA: An Adaptive Learning Rate Method", arXiv:1212.5701, 2012, Algorithm 1.',
  text: `# Adadelta: Zeiler 2012, Algorithm 1 (lr = 1 is the paper's method)
hyper rho = 0.95
hyper eps = 1e-6
state sq = 0     # running mean of g^2
state dsq = 0    # running mean of squared steps
sq = rho * sq + (1 - rho) * g * g
let d = sqrt(dsq + eps) / sqrt(sq + eps) * g
dsq = rho * dsq + (1 - rho) * d * d
x = x - lr * d
`,
};
