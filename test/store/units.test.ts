import { describe, expect, it } from 'vitest';
import { buildSurface } from '../../src/problems';
import { coordinateTitle, reportedUnits } from '../../src/store/units';

describe('reportedUnits', () => {
  const table = { kind: 'table' as const, name: 't', columns: ['x', 'y'], rows: [[1, 3], [2, 5], [4, 9], [7, 15]] };
  const spec = (standardise: boolean) => ({ kind: 'datafit' as const, dataset: table, model: { kind: 'linear' as const, inputs: ['x'], target: 'y' }, ...(standardise ? { standardise: true } : {}) });
  it('converts a standardised data-fit point to original units', () => {
    const units = reportedUnits(buildSurface(spec(true)));
    expect(units.standardised).toBe(true);
    // x: mean 3.5, sd sqrt(7); y = 1 + 2x, i.e. standardised b = 1 + 2 * 3.5 = 8, w = 2 sqrt(7).
    const [b, w] = units.toReported([8, 2 * Math.sqrt(7)]);
    expect(b).toBeCloseTo(1, 12);
    expect(w).toBeCloseTo(2, 12);
    expect(coordinateTitle('w_x', units)).toBe('w_x (standardised)');
  });
  it('leaves other surfaces alone', () => {
    const units = reportedUnits(buildSurface(spec(false)));
    expect(units.standardised).toBe(false);
    expect(units.toReported([8, 5])).toEqual([8, 5]);
    expect(reportedUnits(buildSurface({ kind: 'catalogue', id: 'rosenbrock' })).toReported([1, 2])).toEqual([1, 2]);
    expect(coordinateTitle('x', units)).toBe('x');
  });
});
