// The page's CSV exports (figures are exported by src/ui/figure).
import { resultsCsvOf, trajectoriesCsvOf } from '../../io/run-exports';
import type { AppState } from '../../store/app-store';
import type { LiveRuns } from '../../store/live-runs';
import { mainThreadSurface } from '../view/use-surface';
import { reportedUnits } from '../../store/units';

/** Trajectories of every run, one row per run per step (columns in the README). */
export function trajectoriesCsv(s: AppState, live: LiveRuns): string {
  return trajectoriesCsvOf(s.workspace.runs, (id) => live.trajectory(id)?.asBatch(), s.surfaceInfo.variables, reportedUnits(mainThreadSurface(s.workspace.surface)));
}

/** The run table as shown on the page. */
export function resultsCsv(s: AppState): string {
  return resultsCsvOf(s.workspace.runs, (id) => s.status[id]?.summary, s.surfaceInfo, reportedUnits(mainThreadSurface(s.workspace.surface)));
}
