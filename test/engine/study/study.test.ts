import { describe, expect, it } from 'vitest';
import { drawStarts, lossBands, networkLayers, quantile, summariseStarts, type RunOutcome, type StartResult } from '../../../src/engine';
import { buildSurface, type DataFitSpec } from '../../../src/problems';
import { SPECS } from '../../problems/datafit/specs';

const meanSd = (xs: number[]) => {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  return [m, Math.sqrt(xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1))];
};
const column = (starts: Float64Array, n: number, i: number) => Array.from({ length: starts.length / n }, (_, r) => starts[r * n + i]);

describe('drawStarts', () => {
  it('is seeded: the same seed gives the same starts bit for bit, another seed others', () => {
    const d = { kind: 'uniform' as const, box: [[-1, 1], [0, 5]] as [number, number][] };
    expect(Array.from(drawStarts(d, 2, 50, 7))).toEqual(Array.from(drawStarts(d, 2, 50, 7)));
    expect(Array.from(drawStarts(d, 2, 50, 7))).not.toEqual(Array.from(drawStarts(d, 2, 50, 8)));
  });

  it('uniform: every start in its box, means near the centres (10,000 draws: 5 standard errors)', () => {
    const s = drawStarts({ kind: 'uniform', box: [[-1, 1], [0, 5]] }, 2, 10_000, 3);
    const [x, y] = [column(s, 2, 0), column(s, 2, 1)];
    expect(x.every((v) => v >= -1 && v <= 1) && y.every((v) => v >= 0 && v <= 5)).toBe(true);
    // Uniform on [a, b]: sd (b - a) / sqrt(12); the mean's standard error is that / sqrt(10,000).
    expect(Math.abs(meanSd(x)[0])).toBeLessThan((5 * 2) / Math.sqrt(12) / 100);
    expect(Math.abs(meanSd(y)[0] - 2.5)).toBeLessThan((5 * 5) / Math.sqrt(12) / 100);
  });

  it('gaussian: mean and sd per coordinate (10,000 draws)', () => {
    const s = drawStarts({ kind: 'gaussian', centre: [1, -2], sd: [0.5, 3] }, 2, 10_000, 11);
    const [mx, sx] = meanSd(column(s, 2, 0));
    const [my, sy] = meanSd(column(s, 2, 1));
    expect(Math.abs(mx - 1)).toBeLessThan(5 * 0.005);
    expect(Math.abs(my + 2)).toBeLessThan(5 * 0.03);
    expect(Math.abs(sx / 0.5 - 1)).toBeLessThan(0.05);
    expect(Math.abs(sy / 3 - 1)).toBeLessThan(0.05);
  });

  it('reads a network\'s layers from its parameter groups: fan-in and fan-out of each layer', () => {
    const surface = buildSurface(SPECS['mlp tanh 2 layers softmax'] as DataFitSpec) as unknown as { dimension: number; parameterGroups: never[] };
    // inputs 2 -> hidden [3, 2] -> 3 classes (softmax): layers 2x3, 3x2, 2x3.
    expect(networkLayers(surface.parameterGroups, surface.dimension, 'glorot').map((l) => [l.fanIn, l.fanOut])).toEqual([[2, 3], [3, 2], [2, 3]]);
  });

  it('glorot: weights within +-sqrt(6 / (fan_in + fan_out)) with the uniform variance r^2 / 3, biases 0 (Glorot & Bengio 2010)', () => {
    const surface = buildSurface(SPECS['mlp tanh binary'] as DataFitSpec) as unknown as { dimension: number; parameterGroups: { kind: string; indices: number[] }[] };
    const n = surface.dimension;
    const s = drawStarts({ kind: 'glorot' }, n, 4000, 5, surface.parameterGroups as never);
    const layers = networkLayers(surface.parameterGroups as never, n, 'glorot');
    const biasIndices = surface.parameterGroups.filter((g) => g.kind === 'bias').flatMap((g) => g.indices);
    for (const i of biasIndices) expect(column(s, n, i).every((v) => v === 0)).toBe(true);
    for (const layer of layers) {
      const r = Math.sqrt(6 / (layer.fanIn + layer.fanOut));
      const values = layer.weights.flatMap((i) => column(s, n, i));
      expect(values.every((v) => Math.abs(v) <= r)).toBe(true);
      expect(Math.abs(meanSd(values)[1] ** 2 / (r * r / 3) - 1)).toBeLessThan(0.05);
    }
  });

  it('he: weight variance 2 / fan_in (He et al. 2015)', () => {
    const surface = buildSurface(SPECS['mlp relu regression'] as DataFitSpec) as unknown as { dimension: number; parameterGroups: never[] };
    const n = surface.dimension;
    const s = drawStarts({ kind: 'he' }, n, 4000, 9, surface.parameterGroups);
    for (const layer of networkLayers(surface.parameterGroups, n, 'he')) {
      const values = layer.weights.flatMap((i) => column(s, n, i));
      expect(Math.abs(meanSd(values)[1] ** 2 / (2 / layer.fanIn) - 1)).toBeLessThan(0.06);
    }
  });

  it('refuses bad input with the field named', () => {
    expect(() => drawStarts({ kind: 'uniform', box: [[0, 1]] }, 2, 5, 1)).toThrow('starts: box must have 2 entries (one per parameter), got 1');
    expect(() => drawStarts({ kind: 'uniform', box: [[1, 0], [0, 1]] }, 2, 5, 1)).toThrow('starts: box[0] must be finite with lo <= hi, got [1, 0]');
    expect(() => drawStarts({ kind: 'gaussian', centre: [0, 0], sd: -1 }, 2, 5, 1)).toThrow('starts: sd[0] must be a finite number >= 0, got -1');
    expect(() => drawStarts({ kind: 'glorot' }, 2, 5, 1)).toThrow("starts: 'glorot' initialisation needs a surface with parameter groups");
    expect(() => drawStarts({ kind: 'he' }, 2, 0, 1)).toThrow('starts: count must be a whole number from 1 to 1000000, got 0');
  });
});

describe('quantiles and loss bands', () => {
  it('quantile is R/NumPy type 7 (Hyndman & Fan 1996): worked values', () => {
    // numpy.quantile([1, 2, 3, 4], [0.25, 0.5, 0.9]) = [1.75, 2.5, 3.7] (from memory of the definition: h = (n-1) q).
    const s = [1, 2, 3, 4];
    expect(quantile(s, 0.25)).toBeCloseTo(1.75, 15);
    expect(quantile(s, 0.5)).toBeCloseTo(2.5, 15);
    expect(quantile(s, 0.9)).toBeCloseTo(3.7, 15);
    expect(quantile([5], 0.3)).toBe(5);
  });

  it('a run that ended keeps its last loss; a diverged run counts as +Infinity', () => {
    const b = lossBands([[4, 2, 1], [4, 3], [4, Number.NaN]], [0, 0.5, 1]);
    expect(b.steps).toBe(3);
    expect(Array.from(b.bands[0])).toEqual([4, 2, 1]);
    expect(Array.from(b.bands[1])).toEqual([4, 3, 3]);
    expect(Array.from(b.bands[2])).toEqual([4, Infinity, Infinity]);
  });
});

describe('summariseStarts', () => {
  const point = { gradNorm: 0, gradThreshold: 1, stationary: true, curvature: null, newtonStep: null };
  const r = (kind: 'converged' | 'step-limit' | 'saddle', finalLoss: number, steps: number | null): StartResult => ({
    outcome: (kind === 'saddle' ? { kind, step: 1, rule: 'no-step', index: 1, point } : kind === 'converged' ? { kind, step: 1, rule: 'gradient-norm', point } : { kind, step: 1, point }) as RunOutcome,
    finalLoss,
    endPoint: [0, 0],
    stepsToTolerance: steps,
  });

  it('success = converged to within the tolerance of the known minimum; saddles and the step limit never count', () => {
    const s = summariseStarts([r('converged', 1e-9, 10), r('converged', 0.5, null), r('saddle', 1e-9, 4), r('step-limit', 1e-9, 30)], 1e-6, 0);
    expect(s).toMatchObject({ runs: 4, converged: 2, successes: 1, successRate: 0.25, target: { loss: 0, source: 'known minimum' }, outcomes: { converged: 2, saddle: 1, 'step-limit': 1 } });
    expect(s.finalLoss).toMatchObject({ min: 1e-9, max: 0.5, finite: 4 });
    // Steps to tolerance by hand: 3 of the 4 reached it, at 10, 4 and 30; sorted 4, 10, 30, so (type 7
    // quantiles) q1 = 4 + 0.5 (10 - 4) = 7, median 10, q3 = 10 + 0.5 (30 - 10) = 20.
    expect(s.stepsToTolerance).toEqual({ reached: 3, q1: 7, median: 10, q3: 20 });
  });

  it('steps to tolerance count every start that reached it, whatever its outcome, and none is NaN', () => {
    // Reached at 12, 3, 50, 7, 20 (sorted 3, 7, 12, 20, 50: q1 7, median 12, q3 20 exactly); 2 never.
    const steps = [12, null, 3, 50, null, 7, 20];
    const s = summariseStarts(steps.map((k, i) => r(i % 2 ? 'converged' : 'step-limit', 1, k)), 1e-6, 0);
    expect(s.stepsToTolerance).toEqual({ reached: 5, q1: 7, median: 12, q3: 20 });
    const none = summariseStarts([r('converged', 1, null)], 1e-6, 0).stepsToTolerance;
    expect(none.reached).toBe(0);
    expect(none.median).toBeNaN();
  });

  it('without a known minimum, the best converged end point is the target (and says so)', () => {
    const s = summariseStarts([r('converged', 3, null), r('converged', 3 + 1e-9, null), r('converged', 7, null)], 1e-6, null);
    expect(s.target).toEqual({ loss: 3, source: 'best end point' });
    expect(s.successes).toBe(2);
  });
});
