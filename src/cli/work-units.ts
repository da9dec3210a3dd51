/**
 * The work of an experiment as a list of units in file order, and a shard's share of it. Today a unit
 * is one run; a study (several starts or learning rates inside one run entry) will add units with a
 * start and learning-rate index, and the split below works on the list unchanged.
 */
import type { Experiment } from '../io/experiment';

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
