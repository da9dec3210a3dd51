import { describe, expect, it } from 'vitest';
import { buildOptimizer, RunCursor } from '../../../src/engine';
import { buildDataFitSurface, designFor, linearLeastSquares, type DataFitSpec } from '../../../src/problems';
import { SPECS } from './specs';

/** Standardised inputs: the conversion back to original units, exactly the same fitted function. */

const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('standardisation', () => {
  const raw: DataFitSpec = {
    kind: 'datafit',
    dataset: { kind: 'nist', id: 'longley' },
    model: { kind: 'linear', inputs: ['x1', 'x2', 'x3', 'x4', 'x5', 'x6'], target: 'y', loss: 'rss' },
  };

  it('a linear fit in standardised units, converted back, is the fit in original units (1e-9 relative)', () => {
    for (const spec of [raw, { ...raw, dataset: { kind: 'demo', id: 'seed-pods' }, model: { kind: 'linear', inputs: ['length_mm', 'mass_g'], target: 'ripe' } } as DataFitSpec]) {
      const { model } = spec;
      const inOriginal = linearLeastSquares(designFor(spec.dataset, model.inputs, model.target, false), 'rss', 0);
      const standardised = buildDataFitSurface({ ...spec, standardise: true });
      const inStandard = linearLeastSquares(designFor(spec.dataset, model.inputs, model.target, true), 'rss', 0);
      const back = standardised.toOriginalUnits(inStandard);
      back.forEach((w, j) => expect(relative(w, inOriginal[j])).toBeLessThan(1e-9));
    }
  });

  it('Newton in standardised units lands on the same linear solution once converted back', () => {
    const standardised = buildDataFitSurface({ ...raw, standardise: true });
    const cursor = new RunCursor(standardised, buildOptimizer({ kind: 'newton', learningRate: 1 }), {
      start: new Array(7).fill(0),
      seed: 1,
      stop: { maxSteps: 3 },
    });
    cursor.runToEnd();
    const back = standardised.toOriginalUnits(cursor.state.x);
    const inOriginal = linearLeastSquares(designFor(raw.dataset, raw.model.inputs, raw.model.target, false), 'rss', 0);
    back.forEach((w, j) => expect(relative(w, inOriginal[j])).toBeLessThan(1e-9));
  });

  it.each(Object.keys(SPECS).filter((k) => SPECS[k].standardise))('%s: same predictions and loss in both unit systems; the conversions are inverse', (key) => {
    const spec = { ...SPECS[key], l2: 0 };
    const standardised = buildDataFitSurface(spec);
    const original = buildDataFitSurface({ ...spec, standardise: false });
    const p = standardised.variables.map((_, j) => 0.3 * Math.sin(1.7 * j + 0.4));
    const q = standardised.toOriginalUnits(p);
    expect(Math.abs(original.value(q) - standardised.value(p))).toBeLessThan(1e-12 * Math.max(1, standardised.value(p)));
    const row = spec.model.inputs.map((_, j) => 1.5 + j);
    const a = [standardised.predict(p, row)].flat();
    const b = [original.predict(q, row)].flat();
    a.forEach((v, k) => expect(v).toBeCloseTo(b[k], 12));
    standardised.fromOriginalUnits(q).forEach((v, j) => expect(v).toBeCloseTo(p[j], 12));
  });

  it('without standardisation the conversions are copies', () => {
    const s = buildDataFitSurface(raw);
    expect(s.standardised).toBe(false);
    expect(s.toOriginalUnits([1, 2, 3, 4, 5, 6, 7])).toEqual([1, 2, 3, 4, 5, 6, 7]);
  });

  it('refuses a constant input column', () => {
    const constant: DataFitSpec = {
      kind: 'datafit',
      dataset: { kind: 'table', name: 'flat', columns: ['x', 'y'], rows: [[1, 2], [1, 3], [1, 5]] },
      model: { kind: 'linear', inputs: ['x'], target: 'y' },
      standardise: true,
    };
    expect(() => buildDataFitSurface(constant)).toThrow("dataset flat: input column 'x' is constant, so it cannot be standardised");
  });
});
