/**
 * The one typed protocol between the page and the engine workers. Every message is plain data
 * (structured-clone safe); trajectory and grid buffers are transferred, not copied.
 *
 * Identity: each launch of a run gets a fresh `runId`, each grid request a fresh `requestId`; the page
 * drops any message whose id is no longer current, so work superseded by an edit can never be drawn.
 */
import type { GridRequest, OptimizerSpec, RunOutcome, RunSettings, TrajectoryBatch } from '../engine';
import type { SurfaceSpec } from '../problems';

/** Everything needed to reproduce one run. */
export interface RunSpec {
  surface: SurfaceSpec;
  optimizer: OptimizerSpec;
  settings: RunSettings;
}

/**
 * How fast runs stream: steps per second per run, or 'max' (as fast as the worker can go, in
 * time slices). A slow pace lets a person watch the trajectories form.
 */
export type Pace = number | 'max';

export type RunControl = 'pause' | 'resume' | 'step' | 'cancel';

export type ToWorker =
  | { type: 'run/start'; runId: string; spec: RunSpec; paused?: boolean }
  | { type: 'run/control'; runId: string; action: RunControl }
  | { type: 'run/pace'; pace: Pace }
  | { type: 'grid/sample'; requestId: string; surface: SurfaceSpec; grid: GridRequest; coarseFirst?: boolean }
  | { type: 'grid/cancel'; requestId: string };

export type FromWorker =
  | { type: 'run/batch'; runId: string; batch: TrajectoryBatch; evaluations: number; paused: boolean }
  | { type: 'run/error'; runId: string; message: string; field?: string }
  | { type: 'grid/progress'; requestId: string; rowsDone: number; rows: number }
  | {
      type: 'grid/result';
      requestId: string;
      grid: GridRequest;
      values: Float64Array;
      min: number;
      max: number;
      /** 'coarse' results are a quick preview; 'final' is the requested resolution. */
      stage: 'coarse' | 'final';
    }
  | { type: 'grid/error'; requestId: string; message: string };

export type { RunOutcome };
