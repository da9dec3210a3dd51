import { describe, expect, it } from 'vitest';
import {
  basinOf,
  basinsOf,
  bandPlan,
  clusterEndPoints,
  coarseToFineOrder,
  defaultOptimizerSpec,
  logSpaced,
  mergeBandResults,
  permuteStarts,
  refineDivergenceThreshold,
  splitBands,
  startGrid,
  Sweep,
  unstableRates,
  type SweepPlan,
} from '../../../src/engine';
import { buildSurface, describeSurface } from '../../../src/problems';

const himmelblau = buildSurface({ kind: 'catalogue', id: 'himmelblau' });
const bowl = buildSurface({ kind: 'formula', text: 'x^2 + 10*y^2' });

describe('splitBands and mergeBandResults', () => {
  it('bands are contiguous, cover every run once and differ in size by at most one', () => {
    for (const [count, parts] of [[0, 3], [1, 4], [10, 3], [144, 7], [4096, 8], [5, 5]]) {
      const bands = splitBands(count, parts);
      let next = 0;
      for (const b of bands) {
        expect(b.lo).toBe(next);
        expect(b.hi).toBeGreaterThan(b.lo);
        next = b.hi;
      }
      expect(next).toBe(count);
      const sizes = bands.map((b) => b.hi - b.lo);
      if (count > 0) expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      expect(bands.length).toBe(Math.min(count, parts));
    }
  });

  it('band results merged in index order equal the single-band result, bit for bit', () => {
    const grid = startGrid({ a: [-5, 5], b: [-5, 5] }, 12);
    const seeds = Float64Array.from({ length: 144 }, (_, i) => i);
    const learningRates = Float64Array.from({ length: 144 }, (_, i) => 0.004 + 0.0001 * (i % 9));
    const plan: SweepPlan = { surface: himmelblau, optimizer: { ...defaultOptimizerSpec('momentum'), learningRate: 0.005 }, stop: { maxSteps: 300, lossChangeTolerance: 1e-12 }, starts: grid.starts, seeds, learningRates, gradientNoise: 0.1, lossTolerance: 1e-3 };
    const whole = new Sweep(plan);
    whole.advance(1000);
    const bands = splitBands(144, 5);
    // Merged out of order on purpose: the bands say where each result goes.
    const order = [3, 0, 4, 1, 2];
    const results = order.map((k) => {
      const s = new Sweep(bandPlan(plan, bands[k]));
      s.advance(1000);
      return s.result();
    });
    const merged = mergeBandResults(order.map((k) => bands[k]), results, 2);
    expect(merged).toEqual(whole.result());
    expect(merged.stepsToTolerance.some((s) => s > 0)).toBe(true);
  });

  it('refuses bands that leave a gap', () => {
    const r = new Sweep({ surface: bowl, optimizer: defaultOptimizerSpec('gd'), stop: { maxSteps: 2 }, starts: new Float64Array(4) }).result();
    expect(() => mergeBandResults([{ lo: 0, hi: 2 }, { lo: 3, hi: 5 }], [r, r], 2)).toThrow('does not follow run 1');
  });
});

describe('startGrid and coarseToFineOrder', () => {
  it('row-major cell centres, other coordinates held at the base point', () => {
    const g = startGrid({ a: [0, 4], b: [-1, 1] }, { nx: 4, ny: 2 }, { base: [7, 8, 9], axes: [2, 0] });
    expect(g.dimension).toBe(3);
    expect(Array.from(g.starts.subarray(0, 3))).toEqual([-0.5, 8, 0.5]);
    // Cell (i, j) = (3, 1) is run 3 + 1 * 4 = 7: a = 3.5 on axis 2, b = 0.5 on axis 0.
    expect(Array.from(g.starts.subarray(21, 24))).toEqual([0.5, 8, 3.5]);
    expect(() => startGrid({ a: [1, 0], b: [0, 1] }, 3)).toThrow('box.a');
    expect(() => startGrid({ a: [0, 1], b: [0, 1] }, 3, { base: [0, 0], axes: [1, 1] })).toThrow('axes');
  });

  it('is a permutation whose first 1/16 and 1/4 are the stride-4 and stride-2 grids', () => {
    const nx = 64;
    const order = coarseToFineOrder(nx, nx);
    expect(new Set(order).size).toBe(nx * nx);
    const prefix = (k: number) => new Set(Array.from(order.subarray(0, k)));
    const stride = (s: number) => {
      const set = new Set<number>();
      for (let j = 0; j < nx; j += s) for (let i = 0; i < nx; i += s) set.add(i + j * nx);
      return set;
    };
    expect(prefix(nx * nx / 16)).toEqual(stride(4));
    expect(prefix(nx * nx / 4)).toEqual(stride(2));
    expect(prefix(1)).toEqual(new Set([0]));
  });

  it('non-square and odd grids: each prefix of a level is a full coarser grid', () => {
    const [nx, ny] = [13, 6];
    const order = coarseToFineOrder(nx, ny);
    expect(Array.from(order).sort((a, b) => a - b)).toEqual(Array.from({ length: nx * ny }, (_, i) => i));
    for (const s of [8, 4, 2]) {
      const k = Math.ceil(nx / s) * Math.ceil(ny / s);
      for (const c of order.subarray(0, k)) expect((c % nx) % s === 0 && Math.floor(c / nx) % s === 0).toBe(true);
    }
  });

  it('a sweep over permuted starts gives the same runs, in the permuted order', () => {
    const g = startGrid({ a: [-5, 5], b: [-5, 5] }, 8);
    const order = coarseToFineOrder(8, 8);
    const plan = { surface: himmelblau, optimizer: { ...defaultOptimizerSpec('adam'), learningRate: 0.05 }, stop: { maxSteps: 50 } };
    const a = new Sweep({ ...plan, starts: g.starts });
    const b = new Sweep({ ...plan, starts: permuteStarts(g.starts, 2, order) });
    a.advance(50);
    b.advance(50);
    const ra = a.result();
    const rb = b.result();
    order.forEach((cell, k) => expect(rb.losses[k]).toBe(ra.losses[cell]));
  });
});

describe('basins', () => {
  const minima = describeSurface({ kind: 'catalogue', id: 'himmelblau' }).knownPoints.filter((p) => p.kind === 'global-min' || p.kind === 'local-min').map((p) => p.point);

  it('GD from a grid of starts ends in Himmelblau\'s four minima', () => {
    expect(minima).toHaveLength(4);
    const g = startGrid({ a: [-5, 5], b: [-5, 5] }, 16);
    const sweep = new Sweep({ surface: himmelblau, optimizer: { ...defaultOptimizerSpec('gd'), learningRate: 0.01 }, stop: { maxSteps: 2000, gradientNormTolerance: 1e-9 }, starts: g.starts });
    sweep.advance(2000);
    const r = sweep.result();
    const labels = basinsOf(r.endPoints, 2, minima, 1e-6);
    const converged = r.outcomes.map((o) => o?.kind === 'converged');
    // Every converged run is at one of the four minima, and each minimum draws some runs.
    labels.forEach((l, i) => converged[i] && expect(l).toBeGreaterThanOrEqual(0));
    expect(new Set(Array.from(labels).filter((l) => l >= 0)).size).toBe(4);
    // Without known minima, clustering finds the same four groups among converged runs.
    const ends = r.endPoints.filter((_, k) => converged[k >> 1]);
    const clusters = clusterEndPoints(ends, 2, 1e-3);
    expect(clusters.count).toBe(4);
    for (let c = 0; c < 4; c++) expect(basinOf(clusters.leaders.subarray(2 * c, 2 * c + 2), minima, 1e-6)).toBeGreaterThanOrEqual(0);
  });

  it('basinOf takes the nearest minimum within the tolerance, -1 outside or non-finite', () => {
    expect(basinOf([3.1, 2], minima, 0.2)).toBe(minima.findIndex((m) => m[0] === 3 && m[1] === 2));
    expect(basinOf([0, 0], minima, 0.5)).toBe(-1);
    expect(basinOf([NaN, 0], minima, 10)).toBe(-1);
    expect(basinOf([0, 0], [[1, 0], [0, 1]], 1)).toBe(0);
  });

  it('clusterEndPoints: the leader rule with a radius', () => {
    const pts = Float64Array.of(0, 0, 0.5, 0, 3, 3, 0.9, 0, NaN, 1, 3, 3.4, 1.6, 0);
    const c = clusterEndPoints(pts, 2, 1);
    expect(Array.from(c.labels)).toEqual([0, 0, 1, 0, -1, 1, 2]);
    expect(Array.from(c.sizes)).toEqual([3, 2, 1]);
    expect(Array.from(c.leaders)).toEqual([0, 0, 3, 3, 1.6, 0]);
  });
});

describe('learning-rate sweeps', () => {
  it('logSpaced: exact ends, constant ratio', () => {
    const r = logSpaced(1e-4, 1, 5);
    expect(r[0]).toBe(1e-4);
    expect(r[4]).toBe(1);
    for (let k = 1; k < 5; k++) expect(r[k] / r[k - 1]).toBeCloseTo(10, 10);
    expect(Array.from(logSpaced(0.3, 7, 1))).toEqual([0.3]);
    expect(() => logSpaced(0, 1, 3)).toThrow('lo and hi');
  });

  it('GD on x^2 + 10 y^2: the observed threshold is 2 / lambda_max = 0.1 to 1e-6', () => {
    const config = { surface: bowl, optimizer: defaultOptimizerSpec('gd'), start: [1, 1] };
    const coarse = unstableRates(config, logSpaced(1e-3, 1, 13));
    const first = coarse.unstable.indexOf(1);
    expect(first).toBeGreaterThan(0);
    expect(Array.from(coarse.unstable.subarray(first)).every((u) => u === 1)).toBe(true);
    const t = refineDivergenceThreshold(config, coarse.learningRates[first - 1], coarse.learningRates[first]);
    expect(Math.abs(t.threshold / 0.1 - 1)).toBeLessThan(1e-6);
    expect(t.lo).toBeLessThanOrEqual(0.1);
    expect(t.hi).toBeGreaterThan(0.1);
  });

  it('heavy-ball momentum mu = 0.9 on x^2 + 10 y^2: the threshold is 2(1 + mu) / lambda_max = 0.19', () => {
    const config = { surface: bowl, optimizer: { ...defaultOptimizerSpec('momentum'), hyper: { momentum: 0.9 } }, start: [1, 1] };
    const t = refineDivergenceThreshold(config, 0.05, 0.5);
    expect(Math.abs(t.threshold / 0.19 - 1)).toBeLessThan(1e-6);
  });

  it('refuses a bracket that does not straddle the threshold', () => {
    const config = { surface: bowl, optimizer: defaultOptimizerSpec('gd'), start: [1, 1] };
    expect(() => refineDivergenceThreshold(config, 0.01, 0.05)).toThrow('is stable');
    expect(() => refineDivergenceThreshold(config, 0.2, 0.5)).toThrow('already unstable');
  });
});
