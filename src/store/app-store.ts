/**
 * The page store: one zustand vanilla store whose state is the saved `workspace` (one object) and the
 * live state beside it (app-state.ts), and whose actions are made by the slices in slices/ from one
 * shared context. Worker requests and grid scheduling are the engine client's (engine-client.ts).
 */
import { createStore, type StoreApi } from 'zustand/vanilla';
import { validateOptimizerSpec } from '../engine';
import { describeSurface } from '../problems';
import { referenceMinima } from '../io/run-exports';
import type { EngineLink } from './engine-link';
import { createEngineClient, type GridJob, type GridSource } from './engine-client';
import { LiveRuns } from './live-runs';
import { demoWorkspace } from './demo';
import { slicePlane } from './slice-plane';
import { createHoverStore, type HoverState } from './hover-store';
import { defaultTable, noGrid, type AppState } from './app-state';
import { viewShownBy, workspaceOf } from './selectors';
import { drawableSurface } from './surface-info';
import type { SliceContext } from './slices/context';
import { workspaceSlice } from './slices/workspace-slice';
import { requestsSlice } from './slices/requests-slice';
import { viewSlice } from './slices/view-slice';
import { runsSlice } from './slices/runs-slice';
import { pageSlice } from './slices/page-slice';
import type { Workspace } from './workspace';

export type { AppActions, AppState, GridState, SurfaceInfo } from './app-state';
export { focusRun, studyOfKind, viewShownBy, workspaceChanged, workspaceOf } from './selectors';
export { GRID_SETTLE_MS, type GridSource } from './engine-client';

export interface AppStore {
  store: StoreApi<AppState>;
  /** The point under the pointer (hover-store.ts), apart from the rest so pointer moves re-render no panel. */
  hover: StoreApi<HoverState>;
  live: LiveRuns;
  workspaceOf(state: AppState): Workspace;
}

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

  /** The grid over the box shown, at the display's resolution, for the current state. */
  function gridJob(): GridJob {
    const s = get();
    const side = s.workspace.display.resolution;
    const view = viewShownBy(s);
    return { surface: s.workspace.surface, grid: { plane: slicePlane(s.workspace.slice, s.surfaceInfo.variables.length), a: view.a, b: view.b, nx: side, ny: side } };
  }

  const ctx: SliceContext = {
    get,
    set,
    setWorkspace: (patch, rest = {}) => store.setState((s) => ({ ...rest, workspace: { ...s.workspace, ...patch } })),
    live,
    engine,
    hover,
    launch(run) {
      const problems = validateOptimizerSpec(run.optimizer);
      if (problems.length) return live.reject(run.id, problems[0].message, problems[0].field);
      live.launch(run.id, { surface: get().workspace.surface, optimizer: run.optimizer, settings: run.settings });
    },
    launchAll() {
      for (const run of get().workspace.runs) ctx.launch(run);
    },
    requestGrid: () => engine.sampleGrid(gridJob),
    requestGridWhenQuiet: () => engine.sampleGridWhenQuiet(gridJob),
    updateReference() {
      const s = get();
      live.setReference(referenceMinima(s.surfaceInfo.knownPoints), s.workspace.tolerance);
    },
  };

  const actions = { ...workspaceSlice(ctx), ...requestsSlice(ctx), ...viewSlice(ctx), ...runsSlice(ctx), ...pageSlice(ctx) };

  store = createStore<AppState>(() => ({
    workspace: start,
    surfaceInfo: describeSurface(start.surface),
    surfaceError: null,
    notice: startNotice,
    grid: noGrid(),
    status: {},
    selectedRunId: null,
    startTarget: 'all',
    frame: null,
    table: defaultTable(),
    actions,
  }));
  actions.loadWorkspace(start);

  return { store, hover, live, workspaceOf };
}
