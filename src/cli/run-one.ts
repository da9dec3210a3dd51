/**
 * One run from its start to its end, as the page runs it: same surface, optimizer and settings, same
 * summary fold (src/io/run-summary.ts). Pure: no files, no threads.
 */
import { buildOptimizer, concatBatches, RunCursor, type TrajectoryBatch } from '../engine';
import { emptySummary, updateSummary, type ReferenceMinimum, type RunSummary } from '../io/run-summary';
import type { RunConfig } from '../io/experiment/types';
import { buildSurface, type SurfaceSpec } from '../problems';

export interface RunResult {
  trajectory: TrajectoryBatch;
  summary: RunSummary;
  /** Set when a step threw (the trajectory and summary then hold what was recorded before). */
  error: string | null;
}

/** Steps per batch: only memory and the summary fold's granularity depend on it, not the numbers. */
const BATCH_STEPS = 4096;

export function runOne(surfaceSpec: SurfaceSpec, run: RunConfig, minima: readonly ReferenceMinimum[], tolerance: number): RunResult {
  const surface = buildSurface(surfaceSpec);
  const cursor = new RunCursor(surface, buildOptimizer(run.optimizer), run.settings);
  const batches: TrajectoryBatch[] = [];
  let summary = emptySummary();
  let error: string | null = null;
  try {
    do {
      const batch = cursor.advance(BATCH_STEPS);
      batches.push(batch);
      summary = updateSummary(summary, batch, minima, tolerance);
    } while (!cursor.state.outcome);
  } catch (e) {
    error = `step ${cursor.state.t}: ${e instanceof Error ? e.message : String(e)}`;
  }
  return { trajectory: concatBatches(batches, surface.dimension), summary, error };
}
