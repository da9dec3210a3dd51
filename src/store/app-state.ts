/**
 * The page store's state and actions as types: the saved workspace (one object), the live state beside
 * it, and the actions grouped as the slices in slices/ implement them.
 */
import type { GridRequest, OptimizerKind, StudySpec, ViewBox } from '../engine';
import type { CsvImport, SurfaceDescription, SurfaceSpec } from '../problems';
import type { CsvParseOptions, Pace, RunControl } from '../protocol';
import type { FrameSize } from './equal-scale';
import type { RunStatus } from './live-runs';
import type { DisplaySettings, PanelSettings, RunConfig, SliceSettings, Workspace } from './workspace';

/** The surface grid as last received from the worker. */
export interface GridState {
  requestId: string | null;
  phase: 'idle' | 'computing' | 'ready' | 'error';
  /** Rows done / rows, while computing. */
  progress: number;
  request: GridRequest | null;
  values: Float64Array | null;
  min: number;
  max: number;
  stage: 'coarse' | 'final' | null;
  error: string | null;
}

/** Label, variables, default box, known points, suggested start of the current surface. */
export type SurfaceInfo = SurfaceDescription;

export interface AppState {
  /** The saved part, replaced as a whole object on every change (so one identity check tells a change). */
  workspace: Workspace;
  surfaceInfo: SurfaceInfo;
  /** Problems with the last surface the user tried to set (it was not applied). */
  surfaceError: string | null;
  /** A message for the user that is not tied to one field (storage trouble, a file that did not load). */
  notice: string | null;
  grid: GridState;
  status: Record<string, RunStatus>;
  selectedRunId: string | null;
  /** Whether a click on the surface sets the start of every run or only of the selected one. */
  startTarget: 'all' | 'selected';
  /** The map's plot frame in CSS pixels, once measured (the grid covers the box shown on it); not saved. */
  frame: FrameSize | null;
  /** The results table's chosen columns (null: the defaults for the surface) and sort; not saved. */
  table: { columns: string[] | null; sort: { column: string; direction: 'ascending' | 'descending' } | null };
  actions: AppActions;
}

/** Surface and whole-workspace actions (slices/workspace-slice.ts). */
export interface WorkspaceActions {
  /** Applies a new surface if it builds; otherwise records the error and leaves the workspace as it was. */
  setSurface(spec: SurfaceSpec): boolean;
  setConstant(name: string, value: number): void;
  setPanels(patch: Partial<PanelSettings>): void;
  /**
   * Sets up a study on the page: replaces the workspace's first study of the same kind (the one its
   * panel shows), or adds it. Saved with the workspace and the experiment file; nothing runs.
   */
  setStudy(spec: StudySpec): void;
  /** Loads a whole workspace (from storage or an experiment file) and launches its runs. */
  loadWorkspace(workspace: Workspace): void;
}

/** One-off computations in the engine worker: CSV parsing, profiles, data-fit outputs (slices/requests-slice.ts). */
export interface RequestActions {
  /** Parses an imported CSV file in the worker (progress as a fraction of the text and rows read). */
  importCsv(text: string, options: CsvParseOptions, onProgress?: (fraction: number, rowsRead: number) => void): Promise<CsvImport>;
  /** The loss along the segment from -> to, computed in the worker. */
  sampleProfile(from: number[], to: number[], alphas?: { from: number; to: number; count: number }): Promise<{ alphas: Float64Array; values: Float64Array }>;
  /**
   * The current data-fit model's outputs at `params` for `count` input rows (count x d, original units),
   * computed in the worker (for the data view); rejects with the worker's message.
   */
  predictFit(params: Float64Array, rows: Float64Array, count: number): Promise<{ outputs: Float64Array; width: number }>;
  /** Loss and exact gradient at `count` points (count x n) of the current surface, computed in the worker. */
  probeSurface(points: Float64Array, count: number): Promise<{ values: Float64Array; gradients: Float64Array }>;
}

/** The slice, the view box, the display and the map's frame (slices/view-slice.ts). */
export interface ViewActions {
  /** Changes the slice; a new plane or new axes also reset the view (to `view` if given). */
  setSlice(slice: Partial<SliceSettings> & { view?: ViewBox }): void;
  setView(view: ViewBox): void;
  setHover(point: { a: number; b: number } | null): void;
  resetView(): void;
  setDisplay(patch: Partial<DisplaySettings>): void;
  /** The map reports its plot frame; with equal scale the grid is sampled over the box shown on it. */
  setFrame(frame: FrameSize): void;
}

/** Runs: their configurations, launches, controls and the optimizer x learning-rate table (slices/runs-slice.ts). */
export interface RunActions {
  addRun(kind?: OptimizerKind): string;
  updateRun(id: string, patch: Partial<Omit<RunConfig, 'id'>>): void;
  /**
   * Switches a run to another optimizer: its defaults, keeping the learning rate between kinds whose
   * rates mean the same thing; a plain-gradient kind otherwise gets the rate suggested by the curvature
   * at the run's start. A label that named the old optimizer names the new one.
   */
  changeOptimizer(id: string, kind: OptimizerKind): void;
  duplicateRun(id: string): string | null;
  removeRun(id: string): void;
  selectRun(id: string | null): void;
  setStartTarget(target: 'all' | 'selected'): void;
  /** Sets the start point (full coordinates) of the selected run or of all runs, and restarts them. */
  setStart(point: number[]): void;
  control(id: string, action: RunControl): void;
  controlAll(action: RunControl): void;
  restart(id: string): void;
  restartAll(): void;
  setPace(pace: Pace): void;
  setTolerance(tolerance: number): void;
  /** Replaces the table runs with one run per optimizer x learning rate cell. */
  buildTableRuns(): void;
}

/** Live page state that is not saved: the notice and the results table's columns and sort (slices/page-slice.ts). */
export interface PageActions {
  dismissNotice(): void;
  /** Shows or hides a results-table column (ids from ui/table/columns.ts); `shown` is the current list. */
  setTableColumns(columns: string[] | null): void;
  setTableSort(sort: AppState['table']['sort']): void;
}

export type AppActions = WorkspaceActions & RequestActions & ViewActions & RunActions & PageActions;

/** The grid before any has been asked for. */
export function noGrid(): GridState {
  return { requestId: null, phase: 'idle', progress: 0, request: null, values: null, min: Number.NaN, max: Number.NaN, stage: null, error: null };
}

/** The results table's default: the surface's default columns, unsorted. */
export function defaultTable(): AppState['table'] {
  return { columns: null, sort: null };
}
