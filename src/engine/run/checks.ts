import type { Surface } from '../surface';
import { allFinite, norm2At } from '../vector';
import { describeEndPoint, judgeEnd, type EndFacts, type EndTrigger } from './end-state';
import type { RunOutcome } from './outcome';
import type { RecentPath } from './recent';
import { DEFAULT_BLOW_UP_FACTOR, DEFAULT_LOSS_CHANGE_PATIENCE, type StopRules } from './settings';

/**
 * The per-step stop rules, as pure functions of plain facts: the one home of each rule, shared by the
 * run loop (cursor.ts) and the sweep engine (../sweep). Each check comes in two halves: a cheap,
 * allocation-free test the hot loop calls every step (`pointFinding`, `nextCalmSteps`,
 * `progressTrigger`), and a builder of the outcome that runs only when a rule fires (`pointOutcome`,
 * `judgeEnd`). The order of the rules at a point reached by a step is:
 *  1. a non-finite coordinate: escaping if the loss fell and the distance from the start has grown
 *     over the last recorded doublings of the step count, diverged otherwise;
 *  2. a loss of -Infinity: escaping (unbounded below);
 *  3. a non-finite loss: undefined where the surface can say why (left the domain), diverged otherwise;
 *  4. a non-finite gradient: undefined (a kink or cusp);
 *  5. blow-up: f - f0 > blowUpFactor * max(1, |f0|) (default 1e8): diverged;
 *  6. the gradient-norm rule: |grad| <= gradientNormTolerance, then the end point is judged.
 * After these, a step that found no descent ends the run (rule 'no-step'); otherwise the loss-change
 * rule with patience and the step limit (nextCalmSteps, progressTrigger).
 */
export type PointFinding = 'ok' | 'x-non-finite' | 'loss-minus-infinity' | 'loss-non-finite' | 'gradient-non-finite' | 'blow-up' | 'gradient-norm';

/** Rules 1-6 above at the point x with loss and exact gradient grad; 'ok' when none fires. */
export function pointFinding(x: Float64Array, grad: Float64Array, loss: number, initialLoss: number, stop: StopRules): PointFinding {
  return pointFindingAt(x, grad, 0, x.length, loss, initialLoss, stop);
}

/** pointFinding for the point x[at..at+n) and gradient grad[at..at+n) of flat storage (a sweep's). */
export function pointFindingAt(x: Float64Array, grad: Float64Array, at: number, n: number, loss: number, initialLoss: number, stop: StopRules): PointFinding {
  if (!finiteEntries(x, at, n)) return 'x-non-finite';
  if (loss === -Infinity) return 'loss-minus-infinity';
  if (!Number.isFinite(loss)) return 'loss-non-finite';
  if (!finiteEntries(grad, at, n)) return 'gradient-non-finite';
  const blowUp = stop.blowUpFactor ?? DEFAULT_BLOW_UP_FACTOR;
  if (loss - initialLoss > blowUp * Math.max(1, Math.abs(initialLoss))) return 'blow-up';
  const gTol = stop.gradientNormTolerance;
  if (gTol !== undefined && norm2At(grad, at, n) <= gTol) return 'gradient-norm';
  return 'ok';
}

/**
 * The outcome for a finding other than 'ok'. `surface` should count its evaluations into the run's
 * count (oracle.ts, countingSurface): the end judgement may evaluate the Hessian.
 */
export function pointOutcome(finding: Exclude<PointFinding, 'ok'>, surface: Surface, f: EndFacts, stop: StopRules): RunOutcome {
  const step = f.t;
  switch (finding) {
    case 'x-non-finite':
      if (f.loss < f.initialLoss && movingAway(f.recent, f.t))
        return { kind: 'escaping', step, detail: 'a coordinate overflowed to infinity while the loss kept falling', point: describeEndPoint(surface, f) };
      return { kind: 'diverged', reason: 'non-finite', step, detail: 'a coordinate became non-finite' };
    case 'loss-minus-infinity':
      return { kind: 'escaping', step, detail: 'the loss fell without bound (it reached -Infinity)', point: describeEndPoint(surface, f) };
    case 'loss-non-finite': {
      const why = f.loss !== f.loss ? surface.explainUndefined?.(f.x, 'value') : null;
      if (why) return { kind: 'undefined', step, detail: `the step left the surface's domain: ${why}` };
      return { kind: 'diverged', reason: 'non-finite', step, detail: `the loss became ${f.loss}` };
    }
    case 'gradient-non-finite': {
      const why = surface.explainUndefined?.(f.x, 'gradient');
      return { kind: 'undefined', step, detail: `the run reached a point where the gradient does not exist${why ? `: ${why}` : ''}` };
    }
    case 'blow-up':
      return { kind: 'diverged', reason: 'blow-up', step, detail: `the loss rose to ${f.loss.toPrecision(4)} from ${f.initialLoss.toPrecision(4)} at the start` };
    case 'gradient-norm':
      return judgeEnd(surface, f, { rule: 'gradient-norm', tolerance: stop.gradientNormTolerance });
  }
}

/**
 * A start where the loss or its gradient does not exist is not a divergence: the surface is
 * undefined there (outside a formula's domain, or at a cusp), and the outcome says why. Null for a
 * start with a finite loss and gradient (or a non-finite start point, which the point rules report).
 */
export function startOutcome(surface: Surface, x: Float64Array, loss: number, grad: Float64Array): RunOutcome | null {
  if (!allFinite(x)) return null;
  if (!Number.isFinite(loss)) {
    const why = surface.explainUndefined?.(x, 'value');
    return { kind: 'undefined', step: 0, detail: `the loss is not defined at the start (${why ?? `it is ${loss}`})` };
  }
  if (!allFinite(grad)) {
    const why = surface.explainUndefined?.(x, 'gradient');
    return { kind: 'undefined', step: 0, detail: `the gradient does not exist at the start: the loss is finite but not differentiable here (a kink or cusp${why ? `: ${why}` : ''})` };
  }
  return null;
}

/** Whether the distance from the start has been growing over the recorded doublings of steps. */
export function movingAway(recent: RecentPath, t: number): boolean {
  const d = recent.distanceAt;
  const k = Math.floor(Math.log2(Math.max(1, t)));
  return k >= 2 && d[k] > d[k - 1] && d[k - 1] > d[k - 2];
}

/**
 * The loss-change rule's counter after a step from previousLoss to loss: one more calm step when
 * |f_t - f_{t-1}| / max(1, |f_t|, |f_{t-1}|) <= lossChangeTolerance, else 0. A step taken at learning
 * rate 0 (a schedule decayed to nothing) does not count as calm: the loss stopped changing because the
 * run stopped moving, not because it reached a minimum. Without the rule the counter stays as it is.
 */
export function nextCalmSteps(stop: StopRules, calmSteps: number, loss: number, previousLoss: number, learningRate: number): number {
  const tol = stop.lossChangeTolerance;
  if (tol === undefined) return calmSteps;
  if (learningRate === 0) return 0;
  const scale = Math.max(1, Math.abs(loss), Math.abs(previousLoss));
  return Math.abs(loss - previousLoss) / scale <= tol ? calmSteps + 1 : 0;
}

/**
 * Which end the loss-change rule (calm for `lossChangePatience` consecutive steps, default 3) or the
 * step limit calls for after step t, or null. The end point is then judged (end-state.ts).
 */
export function progressTrigger(stop: StopRules, calmSteps: number, t: number): EndTrigger | null {
  const { lossChangeTolerance, lossChangePatience = DEFAULT_LOSS_CHANGE_PATIENCE, maxSteps } = stop;
  if (lossChangeTolerance !== undefined && calmSteps >= lossChangePatience) return { rule: 'loss-change', tolerance: lossChangeTolerance, patience: lossChangePatience };
  if (t >= maxSteps) return 'step-limit';
  return null;
}

/** Whether every entry is finite: v * 0 is 0 for a finite v and NaN for NaN and +-Infinity (one branch per vector). */
function finiteEntries(a: Float64Array, at: number, n: number): boolean {
  let z = 0;
  for (let i = at; i < at + n; i++) z += a[i] * 0;
  return z === 0;
}
