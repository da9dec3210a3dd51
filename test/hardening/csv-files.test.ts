/**
 * Bad and hostile CSV files, one row per file: the line the import shows under "Import a CSV file…"
 * (CsvImport.tsx prints csvFailureText of the worker's parseDatasetCsv result), or, for files that
 * are fine, the table they give. Large files are generated here rather than committed.
 */
import { describe, expect, it } from 'vitest';
import { parseDatasetCsv, type CsvImport } from '../../src/problems';
import { MAX_CSV_BYTES, MAX_TABLE_COLUMNS, MAX_TABLE_ROWS } from '../../src/problems/datasets/limits';
import { csvFailureText } from '../../src/ui/messages';

function importLine(text: string): string {
  const r: CsvImport = parseDatasetCsv(text);
  if (r.ok) throw new Error(`imported: ${JSON.stringify(r.dataset).slice(0, 200)}`);
  return csvFailureText(r);
}

const header = (n: number) => Array.from({ length: n }, (_, j) => `c${j}`).join(',');

describe('CSV import: files that are refused, with the line shown under the import', () => {
  it.each<[string, string, string | RegExp]>([
    ['empty file', '', 'the file is empty: expected a header row of column names'],
    ['only blank lines', '\n\n\n', 'the file is empty: expected a header row of column names'],
    ['header only', 'dose,response\n', 'no usable data rows: the file has a header row but no data rows'],
    ['a header cell without a name', 'dose,,response\n1,2,3\n', 'column 2 of the header (row 1) has no name'],
    ['duplicate headers', 'dose,dose\n1,2\n', "the header names column 'dose' twice"],
    ['duplicate headers after trimming', 'dose, dose\n1,2\n', "the header names column 'dose' twice"],
    ['ragged: a short row', 'a,b\n1,2\n3\n', '1 value could not be read (first: row 3, column b: missing); fix them or tick "drop rows that cannot be read"'],
    ['ragged: a long row', 'a,b\n1,2\n3,4,5\n', '1 value could not be read (first: row 3: more fields than the header has ("5")); fix them or tick "drop rows that cannot be read"'],
    ['decimal commas in a comma-separated file (quoted; a semicolon file reads them)', 'dose,response\n"1,5","2,25"\n', /^2 values could not be read \(first: row 2, column dose: not a number \("1,5"\), write decimals with a point \(1\.5, not 1,5\)\)/],
    ['a number that overflows', 'a,b\n1e400,1\n', /^1 value could not be read \(first: row 2, column a: too large for a number \("1e400"\)\)/],
    ['Infinity written out', 'a,b\nInfinity,1\n', /first: row 2, column a: not a number \("Infinity"\)/],
    ['hex', 'a,b\n0x1F,1\n', /first: row 2, column a: not a number \("0x1F"\)/],
    ['a formula-injection cell (=)', 'a,b\n=1+1,2\n', /first: row 2, column a: not a number \("=1\+1"\)/],
    ['a formula-injection cell (@)', 'a,b\n1,@SUM(A1:A9)\n', /first: row 2, column b: not a number \("@SUM\(A1:A9\)"\)/],
    ['a formula-injection cell (+ with a command)', "a,b\n+cmd|' /C calc'!A0,2\n", /first: row 2, column a: not a number/],
    ['a quoted field never closed', 'a,b\n"1,2\n3,4\n', /^row 2: Quoted field unterminated$/],
    ['binary noise', '\u0000\u0001\u0002\u0003', 'no usable data rows: the file has a header row but no data rows'],
    [`${MAX_TABLE_COLUMNS * 20} columns`, `${header(1000)}\n${Array(1000).fill(1).join(',')}\n`, `the table has 1000 columns; at most ${MAX_TABLE_COLUMNS} can be imported`],
    [`${MAX_TABLE_ROWS + 1} rows`, `x\n${'1\n'.repeat(MAX_TABLE_ROWS + 1)}`, 'the file has more than 100,000 data rows; at most 100,000 can be imported'],
  ])('%s', (_what, text, line) => {
    if (typeof line === 'string') expect(importLine(text)).toBe(line);
    else expect(importLine(text)).toMatch(line);
  });

  it('a 50 MB file is refused before it is parsed', () => {
    const row = '1.25,2.5,3.75\n';
    const text = 'a,b,c\n' + row.repeat(Math.ceil((50 * 1024 * 1024) / row.length));
    expect(MAX_CSV_BYTES).toBe(20 * 1024 * 1024);
    expect(importLine(text)).toBe('the file is 50.0 MiB; at most 20.0 MiB can be imported');
  });

  it('just over the limit in UTF-8 bytes (2-byte characters), not in characters', () => {
    // 'é' is one UTF-16 unit but two UTF-8 bytes: 11 Mi characters are 22 MiB on disk.
    const text = 'é\n' + 'é'.repeat(11 * 1024 * 1024);
    expect(text.length).toBeLessThan(MAX_CSV_BYTES);
    expect(importLine(text)).toMatch(/^the file is 2\d\.\d MiB; at most 20\.0 MiB can be imported$/);
  });
});

describe('CSV import: odd but valid files', () => {
  const table = (text: string) => {
    const r = parseDatasetCsv(text);
    if (!r.ok) throw new Error(r.message);
    return r.dataset;
  };

  it('a byte-order mark is not part of the first column name', () => {
    expect(table('\ufeffdose,response\n1,2\n')).toMatchObject({ columns: ['dose', 'response'], rows: [[1, 2]] });
  });

  it('a quoted newline inside a header name stays one field (RFC 4180 section 2.6)', () => {
    expect(table('dose,"response\n(mg)"\n1,2\n').columns).toEqual(['dose', 'response\n(mg)']);
  });

  it('a quoted newline inside a class label stays one label, and row numbers count records', () => {
    const r = parseDatasetCsv('kind,x\n"two\nlines",1\nplain,\n', { classColumns: ['kind'] });
    expect(!r.ok && r.problems[0]).toEqual({ row: 3, column: 'x', value: '', reason: 'missing' });
  });

  it('prototype names as column names are ordinary names', () => {
    const d = table('__proto__,constructor,toString\n1,2,3\n');
    expect(d.columns).toEqual(['__proto__', 'constructor', 'toString']);
    expect(({} as Record<string, unknown>).constructor).toBe(Object);
  });

  it('CRLF line ends and a missing final newline', () => {
    expect(table('a,b\r\n1,2\r\n3,4')).toMatchObject({ rows: [[1, 2], [3, 4]] });
  });

  it('semicolon files with decimal points', () => {
    expect(table('a;b\n1.5;2\n')).toMatchObject({ columns: ['a', 'b'], rows: [[1.5, 2]] });
  });
});
