/**
 * The work of an experiment as lists of units in file order, and a shard's share of each: the runs,
 * and each study's cells (a map's cells, a multi-start's starts, a sweep's optimizer x rate runs) in
 * the study's run order (engine/study studyOrder). Every shard takes its share of the runs and of
 * every study, so the tasks of a job array share each study; a map's coarse-to-fine order spreads a
 * shard's cells over the whole map, so slow regions are shared too.
 */
import { studyOrder } from '../engine';
import type { Experiment } from '../io/experiment';
import type { Task } from './thread-messages';

export interface WorkUnit {
  /** Position of the run in the file's `runs`. */
  runIndex: number;
  runId: string;
}

export interface Shard {
  /** 0-based, as Slurm's SLURM_ARRAY_TASK_ID with --array=0-(count-1). */
  index: number;
  count: number;
}

export const WHOLE: Shard = { index: 0, count: 1 };

export function workUnits(experiment: Experiment): WorkUnit[] {
  return experiment.runs.map((r, runIndex) => ({ runIndex, runId: r.id }));
}

/** The cells of each study (in file order) that shard computes. */
export function studyShares(experiment: Experiment, shard: Shard): Int32Array[] {
  return (experiment.studies ?? []).map((spec) => Int32Array.from(shareOf(Array.from(studyOrder(spec)), shard)));
}

/** Most and fewest cells per thread task (the sweep engine steps blocks of 64 runs). */
const MAX_TASK_CELLS = 1024;
const MIN_TASK_CELLS = 64;

/** A study's cells cut into thread tasks, about four per thread, so the threads finish close together. */
export function cellTasks(study: number, cells: Int32Array, threads: number): Task[] {
  const size = Math.min(MAX_TASK_CELLS, Math.max(MIN_TASK_CELLS, Math.ceil(cells.length / (4 * threads))));
  const tasks: Task[] = [];
  for (let from = 0; from < cells.length; from += size) tasks.push({ kind: 'cells', study, cells: cells.slice(from, from + size) });
  return tasks;
}

/**
 * Shard i of n gets the contiguous block of units [floor(i U / n), floor((i + 1) U / n)): the blocks
 * partition the list, differ in size by at most one, and in shard order give back the file order, so
 * joining shard outputs in shard order is the same as one run over everything.
 */
export function shareOf<T>(units: readonly T[], shard: Shard): T[] {
  const from = Math.floor((shard.index * units.length) / shard.count);
  const to = Math.floor(((shard.index + 1) * units.length) / shard.count);
  return units.slice(from, to);
}

/** Parses `i/n` (0 <= i < n); throws an Error saying what is wrong. */
export function parseShard(text: string): Shard {
  const m = /^(\d+)\/(\d+)$/.exec(text.trim());
  if (!m) throw new Error(`--shard ${JSON.stringify(text)}: expected i/n with whole numbers, 0 <= i < n (e.g. 0/4)`);
  const index = Number(m[1]);
  const count = Number(m[2]);
  if (count < 1) throw new Error(`--shard ${text}: the number of shards must be at least 1`);
  if (index >= count) throw new Error(`--shard ${text}: shard index ${index} is out of range; shards of ${count} are numbered 0 to ${count - 1}`);
  return { index, count };
}
