import { describe, expect, it } from 'vitest';
import { buildSurface, datasetTable, type DataFitSpec } from '../../../src/problems';

/** The loss written out from its definition, row by row, as an independent check of the model's loops. */
function directMse(spec: DataFitSpec, w: number[]): number {
  const t = datasetTable(spec.dataset);
  const cols = spec.model.inputs.map((c) => t.columns.indexOf(c));
  const yc = t.columns.indexOf(spec.model.target);
  const m = t.columns.length;
  let s = 0;
  for (let i = 0; i < t.rows; i++) {
    let f = w[0];
    cols.forEach((c, j) => (f += w[j + 1] * t.values[i * m + c]));
    const r = f - t.values[i * m + yc];
    s += r * r;
  }
  return s / t.rows;
}

describe('linear regression value for one, two and three inputs (each has its own loop)', () => {
  const cases: [string, DataFitSpec, number[]][] = [
    ['one input', { kind: 'datafit', dataset: { kind: 'demo', id: 'probe-calibration' }, model: { kind: 'linear', inputs: ['flow'], target: 'signal' } }, [0.3, 0.02]],
    ['two inputs', { kind: 'datafit', dataset: { kind: 'demo', id: 'seed-pods' }, model: { kind: 'linear', inputs: ['length_mm', 'ripe'], target: 'mass_g' } }, [0.1, 0.05, -0.4]],
    ['three inputs', { kind: 'datafit', dataset: { kind: 'iris' }, model: { kind: 'linear', inputs: ['sepal_length', 'sepal_width', 'petal_length'], target: 'petal_width' } }, [-0.2, -0.2, 0.2, 0.5]],
  ];
  it.each(cases)('%s: equals the mean squared residual computed directly', (_, spec, w) => {
    const surface = buildSurface(spec);
    expect(surface.value(w)).toBeCloseTo(directMse(spec, w), 12);
    const g = new Float64Array(w.length);
    expect(surface.valueGradient(w, g)).toBeCloseTo(directMse(spec, w), 12);
  });
});
