import { describe, expect, it } from 'vitest';
import { compactNumber, defaultColumnIds, nextSort, resultColumns, sortRows, tableTsv, type ResultRow } from '../../../src/ui/table/columns';

function row(id: string, finalLoss: number, point: number[] = [1, 2]): ResultRow {
  return {
    id, label: id, style: 0, optimizer: 'Adam', learningRate: 0.001, outcome: 'converged', outcomeKind: 'converged', outcomeTitle: undefined,
    steps: 10, maxSteps: 3000, finalLoss, bestLoss: finalLoss, point, nearestDistance: null, nearestPoint: null, stepsToTolerance: null, evaluations: 11,
  };
}

describe('compactNumber', () => {
  it('keeps four significant digits and switches to exponents outside [1e-3, 1e6)', () => {
    expect(compactNumber(3.367712345678)).toBe('3.368');
    expect(compactNumber(-0.02621234)).toBe('-0.02621');
    expect(compactNumber(1234567.89)).toBe('1.235e6');
    expect(compactNumber(0.00001234567)).toBe('1.235e-5');
    expect(compactNumber(2e-7)).toBe('2e-7');
    expect(compactNumber(0)).toBe('0');
    expect(compactNumber(120)).toBe('120');
    expect(compactNumber(Number.NaN)).toBe('—');
    expect(compactNumber(Infinity)).toBe('∞');
  });
});

describe('sorting', () => {
  const columns = resultColumns(['x', 'y']);
  const rows = [row('b', 3), row('a', 1), row('c', Number.NaN), row('d', 2)];
  it('cycles ascending, descending, unsorted', () => {
    expect(nextSort(null, 'final-loss')).toEqual({ column: 'final-loss', direction: 'ascending' });
    expect(nextSort({ column: 'final-loss', direction: 'ascending' }, 'final-loss')).toEqual({ column: 'final-loss', direction: 'descending' });
    expect(nextSort({ column: 'final-loss', direction: 'descending' }, 'final-loss')).toBeNull();
    expect(nextSort({ column: 'steps', direction: 'descending' }, 'final-loss')).toEqual({ column: 'final-loss', direction: 'ascending' });
  });
  it('sorts numbers by value with missing values last either way', () => {
    expect(sortRows(rows, columns, { column: 'final-loss', direction: 'ascending' }).map((r) => r.id)).toEqual(['a', 'd', 'b', 'c']);
    expect(sortRows(rows, columns, { column: 'final-loss', direction: 'descending' }).map((r) => r.id)).toEqual(['b', 'd', 'a', 'c']);
    expect(sortRows(rows, columns, null).map((r) => r.id)).toEqual(['b', 'a', 'c', 'd']);
  });
  it('sorts text naturally', () => {
    const named = ['run 10', 'run 2', 'run 1'].map((id) => ({ ...row(id, 1), optimizer: id }));
    expect(sortRows(named, columns, { column: 'optimizer', direction: 'ascending' }).map((r) => r.id)).toEqual(['run 1', 'run 2', 'run 10']);
  });
});

describe('columns', () => {
  it('has one column per parameter and shows them by default for up to four parameters', () => {
    expect(resultColumns(['intercept', 'w_flow']).map((c) => c.id)).toContain('param:1');
    expect(defaultColumnIds(['intercept', 'w_flow'], false)).toEqual(['outcome', 'steps', 'final-loss', 'param:0', 'param:1', 'evaluations']);
    expect(defaultColumnIds(['a', 'b', 'c', 'd', 'e'], true)).toEqual(['outcome', 'steps', 'final-loss', 'final-point', 'nearest-distance', 'steps-to-tolerance', 'evaluations']);
  });
  it('copies at full precision', () => {
    const columns = resultColumns(['x', 'y']).filter((c) => ['final-loss', 'param:0'].includes(c.id));
    expect(tableTsv([row('r', 0.123456789012345, [3.3677123456789, 0])], columns)).toBe('Run\tFinal loss\tx\nr\t0.123456789012345\t3.3677123456789\n');
  });
});
