import type { PointClass } from '../analysis';

/**
 * How a run ended, as plain data. Step numbers count optimizer steps; step 0 is the start point.
 *
 * The kinds say what happened, not which rule fired: a stop rule (loss change, gradient norm, a step
 * that could not move) only ends the run, and `judgeEnd` (end-state.ts) then decides what the end point
 * is. Only a point that passes the scale-aware gradient test (stationarity.ts) and whose Hessian shows
 * no direction of descent is `converged`; a stationary point with negative curvature is a `saddle` or a
 * `maximum`; one whose Hessian is degenerate (a flat valley, a plateau, an asymptote) or too large to
 * classify is `stationary`; a rule that fired away from a stationary point is `stalled`.
 */
export type RunOutcome =
  | { kind: 'converged'; step: number; rule: StopRule; point: EndPoint }
  | { kind: 'saddle'; step: number; rule: StopRule; index: number; point: EndPoint }
  | { kind: 'maximum'; step: number; rule: StopRule; point: EndPoint }
  | { kind: 'stationary'; step: number; rule: StopRule; point: EndPoint }
  | { kind: 'stalled'; step: number; rule: StopRule; detail: string; point: EndPoint }
  | { kind: 'oscillating'; step: number; period: number; amplitude: number; point: EndPoint }
  | { kind: 'escaping'; step: number; detail: string; point: EndPoint }
  | { kind: 'diverged'; step: number; reason: 'non-finite' | 'blow-up'; detail: string }
  | { kind: 'undefined'; step: number; detail: string }
  | { kind: 'step-limit'; step: number; point: EndPoint }
  | { kind: 'cancelled'; step: number; point: EndPoint };

export type OutcomeKind = RunOutcome['kind'];

/** Which stop rule ended the run. 'no-step': the method could not find a step that lowers the loss. */
export type StopRule = 'loss-change' | 'gradient-norm' | 'no-step';

/** What is known of the point where a run ended. */
export interface EndPoint {
  /** Euclidean norm of the exact gradient there. */
  gradNorm: number;
  /** The gradient norm the scale-aware test compares it with (stationarity.ts). */
  gradThreshold: number;
  stationary: boolean;
  /** The Hessian's verdict, when the point is stationary and could be classified. */
  curvature: PointClass | null;
  /**
   * |H^-1 g|, the distance to the stationary point of the local quadratic model, where the Hessian is
   * definite and small enough to solve (end-state.ts); null otherwise.
   */
  newtonStep: number | null;
}

/** Every outcome kind, in the order the README and the legends list them. */
export const OUTCOME_KINDS: readonly OutcomeKind[] = [
  'converged', 'saddle', 'maximum', 'stationary', 'stalled', 'oscillating', 'escaping', 'diverged', 'undefined', 'step-limit', 'cancelled',
];

const RULE_TEXT: Record<StopRule, string> = {
  'loss-change': 'loss change',
  'gradient-norm': 'gradient norm',
  'no-step': 'no descent step',
};

/** The outcome in a few words with its step, for the run card. */
export function describeOutcome(o: RunOutcome): string {
  if (o.kind === 'diverged') return `diverged at step ${o.step}: ${o.detail}`;
  if (o.kind === 'undefined') return o.step === 0 ? `undefined at start: ${o.detail}` : `undefined at step ${o.step}: ${o.detail}`;
  if (o.kind === 'step-limit') return `step limit reached at step ${o.step}`;
  return `${outcomeLabel(o)} at step ${o.step}`;
}

/** The outcome without its step number, for tables that show the step in a column of its own. */
export function outcomeLabel(o: RunOutcome): string {
  switch (o.kind) {
    case 'converged':
      return 'converged';
    case 'saddle':
      return `saddle point (index ${o.index})`;
    case 'maximum':
      return 'maximum';
    case 'stationary':
      return o.point.curvature?.kind === 'degenerate' ? 'flat stationary point' : 'stationary (not classified)';
    case 'stalled':
      return `stalled (${RULE_TEXT[o.rule]})`;
    case 'oscillating':
      return `oscillating (period ${o.period})`;
    case 'escaping':
      return 'escaping';
    case 'diverged':
      return `diverged at step ${o.step} (${o.reason === 'blow-up' ? 'loss blew up' : 'non-finite value'})`;
    case 'undefined':
      return o.step === 0 ? 'undefined at start' : `undefined at step ${o.step}`;
    case 'step-limit':
      return 'step limit';
    case 'cancelled':
      return 'cancelled';
  }
}

/** The second CSV column: the rule, reason or measured detail behind the outcome word. */
export function outcomeDetail(o: RunOutcome): string {
  switch (o.kind) {
    case 'converged':
    case 'saddle':
    case 'maximum':
    case 'stationary':
      return `${RULE_TEXT[o.rule]}; ${pointText(o.point)}`;
    case 'stalled':
      return o.detail;
    case 'oscillating':
      return `period ${o.period}, amplitude ${o.amplitude.toPrecision(3)}; ${pointText(o.point)}`;
    case 'escaping':
      return o.detail;
    case 'diverged':
    case 'undefined':
      return o.detail;
    case 'step-limit':
    case 'cancelled':
      return pointText(o.point);
  }
}

/** "gradient norm 3.2e-9 (stationary below 2.3e-4); Hessian: minimum, eigenvalues 0.4 to 802". */
export function pointText(p: EndPoint): string {
  const head = `gradient norm ${p.gradNorm.toPrecision(3)} (${p.stationary ? 'stationary' : 'not stationary'}: test ${p.gradThreshold.toPrecision(3)})`;
  const c = p.curvature;
  if (!c) return head;
  const flat = c.kind === 'degenerate' && p.newtonStep !== null ? ` (the local model's minimum is ${p.newtonStep.toPrecision(3)} away)` : '';
  const what = c.kind === 'saddle' ? `saddle of index ${c.negative ?? '>= 1'}` : c.kind;
  return `${head}; Hessian: ${what}${flat}, eigenvalues ${c.smallest.toPrecision(3)} to ${c.largest.toPrecision(3)}`;
}
