import { outcomeDetail, type RunOutcome } from '../engine';
import { toCsv, type CsvCell } from './csv';

/**
 * Study CSV (same RFC 4180 and formula-neutralising rules as csv.ts), one row per start (start-point
 * maps, multi-start) or per learning rate (learning-rate sweeps). Columns:
 *   study, index          the study's id and the row's index in it (start or learning-rate index)
 *   optimizer, learning_rate
 *   start_<variable> ...  the start point
 *   outcome, outcome_detail, outcome_step   as in the results CSV (README: Outcomes)
 *   steps, final_loss
 *   final_<variable> ...  the end point
 *   basin                 the known point or end-point cluster the run ended in; empty when none
 *   steps_to_tolerance    first step within the tolerance of the lowest known minimum; empty if never
 */
export interface StudyRow {
  index: number;
  optimizer: string;
  learningRate: number;
  start: ArrayLike<number>;
  outcome: RunOutcome;
  steps: number;
  finalLoss: number;
  endPoint: ArrayLike<number>;
  basin: string | null;
  stepsToTolerance: number | null;
}

export function studyCsv(study: string, variables: readonly string[], rows: readonly StudyRow[]): string {
  const n = variables.length;
  const header = [
    'study', 'index', 'optimizer', 'learning_rate', ...variables.map((v) => `start_${v}`),
    'outcome', 'outcome_detail', 'outcome_step', 'steps', 'final_loss', ...variables.map((v) => `final_${v}`), 'basin', 'steps_to_tolerance',
  ];
  const body = rows.map((r): CsvCell[] => {
    if (r.start.length !== n || r.endPoint.length !== n) throw new Error(`study csv: row ${r.index} has ${r.start.length} start and ${r.endPoint.length} end coordinates, expected ${n}`);
    return [
      study, r.index, r.optimizer, r.learningRate, ...Array.from(r.start),
      r.outcome.kind, outcomeDetail(r.outcome), r.outcome.step, r.steps, r.finalLoss, ...Array.from(r.endPoint), r.basin, r.stepsToTolerance,
    ];
  });
  return toCsv(body, header);
}
