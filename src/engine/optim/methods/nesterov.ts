import type { ResolvedSpec } from '../spec';
import { applyTransforms, initTransforms, learningRateStage, type ChainState } from '../transform';
import { traceMomentum, traceVelocity } from '../transforms';
import type { Optimizer } from '../types';
import { firstOrderChain, wrapFirstOrder } from './firstOrder';
import { num, str, type MethodDefinition } from './method';
import { momentumInfo } from './sharedSettings';

/**
 * Nesterov momentum (Nesterov 1983; in deep-learning form, Sutskever, Martens, Dahl & Hinton,
 * "On the importance of initialization and momentum in deep learning", ICML 2013).
 *
 * 'record-look-ahead' form (default; PyTorch SGD(nesterov=True), Keras, Optax, tfjs): the gradient is taken at
 * the stored point and
 *   b_1 = g_1,  b_t = mu b_{t-1} + g_t,  x_t = x_{t-1} - lr_t (g_t + mu b_t).
 * 'record-base-point' form (Sutskever et al.'s equations): v_t = mu v_{t-1} - lr_t grad f(theta_{t-1} + mu v_{t-1}), theta_t = theta_{t-1} + v_t.
 * The two are one algorithm seen at different points: the first form's stored point is the second's
 * look-ahead theta_t + mu v_t (TF 2.2's SGD documentation says so). So the iterates differ (already
 * at t = 1: theta_0 - lr g_0 against theta_0 - lr (1 + mu) g_0). The 'record-base-point' form costs one extra
 * gradient evaluation per step here, at the look-ahead point, because the run records theta.
 * Defaults mu = 0.9, lr 0.01.
 */
export const nesterov: MethodDefinition = {
  info: {
    kind: 'nesterov',
    label: 'Nesterov momentum',
    defaultLearningRate: 0.01,
    hyperparameters: [
      momentumInfo(0.9, 'Fraction of the previous step direction kept (mu).'),
      {
        name: 'form',
        label: 'form',
        default: 'record-look-ahead',
        choices: ['record-look-ahead', 'record-base-point'],
        help: "'record-look-ahead': the path records the look-ahead point theta + mu v, where the gradient is taken; 'record-base-point': the path records theta and the gradient is taken at theta + mu v (one extra evaluation per step; Sutskever, Martens, Dahl & Hinton 2013, eq. 3-4).",
      },
    ],
    usesSchedule: true,
    defaultWeightDecay: 0,
    summary: 'Momentum that looks ahead along the velocity before taking the gradient.',
    source: 'Y. Nesterov, "A method for solving the convex programming problem with convergence rate O(1/k^2)", Soviet Math. Dokl. 27, 1983; Sutskever, Martens, Dahl & Hinton, ICML 2013.',
  },
  build: (spec) =>
    str(spec, 'form') === 'record-base-point'
      ? baseRecordingNesterov(spec)
      : firstOrderChain('Nesterov momentum', spec, [traceMomentum(num(spec, 'momentum'), 0, true)]),
};

interface LookAheadState {
  chain: ChainState;
  lookAhead: Float64Array;
}

/**
 * The 'record-base-point' form: the chain [clip] -> [L2] -> [decay] -> -lr_t -> velocity (v = mu v + u) runs on the
 * gradient at the look-ahead point x + mu v; the penalties read the look-ahead point too.
 */
function baseRecordingNesterov(spec: ResolvedSpec): Optimizer<LookAheadState> {
  const mu = num(spec, 'momentum');
  const transforms = [...wrapFirstOrder(spec, []), traceVelocity(mu)];
  const rate = learningRateStage(transforms, 'Nesterov momentum (base point recorded)');
  const velocityStage = transforms.length - 1;
  return {
    label: 'Nesterov momentum (base point recorded)',
    init: (x0) => ({ chain: initTransforms(transforms, x0), lookAhead: new Float64Array(x0.length) }),
    step(x, grad, state, ctx) {
      const v = (state.chain.stages[velocityStage] as { velocity: Float64Array }).velocity;
      const look = state.lookAhead;
      for (let i = 0; i < x.length; i++) look[i] = x[i] + mu * v[i];
      ctx.oracle.valueGradient(look, grad);
      applyTransforms(transforms, state.chain, grad, look, ctx.t);
      for (let i = 0; i < x.length; i++) x[i] += grad[i];
      return { learningRate: rate.learningRate(ctx.t), extraEvaluations: 1 };
    },
  };
}
