/** What `fall run` and its worker threads send each other. */
import type { StudyCellResults, StudySpec, ToleranceTarget } from '../engine';
import type { RunConfig } from '../io/experiment/types';
import type { ReferenceMinimum } from '../io/run-summary';
import type { SurfaceSpec } from '../problems';
import type { RunResult } from './run-one';

/** Given to every thread once, at start. */
export interface ThreadJob {
  surface: SurfaceSpec;
  runs: RunConfig[];
  studies: StudySpec[];
  minima: ReferenceMinimum[];
  tolerance: number;
  /** What the studies' steps to tolerance are measured against (io/run-summary.ts toleranceTarget). */
  target: ToleranceTarget | null;
}

/** One piece of work: a run of the file, or some cells of a study (engine/study/cells.ts). */
export type Task = { kind: 'run'; runIndex: number } | { kind: 'cells'; study: number; cells: Int32Array };

export type TaskResult = { kind: 'run'; result: RunResult } | { kind: 'cells'; cells: StudyCellResults };

export interface JobMessage {
  /** Index of the task in the shard's list. */
  unit: number;
  task: Task;
}

export interface ResultMessage {
  unit: number;
  result: TaskResult;
}
