import { choleskyDecompose, choleskySolve, luDecompose, luSolve, symmetricEigen } from '../../linalg';
import { dot } from '../../vector';
import { backtrackingSearch } from '../search';
import type { ResolvedSpec } from '../spec';
import type { Optimizer, StepReport } from '../types';
import { choice, number, type SettingValues } from '../settings';
import { defineMethod } from './method';

/**
 * Newton's method with damping: x_{k+1} = x_k - lr H_k^{-1} g_k (lr = 1: pure Newton, which reaches
 * the minimiser of a quadratic in one step and converges quadratically near a minimiser with a
 * positive-definite Hessian; Nocedal & Wright, Numerical Optimization, 2nd ed., Sec. 3.3).
 * The solve uses Cholesky when H is positive definite, LU with pivoting otherwise; when H is singular
 * the step falls back to -g (common practice).
 *
 * 'saddle-free' variant (Dauphin, Pascanu, Gulcehre, Cho, Ganguli & Bengio, "Identifying and
 * attacking the saddle point problem in high-dimensional non-convex optimization", NeurIPS 2014):
 * H = V diag(lambda) V^T (cyclic Jacobi), step -V diag(1 / max(|lambda_i|, floor)) V^T g: directions of
 * negative curvature are descended instead of climbed, so saddle points repel rather than attract.
 * The paper damps |H| by adding a multiple of I; the floor here is our simpler safeguard against
 * near-zero curvature (default 1e-3, an own choice).
 *
 * 'backtracking' line search: start from a = lr, halve (factor 0.5) until the Armijo condition
 * f(x + a p) <= f(x) + c1 a g^T p holds (N&W Alg. 3.1, c1 = 1e-4). When p is not a descent direction
 * (plain Newton at an indefinite Hessian) the search uses -g instead. With backtracking the step
 * reports lossAtNewPoint and leaves the gradient there (the run loop then makes no evaluation of its
 * own, so extraEvaluations counts the Hessian evaluation and every trial); without it the Hessian is
 * the one extra evaluation per step. Reported learning rate: the step factor a actually taken (0 if no step was accepted).
 * With l2Penalty the objective is f + l2/2 |x|^2 (Hessian + l2 I); the recorded loss stays f.
 */
const NEWTON_SETTINGS = {
  variant: choice(['plain', 'saddle-free'], {
    help: "'plain': H^-1 g; 'saddle-free': |H|^-1 g from the eigen-decomposition, with a floor on |eigenvalue| (Dauphin et al. 2014).",
  }),
  eigenvalueFloor: number(1e-3, { label: 'eigenvalue floor', min: 0, minExclusive: true, help: 'Smallest |eigenvalue| used by the saddle-free variant.' }),
  lineSearch: choice(['none', 'backtracking'], {
    label: 'line search',
    help: "'none': fixed damping factor lr; 'backtracking': shrink the step from lr until the Armijo condition holds.",
  }),
  c1: number(1e-4, { label: 'c1 (sufficient decrease)', min: 0, max: 1, minExclusive: true, maxExclusive: true, help: 'Armijo constant.' }),
  backtrackingFactor: number(0.5, { label: 'backtracking factor', min: 0, max: 1, minExclusive: true, maxExclusive: true, help: 'Step shrink factor per rejected trial.' }),
  maxBacktracks: number(30, { label: 'trials per step', min: 1, max: 1000, integer: true, help: 'Most trial points per line search.' }),
};

export const newton = defineMethod({
    kind: 'newton',
    label: "Newton's method",
    defaultLearningRate: 1,
    family: 'curvature',
    settings: NEWTON_SETTINGS,
    defaultWeightDecay: 0,
    summary: 'Steps to the minimum of the local quadratic model from the exact Hessian.',
    source: 'J. Nocedal & S. J. Wright, Numerical Optimization, 2nd ed., Springer 2006, Ch. 3; saddle-free variant: Dauphin et al., NeurIPS 2014.',
  build: (settings, spec) => buildNewton(settings, spec),
});

function buildNewton(settings: SettingValues<typeof NEWTON_SETTINGS>, spec: ResolvedSpec): Optimizer<null> {
  const saddleFree = settings.variant === 'saddle-free';
  const search = settings.lineSearch === 'backtracking';
  const { eigenvalueFloor: floor, c1, backtrackingFactor: shrink, maxBacktracks: maxTrials } = settings;
  const lr = spec.learningRate;
  const l2 = spec.l2Penalty;
  let n = -1;
  let H = new Float64Array(0);
  let factor = new Float64Array(0);
  let vectors = new Float64Array(0);
  let values = new Float64Array(0);
  let g = new Float64Array(0);
  let gH = new Float64Array(0);
  let p = new Float64Array(0);
  let trial = new Float64Array(0);
  let trialGrad = new Float64Array(0);
  const ensure = (dim: number) => {
    if (dim === n) return;
    n = dim;
    [H, factor, vectors] = Array.from({ length: 3 }, () => new Float64Array(dim * dim));
    [values, g, gH, p, trial, trialGrad] = Array.from({ length: 6 }, () => new Float64Array(dim));
  };

  /** p = -(H^-1 or |H|^-1) g. */
  const direction = () => {
    if (saddleFree) {
      symmetricEigen(H, n, { values, vectors, work: factor });
      p.fill(0);
      for (let k = 0; k < n; k++) {
        let c = 0;
        for (let i = 0; i < n; i++) c += vectors[i * n + k] * g[i];
        c /= Math.max(Math.abs(values[k]), floor);
        for (let i = 0; i < n; i++) p[i] -= c * vectors[i * n + k];
      }
      return;
    }
    if (choleskyDecompose(H, n, factor)) choleskySolve(factor, n, g, p);
    else {
      const lu = luDecompose(H, n);
      if (lu) luSolve(lu, g, p);
      else p.set(g);
    }
    for (let i = 0; i < n; i++) p[i] = -p[i];
  };

  const label = `${saddleFree ? 'Saddle-free Newton' : "Newton's method"}${search ? ' (backtracking)' : ''}`;
  return {
    label,
    init: () => null,
    step(x, grad, _state, ctx): StepReport {
      ensure(x.length);
      ctx.oracle.valueGradientHessian(x, gH, H);
      for (let i = 0; i < n; i++) {
        g[i] = grad[i] + l2 * x[i];
        H[i * n + i] += l2;
      }
      direction();
      if (!p.every(Number.isFinite)) for (let i = 0; i < n; i++) p[i] = -g[i];
      if (!search) {
        for (let i = 0; i < n; i++) x[i] += lr * p[i];
        return { learningRate: lr, extraEvaluations: 1 };
      }
      let slope = dot(g, p);
      if (!(slope < 0)) {
        for (let i = 0; i < n; i++) p[i] = -g[i];
        slope = -dot(g, g);
      }
      let rawLoss = ctx.loss;
      const phi = (a: number) => {
        for (let i = 0; i < n; i++) trial[i] = x[i] + a * p[i];
        rawLoss = ctx.oracle.valueGradient(trial, trialGrad);
        return rawLoss + 0.5 * l2 * dot(trial, trial);
      };
      const phi0 = ctx.loss + 0.5 * l2 * dot(x, x);
      const result = slope < 0 ? backtrackingSearch(phi, phi0, slope, lr, c1, shrink, maxTrials) : { step: 0, value: phi0, evaluations: 0 };
      if (result.step === 0) return { learningRate: 0, extraEvaluations: 1 + result.evaluations, lossAtNewPoint: ctx.loss, noDescent: true };
      x.set(trial);
      grad.set(trialGrad);
      return { learningRate: result.step, extraEvaluations: 1 + result.evaluations, lossAtNewPoint: rawLoss };
    },
  };
}
