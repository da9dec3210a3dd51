import { dot, norm2 } from '../../vector';
import { clearHistory, createHistory, pushPair, twoLoopDirection, type CurvatureHistory } from '../quasiNewton/history';
import { strongWolfeSearch, type LinePoint } from '../search';
import type { ResolvedSpec } from '../spec';
import type { Optimizer, StepReport } from '../types';
import { choice, number, type SettingValues } from '../settings';
import { defineMethod } from './method';

/**
 * L-BFGS (Liu & Nocedal, "On the limited memory BFGS method for large scale optimization", Math.
 * Programming 45, 1989; Nocedal & Wright, Numerical Optimization, 2nd ed., 2006, Alg. 7.4-7.5):
 *   p_k = -H_k g_k by the two-loop recursion over the last m pairs (s_i, y_i), H_k^0 = gamma_k I with
 *   gamma_k = s^T y / y^T y of the newest pair; x_{k+1} = x_k + a_k p_k with a_k from a strong-Wolfe
 *   line search (N&W Alg. 3.5/3.6, safeguarded cubic interpolation; c1 = 1e-4, c2 = 0.9), first trial
 *   a = lr (1 for quasi-Newton steps).
 * While no pair is held (the first step, or after a reset) the direction is -g and the first trial is
 * lr min(1, 1/||g||_1), PyTorch's first-step rule. A pair is stored only when
 * y^T s > 1e-10 |s| |y| (our scale-free version of PyTorch's absolute y^T s > 1e-10; SciPy's BFGS
 * skips non-positive y^T s similarly). If the search finds no step with sufficient decrease, the
 * memory is cleared and the search repeated along -g; if that fails too the point stays put
 * (learning rate reported 0, `noDescent` set: the run loop ends the run there and judges the point).
 * Defaults m = 10 (SciPy L-BFGS-B; PyTorch 100), at most 20 evaluations per search.
 * 'none' line search takes the fixed step a = lr (PyTorch's default line_search_fn=None).
 * The step leaves the gradient at the new point in the work buffer and reports lossAtNewPoint, so the
 * run loop does not re-evaluate (it then counts none of its own); extraEvaluations is therefore every
 * evaluation the search made.
 * With l2Penalty the objective is f + l2/2 |x|^2 throughout; the recorded loss stays f.
 */
const LBFGS_SETTINGS = {
  historySize: number(10, { label: 'history size (m)', min: 1, max: 1000, integer: true, help: 'Curvature pairs kept.' }),
  lineSearch: choice(['strong-wolfe', 'none'], {
    label: 'line search',
    help: "'strong-wolfe': Nocedal & Wright Alg. 3.5/3.6; 'none': fixed step equal to the learning rate (PyTorch's default).",
  }),
  c1: number(1e-4, { label: 'c1 (sufficient decrease)', min: 0, max: 1, minExclusive: true, maxExclusive: true, help: 'Armijo constant of the Wolfe conditions.' }),
  c2: number(0.9, { label: 'c2 (curvature)', min: 0, max: 1, minExclusive: true, maxExclusive: true, help: 'Curvature constant of the strong Wolfe conditions (0.9 for quasi-Newton).' }),
  maxLineSearchEvaluations: number(20, { label: 'evaluations per line search', min: 1, max: 1000, integer: true, help: 'Budget of function evaluations for one line search.' }),
};

export const lbfgs = defineMethod({
    kind: 'lbfgs',
    label: 'L-BFGS',
    defaultLearningRate: 1,
    family: 'line-search',
    settings: LBFGS_SETTINGS,
    defaultWeightDecay: 0,
    summary: 'Quasi-Newton steps from a short memory of gradient changes, with a line search.',
    source: 'D. C. Liu & J. Nocedal, "On the limited memory BFGS method for large scale optimization", Math. Programming 45, 1989.',
  crossChecks: ({ c1, c2 }) => (c1 < c2 ? [] : [['hyper.c1', `c1 must be less than c2, got c1 = ${c1}, c2 = ${c2}`]]),
  build: (settings, spec) => buildLbfgs(settings, spec),
});

export interface LbfgsState {
  history: CurvatureHistory;
}

function buildLbfgs(settings: SettingValues<typeof LBFGS_SETTINGS>, spec: ResolvedSpec): Optimizer<LbfgsState> {
  const { historySize: m, c1, c2, maxLineSearchEvaluations: maxEvaluations } = settings;
  const useSearch = settings.lineSearch === 'strong-wolfe';
  const lr = spec.learningRate;
  const l2 = spec.l2Penalty;
  let n = -1;
  let g0 = new Float64Array(0);
  let p = new Float64Array(0);
  let trial = new Float64Array(0);
  let trialGrad = new Float64Array(0);
  let s = new Float64Array(0);
  let y = new Float64Array(0);
  const alpha = new Float64Array(m);
  const ensure = (dim: number) => {
    if (dim === n) return;
    n = dim;
    [g0, p, trial, trialGrad, s, y] = Array.from({ length: 6 }, () => new Float64Array(dim));
  };

  return {
    label: useSearch ? 'L-BFGS' : 'L-BFGS (fixed step)',
    init: (x0) => ({ history: createHistory(m, x0.length) }),
    step(x, grad, state, ctx): StepReport {
      ensure(x.length);
      const h = state.history;
      for (let i = 0; i < n; i++) g0[i] = grad[i] + l2 * x[i];
      const phi0 = ctx.loss + 0.5 * l2 * dot(x, x);
      let evaluations = 0;
      let lastA = Number.NaN;
      let lastF = Number.NaN;
      /** phi(a) at x + a p: penalised value and slope; trialGrad keeps the raw gradient there. */
      const phi = (a: number, out: LinePoint) => {
        for (let i = 0; i < n; i++) trial[i] = x[i] + a * p[i];
        const f = ctx.oracle.valueGradient(trial, trialGrad);
        lastA = a;
        lastF = f;
        let d = 0;
        for (let i = 0; i < n; i++) d += (trialGrad[i] + l2 * trial[i]) * p[i];
        out.f = f + 0.5 * l2 * dot(trial, trial);
        out.d = d;
      };
      const stayPut = (): StepReport => ({ learningRate: 0, extraEvaluations: evaluations, lossAtNewPoint: ctx.loss, noDescent: true });
      if (norm2(g0) === 0) return stayPut();

      for (;;) {
        twoLoopDirection(h, g0, p, alpha);
        let dphi0 = dot(g0, p);
        if (!(dphi0 < 0)) {
          // Not a descent direction (possible with noisy gradients): start the memory afresh.
          clearHistory(h);
          twoLoopDirection(h, g0, p, alpha);
          dphi0 = dot(g0, p);
        }
        const gNorm1 = g0.reduce((acc, v) => acc + Math.abs(v), 0);
        const a1 = h.count === 0 ? lr * Math.min(1, 1 / gNorm1) : lr;
        let accepted: LinePoint | null = null;
        if (useSearch) {
          const result = strongWolfeSearch(phi, phi0, dphi0, a1, { c1, c2, maxEvaluations });
          evaluations += result.evaluations;
          if (result.status !== 'failed') accepted = result.point;
        } else {
          const point: LinePoint = { a: a1, f: Number.NaN, d: Number.NaN };
          phi(a1, point);
          evaluations += 1;
          accepted = point;
        }
        if (accepted) {
          if (accepted.a !== lastA) {
            phi(accepted.a, { a: accepted.a, f: 0, d: 0 });
            evaluations += 1;
          }
          const a = accepted.a;
          for (let i = 0; i < n; i++) {
            s[i] = a * p[i];
            y[i] = trialGrad[i] + l2 * trial[i] - g0[i];
          }
          const ys = dot(y, s);
          if (ys > 1e-10 * norm2(s) * norm2(y)) pushPair(h, s, y, ys);
          x.set(trial);
          grad.set(trialGrad);
          return { learningRate: a, extraEvaluations: evaluations, lossAtNewPoint: lastF };
        }
        if (h.count === 0) return stayPut();
        clearHistory(h);
      }
    },
  };
}
