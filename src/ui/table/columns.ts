/**
 * The results table as data: its columns, their cell values, compact number text, sorting and the
 * full-precision copy. The component only lays these out.
 */

/** One run's row, every number in the reported (original) units. */
export interface ResultRow {
  id: string;
  label: string;
  style: number;
  optimizer: string;
  learningRate: number;
  outcome: string;
  outcomeKind: string | undefined;
  outcomeTitle: string | undefined;
  steps: number | null;
  maxSteps: number;
  finalLoss: number;
  bestLoss: number;
  /** Final point in the reported units (empty before the first batch). */
  point: number[];
  nearestDistance: number | null;
  nearestPoint: number[] | null;
  stepsToTolerance: number | null | 'none';
  /** stepsToTolerance is an upper bound (see RunSummary). */
  stepsToToleranceIsBound?: boolean;
  evaluations: number | null;
}

export type CellValue = number | string | null;

export interface ResultColumn {
  id: string;
  /** Header text (short, one line). */
  label: string;
  /** A longer explanation shown on hover. */
  title?: string;
  /** The value sorted on and copied at full precision. */
  value(row: ResultRow): CellValue;
  /** The text shown (compact). */
  text(row: ResultRow): string;
  numeric: boolean;
}

/** Significant digits shown in the table; the title, the copy and the CSV keep every digit. */
export const COMPACT_DIGITS = 4;

/** A number in at most `digits` significant digits: 0.001234, 1.235e+7 -> 1.235e7, -0.5. */
export function compactNumber(v: number, digits = COMPACT_DIGITS): string {
  if (Number.isNaN(v)) return '—';
  if (!Number.isFinite(v)) return v > 0 ? '∞' : '-∞';
  if (v === 0) return '0';
  const m = Math.abs(v);
  const text = m >= 1e-3 && m < 1e6 ? String(Number(v.toPrecision(digits))) : v.toExponential(digits - 1).replace(/\.?0+e/, 'e').replace('e+', 'e');
  return text;
}

/** Full precision, as the CSV writes it (reads back to the same double). */
export function fullNumber(v: number): string {
  return Object.is(v, -0) ? '-0' : String(v);
}

function pointText(x: readonly number[]): string {
  return x.length <= 4 ? `(${x.map((v) => compactNumber(v)).join(', ')})` : `(${x.slice(0, 3).map((v) => compactNumber(v)).join(', ')}, … ${x.length} values)`;
}

const num = (v: number | null | undefined): string => (v === null || v === undefined ? '—' : compactNumber(v));

/** Every column the table can show, for a surface with these parameter names. */
export function resultColumns(variables: readonly string[]): ResultColumn[] {
  const fixed: ResultColumn[] = [
    { id: 'optimizer', label: 'Optimizer', value: (r) => r.optimizer, text: (r) => r.optimizer, numeric: false },
    { id: 'learning-rate', label: 'Rate', title: 'Base learning rate', value: (r) => r.learningRate, text: (r) => compactNumber(r.learningRate), numeric: true },
    { id: 'outcome', label: 'Outcome', value: (r) => r.outcome, text: (r) => r.outcome, numeric: false },
    { id: 'steps', label: 'Steps', title: 'Steps taken of the run’s step limit', value: (r) => r.steps, text: (r) => (r.steps === null ? '—' : String(r.steps)), numeric: true },
    { id: 'final-loss', label: 'Final loss', value: (r) => (Number.isNaN(r.finalLoss) ? null : r.finalLoss), text: (r) => num(Number.isNaN(r.finalLoss) ? null : r.finalLoss), numeric: true },
    { id: 'best-loss', label: 'Best loss', title: 'Lowest loss the run reached', value: (r) => (Number.isNaN(r.bestLoss) ? null : r.bestLoss), text: (r) => num(Number.isNaN(r.bestLoss) ? null : r.bestLoss), numeric: true },
    { id: 'final-point', label: 'Final point', title: 'All final coordinates (original units)', value: (r) => (r.point.length ? r.point.map(fullNumber).join(', ') : null), text: (r) => (r.point.length ? pointText(r.point) : '—'), numeric: false },
  ];
  const coords: ResultColumn[] = variables.map((name, k) => ({
    id: `param:${k}`,
    label: name,
    title: `Final ${name} (original units)`,
    value: (r) => r.point[k] ?? null,
    text: (r) => num(r.point[k]),
    numeric: true,
  }));
  const rest: ResultColumn[] = [
    { id: 'nearest-distance', label: 'Distance', title: 'Distance from the final point to the nearest known minimum', value: (r) => r.nearestDistance, text: (r) => num(r.nearestDistance), numeric: true },
    { id: 'nearest', label: 'Nearest known min.', value: (r) => (r.nearestPoint ? r.nearestPoint.map(fullNumber).join(', ') : null), text: (r) => (r.nearestPoint ? pointText(r.nearestPoint) : '—'), numeric: false },
    {
      id: 'steps-to-tolerance',
      label: 'Reached at',
      title: 'First step whose loss came within the tolerance of the lowest known minimum',
      value: (r) => (typeof r.stepsToTolerance === 'number' ? r.stepsToTolerance : null),
      text: (r) => (r.stepsToTolerance === 'none' ? 'no known min.' : r.stepsToTolerance === null ? 'not yet' : `${r.stepsToToleranceIsBound ? '≤ ' : ''}${r.stepsToTolerance}`),
      numeric: true,
    },
    { id: 'evaluations', label: 'Evals', title: 'Surface evaluations, line searches included', value: (r) => r.evaluations, text: (r) => (r.evaluations === null ? '—' : String(r.evaluations)), numeric: true },
  ];
  return [...fixed.slice(0, 6), ...coords, fixed[6], ...rest];
}

/** The columns shown before the user chooses: outcome, steps, loss, the parameters (or the point when there are many), distance, steps to minimum. */
export function defaultColumnIds(variables: readonly string[], hasKnownMinimum: boolean): string[] {
  const point = variables.length <= 4 ? variables.map((_, k) => `param:${k}`) : ['final-point'];
  return ['outcome', 'steps', 'final-loss', ...point, ...(hasKnownMinimum ? ['nearest-distance', 'steps-to-tolerance'] : []), 'evaluations'];
}

export type SortDirection = 'ascending' | 'descending';
export interface TableSort {
  column: string;
  direction: SortDirection;
}

/** The next sort after a click on a column's header: ascending, then descending, then unsorted. */
export function nextSort(current: TableSort | null, column: string): TableSort | null {
  if (!current || current.column !== column) return { column, direction: 'ascending' };
  return current.direction === 'ascending' ? { column, direction: 'descending' } : null;
}

/**
 * Rows sorted on a column (stable; rows without a value last in either direction; numbers by value,
 * text naturally so "run 2" comes before "run 10").
 */
export function sortRows(rows: readonly ResultRow[], columns: readonly ResultColumn[], sort: TableSort | null): ResultRow[] {
  const col = sort && columns.find((c) => c.id === sort.column);
  if (!sort || !col) return rows.slice();
  const sign = sort.direction === 'ascending' ? 1 : -1;
  return rows
    .map((row, index) => ({ row, index, v: col.value(row) }))
    .sort((x, y) => {
      const missingX = x.v === null || (typeof x.v === 'number' && Number.isNaN(x.v));
      const missingY = y.v === null || (typeof y.v === 'number' && Number.isNaN(y.v));
      if (missingX || missingY) return missingX === missingY ? x.index - y.index : missingX ? 1 : -1;
      const c = typeof x.v === 'number' && typeof y.v === 'number' ? x.v - y.v : naturalCompare(String(x.v), String(y.v));
      return c !== 0 ? sign * c : x.index - y.index;
    })
    .map((e) => e.row);
}

const COLLATOR = new Intl.Collator('en', { numeric: true, sensitivity: 'variant' });

/** Text order with digit runs compared as numbers: x1, x2, x10. */
export function naturalCompare(a: string, b: string): number {
  return COLLATOR.compare(a, b);
}

/** The shown rows and columns as tab-separated text at full precision (for the clipboard). */
export function tableTsv(rows: readonly ResultRow[], columns: readonly ResultColumn[]): string {
  const clean = (s: string) => s.replace(/[\t\r\n]+/g, ' ');
  const head = ['Run', ...columns.map((c) => c.label)].map(clean).join('\t');
  const body = rows.map((r) =>
    [r.label, ...columns.map((c) => {
      const v = c.value(r);
      return v === null ? '' : typeof v === 'number' ? fullNumber(v) : v;
    })]
      .map(clean)
      .join('\t'),
  );
  return [head, ...body].join('\n') + '\n';
}
