import { describe, expect, it } from 'vitest';
import { buildOptimizer, concatBatches, createRng, isRowwiseSurface, nextUniform, RunCursor, shuffleInPlace, stepsForEpochs } from '../../../src/engine';
import { buildDataFitSurface, type DataFitSurface } from '../../../src/problems';
import { maxAbs, maxAbsDiff } from '../calculus';
import { SPECS } from './specs';

/** Minibatch evaluation and parameter groups of every data-fit model. */

function randomPoint(n: number, seed: number): number[] {
  const rng = createRng(seed);
  return Array.from({ length: n }, () => 0.6 * (nextUniform(rng) - 0.5));
}

describe.each(Object.keys(SPECS))('%s', (key) => {
  const surface: DataFitSurface = buildDataFitSurface(SPECS[key]);
  const n = surface.dimension;
  const N = surface.rows;
  const x = randomPoint(n, 7);

  it('is row-wise', () => {
    expect(isRowwiseSurface(surface)).toBe(true);
  });

  it('a batch of every row in order is exactly the full loss, gradient and Hessian', () => {
    const all = Int32Array.from({ length: N }, (_, i) => i);
    const [g, gb] = [new Float64Array(n), new Float64Array(n)];
    const [h, hb] = [new Float64Array(n * n), new Float64Array(n * n)];
    expect(surface.valueGradientOnRows(x, gb, all, N)).toBe(surface.valueGradient(x, g));
    expect(Array.from(gb)).toEqual(Array.from(g));
    expect(surface.valueGradientHessianOnRows(x, gb, hb, all, N)).toBe(surface.valueGradientHessian(x, g, h));
    expect(Array.from(hb)).toEqual(Array.from(h));
  });

  it('batch gradients over one shuffled epoch, weighted by batch size, average to the full gradient', () => {
    const order = Int32Array.from({ length: N }, (_, i) => i);
    shuffleInPlace(createRng(3), order);
    const size = Math.max(1, Math.floor(N / 4));
    const full = new Float64Array(n);
    const fullLoss = surface.valueGradient(x, full);
    const mean = new Float64Array(n);
    const g = new Float64Array(n);
    let meanLoss = 0;
    let batches = 0;
    for (let start = 0; start < N; start += size) {
      const rows = order.slice(start, Math.min(N, start + size));
      const weight = rows.length / N;
      meanLoss += weight * surface.valueGradientOnRows(x, g, rows, rows.length);
      for (let j = 0; j < n; j++) mean[j] += weight * g[j];
      batches += 1;
    }
    expect(batches).toBe(stepsForEpochs(N, size, 1));
    expect(Math.abs(meanLoss - fullLoss)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(fullLoss)));
    expect(maxAbsDiff(mean, full)).toBeLessThanOrEqual(1e-12 * (1 + maxAbs(full)));
  });

  it('refuses an empty batch and rows that do not exist', () => {
    const g = new Float64Array(n);
    expect(() => surface.valueGradientOnRows(x, g, new Int32Array(2), 0)).toThrow('batch count must be a whole number from 1 to 2, got 0');
    expect(() => surface.valueGradientOnRows(x, g, Int32Array.of(N), 1)).toThrow(`row index ${N} is outside 0..${N - 1}`);
  });

  it('parameter groups cover every parameter once; bias groups are exactly the unpenalised parameters', () => {
    const seen = surface.parameterGroups.flatMap((g) => g.indices).sort((a, b) => a - b);
    expect(seen).toEqual(Array.from({ length: n }, (_, i) => i));
    const l2 = 0.7;
    const spec = SPECS[key];
    const withPenalty = buildDataFitSurface({ ...spec, l2 });
    const without = buildDataFitSurface({ ...spec, l2: 0 });
    const [gp, g0] = [new Float64Array(n), new Float64Array(n)];
    withPenalty.valueGradient(x, gp);
    without.valueGradient(x, g0);
    const biases = new Set(surface.parameterGroups.filter((g) => g.kind === 'bias').flatMap((g) => g.indices));
    for (let j = 0; j < n; j++) {
      // A formula model penalises every parameter (it has no bias group).
      const penalised = !biases.has(j);
      expect(Math.abs(gp[j] - g0[j] - (penalised ? l2 * x[j] : 0))).toBeLessThanOrEqual(1e-12 * (1 + Math.abs(g0[j])));
    }
  });

  it('names every parameter, all different', () => {
    expect(surface.variables.length).toBe(n);
    expect(new Set(surface.variables).size).toBe(n);
  });
});

describe('minibatch runs on a data-fit surface', () => {
  const surface = buildDataFitSurface(SPECS['logistic, l2, standardised']);
  const start = new Array(surface.dimension).fill(0);

  it('Adam on batches of 8 lowers the exact loss it records', () => {
    const steps = stepsForEpochs(surface.rows, 8, 20);
    const cursor = new RunCursor(surface, buildOptimizer({ kind: 'adam', learningRate: 0.05 }), { start, seed: 1, stop: { maxSteps: steps }, minibatch: { size: 8 } });
    const b = concatBatches(cursor.runToEnd(), surface.dimension);
    expect(b.count).toBe(steps + 1);
    expect(cursor.state.minibatch?.epoch).toBe(20);
    const last = b.count - 1;
    expect(b.loss[last]).toBe(surface.value(b.points.subarray(last * surface.dimension, (last + 1) * surface.dimension)));
    expect(b.loss[last]).toBeLessThan(0.8 * b.loss[0]);
  });
});
