import { choice } from '../settings';
import type { ResolvedSpec } from '../spec';
import { applyTransforms, initTransforms, learningRateStage, type ChainState } from '../transform';
import { traceMomentum } from '../transforms';
import type { Optimizer } from '../types';
import { firstOrderChain, wrapFirstOrder } from './firstOrder';
import { defineMethod } from './method';
import { momentum } from './sharedSettings';

/**
 * Nesterov momentum (Nesterov 1983; in deep-learning form, Sutskever, Martens, Dahl & Hinton,
 * "On the importance of initialization and momentum in deep learning", ICML 2013).
 *
 * 'record-look-ahead' form (default; PyTorch SGD(nesterov=True), Keras, Optax, tfjs): the gradient is taken at
 * the stored point and
 *   b_1 = g_1,  b_t = mu b_{t-1} + g_t,  x_t = x_{t-1} - lr_t (g_t + mu b_t).
 * 'record-base-point' form: v_t = mu v_{t-1} - lr_t grad f(theta_{t-1} + mu v_{t-1}), theta_t = theta_{t-1} + v_t.
 * The two are one algorithm seen at different points: the library's stored point is Sutskever's
 * look-ahead theta_t + mu v_t (TF 2.2's SGD documentation says so). So the iterates differ (already
 * at t = 1: theta_0 - lr g_0 against theta_0 - lr (1 + mu) g_0). The 'record-base-point' form costs one extra
 * gradient evaluation per step here, at the look-ahead point, because the run records theta.
 * Defaults mu = 0.9, lr 0.01.
 */
export const nesterov = defineMethod({
  kind: 'nesterov',
  label: 'Nesterov momentum',
  defaultLearningRate: 0.01,
  family: 'first-order',
  settings: {
    momentum: momentum(0.9, 'Fraction of the previous step direction kept (mu).'),
    form: choice(['record-look-ahead', 'record-base-point'], {
      help: "'record-look-ahead': the path records the look-ahead point theta + mu v, where the gradient is taken; 'record-base-point': the path records theta and the gradient is taken at theta + mu v (one extra evaluation per step; Sutskever, Martens, Dahl & Hinton 2013, eq. 3-4).",
    }),
  },
  defaultWeightDecay: 0,
  summary: 'Momentum that looks ahead along the velocity before taking the gradient.',
  source: 'Y. Nesterov, "A method for solving the convex programming problem with convergence rate O(1/k^2)", Soviet Math. Dokl. 27, 1983; Sutskever, Martens, Dahl & Hinton, ICML 2013.',
  build: (s, spec) =>
    s.form === 'record-base-point' ? baseRecordingNesterov(s.momentum, spec) : firstOrderChain('Nesterov momentum', spec, [traceMomentum(s.momentum, 0, true)]),
});

interface LookAheadState {
  chain: ChainState;
  /** v, Sutskever's velocity (the learning rate inside). */
  velocity: Float64Array;
  lookAhead: Float64Array;
}

/**
 * Sutskever's form: the chain [clip] -> [L2] -> [decay] -> -lr_t runs on the gradient at the
 * look-ahead point x + mu v (the penalties read the look-ahead point too), giving u = -lr_t g; then
 * v = mu v + u and x = x + v (the classical-momentum velocity of Sutskever et al., the Keras SGD form).
 */
function baseRecordingNesterov(mu: number, spec: ResolvedSpec): Optimizer<LookAheadState> {
  const transforms = wrapFirstOrder(spec, []);
  const rate = learningRateStage(transforms, 'Nesterov momentum (base point recorded)');
  return {
    label: 'Nesterov momentum (base point recorded)',
    init: (x0) => ({ chain: initTransforms(transforms, x0), velocity: new Float64Array(x0.length), lookAhead: new Float64Array(x0.length) }),
    step(x, grad, state, ctx) {
      const { velocity: v, lookAhead: look } = state;
      for (let i = 0; i < x.length; i++) look[i] = x[i] + mu * v[i];
      ctx.oracle.valueGradient(look, grad);
      applyTransforms(transforms, state.chain, grad, look, ctx.t);
      for (let i = 0; i < x.length; i++) {
        v[i] = mu * v[i] + grad[i];
        x[i] += v[i];
      }
      return { learningRate: rate.learningRate(ctx.t), extraEvaluations: 1 };
    },
  };
}
