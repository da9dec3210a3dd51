import { classifyPoint } from '../analysis';
import { choleskyDecompose, choleskySolve } from '../linalg';
import type { Surface } from '../surface';
import { norm2 } from '../vector';
import type { EndPoint, RunOutcome, StopRule } from './outcome';
import { distance, recentDistance, type RecentPath } from './recent';
import { stationarityThreshold } from './stationarity';

/** What the judgement reads of a run at its end (a view of RunState). */
export interface EndFacts {
  t: number;
  x: Float64Array;
  x0: Float64Array;
  grad: Float64Array;
  loss: number;
  initialLoss: number;
  initialGradNorm: number;
  recent: RecentPath;
  stationarityTolerance?: number;
}

/** Why the run is being judged: a stop rule fired, the step limit came, or the user cancelled. */
export type EndTrigger = { rule: StopRule; tolerance?: number; patience?: number } | 'step-limit' | 'cancelled';

/** Relative closeness of x_t to x_{t-p} (against the spread of the cycle) that counts as a cycle. */
const CYCLE_MATCH = 1e-3;
/** Growth factor of the distance from the start per doubling of the step count that counts as escape. */
const ESCAPE_GROWTH = 1.5;
/** How far (in units of max(1, |x0|) or max(1, |f0|)) a non-stationary run must have gone to escape. */
const ESCAPE_REACH = 1e4;
/** Shortest last step, relative to max(1, |x|), of a run that is still escaping. */
const ESCAPE_STEP = 1e-3;

/** The state of the point where a run ended: its gradient, the stationarity test, its Hessian class. */
export function describeEndPoint(surface: Surface, f: EndFacts): EndPoint {
  const gradNorm = norm2(f.grad);
  const gradThreshold = stationarityThreshold(f.initialGradNorm, f.loss, f.stationarityTolerance);
  const stationary = gradNorm <= gradThreshold;
  const point: EndPoint = { gradNorm, gradThreshold, stationary, curvature: null, newtonStep: null };
  if (!stationary) return point;
  point.curvature = safeClassify(surface, f.x);
  if (point.curvature?.kind === 'minimum' && surface.dimension <= NEWTON_STEP_LIMIT) {
    point.newtonStep = newtonStepLength(surface, f.x);
    // A definite Hessian whose model minimum is still far away: the curvature is too weak to hold the
    // point (a flat direction), so it is not a minimum the run has reached.
    if (point.newtonStep === null || point.newtonStep > FLAT_STEP * Math.max(1, norm2(f.x))) point.curvature = { ...point.curvature, kind: 'degenerate' };
  }
  return point;
}

/** Largest dimension for which the Newton step is measured (a dense Cholesky solve). */
const NEWTON_STEP_LIMIT = 200;

/** |H^-1 g| relative to max(1, |x|) above which a definite stationary point counts as flat. */
const FLAT_STEP = 1e-3;

function safeClassify(surface: Surface, x: Float64Array) {
  try {
    return classifyPoint(surface, x);
  } catch {
    return null;
  }
}

/**
 * The Newton step's buffers for the last dimension asked (a sweep judges thousands of end points of
 * one dimension; zeroed or filled before each read, so one set serves every call).
 */
let newtonScratch: { n: number; g: Float64Array; h: Float64Array; factor: Float64Array; d: Float64Array } | null = null;

/** |H^-1 g| by Cholesky (null when H is not numerically positive definite). */
function newtonStepLength(surface: Surface, x: Float64Array): number | null {
  const n = surface.dimension;
  if (newtonScratch?.n !== n) newtonScratch = { n, g: new Float64Array(n), h: new Float64Array(n * n), factor: new Float64Array(n * n), d: new Float64Array(n) };
  const { g, h, factor } = newtonScratch;
  // Zeroed as fresh arrays would be, for a surface that only writes some entries.
  g.fill(0);
  h.fill(0);
  surface.valueGradientHessian(x, g, h);
  if (!choleskyDecompose(h, n, factor)) return null;
  const d = choleskySolve(factor, n, g, newtonScratch.d);
  const length = norm2(d);
  return Number.isFinite(length) ? length : null;
}

/**
 * Decides what the end point of a run is (see outcome.ts for the kinds), in this order:
 *  1. still moving away without bound (escapeDetail below): escaping, even where rounding makes the
 *     gradient vanish far out (a point at |x| ~ 1e150 can look like a minimum in floating point);
 *  2. stationary with a positive-definite Hessian and a short Newton step: converged;
 *  3. stationary otherwise: a saddle with its index, a maximum, or `stationary` (a degenerate
 *     Hessian: flat valley, plateau or asymptote; or too large to classify);
 *  4. a bounded cycle of period 2 to 4: oscillating;
 *  5. otherwise the rule that fired made the run stall, or the step limit / cancel stands: a run that
 *     reached its step limit or was cancelled keeps that outcome (with its end point's state, which
 *     may well be a stationary minimum) unless it is escaping or oscillating, since no rule saw it end.
 */
export function judgeEnd(surface: Surface, f: EndFacts, trigger: EndTrigger): RunOutcome {
  const step = f.t;
  const point = describeEndPoint(surface, f);
  const c = point.curvature;
  const rule: StopRule = typeof trigger === 'object' ? trigger.rule : 'loss-change';
  const escape = escapeDetail(f, point.stationary && c?.kind !== 'saddle' && c?.kind !== 'maximum');
  if (escape) return { kind: 'escaping', step, detail: escape, point };
  if (point.stationary && typeof trigger === 'object') {
    if (c?.kind === 'minimum') return { kind: 'converged', step, rule, point };
    if (!c) return { kind: 'stationary', step, rule, point };
    if (c.kind === 'degenerate' && point.newtonStep !== null)
      return { kind: 'stalled', step, rule, detail: `${stallDetail(trigger, point, true)}; the gradient is small next to the start's, but the local quadratic model's minimum is still ${point.newtonStep.toPrecision(3)} away (an ill-conditioned valley)`, point };
    if (c.kind === 'degenerate') return { kind: 'stationary', step, rule, point };
    if (c.kind === 'maximum') return { kind: 'maximum', step, rule, point };
    return { kind: 'saddle', step, rule, index: c.negative ?? 1, point };
  }
  const cycle = point.stationary ? null : findCycle(f);
  if (cycle) return { kind: 'oscillating', step, period: cycle.period, amplitude: cycle.amplitude, point };
  if (trigger === 'step-limit') return { kind: 'step-limit', step, point };
  if (trigger === 'cancelled') return { kind: 'cancelled', step, point };
  return { kind: 'stalled', step, rule, detail: stallDetail(trigger, point), point };
}

function stallDetail(trigger: { rule: StopRule; tolerance?: number; patience?: number }, p: EndPoint, passedTest = false): string {
  const g = `gradient norm ${p.gradNorm.toPrecision(3)}, ${passedTest ? 'below' : 'above'} the stationarity test ${p.gradThreshold.toPrecision(3)}`;
  switch (trigger.rule) {
    case 'loss-change':
      return `the loss stopped changing (relative change <= ${trigger.tolerance} for ${trigger.patience} steps) at ${g}`;
    case 'gradient-norm':
      return `the gradient-norm rule (<= ${trigger.tolerance}) fired at ${g}`;
    case 'no-step':
      return `no step along the search direction lowered the loss (the line search rejected every trial) at ${g}`;
  }
}

/**
 * Escape: the distance from the start grew by at least ESCAPE_GROWTH per doubling of the step count
 * over the last three doublings and is still growing, the last step is still long (at least
 * ESCAPE_STEP of max(1, |x|): a run settling into a minimum takes ever shorter steps), and either the
 * end point is stationary without negative curvature (drifting along a flat direction), or the run
 * went far: ESCAPE_REACH times the start's scale away, or the loss fell ESCAPE_REACH times its start's
 * scale below it (a surface unbounded below).
 */
function escapeDetail(f: EndFacts, flatStationary: boolean): string | null {
  const n = f.x.length;
  if (f.recent.filled < 2) return null;
  const lastStep = recentDistance(f.recent, f.t, 0, 1, n);
  if (!(lastStep >= ESCAPE_STEP * Math.max(1, norm2(f.x)))) return null;
  const k = Math.floor(Math.log2(Math.max(1, f.t)));
  if (k < 2 || k >= f.recent.distanceAt.length) return null;
  const d = f.recent.distanceAt;
  const now = distance(f.x, f.x0);
  if (!(d[k] >= ESCAPE_GROWTH * d[k - 1] && d[k - 1] >= ESCAPE_GROWTH * d[k - 2] && d[k - 2] > 0 && now >= d[k])) return null;
  const xScale = Math.max(1, norm2(f.x0));
  const fScale = Math.max(1, Math.abs(f.initialLoss));
  const far = now >= ESCAPE_REACH * xScale;
  const fellFar = f.loss <= f.initialLoss - ESCAPE_REACH * fScale;
  if (!(flatStationary || far || fellFar)) return null;
  const growth = `distance from the start ${d[k - 2].toPrecision(3)}, ${d[k - 1].toPrecision(3)}, ${d[k].toPrecision(3)} after steps ${2 ** (k - 2)}, ${2 ** (k - 1)}, ${2 ** k}; now ${now.toPrecision(3)}`;
  if (fellFar) return `the loss keeps falling without bound (${f.loss.toPrecision(3)} from ${f.initialLoss.toPrecision(3)} at the start); ${growth}`;
  if (far) return `the parameters keep growing (${growth}); the loss is ${f.loss.toPrecision(3)} (${f.initialLoss.toPrecision(3)} at the start)`;
  return `drifting along a flat direction (the gradient is nearly zero but the point keeps moving); ${growth}`;
}

/** A cycle x_t ~ x_{t-p} (and x_{t-1} ~ x_{t-1-p}) of period p in 2..4 whose points are apart. */
function findCycle(f: EndFacts): { period: number; amplitude: number } | null {
  const n = f.x.length;
  const r = f.recent;
  for (let p = 2; p <= 4; p++) {
    if (r.filled < p + 2) break;
    let spread = 0;
    for (let j = 1; j < p; j++) spread = Math.max(spread, recentDistance(r, f.t, 0, j, n));
    if (!(spread > 0) || spread <= 1e-12 * Math.max(1, norm2(f.x))) continue;
    const back = recentDistance(r, f.t, 0, p, n);
    const before = recentDistance(r, f.t, 1, p + 1, n);
    if (back <= CYCLE_MATCH * spread && before <= CYCLE_MATCH * spread) return { period: p, amplitude: spread / 2 };
  }
  return null;
}
