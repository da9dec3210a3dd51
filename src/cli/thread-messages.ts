/** What `fall run` and its worker threads send each other. */
import type { RunConfig } from '../io/experiment/types';
import type { ReferenceMinimum } from '../io/run-summary';
import type { SurfaceSpec } from '../problems';
import type { RunResult } from './run-one';

/** Given to every thread once, at start. */
export interface ThreadJob {
  surface: SurfaceSpec;
  runs: RunConfig[];
  minima: ReferenceMinimum[];
  tolerance: number;
}

export interface JobMessage {
  /** Index of the unit in the shard's share. */
  unit: number;
  runIndex: number;
}

export interface ResultMessage {
  unit: number;
  result: RunResult;
}
