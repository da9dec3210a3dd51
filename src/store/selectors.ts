/**
 * Reading the page store's state: the saved workspace as written, whether it changed, the box the map
 * shows, the run single-run panels follow, the study a panel shows. Pure functions of the state.
 */
import type { StudySpec, ViewBox } from '../engine';
import type { AppState } from './app-state';
import { equalScaleOn, shownView } from './equal-scale';
import type { RunConfig, Workspace } from './workspace';

/** The saved part of the state, as written: no empty title or studies list. */
export function workspaceOf(s: Pick<AppState, 'workspace'>): Workspace {
  const { title, studies, ...rest } = s.workspace;
  return { ...rest, ...(title === undefined ? {} : { title }), ...(studies?.length ? { studies } : {}) };
}

/** Whether the saved part changed (it is a new object on every change, so identity suffices). */
export function workspaceChanged(a: Pick<AppState, 'workspace'>, b: Pick<AppState, 'workspace'>): boolean {
  return a.workspace !== b.workspace;
}

/** The study a panel shows: the workspace's first of that kind. */
export function studyOfKind<K extends StudySpec['kind']>(studies: readonly StudySpec[] | undefined, kind: K): Extract<StudySpec, { kind: K }> | null {
  return (studies?.find((s) => s.kind === kind) as Extract<StudySpec, { kind: K }> | undefined) ?? null;
}

/** The box the map shows for the state's view on its measured frame (the view itself without equal scale). */
export function viewShownBy(s: { workspace: Pick<Workspace, 'view' | 'display' | 'surface'> } & Pick<AppState, 'frame' | 'surfaceInfo'>): ViewBox {
  return shownView(s.workspace.view, s.frame, equalScaleOn(s.workspace.display, s.workspace.surface, s.surfaceInfo.variables.length));
}

/**
 * The run a single-run panel (data view, profile, plane choices) follows: the selected run, else the
 * visible run with the lowest loss so far, else the first run.
 */
export function focusRun(s: Pick<AppState, 'workspace' | 'selectedRunId' | 'status'>): RunConfig | null {
  const { runs } = s.workspace;
  const selected = runs.find((r) => r.id === s.selectedRunId);
  if (selected) return selected;
  const loss = (r: RunConfig) => s.status[r.id]?.summary.finalLoss ?? Number.NaN;
  const ranked = runs.filter((r) => !r.hidden && Number.isFinite(loss(r))).sort((a, b) => loss(a) - loss(b));
  return ranked[0] ?? runs[0] ?? null;
}
