import { describeOutcome } from '../../engine';
import type { OptimizerKind } from '../../engine';
import type { RunStatus } from '../../store/live-runs';
import { runErrorMessage } from '../messages';

/** One short line about where a run is (an error in the page's field labels). */
export function statusText(status: RunStatus | undefined, kind?: OptimizerKind): string {
  if (!status) return 'not started';
  if (status.phase === 'error') return `error: ${status.error ? (kind ? runErrorMessage(status.error.message, kind) : status.error.message) : 'unknown'}`;
  if (status.summary.outcome) return describeOutcome(status.summary.outcome);
  return status.phase === 'paused' ? 'paused' : 'running'; // the step count is on the card's progress line
}

/** How far a run got against its step budget: "step 729 of 3000". */
export function progressText(status: RunStatus | undefined, maxSteps: number): string {
  return `step ${status ? status.summary.steps : 0} of ${maxSteps}`;
}
