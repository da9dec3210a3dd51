/**
 * CSV export (RFC 4180): trajectories and the run table.
 *
 * Format: fields separated by commas, records ended by CRLF (the last one too). A field is quoted when
 * it contains a comma, a double quote, CR or LF; quotes inside are doubled. Numbers are written with
 * String(n), which reads back to the same double (and -0 as "-0", which String() would write as "0"); NaN, null and undefined are empty cells; +-Infinity
 * are written "Infinity" / "-Infinity" (Number() reads them back).
 *
 * Formula neutralising (OWASP "CSV Injection"; OWASP ASVS 5.0 requirement 1.2.10 adds NUL): a text
 * cell that starts with =, +, -, @, a tab, CR or NUL would be evaluated as a formula by common
 * spreadsheet programs, so it gets a single quote (') in front. The type decides, not the look: the number -1.5 is written -1.5, while the text "-1.5" (say,
 * a run label) is written '-1.5. Header cells are text and follow the same rule. Neutralising happens
 * before quoting, so "=1,2" becomes "'=1,2" (quoted for its comma).
 */
import { outcomeDetail, stepOfRow, type RunOutcome, type TrajectoryBatch } from '../engine';

export type CsvCell = string | number | null | undefined;

export const CSV_LINE_END = '\r\n';

const FORMULA_START = /^[=+\-@\t\r\0]/;
const NEEDS_QUOTES = /[",\r\n]/;

/** One cell as CSV text (neutralised and quoted as described above). */
export function csvField(cell: CsvCell): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'number') return Number.isNaN(cell) ? '' : Object.is(cell, -0) ? '-0' : String(cell);
  const text = FORMULA_START.test(cell) ? `'${cell}` : cell;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(rows: readonly (readonly CsvCell[])[], header: readonly string[]): string {
  const lines = [header.map(csvField).join(',')];
  rows.forEach((row, k) => {
    if (row.length !== header.length) throw new Error(`csv: row ${k + 1} has ${row.length} cells but the header has ${header.length}`);
    lines.push(row.map(csvField).join(','));
  });
  return lines.join(CSV_LINE_END) + CSV_LINE_END;
}

/** What a trajectory export needs of one run. */
export interface TrajectoryExportRun {
  id: string;
  label: string;
  optimizer: string;
  /** The run's base learning rate (before any schedule). */
  learningRate: number;
  /** Names of the coordinates, one per dimension of the batch. */
  variables: readonly string[];
  batch: Pick<TrajectoryBatch, 'count' | 'dimension' | 'points' | 'loss' | 'gradNorm' | 'learningRate' | 'firstStep' | 'steps'>;
}

export const TRAJECTORY_FIXED_COLUMNS = ['run_id', 'run_label', 'optimizer', 'learning_rate', 'step'] as const;
export const TRAJECTORY_VALUE_COLUMNS = ['loss', 'grad_norm', 'step_learning_rate'] as const;

/**
 * Trajectory CSV, one row per run per recorded step, runs in the order given. Columns:
 *   run_id              the run's id
 *   run_label           the run's label as the user typed it
 *   optimizer           optimizer name
 *   learning_rate       the run's base learning rate
 *   step                step number (0 = the start point); a page run of more steps than its buffer
 *                       keeps (store/trajectory-buffer.ts) has rows only at every k-th step, and its last
 *   <variable> ...      one column per coordinate, named by the variable; when runs have different
 *                       variables, the union in first-seen order, empty where a run has no such
 *                       variable (a variable named like a fixed column gets the prefix "coord_")
 *   loss                loss at the point after this step
 *   grad_norm           Euclidean norm of the exact gradient there
 *   step_learning_rate  the (scheduled) learning rate this step used; empty at step 0
 */
export function trajectoryCsv(runs: readonly TrajectoryExportRun[]): string {
  const variables = unionOfVariables(runs.map((r) => r.variables));
  const header = [...TRAJECTORY_FIXED_COLUMNS, ...variables.map((v) => coordinateColumn(v, 'trajectory')), ...TRAJECTORY_VALUE_COLUMNS];
  const rows: CsvCell[][] = [];
  for (const run of runs) {
    const b = run.batch;
    if (run.variables.length !== b.dimension)
      throw new Error(`csv: run "${run.id}" names ${run.variables.length} variables but its points have ${b.dimension} coordinates`);
    const column = variables.map((v) => run.variables.indexOf(v));
    for (let k = 0; k < b.count; k++) {
      const step = stepOfRow(b, k);
      const coords = column.map((c) => (c < 0 ? null : b.points[k * b.dimension + c]));
      rows.push([run.id, run.label, run.optimizer, run.learningRate, step, ...coords, b.loss[k], b.gradNorm[k], step === 0 ? null : b.learningRate[k]]);
    }
  }
  return toCsv(rows, header);
}

/** One line of the run table. */
export interface RunSummaryRow {
  id: string;
  label: string;
  optimizer: string;
  learningRate: number;
  /** How the run ended; null while it is still running. */
  outcome: RunOutcome | null;
  /** Steps taken so far. */
  steps: number;
  finalLoss: number;
  variables: readonly string[];
  finalPoint: ArrayLike<number>;
  /** Euclidean distance from the final point to the nearest known minimum; null without known minima. */
  distanceToNearestMinimum: number | null;
  /** Which minimum that is (its label or coordinates as text). */
  nearestMinimum: string | null;
  /** First step whose loss came within the tolerance of the lowest known minimum; null if never. */
  stepsToTolerance: number | null;
}

/**
 * Run table CSV, one row per run. Columns:
 *   run_id, run_label, optimizer, learning_rate   as in the trajectory CSV
 *   outcome             converged | saddle | maximum | stationary | stalled | oscillating | escaping |
 *                       diverged | undefined | step-limit | cancelled | running (README: Outcomes)
 *   outcome_detail      the rule that stopped the run and the end point's state, or why it diverged
 *   final_grad_norm     the exact gradient norm at the final point
 *   point_kind          minimum | saddle | maximum | degenerate from the Hessian, when stationary
 *   outcome_step        the step at which the run ended; empty while running
 *   steps               steps taken
 *   final_loss          loss at the final point
 *   final_<variable>    final point coordinates, union of variables in first-seen order
 *   distance_to_nearest_minimum, nearest_minimum, steps_to_tolerance   empty when not known
 */
export function runTableCsv(rows: readonly RunSummaryRow[]): string {
  const variables = unionOfVariables(rows.map((r) => r.variables));
  const header = [
    'run_id', 'run_label', 'optimizer', 'learning_rate', 'outcome', 'outcome_detail', 'outcome_step', 'steps', 'final_loss', 'final_grad_norm', 'point_kind',
    ...variables.map((v) => coordinateColumn(v, 'final')),
    'distance_to_nearest_minimum', 'nearest_minimum', 'steps_to_tolerance',
  ];
  const body = rows.map((r): CsvCell[] => {
    if (r.variables.length !== r.finalPoint.length && r.finalPoint.length !== 0)
      throw new Error(`csv: run "${r.id}" names ${r.variables.length} variables but its final point has ${r.finalPoint.length} coordinates`);
    const o = r.outcome;
    const point = o && 'point' in o ? o.point : null;
    return [
      r.id, r.label, r.optimizer, r.learningRate,
      o ? o.kind : 'running', o ? outcomeDetail(o) : null, o ? o.step : null, r.steps, r.finalLoss,
      point?.gradNorm, point?.curvature?.kind,
      ...variables.map((v) => {
        const c = r.variables.indexOf(v);
        return c < 0 || c >= r.finalPoint.length ? null : r.finalPoint[c];
      }),
      r.distanceToNearestMinimum, r.nearestMinimum, r.stepsToTolerance,
    ];
  });
  return toCsv(body, header);
}

/** Distinct names in first-seen order. */
export function unionOfVariables(lists: readonly (readonly string[])[]): string[] {
  const seen = new Set<string>();
  for (const list of lists) for (const v of list) seen.add(v);
  return [...seen];
}

const RESERVED = new Set<string>([...TRAJECTORY_FIXED_COLUMNS, ...TRAJECTORY_VALUE_COLUMNS]);

function coordinateColumn(variable: string, table: 'trajectory' | 'final'): string {
  if (table === 'final') return `final_${variable}`;
  return RESERVED.has(variable) ? `coord_${variable}` : variable;
}
