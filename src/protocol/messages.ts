/**
 * The one typed protocol between the page and the engine workers. Every message is plain data
 * (structured-clone safe). Typed arrays are copied, never transferred: detaching a buffer slows every
 * later typed-array access in a V8 worker (see src/client/README.md).
 *
 * Identity: each launch of a run gets a fresh `runId`, each grid request a fresh `requestId`; the page
 * drops any message whose id is no longer current, so work superseded by an edit can never be drawn.
 */
import type { CriticalPoint, GridRequest, OptimizerSpec, RunOutcome, RunSettings, StudySpec, SweepThreshold, ToleranceTarget, TrajectoryBatch } from '../engine';
import type { CsvImport, SurfaceSpec } from '../problems';

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

/**
 * Rows j0 <= j < j1 of a grid: one pool member's share of a pooled grid request (see src/client/grid-pool.ts).
 * A band's values are row-major nx (j1 - j0) numbers, row j0 first.
 */
export type RowRange = [number, number];

export type ToWorker =
  | { type: 'run/start'; runId: string; spec: RunSpec; paused?: boolean }
  | { type: 'run/control'; runId: string; action: RunControl }
  | { type: 'run/pace'; pace: Pace }
  | { type: 'grid/sample'; requestId: string; surface: SurfaceSpec; grid: GridRequest; coarseFirst?: boolean }
  | { type: 'grid/cancel'; requestId: string }
  /** Parse an imported CSV file's text into a dataset table (off the main thread, with progress). */
  | { type: 'csv/parse'; requestId: string; text: string; options: CsvParseOptions }
  /** The loss along the segment from -> to (Goodfellow, Vinyals & Saxe 2015), at `count` alphas in [lo, hi]. */
  | { type: 'profile/sample'; requestId: string; surface: SurfaceSpec; from: number[]; to: number[]; alphas: { from: number; to: number; count: number } }
  /**
   * Run a study (src/worker/studies.ts), or with `part` only that share of it (the page's study pool,
   * src/client/study-pool.ts); a new study supersedes the one in progress. `target`: what each run's
   * steps to tolerance are measured against (null: the surface has no known minimum, not measured).
   */
  | { type: 'study/start'; requestId: string; surface: SurfaceSpec; study: StudySpec; target: ToleranceTarget | null; part?: StudyPart }
  /**
   * The end of a study run in parts, from the merged cells: a multi-start's loss bands from every
   * run's loss curve (by cell), a learning-rate sweep's thresholds from every outcome; answered by
   * 'study/done'.
   */
  | { type: 'study/finish'; requestId: string; surface: SurfaceSpec; study: StudySpec; outcomes: RunOutcome[]; curves: Float64Array[] }
  | { type: 'study/cancel'; requestId: string }
  /** The largest Hessian eigenvalue at `count` points (count x n, row-major), e.g. along a trajectory. */
  | { type: 'sharpness/sample'; requestId: string; surface: SurfaceSpec; points: Float64Array; count: number }
  /** Critical points of the surface found from `count` starts (count x n). */
  | { type: 'critical/find'; requestId: string; surface: SurfaceSpec; starts: Float64Array; count: number }
  /** A data-fit model's outputs at `params` for `count` input rows (count x d, original units), for the data view. */
  | { type: 'fit/predict'; requestId: string; surface: SurfaceSpec; params: Float64Array; rows: Float64Array; count: number }
  /** Loss and exact gradient at `count` points (count x n): the hover readout, the gradient arrows. */
  | { type: 'probe/sample'; requestId: string; surface: SurfaceSpec; points: Float64Array; count: number };

/**
 * Learning-rate sweeps, per optimizer: the largest Hessian eigenvalue at the start, the predicted
 * divergence threshold (null where the method has none), and the observed one as a bracket
 * [lo stable, hi unstable] (refined by bisection when `refined`), null when no rate diverged or the
 * smallest already did.
 */
export type StudyThreshold = SweepThreshold;

/**
 * Share `index` of `count` of a study: of every wave of runs (a map's coarse-to-fine waves, each
 * optimizer's rates, a multi-start's starts) the band splitBands(wave length, count)[index], so every
 * part starts with its share of the coarse grid.
 */
export interface StudyPart {
  index: number;
  count: number;
}

/** Finished cells of a study, in the order they finished (cell indices as in StartMapSpec). */
export interface StudyCells {
  indices: Int32Array;
  steps: Int32Array;
  loss: Float64Array;
  /** count x n end points, row-major. */
  endPoints: Float64Array;
  /** First step within the study's tolerance target, -1 if never or not measured. */
  stepsToTolerance: Int32Array;
  outcomes: RunOutcome[];
}

/** What the page chooses when importing a CSV file (the rest of CsvImportOptions are the worker's). */
export interface CsvParseOptions {
  name: string;
  dropBadRows: boolean;
  delimiter?: string;
  classColumns?: string[];
}

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
  | { type: 'grid/error'; requestId: string; message: string }
  | { type: 'csv/progress'; requestId: string; fraction: number; rowsRead: number }
  | { type: 'csv/result'; requestId: string; result: CsvImport }
  | { type: 'profile/result'; requestId: string; alphas: Float64Array; values: Float64Array }
  | { type: 'profile/error'; requestId: string; message: string }
  | { type: 'study/cells'; requestId: string; cells: StudyCells; done: number; total: number; elapsedMs: number }
  /**
   * `bands`: for multi-start studies, the 25%, 50% and 75% quantiles of the loss across runs per step.
   * A part of a study ends with neither; a multi-start part sends its runs' loss curves instead
   * (`curves[k]` for cell `curveIndices[k]`).
   */
  | { type: 'study/done'; requestId: string; elapsedMs: number; bands?: Float64Array[]; thresholds?: StudyThreshold[]; curveIndices?: Int32Array; curves?: Float64Array[] }
  | { type: 'study/error'; requestId: string; message: string }
  | { type: 'sharpness/result'; requestId: string; values: Float64Array }
  | { type: 'critical/result'; requestId: string; points: CriticalPoint[]; converged: number; failed: number }
  | { type: 'analysis/error'; requestId: string; message: string }
  /** count x width outputs, row-major: width 1 for a number or P(y = 1), K class probabilities for softmax. */
  | { type: 'fit/predictions'; requestId: string; outputs: Float64Array; width: number }
  | { type: 'fit/error'; requestId: string; message: string }
  /** `values[k]` and `gradients` (count x n) at the points asked for. */
  | { type: 'probe/result'; requestId: string; values: Float64Array; gradients: Float64Array }
  | { type: 'probe/error'; requestId: string; message: string };

/**
 * Pooled grid sampling (src/client/grid-pool.ts): the page's pool sends each member worker bands of one grid
 * request. Kept as unions of their own so the engine link's messages above are unchanged; the same
 * worker entry (src/worker/engine.worker.ts) answers both.
 */
export type ToPoolMember =
  /** Sample one band of a grid; a member queues bands and works through them in order. */
  | { type: 'band/sample'; requestId: string; surface: SurfaceSpec; grid: GridRequest; rows: RowRange }
  /** Drop every queued or unfinished band of this request. */
  | { type: 'band/cancel'; requestId: string };

export type FromPoolMember =
  /** Rows of the band finished so far (0 to j1 - j0), sent between time slices of a long band. */
  | { type: 'band/progress'; requestId: string; rows: RowRange; rowsDone: number }
  /** The band's values (copied) with their finite min and max (NaN when none is finite). */
  | { type: 'band/result'; requestId: string; rows: RowRange; values: Float64Array; min: number; max: number }
  | { type: 'band/error'; requestId: string; rows: RowRange; message: string };

export type { RunOutcome };

/**
 * Liveness of a page's worker link (store/engine-link.ts): the page pings every few seconds and the
 * worker entry answers at once, outside the message switches above. Any message counts as a sign of
 * life, so a busy worker that streams batches is never taken for dead.
 */
export type LinkPing = { type: 'link/ping' };
export type LinkPong = { type: 'link/pong' };
