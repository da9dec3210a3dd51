import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { RunOutcome } from '../../src/engine';
import { studyCsv, type StudyRow } from '../../src/io/study-csv';

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
});
