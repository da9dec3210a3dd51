import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvField, runTableCsv, toCsv, trajectoryCsv, type RunSummaryRow, type TrajectoryExportRun } from '../../src/io/csv';

/** papaparse 5.7.1 is the independent RFC 4180 reader for these tests. */
function parse(text: string): string[][] {
  const result = Papa.parse<string[]>(text, { newline: '\r\n', skipEmptyLines: true });
  expect(result.errors).toEqual([]);
  return result.data;
}

describe('toCsv (RFC 4180)', () => {
  it('round-trips awkward text through papaparse', () => {
    const cells = ['plain', 'comma, inside', 'quote " inside', '"quoted"', 'line\nbreak', 'cr\rreturn', 'crlf\r\nboth', '', 'unicode \u00e9\u4e2d\u{1F600}'];
    const text = toCsv([cells], cells.map((_, k) => `c${k}`));
    expect(parse(text)[1]).toEqual(cells);
  });

  it('quotes exactly the fields with comma, quote, CR or LF, doubling quotes', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('plain text')).toBe('plain text');
  });

  it('ends every record with CRLF', () => {
    const text = toCsv([[1, 2], [3, 4]], ['a', 'b']);
    expect(text).toBe('a,b\r\n1,2\r\n3,4\r\n');
  });

  it('writes numbers so they read back to the same double; NaN, null and undefined are empty', () => {
    const numbers = [0.1 + 0.2, -1.5, 1e-300, 123456789012345680000, -0, Number.MIN_VALUE];
    const text = toCsv([numbers, [Number.NaN, null, undefined, Infinity, -Infinity, 0]], numbers.map((_, k) => `n${k}`));
    const rows = parse(text);
    rows[1].forEach((s, k) => expect(Number(s)).toBe(numbers[k])); // toBe is Object.is: -0 must read back as -0
    expect(rows[1][4]).toBe('-0');
    expect(rows[2]).toEqual(['', '', '', 'Infinity', '-Infinity', '0']);
  });

  it('neutralises text a spreadsheet would run as a formula (OWASP CSV injection), never numbers', () => {
    const text = ['=SUM(A1)', '+1', '-x', '@x', '\tx', '\rx', '=1,2', 'a=b', 'safe'];
    const out = parse(toCsv([[...text, -1.5, 2]], [...text.map((_, k) => `t${k}`), 'n0', 'n1']))[1];
    expect(out).toEqual(["'=SUM(A1)", "'+1", "'-x", "'@x", "'\tx", "'\rx", "'=1,2", 'a=b', 'safe', '-1.5', '2']);
    expect(csvField('-1.5')).toBe("'-1.5"); // text that looks like a number is still text
  });

  it('neutralises header cells too, and checks row lengths', () => {
    expect(toCsv([], ['=cmd', 'ok'])).toBe("'=cmd,ok\r\n");
    expect(() => toCsv([[1]], ['a', 'b'])).toThrow('csv: row 1 has 1 cells but the header has 2');
  });
});

function batch(firstStep: number, points: number[][], loss: number[], gradNorm: number[], lr: number[]): TrajectoryExportRun['batch'] {
  return {
    firstStep,
    count: points.length,
    dimension: points[0].length,
    points: Float64Array.from(points.flat()),
    loss: Float64Array.from(loss),
    gradNorm: Float64Array.from(gradNorm),
    learningRate: Float64Array.from(lr),
  };
}

describe('trajectoryCsv', () => {
  const runs: TrajectoryExportRun[] = [
    { id: 'r1', label: 'plain, descent', optimizer: 'gradient descent', learningRate: 0.1, variables: ['x', 'y'], batch: batch(0, [[1, 2], [0.8, 1.6]], [5, 3.2], [4.47, 3.58], [Number.NaN, 0.1]) },
    { id: 'r2', label: '=HYPERLINK("x")', optimizer: 'Adam', learningRate: 0.01, variables: ['y', 'z'], batch: batch(0, [[3, -4]], [25], [10], [Number.NaN]) },
  ];
  const rows = parse(trajectoryCsv(runs));

  it('has the documented columns, coordinates as the union of variables in first-seen order', () => {
    expect(rows[0]).toEqual(['run_id', 'run_label', 'optimizer', 'learning_rate', 'step', 'x', 'y', 'z', 'loss', 'grad_norm', 'step_learning_rate']);
  });

  it('writes one row per run per step, empty where a run lacks a variable and for the step-0 learning rate', () => {
    expect(rows.slice(1)).toEqual([
      ['r1', 'plain, descent', 'gradient descent', '0.1', '0', '1', '2', '', '5', '4.47', ''],
      ['r1', 'plain, descent', 'gradient descent', '0.1', '1', '0.8', '1.6', '', '3.2', '3.58', '0.1'],
      ['r2', `'=HYPERLINK("x")`, 'Adam', '0.01', '0', '', '3', '-4', '25', '10', ''],
    ]);
  });

  it('numbers steps from the batch first step, renames a variable that clashes with a fixed column', () => {
    const text = trajectoryCsv([{ id: 'r', label: 'l', optimizer: 'o', learningRate: 1, variables: ['loss', 'b'], batch: batch(7, [[1, 2]], [3], [4], [0.5]) }]);
    const [header, row] = parse(text);
    expect(header.slice(5, 7)).toEqual(['coord_loss', 'b']);
    expect(row[4]).toBe('7');
    expect(row[9]).toBe('0.5');
  });

  it('reports a variable list that does not match the point dimension', () => {
    expect(() => trajectoryCsv([{ ...runs[0], variables: ['x'] }])).toThrow('csv: run "r1" names 1 variables but its points have 2 coordinates');
  });
});

describe('runTableCsv', () => {
  const base: RunSummaryRow = {
    id: 'a',
    label: 'momentum 0.9',
    optimizer: 'momentum',
    learningRate: 0.05,
    outcome: { kind: 'converged', rule: 'gradient-norm', step: 120, point: { gradNorm: 3e-9, gradThreshold: 2e-4, stationary: true, newtonStep: 1e-9, curvature: { kind: 'minimum', negative: 0, zero: 0, positive: 2, smallest: 2, largest: 20, eigenvalues: [2, 20], method: 'exact' } } },
    steps: 120,
    finalLoss: 1e-9,
    variables: ['x', 'y'],
    finalPoint: [1, 1],
    distanceToNearestMinimum: 2e-5,
    nearestMinimum: '(1, 1)',
    stepsToTolerance: 88,
  };

  it('has the documented column set and one row per run', () => {
    const rows = parse(
      runTableCsv([
        base,
        { ...base, id: 'b', outcome: { kind: 'diverged', reason: 'non-finite', step: 7, detail: 'loss became NaN' }, variables: ['y', 'w'], finalPoint: [3, 4], distanceToNearestMinimum: null, nearestMinimum: null, stepsToTolerance: null },
        { ...base, id: 'c', outcome: null, finalLoss: Number.NaN },
      ]),
    );
    expect(rows[0]).toEqual([
      'run_id', 'run_label', 'optimizer', 'learning_rate', 'outcome', 'outcome_detail', 'outcome_step', 'steps', 'final_loss', 'final_grad_norm', 'point_kind',
      'final_x', 'final_y', 'final_w', 'distance_to_nearest_minimum', 'nearest_minimum', 'steps_to_tolerance',
    ]);
    expect(rows[1]).toEqual(['a', 'momentum 0.9', 'momentum', '0.05', 'converged', 'gradient norm; gradient norm 3.00e-9 (stationary: test 0.000200); Hessian: minimum, eigenvalues 2.00 to 20.0', '120', '120', '1e-9', '3e-9', 'minimum', '1', '1', '', '0.00002', '(1, 1)', '88']);
    expect(rows[2]).toEqual(['b', 'momentum 0.9', 'momentum', '0.05', 'diverged', 'loss became NaN', '7', '120', '1e-9', '', '', '', '3', '4', '', '', '']);
    expect(rows[3].slice(4, 9)).toEqual(['running', '', '', '120', '']);
  });
});
