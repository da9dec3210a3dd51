import { createRng } from '../../engine';
import { DEMO_DATASETS } from './demo';
import { fingerprintRows } from './fingerprint';
import { irisTable } from './iris';
import { MAX_TABLE_COLUMNS, MAX_TABLE_ROWS } from './limits';
import { LruCache } from './lru';
import { isNistDatasetId, NIST_DATASET_IDS, nistTable } from './nist-sets';
import type { DatasetSpec, DemoDatasetId, TableDatasetSpec } from './spec';
import { makeTable, type DataTable } from './table';

/**
 * Dataset specs to tables. Built tables are cached by a key (the spec's JSON for named data, name,
 * shape and a content fingerprint for inline tables; see fingerprint.ts), because workers rebuild
 * surfaces from specs often and the spec arrives as a fresh copy each time.
 */
const TABLES = new LruCache<DataTable>(8);
/** Fingerprints of inline row arrays already seen, so the same object is not hashed twice. */
const SEEN_ROWS = new WeakMap<object, string>();

const W = 'dataset';
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const describe = (v: unknown) => (v === undefined ? 'nothing' : v === null ? 'null' : Array.isArray(v) ? 'an array' : typeof v === 'string' ? JSON.stringify(v) : String(v));

function only(where: string, spec: Record<string, unknown>, allowed: string[]): void {
  for (const key of Object.keys(spec)) if (!allowed.includes(key)) throw new Error(`${where}: unknown field '${key}'; allowed: ${allowed.join(', ')}`);
}

/** Checks a dataset spec read from JSON; returns it typed (inline rows are checked when first built). */
export function validateDatasetSpec(value: unknown): DatasetSpec {
  if (!isRecord(value)) throw new Error(`${W}: expected an object with a 'kind', got ${describe(value)}`);
  switch (value.kind) {
    case 'demo': {
      only(`${W} (demo)`, value, ['kind', 'id', 'seed', 'rows']);
      const id = value.id;
      if (typeof id !== 'string' || !Object.hasOwn(DEMO_DATASETS, id))
        throw new Error(`${W} (demo): unknown id ${describe(id)}; known ids: ${Object.keys(DEMO_DATASETS).join(', ')}`);
      const demo = DEMO_DATASETS[id as DemoDatasetId];
      if (value.seed !== undefined && !(typeof value.seed === 'number' && Number.isFinite(value.seed)))
        throw new Error(`${W} (demo ${id}): seed must be a finite number, got ${describe(value.seed)}`);
      const rows = value.rows;
      if (rows !== undefined && !(typeof rows === 'number' && Number.isInteger(rows) && rows >= demo.minRows && rows <= demo.maxRows))
        throw new Error(`${W} (demo ${id}): rows must be a whole number from ${demo.minRows} to ${demo.maxRows}, got ${describe(rows)}`);
      return { kind: 'demo', id: id as DemoDatasetId, ...(value.seed !== undefined ? { seed: value.seed as number } : {}), ...(rows !== undefined ? { rows: rows as number } : {}) };
    }
    case 'iris':
      only(`${W} (iris)`, value, ['kind']);
      return { kind: 'iris' };
    case 'nist':
      only(`${W} (nist)`, value, ['kind', 'id']);
      if (!isNistDatasetId(value.id)) throw new Error(`${W} (nist): unknown id ${describe(value.id)}; known ids: ${NIST_DATASET_IDS.join(', ')}`);
      return { kind: 'nist', id: value.id };
    case 'table':
      return validateTableSpec(value);
    default:
      throw new Error(`${W}: unknown kind ${describe(value.kind)}; known kinds: demo, iris, nist, table`);
  }
}

function validateTableSpec(value: Record<string, unknown>): TableDatasetSpec {
  only(`${W} (table)`, value, ['kind', 'name', 'columns', 'rows', 'categories']);
  if (typeof value.name !== 'string') throw new Error(`${W} (table): name must be a string, got ${describe(value.name)}`);
  const where = `${W} (table ${value.name})`;
  const columns = value.columns;
  if (!Array.isArray(columns) || columns.length === 0 || !columns.every((c) => typeof c === 'string' && c.length > 0))
    throw new Error(`${where}: columns must be a non-empty array of non-empty names`);
  if (new Set(columns).size !== columns.length) throw new Error(`${where}: column names must be different from each other`);
  if (columns.length > MAX_TABLE_COLUMNS) throw new Error(`${where}: at most ${MAX_TABLE_COLUMNS} columns, got ${columns.length}`);
  const rows = value.rows;
  if (!Array.isArray(rows) || !rows.every(Array.isArray)) throw new Error(`${where}: rows must be an array of arrays of numbers`);
  if (rows.length > MAX_TABLE_ROWS) throw new Error(`${where}: at most ${MAX_TABLE_ROWS} rows, got ${rows.length}`);
  const out: TableDatasetSpec = { kind: 'table', name: value.name, columns: columns as string[], rows: rows as number[][] };
  if (value.categories !== undefined) {
    if (!isRecord(value.categories)) throw new Error(`${where}: categories must be an object of label lists`);
    for (const [column, labels] of Object.entries(value.categories)) {
      if (!columns.includes(column)) throw new Error(`${where}: categories name '${column}', which is not a column`);
      if (!Array.isArray(labels) || labels.length === 0 || !labels.every((l) => typeof l === 'string'))
        throw new Error(`${where}: categories of '${column}' must be a non-empty array of labels`);
    }
    out.categories = value.categories as Record<string, string[]>;
  }
  return out;
}

/** The cache key of a dataset spec. */
export function datasetKey(spec: DatasetSpec): string {
  switch (spec.kind) {
    case 'demo':
      return `demo:${spec.id}:${spec.seed ?? 1}:${spec.rows ?? DEMO_DATASETS[spec.id].defaultRows}`;
    case 'iris':
      return 'iris';
    case 'nist':
      return `nist:${spec.id}`;
    case 'table': {
      let print = SEEN_ROWS.get(spec.rows);
      if (print === undefined) {
        print = fingerprintRows(spec.rows);
        SEEN_ROWS.set(spec.rows, print);
      }
      return `table:${JSON.stringify([spec.name, spec.columns, spec.categories ?? {}])}:${spec.rows.length}:${print}`;
    }
  }
}

/** The table a (validated) dataset spec names, from the cache when it was built before. */
export function datasetTable(spec: DatasetSpec): DataTable {
  return TABLES.getOrMake(datasetKey(spec), () => buildTable(spec));
}

function buildTable(spec: DatasetSpec): DataTable {
  switch (spec.kind) {
    case 'demo': {
      const demo = DEMO_DATASETS[spec.id];
      const seed = spec.seed ?? 1;
      const rows = demo.generate(createRng(seed), spec.rows ?? demo.defaultRows);
      return makeTable(demo.label, `generated: ${demo.id}, seed ${seed}. ${demo.description}`, demo.columns, rows, demo.categories);
    }
    case 'iris':
      return irisTable();
    case 'nist':
      return nistTable(spec.id);
    case 'table': {
      const table = makeTable(spec.name, `imported table '${spec.name}'`, spec.columns, spec.rows, spec.categories);
      checkCategoryCodes(table);
      return table;
    }
  }
}

function checkCategoryCodes(table: DataTable): void {
  const m = table.columns.length;
  for (const [column, labels] of Object.entries(table.categories)) {
    const j = table.columns.indexOf(column);
    for (let i = 0; i < table.rows; i++) {
      const v = table.values[i * m + j];
      if (!(Number.isInteger(v) && v >= 0 && v < labels.length))
        throw new Error(`dataset ${table.name}: row ${i + 1}, class column '${column}' must hold a code from 0 to ${labels.length - 1}, got ${v}`);
    }
  }
}
