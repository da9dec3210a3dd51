/**
 * A numeric data table: named columns, values stored row-major in one Float64Array. Class columns
 * hold codes 0, 1, ..., K-1, with their labels in `categories`.
 */
export interface DataTable {
  /** Display name, e.g. 'iris' or the imported file's name. */
  readonly name: string;
  /** Where the data come from (a generator and its seed, a package, a NIST file, an import). */
  readonly source: string;
  readonly columns: readonly string[];
  readonly rows: number;
  /** values[i * columns.length + j] is row i, column j. */
  readonly values: Float64Array;
  /** Labels of class-coded columns: code k stands for categories[column][k]. */
  readonly categories: Readonly<Record<string, readonly string[]>>;
}

export function makeTable(
  name: string,
  source: string,
  columns: readonly string[],
  rows: readonly (readonly number[])[],
  categories: Record<string, readonly string[]> = {},
): DataTable {
  const m = columns.length;
  const values = new Float64Array(rows.length * m);
  rows.forEach((row, i) => {
    if (row.length !== m) throw new Error(`dataset ${name}: row ${i + 1} has ${row.length} values, expected ${m} (${columns.join(', ')})`);
    for (let j = 0; j < m; j++) {
      const v = row[j];
      if (typeof v !== 'number' || !Number.isFinite(v)) throw new Error(`dataset ${name}: row ${i + 1}, column ${columns[j]} must be a finite number, got ${String(v)}`);
      values[i * m + j] = v;
    }
  });
  return Object.freeze({ name, source, columns: Object.freeze([...columns]), rows: rows.length, values, categories: Object.freeze({ ...categories }) });
}

/** The index of a named column; throws listing the table's columns when there is none. */
export function columnIndex(table: DataTable, column: string, role: string): number {
  const j = table.columns.indexOf(column);
  if (j < 0) throw new Error(`dataset ${table.name}: no column '${column}' for the ${role}; columns: ${table.columns.join(', ')}`);
  return j;
}

/** One column as a fresh Float64Array. */
export function columnValues(table: DataTable, column: string): Float64Array {
  const j = columnIndex(table, column, 'column');
  const m = table.columns.length;
  const out = new Float64Array(table.rows);
  for (let i = 0; i < table.rows; i++) out[i] = table.values[i * m + j];
  return out;
}
