/** Names of the files a run writes: the page's export names for a whole run, shard-named otherwise. */
import type { StudySpec } from '../engine';
import { STUDY_CSV } from '../io/study-csv';
import type { Shard } from './work-units';

export const TRAJECTORIES = 'fall-line-trajectories';
export const RESULTS = 'fall-line-results';
export const SUMMARY = 'summary';
export const STUDY_CELLS = 'fall-line-studies';

export interface OutputNames {
  trajectories: string;
  results: string;
  summary: string;
  /** A shard's raw study cells (study-shard-file.ts); a whole run writes the study CSVs instead. */
  studyCells: string;
}

export function outputNames(shard: Shard | null): OutputNames {
  const tag = shard ? `.shard-${shard.index}-of-${shard.count}` : '';
  return { trajectories: `${TRAJECTORIES}${tag}.csv`, results: `${RESULTS}${tag}.csv`, summary: `${SUMMARY}${tag}.json`, studyCells: `${STUDY_CELLS}${tag}.json` };
}

/** The CSV of study k of the file (a whole run or a merge): the page's download name with the study's place. */
export function studyCsvName(spec: StudySpec, k: number): string {
  return `${STUDY_CSV[spec.kind].file}.study-${k}.csv`;
}

const SHARD_FILE = /^(?:fall-line-trajectories|fall-line-results|fall-line-studies|summary)\.shard-(\d+)-of-(\d+)\.(?:csv|json)$/;

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
