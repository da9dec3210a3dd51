import { firstOrderChain } from './firstOrder';
import { defineMethod } from './method';

/**
 * Gradient descent: x_t = x_{t-1} - lr_t g_t.
 *
 * Default lr 0.01 (a workbench starting point; Keras SGD's default too). On a quadratic with Hessian
 * eigenvalues lambda_i the error shrinks by |1 - lr lambda_i| per step, so a fixed step converges iff 0 < lr < 2 / lambda_max and is best at
 * 2 / (lambda_min + lambda_max) (Polyak, Introduction to Optimization, 1987, Sec. 1.4; Nesterov,
 * convex optimization textbook, Kluwer 2004, Thm 2.1.15). Cauchy (1847) proposed the method.
 * With plain descent, coupled L2 (g + l2 x) and decoupled decay (lr * weightDecay * x) are the same step.
 */
export const gd = defineMethod({
    kind: 'gd',
    label: 'Gradient descent',
    defaultLearningRate: 0.01,
    family: 'first-order',
    settings: {},
    defaultWeightDecay: 0,
    summary: 'Steps against the gradient, scaled by the learning rate.',
    source: 'Cauchy, "Methode generale pour la resolution des systemes d\'equations simultanees", C. R. Acad. Sci. Paris 25, 1847.',
  build: (_settings, spec) => firstOrderChain('Gradient descent', spec, []),
});
