import { describe, expect, it } from 'vitest';
import { buildDataFitSurface, datasetTable, MAX_CSV_BYTES, parseDatasetCsv, utf8Length } from '../../../src/problems';

/** CSV import through papaparse 5.7.1: numbers, problems by row (header = row 1), limits, dropping. */
describe('parseDatasetCsv', () => {
  it('reads a header and numeric rows into an inline table spec that builds', () => {
    const r = parseDatasetCsv('dose,response\n1,2.5\n2,3.25e0\n3,-4\n', { name: 'trial' });
    expect(r).toEqual({
      ok: true,
      dataset: { kind: 'table', name: 'trial', columns: ['dose', 'response'], rows: [[1, 2.5], [2, 3.25], [3, -4]] },
      droppedRows: 0,
      problems: [],
      moreProblems: 0,
    });
    if (!r.ok) return;
    const s = buildDataFitSurface({ kind: 'datafit', dataset: r.dataset, model: { kind: 'linear', inputs: ['dose'], target: 'response' } });
    expect(s.rows).toBe(3);
  });

  it('reports missing and non-numeric cells by row (header is row 1) and column, and fails without dropBadRows', () => {
    const text = 'a,b,c\n1,2,3\n4,,6\n7,eight,9\n10,11,NA\n0x1F,1,2\n';
    const r = parseDatasetCsv(text);
    expect(r.ok).toBe(false);
    expect(r.problems).toEqual([
      { row: 3, column: 'b', value: '', reason: 'missing' },
      { row: 4, column: 'b', value: 'eight', reason: 'not a number' },
      { row: 5, column: 'c', value: 'NA', reason: 'missing' },
      { row: 6, column: 'a', value: '0x1F', reason: 'not a number' },
    ]);
    if (!r.ok) expect(r.message).toBe("4 rows have missing or non-numeric values (first: row 3, column 'b': missing); fix them or drop those rows");
  });

  it('drops bad rows on request and still reports them', () => {
    const r = parseDatasetCsv('a,b\n1,2\n3,x\n5,6\n', { dropBadRows: true });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.dataset.rows).toEqual([[1, 2], [5, 6]]);
    expect(r.droppedRows).toBe(1);
    expect(r.problems).toEqual([{ row: 3, column: 'b', value: 'x', reason: 'not a number' }]);
  });

  it('counts blank lines in row numbers without reporting them; flags short and long records', () => {
    const r = parseDatasetCsv('a,b\n1,2\n\n3\n4,5,6\n', { dropBadRows: true });
    expect(r.ok && r.dataset.rows).toEqual([[1, 2]]);
    expect(r.problems).toEqual([
      { row: 4, column: 'b', value: '', reason: 'missing' },
      { row: 5, column: '', value: '6', reason: 'too many fields' },
    ]);
  });

  it('keeps only chosen columns, so an unused text column does not spoil rows; codes class columns', () => {
    const text = 'id,width,kind,note\n1,2.5,oak,tall\n2,3.0,elm,\n3,1.5,oak,short\n';
    const r = parseDatasetCsv(text, { columns: ['width', 'kind'], classColumns: ['kind'] });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.dataset).toEqual({ kind: 'table', name: 'imported table', columns: ['width', 'kind'], rows: [[2.5, 0], [3, 1], [1.5, 0]], categories: { kind: ['oak', 'elm'] } });
    expect(datasetTable(r.dataset).categories.kind).toEqual(['oak', 'elm']);
  });

  it('handles quoted fields, a byte-order mark, CRLF line ends; takes another delimiter', () => {
    const r = parseDatasetCsv('\uFEFF"x","y, in mm"\r\n1,"2"\r\n');
    expect(r.ok && r.dataset).toEqual({ kind: 'table', name: 'imported table', columns: ['x', 'y, in mm'], rows: [[1, 2]] });
    const semicolons = parseDatasetCsv('"x";"y, in mm"\n1;2\n', { delimiter: ';' });
    expect(semicolons.ok && semicolons.dataset.columns).toEqual(['x', 'y, in mm']);
  });

  it("reads the delimiter from the header row, which decimal commas in the data cannot mislead", () => {
    expect(parseDatasetCsv('dose;response\n1;2\n2;4\n').ok).toBe(true);
    expect(parseDatasetCsv('a\tb\n1\t2\n').ok).toBe(true);
    // The semicolon decides, though the data rows have more commas than semicolons.
    const r = parseDatasetCsv('dose;response\n1,5;2\n2;4\n');
    expect(r.ok && r.dataset.rows).toEqual([[1.5, 2], [2, 4]]);
  });

  it('reads decimal commas in a semicolon (or tab) file, as decimal-comma spreadsheets export them', () => {
    // A file as a spreadsheet set to a decimal-comma locale writes it: semicolons between fields.
    const r = parseDatasetCsv('flow;signal\r\n0,5;-1,25\r\n1;2,5e-3\r\n,75;3,\r\n"4,5";1.5\r\n');
    expect(r.ok && r.dataset.rows).toEqual([[0.5, -1.25], [1, 0.0025], [0.75, 3], [4.5, 1.5]]);
    const tabs = parseDatasetCsv('a\tb\n1,5\t2\n');
    expect(tabs.ok && tabs.dataset.rows).toEqual([[1.5, 2]]);
    // Both marks in one cell: which groups thousands is a guess, so it is refused where it stands.
    const both = parseDatasetCsv('a;b\n1.000,5;2\n1,2,3;4\n');
    expect(both.problems).toEqual([
      { row: 2, column: 'a', value: '1.000,5', reason: 'not a number' },
      { row: 3, column: 'a', value: '1,2,3', reason: 'not a number' },
    ]);
    // In a comma-delimited file a comma is a field separator, never a decimal mark.
    const commas = parseDatasetCsv('a,b\n"1,5",2\n');
    expect(commas.problems).toEqual([{ row: 2, column: 'a', value: '1,5', reason: 'not a number' }]);
  });

  it.each([
    ['', 'the file is empty: expected a header row of column names'],
    ['a,,c\n1,2,3\n', 'column 2 of the header (row 1) has no name'],
    ['a,a\n1,2\n', "the header names column 'a' twice"],
    ['a,b\n', 'no usable data rows: the file has a header row but no data rows'],
  ])('refuses %j', (text, message) => {
    const r = parseDatasetCsv(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toBe(message);
  });

  it('names a missing chosen column', () => {
    const r = parseDatasetCsv('a,b\n1,2\n', { columns: ['a', 'z'] });
    expect(!r.ok && r.message).toBe("no column 'z' in the header; columns: a, b");
  });

  it('enforces the size limits with clear messages', () => {
    const rows = (n: number) => ['x', ...Array.from({ length: n }, (_, i) => String(i))].join('\n');
    const tooMany = parseDatasetCsv(rows(11), { maxRows: 10 });
    expect(!tooMany.ok && tooMany.message).toBe('the file has more than 10 data rows; at most 10 can be imported');
    expect(parseDatasetCsv(rows(10), { maxRows: 10 }).ok).toBe(true);
    const wide = parseDatasetCsv(`${Array.from({ length: 4 }, (_, j) => `c${j}`).join(',')}\n1,2,3,4\n`, { maxColumns: 3 });
    expect(!wide.ok && wide.message).toBe('the table has 4 columns; at most 3 can be imported');
    const big = parseDatasetCsv('x\n' + '1\n'.repeat(600), { maxBytes: 1024 });
    expect(!big.ok && big.message).toBe('the file is 0.0 MiB; at most 0.0 MiB can be imported');
    // The default limits: 20 MiB, 100,000 rows, 50 columns; a caller cannot raise them.
    expect(MAX_CSV_BYTES).toBe(20 * 1024 * 1024);
    const fifty = Array.from({ length: 51 }, (_, j) => `c${j}`).join(',');
    const r = parseDatasetCsv(`${fifty}\n${Array.from({ length: 51 }, () => '1').join(',')}\n`, { maxColumns: 500 });
    expect(!r.ok && r.message).toBe('the table has 51 columns; at most 50 can be imported');
    const huge = parseDatasetCsv(rows(100_001));
    expect(!huge.ok && huge.message).toBe('the file has more than 100,000 data rows; at most 100,000 can be imported');
  });

  it('counts UTF-8 bytes', () => {
    expect(utf8Length('aé€😀')).toBe(1 + 2 + 3 + 4);
  });

  it('parses in chunks with progress when asked, with the same result', () => {
    const text = ['t,v', ...Array.from({ length: 2000 }, (_, i) => `${i},${(i * 0.37).toFixed(3)}`)].join('\n');
    const progress: number[] = [];
    const chunked = parseDatasetCsv(text, { chunkSize: 4096, onProgress: (p) => progress.push(p.fraction) });
    expect(chunked).toEqual(parseDatasetCsv(text));
    expect(progress.length).toBeGreaterThan(3);
    expect(progress[progress.length - 1]).toBe(1);
    expect([...progress].sort((a, b) => a - b)).toEqual(progress);
  });

  it('lists at most 200 problems and counts the rest', () => {
    const text = ['a', ...Array.from({ length: 250 }, () => 'x')].join('\n');
    const r = parseDatasetCsv(text);
    expect(r.problems.length).toBe(200);
    expect(r.moreProblems).toBe(50);
  });
});
