/**
 * A shard's study cells, `fall-line-studies.shard-i-of-n.json`: the raw ended cells of the shard's share
 * of every study, and the experiment itself, so `fall merge` can rebuild the surface and write each
 * study's CSV with the same code as a single process (basins are assigned only once all cells are in,
 * study-exports.ts). JSON cannot hold NaN, +-Infinity or -0, which diverged runs produce: such numbers
 * are written as {"float": "NaN" | "Infinity" | "-Infinity" | "-0"} and read back as the same doubles.
 */
import type { StudyCellResults } from '../engine';
import type { Experiment } from '../io/experiment';
import type { Shard } from './work-units';

export interface StudyShardFile {
  format: 'fall-line-study-cells';
  hash: string;
  shard: Shard;
  experiment: Experiment;
  /** Per study in file order: the cells this shard computed. */
  studies: StudyCellResults[];
}

const SPECIAL: Record<string, number> = { NaN: Number.NaN, Infinity: Infinity, '-Infinity': -Infinity, '-0': -0 };

export function studyShardText(file: StudyShardFile): string {
  const plain = { ...file, studies: file.studies.map((c) => ({ indices: Array.from(c.indices), steps: Array.from(c.steps), loss: Array.from(c.loss), endPoints: Array.from(c.endPoints), stepsToTolerance: Array.from(c.stepsToTolerance), outcomes: c.outcomes })) };
  return JSON.stringify(plain, (_key, v) => (typeof v === 'number' && (!Number.isFinite(v) || Object.is(v, -0)) ? { float: Object.is(v, -0) ? '-0' : String(v) } : v)) + '\n';
}

/** Throws an Error saying what is wrong when the text is not such a file. */
export function readStudyShard(text: string): StudyShardFile {
  const value = JSON.parse(text, (_key, v) => (v !== null && typeof v === 'object' && !Array.isArray(v) && Object.keys(v).length === 1 && typeof v.float === 'string' && v.float in SPECIAL ? SPECIAL[v.float] : v));
  if (value?.format !== 'fall-line-study-cells' || !Array.isArray(value.studies)) throw new Error('not a shard study-cells file');
  return {
    ...value,
    studies: value.studies.map((c: Record<string, number[]> & { outcomes: StudyCellResults['outcomes'] }) => {
      // Shards written before steps to tolerance were kept lack them: refuse rather than write an empty column.
      if (!Array.isArray(c.stepsToTolerance)) throw new Error('shard study-cells file has no steps to tolerance (written by an older fall): run the shard again');
      return {
        indices: Int32Array.from(c.indices), steps: Int32Array.from(c.steps), loss: Float64Array.from(c.loss), endPoints: Float64Array.from(c.endPoints),
        stepsToTolerance: Int32Array.from(c.stepsToTolerance), outcomes: c.outcomes,
      };
    }),
  };
}
