/**
 * summary.json: what was run and how each run ended, in file order. Deterministic (no clock, no host),
 * so a merged summary is byte-identical to the one a single process writes.
 */
import type { Experiment } from '../io/experiment';
import { OUTCOME_KINDS, outcomeDetail, sweepThresholds, type RunOutcome, type StudySpec, type Surface, type SweepThreshold } from '../engine';
import type { RunResult } from './run-one';
import type { Shard } from './work-units';

export interface RunLine {
  id: string;
  label: string;
  outcome: RunOutcome['kind'] | 'failed';
  /** The step at which it ended; the outcome's detail as in the results CSV (rule, end point, reason). */
  step: number | null;
  detail: string | null;
  steps: number;
  finalLoss: number | null;
}

/** One study of the file: where its rows are and how its cells ended (this shard's cells, for a shard). */
export interface StudyLine {
  kind: StudySpec['kind'];
  /** The study's CSV, or for a shard the file holding its raw cells. */
  file: string;
  cells: number;
  totals: Record<RunOutcome['kind'], number>;
  /** Learning-rate sweeps, once every cell is in (a whole run or a merge): per optimizer, as the page's table shows them. */
  thresholds?: SweepThreshold[];
}

export interface SummaryFile {
  format: 'fall-line-summary';
  experiment: { hash: string; title: string | null; runs: number; studies: number };
  /** Null for a whole run or a merge of all shards. */
  shard: Shard | null;
  totals: Record<RunLine['outcome'], number>;
  runs: RunLine[];
  studies: StudyLine[];
}

export function runLine(id: string, label: string, r: RunResult): RunLine {
  const o = r.summary.outcome;
  const detail = r.error ?? (o ? outcomeDetail(o) : null);
  return {
    id,
    label,
    outcome: r.error ? 'failed' : (o?.kind ?? 'failed'),
    step: o?.step ?? null,
    detail,
    steps: r.summary.steps,
    finalLoss: Number.isFinite(r.summary.finalLoss) ? r.summary.finalLoss : null,
  };
}

export function summaryFile(experiment: Experiment, hash: string, shard: Shard | null, runs: RunLine[], studies: StudyLine[]): SummaryFile {
  return { format: 'fall-line-summary', experiment: { hash, title: experiment.title ?? null, runs: experiment.runs.length, studies: experiment.studies?.length ?? 0 }, shard, totals: totalsOf(runs), runs, studies };
}

/**
 * A study's line from the outcomes of its cells (those computed here); with the surface (all cells in),
 * a learning-rate sweep's divergence thresholds too (engine/study/thresholds.ts, as on the page).
 */
export function studyLine(spec: StudySpec, file: string, outcomes: readonly (RunOutcome | undefined)[], surface?: Surface): StudyLine {
  const kind = spec.kind;
  const totals = Object.fromEntries(OUTCOME_KINDS.map((k) => [k, 0])) as StudyLine['totals'];
  let cells = 0;
  for (const o of outcomes)
    if (o) {
      totals[o.kind] += 1;
      cells++;
    }
  return { kind, file, cells, totals, ...(spec.kind === 'lr-sweep' && surface ? { thresholds: sweepThresholds(spec, surface, outcomes) } : {}) };
}

export function totalsOf(runs: readonly RunLine[]): SummaryFile['totals'] {
  const totals = Object.fromEntries([...OUTCOME_KINDS, 'failed'].map((k) => [k, 0])) as SummaryFile['totals'];
  for (const r of runs) totals[r.outcome] += 1;
  return totals;
}

/** Runs that make the exit code 2: failed, diverged, or undefined at a point (the surface had no value there). */
export function troubled(runs: readonly RunLine[]): RunLine[] {
  return runs.filter((r) => r.outcome === 'failed' || r.outcome === 'diverged' || r.outcome === 'undefined');
}

export function summaryText(s: SummaryFile): string {
  return JSON.stringify(s, null, 2) + '\n';
}
