import { cellStart, drawStarts, hasParameterGroups, logSpaced, outcomeDetail, type RunOutcome, type StudySpec, type Surface } from '../engine';
import { toCsv, type CsvCell } from './csv';
import { reportedUnits } from './units';

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
 *   steps_to_tolerance    first step (0: the start) whose loss - f_min <= the tolerance, f_min the lowest
 *                         known minimum's value (io/run-summary.ts toleranceTarget); empty if never, and
 *                         empty in every row on a surface without a known minimum (nothing to measure from)
 * Points (start and end) are in the reported units (units.ts: the data's original units for a
 * standardised data fit), like the results and trajectory CSVs.
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

/** The `study` column's value and the file name of each kind's CSV (the page's downloads; `fall run` adds the study's place). */
export const STUDY_CSV: Record<StudySpec['kind'], { name: string; file: string }> = {
  'start-map': { name: 'start-map', file: 'fall-line-start-map' },
  'multi-start': { name: 'multi-start', file: 'fall-line-multi-start' },
  'lr-sweep': { name: 'learning-rate sweep', file: 'fall-line-learning-rates' },
};

/** A study's ended cells, indexed by cell (the page's study store holds them so). */
export interface StudyCellTable {
  filled: Uint8Array;
  steps: Int32Array;
  loss: Float64Array;
  endPoints: Float64Array;
  /** First step within the tolerance (engine/study ToleranceTarget), -1 if never or not measured. */
  stepsToTolerance: Int32Array;
  outcomes: (RunOutcome | undefined)[];
}

/**
 * The CSV rows of a study's ended cells in cell order, the one builder for the page's three study
 * exports and the command line: start from the spec (engine/study cellStart, drawStarts with the
 * surface's parameter groups, the sweep's start), optimizer as the page names it (a map's and a
 * multi-start's by kind, a sweep's by its label), learning rate per cell, basin label from `basinOf`.
 */
export function studyRows(spec: StudySpec, surface: Surface, cells: StudyCellTable, basinOf: (cell: number) => string | null): StudyRow[] {
  const n = surface.dimension;
  const starts = spec.kind === 'multi-start' ? drawStarts(spec.distribution, n, spec.count, spec.startSeed, hasParameterGroups(surface) ? surface.parameterGroups : undefined) : null;
  const rates = spec.kind === 'lr-sweep' ? logSpaced(spec.range[0], spec.range[1], spec.count) : null;
  const units = reportedUnits(surface);
  const reported = (x: ArrayLike<number>) => (units.standardised ? units.toReported(x) : x);
  const rows: StudyRow[] = [];
  for (let c = 0; c < cells.filled.length; c++) {
    const outcome = cells.outcomes[c];
    if (!cells.filled[c] || !outcome) continue;
    const common = { index: c, outcome, steps: cells.steps[c], finalLoss: cells.loss[c], endPoint: reported(cells.endPoints.subarray(c * n, (c + 1) * n)), basin: basinOf(c), stepsToTolerance: cells.stepsToTolerance[c] >= 0 ? cells.stepsToTolerance[c] : null };
    if (spec.kind === 'start-map') rows.push({ ...common, optimizer: spec.optimizer.kind, learningRate: spec.optimizer.learningRate, start: reported(cellStart(spec, c, new Float64Array(n))) });
    else if (spec.kind === 'multi-start') rows.push({ ...common, optimizer: spec.optimizer.kind, learningRate: spec.optimizer.learningRate, start: reported(starts!.subarray(c * n, (c + 1) * n)) });
    else rows.push({ ...common, optimizer: spec.optimizers[Math.floor(c / spec.count)].label, learningRate: rates![c % spec.count], start: reported(spec.start) });
  }
  return rows;
}
