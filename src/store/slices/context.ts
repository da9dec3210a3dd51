/** What every slice of the page store is given: the state, the live runs, the engine, shared steps. */
import type { StoreApi } from 'zustand/vanilla';
import type { AppState } from '../app-state';
import type { EngineClient } from '../engine-client';
import type { HoverState } from '../hover-store';
import type { LiveRuns } from '../live-runs';
import type { RunConfig, Workspace } from '../workspace';

export interface SliceContext {
  get(): AppState;
  /** Changes live (unsaved) fields. */
  set(patch: Partial<AppState>): void;
  /** Changes saved fields (a new workspace object) and, with `rest`, live fields in the same update. */
  setWorkspace(patch: Partial<Workspace>, rest?: Partial<AppState>): void;
  live: LiveRuns;
  engine: EngineClient;
  hover: StoreApi<HoverState>;
  /** Starts (or restarts) a run in the engine worker, or records why its settings cannot run. */
  launch(run: RunConfig): void;
  launchAll(): void;
  /** Samples the grid of the box shown now / after the view has been quiet for a moment. */
  requestGrid(): void;
  requestGridWhenQuiet(): void;
  /** Hands the surface's known minima and the tolerance to the run summaries. */
  updateReference(): void;
}
