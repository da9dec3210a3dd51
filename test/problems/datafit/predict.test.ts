import { describe, expect, it } from 'vitest';
import { buildDataFitSurface, datasetTable, softplus } from '../../../src/problems';
import { SPECS } from './specs';

/**
 * predict() against the loss: rebuilding each model's loss from its predictions on the raw rows
 * (an independent route through the data) gives the surface's value.
 */
function rawRows(key: string): { inputs: number[][]; targets: number[] } {
  const spec = SPECS[key];
  const table = datasetTable(spec.dataset);
  const m = table.columns.length;
  const cols = spec.model.inputs.map((c) => table.columns.indexOf(c));
  const t = table.columns.indexOf(spec.model.target);
  const inputs: number[][] = [];
  const targets: number[] = [];
  for (let i = 0; i < table.rows; i++) {
    inputs.push(cols.map((j) => table.values[i * m + j]));
    targets.push(table.values[i * m + t]);
  }
  return { inputs, targets };
}

const point = (n: number) => Array.from({ length: n }, (_, j) => 0.4 * Math.cos(2.3 * j + 1));

describe.each(Object.keys(SPECS).filter((k) => !SPECS[k].l2))('%s', (key) => {
  it('the loss rebuilt from predict() on the raw rows is the surface value', () => {
    const s = buildDataFitSurface(SPECS[key]);
    const p = SPECS[key].model.kind === 'formula' ? [4, 0.02] : point(s.dimension);
    const { inputs, targets } = rawRows(key);
    let sum = 0;
    inputs.forEach((row, i) => {
      const out = s.predict(p, row);
      const y = targets[i];
      if (Array.isArray(out)) sum += -Math.log(out[y]);
      else if (s.lossName === 'mean binary cross-entropy') sum += -(y * Math.log(out) + (1 - y) * Math.log(1 - out));
      else sum += (out - y) ** 2;
    });
    const expected = s.lossName === 'residual sum of squares' ? sum : sum / inputs.length;
    expect(s.value(p)).toBeCloseTo(expected, 10);
  });
});

describe('predict', () => {
  it('gives the plain formulas at simple points', () => {
    const linear = buildDataFitSurface(SPECS['linear rss']);
    expect(linear.predict([1.5, 0.25], [10])).toBe(4);
    const logistic = buildDataFitSurface(SPECS['logistic, raw inputs']);
    expect(logistic.predict([0, 0, 0], [3, 4])).toBe(0.5);
    const softmax = buildDataFitSurface(SPECS['softmax on iris']);
    (softmax.predict(new Array(9).fill(0), [5, 1]) as number[]).forEach((q) => expect(q).toBeCloseTo(1 / 3, 15));
  });

  it('softplus is stable far out', () => {
    expect(softplus(800)).toBe(800);
    expect(softplus(-800)).toBe(0);
    expect(softplus(-40)).toBeCloseTo(Math.exp(-40), 30);
    expect(softplus(0)).toBe(Math.LN2);
  });
});
