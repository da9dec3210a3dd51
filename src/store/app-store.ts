import { createStore, type StoreApi } from 'zustand/vanilla';
import { optimizerLabel, validateOptimizerSpec, type GridRequest, type OptimizerKind, type StudySpec, type ViewBox } from '../engine';
import { buildSurface, describeSurface, type CsvImport, type SurfaceDescription, type SurfaceSpec } from '../problems';
import { referenceMinima } from '../io/run-exports';
import type { CsvParseOptions, FromWorker, Pace, RunControl, RunSpec } from '../protocol';
import type { EngineLink } from './engine-link';
import { createEngineClient, type GridJob, type GridSource } from './engine-client';
import { freshId } from './ids';
import { LiveRuns, type RunStatus } from './live-runs';
import { demoWorkspace } from './demo';
import { newRunConfig, nextStyle, pageDefaultSpec } from './run-configs';
import { curvatureAt, rateFamily, switchedOptimizer } from './suggest-rate';
import { mainThreadSurface } from './surface-cache';
import { slicePlane } from './slice-plane';
import { equalScaleOn, shownView, type FrameSize } from './equal-scale';
import { createHoverStore, type HoverState } from './hover-store';
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

export interface AppActions {
  /** Applies a new surface if it builds; otherwise records the error and leaves the workspace as it was. */
  setSurface(spec: SurfaceSpec): boolean;
  setConstant(name: string, value: number): void;
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
  /** Changes the slice; a new plane or new axes also reset the view (to `view` if given). */
  setSlice(slice: Partial<SliceSettings> & { view?: ViewBox }): void;
  setView(view: ViewBox): void;
  setHover(point: { a: number; b: number } | null): void;
  resetView(): void;
  setDisplay(patch: Partial<DisplaySettings>): void;
  /** The map reports its plot frame; with equal scale the grid is sampled over the box shown on it. */
  setFrame(frame: FrameSize): void;
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
  setPanels(patch: Partial<PanelSettings>): void;
  /**
   * Sets up a study on the page: replaces the workspace's first study of the same kind (the one its
   * panel shows), or adds it. Saved with the workspace and the experiment file; nothing runs.
   */
  setStudy(spec: StudySpec): void;
  /** Replaces the table runs with one run per optimizer x learning rate cell. */
  buildTableRuns(): void;
  dismissNotice(): void;
  /** Shows or hides a results-table column (ids from ui/table/columns.ts); `shown` is the current list. */
  setTableColumns(columns: string[] | null): void;
  setTableSort(sort: AppState['table']['sort']): void;
  /** Loads a whole workspace (from storage or an experiment file) and launches its runs. */
  loadWorkspace(workspace: Workspace): void;
}

export interface AppStore {
  store: StoreApi<AppState>;
  /** The point under the pointer (hover-store.ts), apart from the rest so pointer moves re-render no panel. */
  hover: StoreApi<HoverState>;
  live: LiveRuns;
  workspaceOf(state: AppState): Workspace;
}

export { GRID_SETTLE_MS, type GridSource } from './engine-client';

export interface StoreOptions {
  link: EngineLink;
  /** A pool for grid sampling; without one, grids go to the engine worker through `link`. */
  grids?: GridSource;
  requestFrame: (fn: () => void) => void;
  initial?: Workspace;
}

export function createAppStore({ link, requestFrame, initial, grids }: StoreOptions): AppStore {
  let start = initial ?? demoWorkspace();
  let startNotice: string | null = null;
  try {
    drawableSurface(start.surface);
  } catch (e) {
    startNotice = `The saved surface could not be built (${e instanceof Error ? e.message : String(e)}); the demo was loaded instead.`;
    start = demoWorkspace();
  }
  let store!: StoreApi<AppState>;
  const hover = createHoverStore();
  const live = new LiveRuns(link, requestFrame, (changed) => {
    store.setState((s) => {
      const status = { ...s.status };
      for (const [id, st] of changed) {
        if (st) status[id] = st;
        else delete status[id];
      }
      return { status };
    });
  });

  const get = () => store.getState();
  const set = (patch: Partial<AppState>) => store.setState(patch);
  /** Changes saved fields (a new workspace object) and, with `rest`, live fields in the same update. */
  const setWorkspace = (patch: Partial<Workspace>, rest: Partial<AppState> = {}) => store.setState((s) => ({ ...rest, workspace: { ...s.workspace, ...patch } }));

  const engine = createEngineClient({
    link,
    grids,
    onRun: (msg) => live.handle(msg),
    onGridStart: (requestId) => set({ grid: { ...get().grid, requestId, phase: 'computing', progress: 0, error: null } }),
    onGrid: (msg) => {
      const g = get().grid;
      if (msg.type === 'grid/progress') return set({ grid: { ...g, progress: msg.rowsDone / msg.rows } });
      if (msg.type === 'grid/error') return set({ grid: { ...g, phase: 'error', error: msg.message } });
      const final = msg.stage === 'final';
      set({ grid: { ...g, phase: final ? 'ready' : 'computing', request: msg.grid, values: msg.values, min: msg.min, max: msg.max, stage: msg.stage, progress: final ? 1 : g.progress } });
    },
    // A replaced worker took its runs and pace with it: end them with the reason, resend the pace.
    onRestart: (reason, message) => {
      live.workerLost(`${message}: press Restart to run again`);
      link.send({ type: 'run/pace', pace: get().workspace.pace });
      set({ notice: `The engine worker ${reason}. It was restarted; runs that were in progress were stopped (Restart runs them again).` });
    },
  });
  const ask = engine.ask;

  function runSpec(s: AppState, run: RunConfig): RunSpec {
    return { surface: s.workspace.surface, optimizer: run.optimizer, settings: run.settings };
  }

  function launch(run: RunConfig): void {
    const problems = validateOptimizerSpec(run.optimizer);
    if (problems.length) return live.reject(run.id, problems[0].message, problems[0].field);
    live.launch(run.id, runSpec(get(), run));
  }

  function launchAll(): void {
    for (const run of get().workspace.runs) launch(run);
  }

  /** The grid over the box shown, at the display's resolution, for the current state. */
  function gridJob(): GridJob {
    const s = get();
    const side = s.workspace.display.resolution;
    const view = viewShownBy(s);
    return { surface: s.workspace.surface, grid: { plane: slicePlane(s.workspace.slice, s.surfaceInfo.variables.length), a: view.a, b: view.b, nx: side, ny: side } };
  }
  const requestGrid = () => engine.sampleGrid(gridJob);
  const requestGridWhenQuiet = () => engine.sampleGridWhenQuiet(gridJob);

  function updateReference(): void {
    const s = get();
    live.setReference(referenceMinima(s.surfaceInfo.knownPoints), s.workspace.tolerance);
  }

  function applySurface(spec: SurfaceSpec, keepView: boolean): void {
    const info = drawableSurface(spec); // throws a specific error for a bad spec before anything changes
    const s = get();
    const n = info.variables.length;
    const sameShape = n === s.surfaceInfo.variables.length;
    // A start is kept while it lies in the new surface's box; elsewhere the run would start out of view.
    const keepStart = (start: number[]) => sameShape && (keepView || insideBox(start, info.view));
    const runs = s.workspace.runs.map((r) => (keepStart(r.settings.start) ? r : { ...r, settings: { ...r.settings, start: suggestedStart(info) } }));
    // The other variables are held at the selected (else the first) run's start, so the slice goes through a run.
    const held = (runs.find((r) => r.id === s.selectedRunId) ?? runs[0])?.settings.start ?? info.view.map(([lo, hi]) => (lo + hi) / 2);
    const slice: SliceSettings = sameShape && !s.workspace.slice.plane ? s.workspace.slice : { axes: [0, 1], at: held.slice(), plane: null };
    const view = keepView && sameShape ? s.workspace.view : viewFor(info.view, slice.axes);
    // A new surface starts from its own equal-scale default (on for two-variable test functions).
    const { equalScale: _choice, ...display } = s.workspace.display;
    setWorkspace({ surface: spec, slice, view, runs, ...(keepView ? {} : { display }) }, { surfaceInfo: info, surfaceError: null, table: sameShape ? s.table : { columns: null, sort: null } });
    updateReference();
    launchAll();
    requestGrid();
  }

  function mutateRun(id: string, f: (r: RunConfig) => RunConfig): RunConfig | null {
    let changed: RunConfig | null = null;
    setWorkspace({ runs: get().workspace.runs.map((r) => (r.id === id ? (changed = f(r)) : r)) });
    return changed;
  }

  const actions: AppActions = {
    setSurface(spec) {
      try {
        applySurface(spec, false);
        return true;
      } catch (e) {
        set({ surfaceError: e instanceof Error ? e.message : String(e) });
        return false;
      }
    },
    setConstant(name, value) {
      const surface = get().workspace.surface;
      if (!Number.isFinite(value) || surface.kind === 'datafit') return;
      applySurface({ ...surface, constants: { ...(surface.constants ?? {}), [name]: value } }, true);
    },
    async importCsv(text, options, onProgress) {
      try {
        const reply = await ask(
          { type: 'csv/parse', requestId: freshId('t'), text, options },
          (m): m is Extract<FromWorker, { type: 'csv/result' }> => m.type === 'csv/result',
          (m) => m.type === 'csv/progress' && onProgress?.(m.fraction, m.rowsRead),
        );
        return reply.result;
      } catch (e) {
        return { ok: false, message: (e as Error).message, problems: [], moreProblems: 0 };
      }
    },
    async sampleProfile(from, to, alphas = { from: -0.5, to: 1.5, count: 101 }) {
      const reply = await ask(
        { type: 'profile/sample', requestId: freshId('p'), surface: get().workspace.surface, from, to, alphas },
        (m): m is Extract<FromWorker, { type: 'profile/result' | 'profile/error' }> => m.type === 'profile/result' || m.type === 'profile/error',
      );
      if (reply.type === 'profile/error') throw new Error(reply.message);
      return { alphas: reply.alphas, values: reply.values };
    },
    async predictFit(params, rows, count) {
      const reply = await ask(
        { type: 'fit/predict', requestId: freshId('f'), surface: get().workspace.surface, params, rows, count },
        (m): m is Extract<FromWorker, { type: 'fit/predictions' | 'fit/error' }> => m.type === 'fit/predictions' || m.type === 'fit/error',
      );
      if (reply.type === 'fit/error') throw new Error(reply.message);
      return { outputs: reply.outputs, width: reply.width };
    },
    async probeSurface(points, count) {
      const reply = await ask(
        { type: 'probe/sample', requestId: freshId('q'), surface: get().workspace.surface, points, count },
        (m): m is Extract<FromWorker, { type: 'probe/result' | 'probe/error' }> => m.type === 'probe/result' || m.type === 'probe/error',
      );
      if (reply.type === 'probe/error') throw new Error(reply.message);
      return { values: reply.values, gradients: reply.gradients };
    },
    setSlice({ view: requestedView, ...patch }) {
      const s = get();
      const slice = { ...s.workspace.slice, ...patch };
      const axesChanged = patch.axes && (patch.axes[0] !== s.workspace.slice.axes[0] || patch.axes[1] !== s.workspace.slice.axes[1]);
      const planeChanged = patch.plane !== undefined && patch.plane !== s.workspace.slice.plane;
      setWorkspace({ slice, view: planeChanged || axesChanged ? defaultView(s.surfaceInfo, slice, requestedView) : requestedView ?? s.workspace.view });
      requestGrid();
    },
    setView(view) {
      setWorkspace({ view });
      // Zooming and panning fire many events; the drawn contours follow at once (they live in parameter
      // space) and the finer grid is asked for when the gesture pauses.
      requestGridWhenQuiet();
    },
    setHover(point) {
      hover.setState({ hover: point });
    },
    resetView() {
      const s = get();
      actions.setView(defaultView(s.surfaceInfo, s.workspace.slice));
    },
    setDisplay(patch) {
      const s = get();
      setWorkspace({ display: { ...s.workspace.display, ...patch } });
      if (patch.resolution !== undefined && patch.resolution !== s.workspace.display.resolution) requestGrid();
      else if (patch.equalScale !== undefined && !sameView(viewShownBy(get()), viewShownBy(s))) requestGrid();
    },
    setFrame(frame) {
      const s = get();
      if (s.frame && s.frame.width === frame.width && s.frame.height === frame.height) return;
      set({ frame: { width: frame.width, height: frame.height } });
      if (sameView(viewShownBy(get()), viewShownBy(s))) return;
      // The first measurement replaces the grid asked for before it at once; a resize waits for quiet.
      if (s.frame === null) requestGrid();
      else requestGridWhenQuiet();
    },
    addRun(kind = 'adam') {
      const s = get();
      const run = newRunConfig(kind, s.workspace.runs, suggestedStartOf(s));
      const suggested = rateFamily(kind) === 'gradient' ? suggestedRateAt(s, run.settings.start) : null;
      if (suggested !== null) run.optimizer = { ...run.optimizer, learningRate: suggested };
      setWorkspace({ runs: [...s.workspace.runs, run] }, { selectedRunId: run.id });
      launch(run);
      return run.id;
    },
    updateRun(id, patch) {
      const run = mutateRun(id, (r) => ({ ...r, ...patch }));
      if (!run) return;
      const relaunch = patch.optimizer !== undefined || patch.settings !== undefined;
      if (relaunch) launch(run);
    },
    changeOptimizer(id, kind) {
      const s = get();
      const run = s.workspace.runs.find((r) => r.id === id);
      if (!run || run.optimizer.kind === kind) return;
      const optimizer = switchedOptimizer(run.optimizer, kind, pageDefaultSpec(kind), suggestedRateAt(s, run.settings.start));
      const label = run.label === optimizerLabel(run.optimizer) ? optimizerLabel(optimizer) : run.label;
      actions.updateRun(id, { optimizer, label });
    },
    duplicateRun(id) {
      const s = get();
      const source = s.workspace.runs.find((r) => r.id === id);
      if (!source) return null;
      const copy: RunConfig = { ...structuredClone(source), id: freshId('c'), label: `${source.label} (copy)`, style: nextStyle(s.workspace.runs), cell: undefined };
      const at = s.workspace.runs.indexOf(source) + 1;
      setWorkspace({ runs: [...s.workspace.runs.slice(0, at), copy, ...s.workspace.runs.slice(at)] }, { selectedRunId: copy.id });
      launch(copy);
      return copy.id;
    },
    removeRun(id) {
      live.forget(id);
      const s = get();
      setWorkspace({ runs: s.workspace.runs.filter((r) => r.id !== id) }, { selectedRunId: s.selectedRunId === id ? null : s.selectedRunId });
    },
    selectRun(id) {
      set({ selectedRunId: id });
      // A slice through two chosen variables holds the others at the selected run's current point.
      const s = get();
      const run = s.workspace.runs.find((r) => r.id === id);
      if (!run || s.workspace.slice.plane || s.surfaceInfo.variables.length <= 2) return;
      const at = runPoint(run, live);
      if (at.length === s.workspace.slice.at.length && at.every((v, k) => v === s.workspace.slice.at[k])) return;
      actions.setSlice({ at });
    },
    setStartTarget(startTarget) {
      set({ startTarget });
    },
    setStart(point) {
      const s = get();
      const targets = s.startTarget === 'selected' && s.selectedRunId ? [s.selectedRunId] : s.workspace.runs.map((r) => r.id);
      for (const id of targets) actions.updateRun(id, { settings: { ...get().workspace.runs.find((r) => r.id === id)!.settings, start: point.slice() } });
    },
    control(id, action) {
      live.control(id, action);
    },
    controlAll(action) {
      for (const r of get().workspace.runs) live.control(r.id, action);
    },
    restart(id) {
      const run = get().workspace.runs.find((r) => r.id === id);
      if (run) launch(run);
    },
    restartAll() {
      launchAll();
    },
    setPace(pace) {
      setWorkspace({ pace });
      engine.send({ type: 'run/pace', pace });
    },
    setStudy(spec) {
      const studies = get().workspace.studies ?? [];
      const at = studies.findIndex((x) => x.kind === spec.kind);
      setWorkspace({ studies: at < 0 ? [...studies, spec] : studies.map((x, k) => (k === at ? spec : x)) });
    },
    setTolerance(tolerance) {
      if (!(tolerance >= 0) || !Number.isFinite(tolerance)) return;
      setWorkspace({ tolerance });
      updateReference();
    },
    setPanels(patch) {
      setWorkspace({ panels: { ...get().workspace.panels, ...patch } });
    },
    buildTableRuns() {
      const s = get();
      for (const r of s.workspace.runs) if (r.cell) live.forget(r.id);
      const kept = s.workspace.runs.filter((r) => !r.cell);
      const start = suggestedStartOf(s);
      // The 'rule' row runs the selected run's rule when it is a rule run, else the latest rule run's.
      const ruleSource = s.workspace.runs.find((r) => r.id === s.selectedRunId && r.optimizer.kind === 'rule') ?? [...kept].reverse().find((r) => r.optimizer.kind === 'rule');
      const table: RunConfig[] = [];
      s.workspace.panels.tableOptimizers.forEach((kind, row) =>
        s.workspace.panels.tableLearningRates.forEach((lr, column) => {
          const run = newRunConfig(kind, [...kept, ...table], start);
          const base = kind === 'rule' && ruleSource ? structuredClone(ruleSource.optimizer) : run.optimizer;
          run.optimizer = { ...base, learningRate: lr };
          run.label = `${optimizerLabel(run.optimizer)} lr=${lr}`;
          run.cell = { row, column };
          table.push(run);
        }),
      );
      setWorkspace({ runs: [...kept, ...table], panels: { ...s.workspace.panels, mode: 'table' } });
      table.forEach(launch);
    },
    dismissNotice() {
      set({ notice: null });
    },
    setTableColumns(columns) {
      set({ table: { ...get().table, columns: columns ? [...columns] : null } });
    },
    setTableSort(sort) {
      set({ table: { ...get().table, sort } });
    },
    loadWorkspace(workspace) {
      let info: SurfaceInfo;
      try {
        info = drawableSurface(workspace.surface);
      } catch (e) {
        set({ notice: `The experiment's surface could not be built (${e instanceof Error ? e.message : String(e)}); nothing was changed.` });
        return;
      }
      for (const r of get().workspace.runs) live.forget(r.id);
      // A file's studies are set up in their panels, not run (a study can take minutes; the panel's
      // "Run as set up" starts it). The workspace is replaced whole, so fields a file leaves out are cleared.
      set({ workspace, surfaceInfo: info, surfaceError: null, status: {}, selectedRunId: null, table: { columns: null, sort: null } });
      engine.send({ type: 'run/pace', pace: workspace.pace });
      updateReference();
      launchAll();
      requestGrid();
    },
  };

  store = createStore<AppState>(() => ({
    workspace: start,
    surfaceInfo: describeSurface(start.surface),
    surfaceError: null,
    notice: startNotice,
    grid: { requestId: null, phase: 'idle', progress: 0, request: null, values: null, min: Number.NaN, max: Number.NaN, stage: null, error: null },
    status: {},
    selectedRunId: null,
    startTarget: 'all',
    frame: null,
    table: { columns: null, sort: null },
    actions,
  }));
  actions.loadWorkspace(start);

  return { store, hover, live, workspaceOf };
}

/** The saved part of the state, as written: no empty title or studies list. */
export function workspaceOf(s: Pick<AppState, 'workspace'>): Workspace {
  const { title, studies, ...rest } = s.workspace;
  return { ...rest, ...(title === undefined ? {} : { title }), ...(studies?.length ? { studies } : {}) };
}

/** The study a panel shows: the workspace's first of that kind. */
export function studyOfKind<K extends StudySpec['kind']>(studies: readonly StudySpec[] | undefined, kind: K): Extract<StudySpec, { kind: K }> | null {
  return (studies?.find((s) => s.kind === kind) as Extract<StudySpec, { kind: K }> | undefined) ?? null;
}

/** Whether the saved part changed (it is a new object on every change, so identity suffices). */
export function workspaceChanged(a: Pick<AppState, 'workspace'>, b: Pick<AppState, 'workspace'>): boolean {
  return a.workspace !== b.workspace;
}

/** The box the map shows for the state's view on its measured frame (the view itself without equal scale). */
export function viewShownBy(s: { workspace: Pick<Workspace, 'view' | 'display' | 'surface'> } & Pick<AppState, 'frame' | 'surfaceInfo'>): ViewBox {
  return shownView(s.workspace.view, s.frame, equalScaleOn(s.workspace.display, s.workspace.surface, s.surfaceInfo.variables.length));
}

function sameView(p: ViewBox, q: ViewBox): boolean {
  return p.a[0] === q.a[0] && p.a[1] === q.a[1] && p.b[0] === q.b[0] && p.b[1] === q.b[1];
}

/** Default view of a slice: the surface's box on the two axes, or [-1, 1]^2 in a method plane's units. */
function defaultView(info: SurfaceInfo, slice: SliceSettings, requested?: ViewBox): ViewBox {
  if (requested) return requested;
  if (slice.plane) return { a: [-1, 1], b: [-1, 1] };
  return viewFor(info.view, slice.axes);
}

function viewFor(view: [number, number][], [i, j]: [number, number]): ViewBox {
  return { a: [...view[i]] as [number, number], b: [...view[j]] as [number, number] };
}

/**
 * Builds the surface (throwing its specific error) and describes it; refuses a surface the map cannot
 * show, one of fewer than two variables.
 */
function drawableSurface(spec: SurfaceSpec): SurfaceInfo {
  buildSurface(spec);
  const info = describeSurface(spec);
  const n = info.variables.length;
  if (n < 2) {
    const which = n ? `1 (${info.variables[0]})` : 'none';
    const hint = spec.kind === 'formula' ? '; list them under Variable order, for example "x, y"' : '';
    throw new Error(`the map needs two or more variables, this surface has ${which}${hint}`);
  }
  return info;
}

function insideBox(point: number[], box: [number, number][]): boolean {
  return point.length === box.length && point.every((x, i) => x >= box[i][0] && x <= box[i][1]);
}

function suggestedStart(info: SurfaceInfo): number[] {
  return info.suggestedStart ?? info.view.map(([lo, hi]) => lo + 0.25 * (hi - lo));
}

/** The rate a new plain-gradient run gets at `start`: SAFE_FRACTION of 2 / lambda_max there, or null. */
function suggestedRateAt(s: AppState, start: number[]): number | null {
  const surface = mainThreadSurface(s.workspace.surface);
  return surface ? curvatureAt(surface, start)?.suggestedRate ?? null : null;
}

/** A run's current point (its last recorded one), else its start. */
function runPoint(run: RunConfig, live: LiveRuns): number[] {
  const b = live.trajectory(run.id);
  if (b && b.count > 0 && b.dimension === run.settings.start.length) {
    const x = Array.from(b.point(b.count - 1));
    if (x.every(Number.isFinite)) return x;
  }
  return run.settings.start.slice();
}

function suggestedStartOf(s: AppState): number[] {
  return s.workspace.runs[0]?.settings.start.slice() ?? suggestedStart(s.surfaceInfo);
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
