/** Names of the files a run writes: the page's export names for a whole run, shard-named otherwise. */
import type { Shard } from './work-units';

export const TRAJECTORIES = 'fall-line-trajectories';
export const RESULTS = 'fall-line-results';
export const SUMMARY = 'summary';

export interface OutputNames {
  trajectories: string;
  results: string;
  summary: string;
}

export function outputNames(shard: Shard | null): OutputNames {
  const tag = shard ? `.shard-${shard.index}-of-${shard.count}` : '';
  return { trajectories: `${TRAJECTORIES}${tag}.csv`, results: `${RESULTS}${tag}.csv`, summary: `${SUMMARY}${tag}.json` };
}

const SHARD_FILE = /^(?:fall-line-trajectories|fall-line-results|summary)\.shard-(\d+)-of-(\d+)\.(?:csv|json)$/;

/** The shard a file name belongs to, or null for any other name. */
export function shardOfName(name: string): Shard | null {
  const m = SHARD_FILE.exec(name);
  return m ? { index: Number(m[1]), count: Number(m[2]) } : null;
}

/** A shard file still being written by another task: `.<shard file name>.partial-<pid>` (out-dir.ts). */
const SHARD_TEMP = /^\.(.+)\.partial-\d+$/;

/**
 * The shard a folder entry belongs to, finished or still being written (the tasks of one job array
 * write into one folder at the same time), or null. Merges read finished files only (shardOfName).
 */
export function shardOfEntry(name: string): Shard | null {
  const temp = SHARD_TEMP.exec(name);
  return shardOfName(temp ? temp[1] : name);
}
