import { describe, expect, it } from 'vitest';
import { runStudyCells, studyOrder } from '../../src/engine';
import { cellTable, studyBasins, studyCsvOf } from '../../src/io/study-exports';
import { buildSurface, describeSurface, type SurfaceSpec } from '../../src/problems';
import { startMapStudy } from '../study-examples';

// Three-hump camel (Branin's "camel" without the cubic term): a formula without listed minima, so the
// basins are end-point clusters and their labels depend on the order they are found in.
const camel: SurfaceSpec = { kind: 'formula', text: '2*x^2 - 1.05*x^4 + x^6/6 + x*y + y^2' };
const spec = { ...startMapStudy(), stop: { maxSteps: 3000, lossChangeTolerance: 1e-14, gradientNormTolerance: 1e-8 }, box: { a: [-2, 2] as [number, number], b: [-2, 2] as [number, number] } };
const view = { a: [-2, 2] as [number, number], b: [-2, 2] as [number, number] };

describe('study CSV from cells', () => {
  const surface = buildSurface(camel);
  const info = describeSurface(camel);
  const all = studyOrder(spec);

  it('the same bytes however the cells were split and in whatever order the pieces come', () => {
    const whole = studyCsvOf(spec, surface, info, view, cellTable(spec, 2, [runStudyCells(spec, surface, all)]));
    const pieces = [all.slice(200), all.slice(0, 77), all.slice(77, 200)].map((c) => runStudyCells(spec, surface, c.reverse()));
    expect(studyCsvOf(spec, surface, info, view, cellTable(spec, 2, pieces))).toBe(whole);
  });

  it('basins are end-point clusters found in run order (coarse to fine): the first cell run leads the first cluster', () => {
    const table = cellTable(spec, 2, [runStudyCells(spec, surface, all)]);
    const basins = studyBasins(spec, table, 2, info.knownPoints, view);
    const first = all.find((c) => table.outcomes[c]!.kind === 'converged')!;
    const end = table.endPoints.subarray(2 * first, 2 * first + 2);
    expect(basins[first]).toBe(`end point (${end[0].toPrecision(4)}, ${end[1].toPrecision(4)})`);
    // The camel's three minima (0, 0) and about (+-1.7476, -+0.8738): clusters around each.
    expect(new Set(basins.filter((b) => b !== null)).size).toBeGreaterThanOrEqual(3);
  });

  it('refuses a missing cell and a cell found twice', () => {
    const a = runStudyCells(spec, surface, all.slice(0, 10));
    expect(() => cellTable(spec, 2, [a])).toThrow('study cells: cell');
    expect(() => cellTable(spec, 2, [a, a, runStudyCells(spec, surface, all.slice(10))])).toThrow(/was computed twice/);
  });
});
