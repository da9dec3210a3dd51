import Papa from 'papaparse';
import { MAX_CSV_BYTES, MAX_TABLE_COLUMNS, MAX_TABLE_ROWS } from './limits';
import type { TableDatasetSpec } from './spec';

/**
 * CSV text to an inline table spec, with papaparse 5.7.1 doing the CSV grammar (RFC 4180 quoting,
 * delimiter detection). Pure and synchronous, so it runs the same on the page, in a worker and in Node.
 *
 * - The first record is the header; every column is numeric unless listed in `classColumns` (values
 *   are labels, coded 0, 1, ... in order of first appearance). `columns` keeps only some columns, so a
 *   text column the model does not use cannot spoil every row.
 * - Row numbers in reports are 1-based and count the header as row 1, as a spreadsheet shows them
 *   (the first data row is row 2). They count CSV records: one per line, unless a quoted field spans
 *   lines. Blank lines are skipped without a report but keep their number.
 * - A cell is "missing" when empty or one of NA, N/A, NaN, null (any case; common practice in exported
 *   tables); "not a number" when it is not a plain decimal number (so no hex, no Infinity); "too large"
 *   when it is one but overflows a double (1e400). In a file
 *   whose delimiter is not the comma (semicolon, tab, bar), a comma is also read as the decimal mark,
 *   as spreadsheets in decimal-comma locales write it ("1,5;-0,25"); a cell with both a comma and a
 *   point ("1.000,5") is not a number, since which one groups thousands is a guess. A record
 *   with more fields than the header is reported too; a shorter one has its absent cells missing.
 * - Without `dropBadRows` any problem fails the import and lists the problems; with it, bad rows are
 *   dropped and still reported. At most 200 problems are listed (`moreProblems` counts the rest).
 * - Limits: 20 MiB of text, 100,000 data rows, 50 columns (lower ones may be passed).
 *
 * Large files: pass `onProgress` and papaparse parses the text in chunks of `chunkSize` characters
 * (default 1 MiB), reporting after each; still synchronous, so a worker calls this and posts the
 * progress (the page's job).
 */
export interface CsvImportOptions {
  /** Dataset name; default 'imported table'. */
  name?: string;
  dropBadRows?: boolean;
  /** Keep only these columns (in file order); default all. */
  columns?: string[];
  /** Columns holding class labels rather than numbers. */
  classColumns?: string[];
  /** Field delimiter; default: the one the header row uses (see `headerDelimiter`). */
  delimiter?: string;
  /** Read "1,5" as 1.5; default: when the delimiter is not a comma. */
  decimalComma?: boolean;
  maxBytes?: number;
  maxRows?: number;
  maxColumns?: number;
  onProgress?: (progress: { rowsRead: number; fraction: number }) => void;
  chunkSize?: number;
}

export interface CsvProblem {
  /** 1-based, the header being row 1. */
  row: number;
  column: string;
  value: string;
  reason: 'missing' | 'not a number' | 'too large' | 'too many fields';
}

export type CsvImport =
  | { ok: true; dataset: TableDatasetSpec; droppedRows: number; problems: CsvProblem[]; moreProblems: number }
  | { ok: false; message: string; problems: CsvProblem[]; moreProblems: number };

export const MAX_REPORTED_PROBLEMS = 200;

const DECIMAL = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;
const MISSING = /^(?:|na|n\/a|nan|null)$/i;
const DECIMAL_COMMA = /^[-+]?(?:\d+,?\d*|,\d+)(?:[eE][-+]?\d+)?$/;

/** A cell's number, or null when it is not a plain decimal (with a comma as the mark when allowed). */
function decimalValue(cell: string, decimalComma: boolean): number | null {
  if (DECIMAL.test(cell)) return Number(cell);
  if (decimalComma && DECIMAL_COMMA.test(cell)) return Number(cell.replace(',', '.'));
  return null;
}

/** Bytes of `text` in UTF-8. */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

const formatCount = (n: number) => n.toLocaleString('en-US');

/** The refusal of a file of `bytes` bytes (the page says it before reading a file that is too large). */
export function csvTooLargeMessage(bytes: number, maxBytes = MAX_CSV_BYTES): string {
  return `the file is ${(bytes / 1024 / 1024).toFixed(1)} MiB; at most ${(maxBytes / 1024 / 1024).toFixed(1)} MiB can be imported`;
}

export function parseDatasetCsv(text: string, options: CsvImportOptions = {}): CsvImport {
  const maxBytes = Math.min(options.maxBytes ?? MAX_CSV_BYTES, MAX_CSV_BYTES);
  const bytes = text.length > maxBytes ? text.length : utf8Length(text);
  if (bytes > maxBytes) return fail(csvTooLargeMessage(bytes, maxBytes));
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const delimiter = options.delimiter ?? headerDelimiter(source);
  const builder = new CsvTableBuilder({ ...options, decimalComma: options.decimalComma ?? (delimiter !== ',' && delimiter !== '') });
  let fatal: string | null = null;
  const take = (records: string[][], errors: Papa.ParseError[], parser?: Papa.Parser) => {
    const quoteError = errors.find((e) => e.type === 'Quotes');
    if (quoteError && fatal === null) fatal = `row ${builder.rowNumber + (quoteError.row ?? 0) + 1}: ${quoteError.message}`;
    for (const record of records) if (fatal === null) fatal = builder.add(record);
    if (fatal !== null) parser?.abort();
  };
  const config = { delimiter, skipEmptyLines: false as const, dynamicTyping: false as const };
  if (options.onProgress) {
    const onProgress = options.onProgress;
    const chunked = {
      ...config,
      chunkSize: options.chunkSize ?? 1024 * 1024,
      chunk: (results: Papa.ParseResult<string[]>, parser: Papa.Parser) => {
        take(results.data, results.errors, parser);
        onProgress({ rowsRead: builder.dataRows, fraction: source.length === 0 ? 1 : Math.min(1, results.meta.cursor / source.length) });
      },
    };
    // @types/papaparse lists `chunk` for files only, but papaparse 5.7.1 streams a string in chunks too,
    // synchronously (its StringStreamer), which the tests check.
    Papa.parse<string[]>(source, chunked as Papa.ParseConfig<string[]>);
  } else {
    const results = Papa.parse<string[]>(source, config);
    take(results.data, results.errors);
  }
  if (fatal !== null) return fail(fatal, builder);
  return builder.finish();
}

/**
 * The delimiter a file's header row uses: the most frequent of comma, semicolon, tab and bar outside
 * quoted names, or '' (papaparse's guess) when there is none (one column). The header decides because
 * data rows can mislead a guess: a semicolon file with decimal commas ("1,5;2") has more commas.
 */
export function headerDelimiter(text: string): string {
  const end = text.search(/[\r\n]/);
  const header = (end < 0 ? text : text.slice(0, end)).replace(/"[^"]*"/g, '');
  let best = '';
  let most = 0;
  for (const d of [',', ';', '\t', '|']) {
    const count = header.split(d).length - 1;
    if (count > most) [best, most] = [d, count];
  }
  return best;
}

function fail(message: string, builder?: CsvTableBuilder): CsvImport {
  return { ok: false, message, problems: builder?.problems ?? [], moreProblems: builder?.moreProblems ?? 0 };
}

/** Takes CSV records one at a time (header first) and builds the table; `add` returns a fatal message or null. */
export class CsvTableBuilder {
  readonly problems: CsvProblem[] = [];
  moreProblems = 0;
  /** Records seen so far (the header included): the number of the last record. */
  rowNumber = 0;
  dataRows = 0;
  private header: string[] | null = null;
  /** File column index of each kept column. */
  private kept: number[] = [];
  private keptNames: string[] = [];
  private isClass: boolean[] = [];
  private classCodes: Map<string, number>[] = [];
  private readonly rows: number[][] = [];
  private droppedRows = 0;
  private readonly maxRows: number;
  private readonly maxColumns: number;

  constructor(private readonly options: CsvImportOptions) {
    this.maxRows = Math.min(options.maxRows ?? MAX_TABLE_ROWS, MAX_TABLE_ROWS);
    this.maxColumns = Math.min(options.maxColumns ?? MAX_TABLE_COLUMNS, MAX_TABLE_COLUMNS);
  }

  add(record: string[]): string | null {
    this.rowNumber += 1;
    if (this.header === null) return this.readHeader(record);
    if (record.length === 1 && record[0].trim() === '') return null;
    this.dataRows += 1;
    if (this.dataRows > this.maxRows) return `the file has more than ${formatCount(this.maxRows)} data rows; at most ${formatCount(this.maxRows)} can be imported`;
    const row = new Array<number>(this.kept.length);
    let bad = false;
    if (record.length > this.header.length) {
      bad = true;
      this.report({ row: this.rowNumber, column: '', value: record.slice(this.header.length).join(','), reason: 'too many fields' });
    }
    for (let k = 0; k < this.kept.length; k++) {
      const raw = record[this.kept[k]] ?? '';
      const cell = raw.trim();
      if (MISSING.test(cell)) {
        bad = true;
        this.report({ row: this.rowNumber, column: this.keptNames[k], value: raw, reason: 'missing' });
      } else if (this.isClass[k]) {
        const codes = this.classCodes[k];
        let code = codes.get(cell);
        if (code === undefined) codes.set(cell, (code = codes.size));
        row[k] = code;
      } else {
        const value = decimalValue(cell, this.options.decimalComma === true);
        if (value !== null && Number.isFinite(value)) row[k] = value;
        else {
          bad = true;
          this.report({ row: this.rowNumber, column: this.keptNames[k], value: raw, reason: value === null ? 'not a number' : 'too large' });
        }
      }
    }
    if (bad) this.droppedRows += 1;
    else this.rows.push(row);
    return null;
  }

  finish(): CsvImport {
    if (this.header === null) return { ok: false, message: 'the file is empty: expected a header row of column names', problems: [], moreProblems: 0 };
    const total = this.problems.length + this.moreProblems;
    if (total > 0 && !this.options.dropBadRows) {
      const first = this.problems[0];
      return {
        ok: false,
        message: `${formatCount(this.droppedRows)} row${this.droppedRows === 1 ? ' has' : 's have'} missing or non-numeric values (first: row ${first.row}, column '${first.column}': ${first.reason}); fix them or drop those rows`,
        problems: this.problems,
        moreProblems: this.moreProblems,
      };
    }
    if (this.dataRows === 0) return { ok: false, message: 'no usable data rows: the file has a header row but no data rows', problems: [], moreProblems: 0 };
    if (this.rows.length === 0) return { ok: false, message: 'no usable data rows: every row was dropped', problems: this.problems, moreProblems: this.moreProblems };
    const dataset: TableDatasetSpec = { kind: 'table', name: this.options.name ?? 'imported table', columns: this.keptNames, rows: this.rows };
    const categories: Record<string, string[]> = {};
    this.keptNames.forEach((name, k) => {
      if (this.isClass[k]) categories[name] = [...this.classCodes[k].keys()];
    });
    if (Object.keys(categories).length > 0) dataset.categories = categories;
    return { ok: true, dataset, droppedRows: this.droppedRows, problems: this.problems, moreProblems: this.moreProblems };
  }

  private readHeader(record: string[]): string | null {
    const names = record.map((name) => name.trim());
    // A blank line before the header keeps its number and is skipped.
    if (names.length === 1 && names[0] === '') return null;
    const unnamed = names.findIndex((name) => name === '');
    if (unnamed >= 0) return `column ${unnamed + 1} of the header (row ${this.rowNumber}) has no name`;
    const twice = names.find((name, i) => names.indexOf(name) !== i);
    if (twice !== undefined) return `the header names column '${twice}' twice`;
    const wanted = this.options.columns ?? names;
    for (const name of [...wanted, ...(this.options.classColumns ?? [])])
      if (!names.includes(name)) return `no column '${name}' in the header; columns: ${names.join(', ')}`;
    for (const name of this.options.classColumns ?? [])
      if (!wanted.includes(name)) return `class column '${name}' is not among the kept columns`;
    this.kept = names.flatMap((name, j) => (wanted.includes(name) ? [j] : []));
    if (this.kept.length > this.maxColumns) return `the table has ${this.kept.length} columns; at most ${this.maxColumns} can be imported`;
    this.keptNames = this.kept.map((j) => names[j]);
    this.isClass = this.keptNames.map((name) => (this.options.classColumns ?? []).includes(name));
    this.classCodes = this.keptNames.map(() => new Map());
    this.header = names;
    return null;
  }

  private report(problem: CsvProblem): void {
    if (this.problems.length < MAX_REPORTED_PROBLEMS) this.problems.push(problem);
    else this.moreProblems += 1;
  }
}
