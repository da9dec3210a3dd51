import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { RunOutcome } from '../../src/engine';
import { studyCsv, studyRows, type StudyRow } from '../../src/io/study-csv';
import { buildSurface } from '../../src/problems';

const point = { gradNorm: 2e-9, gradThreshold: 1e-4, stationary: true, curvature: null, newtonStep: null };
const row = (index: number, outcome: RunOutcome, basin: string | null): StudyRow => ({
  index, optimizer: 'adam', learningRate: 0.01, start: [index, -0], outcome, steps: outcome.step, finalLoss: 1e-10, endPoint: [3, 2], basin, stepsToTolerance: basin ? 40 : null,
});

describe('studyCsv', () => {
  it('one row per start with inputs, outcome, detail, end point, loss, steps and basin; -0 kept', () => {
    const text = studyCsv('map-1', ['x', 'y'], [
      row(0, { kind: 'converged', step: 57, rule: 'gradient-norm', point }, '(3, 2)'),
      row(1, { kind: 'diverged', step: 9, reason: 'blow-up', detail: 'the loss rose to 1e9' }, null),
    ]);
    const { data } = Papa.parse<string[]>(text.trim());
    expect(data[0]).toEqual(['study', 'index', 'optimizer', 'learning_rate', 'start_x', 'start_y', 'outcome', 'outcome_detail', 'outcome_step', 'steps', 'final_loss', 'final_x', 'final_y', 'basin', 'steps_to_tolerance']);
    expect(data[1]).toEqual(['map-1', '0', 'adam', '0.01', '0', '-0', 'converged', 'gradient norm; gradient norm 2.00e-9 (stationary: test 0.000100)', '57', '57', '1e-10', '3', '2', '(3, 2)', '40']);
    expect(data[2].slice(6, 9)).toEqual(['diverged', 'the loss rose to 1e9', '9']);
    expect(data[2][13]).toBe('');
  });

  it('refuses a row whose points do not match the variables', () => {
    expect(() => studyCsv('s', ['x'], [row(0, { kind: 'step-limit', step: 3, point }, null)])).toThrow('study csv: row 0 has 2 start and 2 end coordinates, expected 1');
  });

  it('writes start and end points in original units on a standardised data fit, as the results CSV does', () => {
    // y = 1 + 2x on x = 1, 2, 4, 7 (mean 3.5, sd sqrt(7)): the standardised point (8, 2 sqrt(7)) is
    // (1, 2) in original units (worked by hand; the same case as test/store/units.test.ts).
    const surface = buildSurface({ kind: 'datafit', dataset: { kind: 'table', name: 't', columns: ['x', 'y'], rows: [[1, 3], [2, 5], [4, 9], [7, 15]] }, model: { kind: 'linear', inputs: ['x'], target: 'y' }, standardise: true });
    const standard = [8, 2 * Math.sqrt(7)];
    const spec = { kind: 'lr-sweep' as const, optimizers: [{ label: 'GD', spec: { kind: 'gd' as const, learningRate: 0.1 } }], stop: { maxSteps: 10 }, seed: 1, start: standard, range: [0.01, 0.1] as [number, number], count: 2 };
    const outcome: RunOutcome = { kind: 'step-limit', step: 10, point };
    const cells = { filled: Uint8Array.of(1, 1), steps: Int32Array.of(10, 10), loss: Float64Array.of(0, 0), endPoints: Float64Array.from([...standard, ...standard]), stepsToTolerance: Int32Array.of(-1, -1), outcomes: [outcome, outcome] };
    for (const r of studyRows(spec, surface, cells, () => null))
      for (const p of [r.start, r.endPoint]) {
        expect(p[0]).toBeCloseTo(1, 12);
        expect(p[1]).toBeCloseTo(2, 12);
      }
  });
});
