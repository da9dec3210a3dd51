/** How a run ended. Step numbers count optimizer steps; step 0 is the start point. */
export type RunOutcome =
  | { kind: 'converged'; rule: 'loss-change' | 'gradient-norm'; step: number }
  | { kind: 'step-limit'; step: number }
  | { kind: 'diverged'; reason: 'non-finite' | 'blow-up'; step: number; detail: string }
  | { kind: 'cancelled'; step: number };

export function describeOutcome(o: RunOutcome): string {
  switch (o.kind) {
    case 'converged':
      return o.rule === 'loss-change'
        ? `converged (loss change) at step ${o.step}`
        : `converged (gradient norm) at step ${o.step}`;
    case 'step-limit':
      return `step limit reached at step ${o.step}`;
    case 'diverged':
      return `diverged at step ${o.step}: ${o.detail}`;
    case 'cancelled':
      return `cancelled at step ${o.step}`;
  }
}

/** The outcome without its step number, for tables that show the step in a column of its own. */
export function outcomeLabel(o: RunOutcome): string {
  switch (o.kind) {
    case 'converged':
      return o.rule === 'loss-change' ? 'converged: loss change' : 'converged: gradient norm';
    case 'step-limit':
      return 'step limit';
    case 'diverged':
      return `diverged at step ${o.step} (${o.reason === 'blow-up' ? 'loss blew up' : 'non-finite value'})`;
    case 'cancelled':
      return 'cancelled';
  }
}
