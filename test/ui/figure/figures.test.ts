import { describe, expect, it } from 'vitest';
import { defaultOptimizerSpec } from '../../../src/engine';
import type { StudyState } from '../../../src/store/study-store';
import { parseFigureSide, pngSizeProblem } from '../../../src/ui/figure/render';
import { lossFigure, multiStartBand } from '../../../src/ui/figure/views/loss-figure';
import { criticalPointsFigure, rateSweepFigure } from '../../../src/ui/figure/views/study-figures';
import { runStyle } from '../../../src/ui/plot';

const idle: StudyState = {
  status: 'idle', message: null, requestId: null, spec: null, surface: null, variables: [], configLabel: '',
  done: 0, total: 0, elapsedMs: 0, cells: null, basinLabels: [], known: [], target: null, bands: null, thresholds: null, version: 0,
};
const bands = [Float64Array.of(4, 2, 1), Float64Array.of(5, 3, 2), Float64Array.of(6, 4, 3)];
const multiStart: StudyState = {
  ...idle, status: 'done', configLabel: 'Adam', bands,
  spec: { kind: 'multi-start', optimizer: defaultOptimizerSpec('adam'), stop: { maxSteps: 2 } as never, seed: 1, distribution: { kind: 'he' }, count: 40, startSeed: 3 },
};

describe('the loss chart figure', () => {
  const trajectory = { loss: Float64Array.of(3, 2, 1), count: 3 };
  const live = { trajectory: (id: string) => (id === 'a' ? trajectory : undefined) } as never;
  const state = { workspace: { runs: [{ id: 'a', label: 'Plain descent', style: 0, hidden: false }, { id: 'b', label: 'Hidden', style: 1, hidden: true }] }, surfaceInfo: { label: 'Bowl', knownPoints: [] } } as never;

  it('keys the visible runs, and the multi-start median and band only when a multi-start study has them', () => {
    expect(multiStartBand(idle)).toBeNull();
    expect(multiStartBand({ ...multiStart, spec: { ...multiStart.spec!, kind: 'start-map' } as never })).toBeNull();
    const plain = lossFigure(state, live, idle);
    expect(plain.title).toBe('Loss by step: Bowl');
    expect(plain.key).toEqual([{ kind: 'run', style: runStyle(0), label: 'Plain descent' }]);
    const withBand = lossFigure(state, live, multiStart);
    expect(withBand.key.map((e) => e.label)).toEqual(['Plain descent', 'multi-start median, 40 starts of “Adam”', 'multi-start 25–75% band']);
    expect(multiStartBand(multiStart)!.quantiles).toBe(bands);
  });
});

describe('study figures', () => {
  it('the learning-rate sweep keys every curve, both threshold marks and the thresholds the panel shows', () => {
    const curve = (label: string, k: number, threshold: { observed: { lo: number; hi: number; refined: boolean } | null; predicted: number | null } | null) =>
      ({ label, style: runStyle(k), finalLoss: new Float64Array(2), kinds: new Int8Array(2), threshold: threshold as never });
    const f = rateSweepFigure({
      rates: Float64Array.of(0.01, 0.1), surfaceLabel: 'x^2 + 10*y^2', startLabel: 'Plain descent',
      // GD on x^2 + 10 y^2: lambda_max = 20, threshold 2/20 = 0.1 (bisection brackets it).
      curves: [curve('Plain descent', 0, { observed: { lo: 0.0999999, hi: 0.1000001, refined: true }, predicted: 0.1 }), curve('Adam', 2, { observed: null, predicted: null })],
    });
    const labels = f.key.map((e) => e.label);
    expect(labels.slice(0, 2)).toEqual(['Plain descent', 'Adam']);
    expect(labels).toContain('Plain descent: observed 0.1, predicted 0.1');
    expect(labels).toContain('Adam: observed none in range, predicted none');
    expect(f.key.find((e) => e.kind === 'line' && e.dash)?.label).toBe('predicted 2/λmax or 2(1+μ)/λmax (dashed)');
  });

  it('the critical-point key counts each kind', () => {
    const point = (kind: 'minimum' | 'saddle' | null) => ({ point: Float64Array.of(0, 0), value: 0, gradientNorm: 0, hits: 1, classification: kind ? { kind, smallest: 1, largest: 2 } : null }) as never;
    const f = criticalPointsFigure({ points: [point('minimum'), point('minimum'), point('saddle'), point(null)], box: { a: [-1, 1], b: [-1, 1] }, axes: [0, 1], labels: { a: 'x', b: 'y' }, surfaceLabel: 'Himmelblau' });
    expect(f.key.map((e) => e.label)).toEqual(['minimum (2)', 'saddle (1)', 'maximum (0)', 'degenerate (1)']);
  });
});

describe('parseFigureSide', () => {
  it('accepts whole numbers of pixels from 200 to 4000 and names the field in every refusal', () => {
    expect(parseFigureSide('width', ' 960 ')).toEqual({ value: 960 });
    expect(parseFigureSide('height', '200')).toEqual({ value: 200 });
    expect(parseFigureSide('width', '50')).toEqual({ error: 'width: from 200 to 4000 pixels, got 50' });
    expect(parseFigureSide('height', '4001')).toEqual({ error: 'height: from 200 to 4000 pixels, got 4001' });
    expect(parseFigureSide('width', '640.5')).toEqual({ error: 'width: "640.5" is not a whole number of pixels' });
    expect(parseFigureSide('width', 'abc')).toEqual({ error: 'width: "abc" is not a whole number of pixels' });
  });
});

describe('pngSizeProblem', () => {
  it('allows up to 64 megapixels and says how many a larger PNG would have', () => {
    expect(pngSizeProblem({ width: 4000, height: 4000 }, 2)).toBeNull(); // exactly 64e6
    expect(pngSizeProblem({ width: 4000, height: 4000 }, 3)).toBe('PNG pixel ratio: 4000 x 4000 at 3 would be 144 megapixels, at most 64');
  });
});
