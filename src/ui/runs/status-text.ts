import { describeOutcome } from '../../engine';
import type { RunStatus } from '../../store/live-runs';

/** One short line about where a run is. */
export function statusText(status: RunStatus | undefined): string {
  if (!status) return 'not started';
  if (status.phase === 'error') return `error: ${status.error?.message ?? 'unknown'}`;
  if (status.summary.outcome) return describeOutcome(status.summary.outcome);
  return `${status.phase === 'paused' ? 'paused' : 'running'}, step ${status.summary.steps}`;
}
