import { describe, expect, it } from 'vitest';
import { buildOptimizer, cellStart, coarseToFineOrder, RunCursor, type StartMapSpec } from '../../src/engine';
import { buildSurface, describeSurface, type SurfaceSpec } from '../../src/problems';
import { createStudyStore } from '../../src/store/study-store';
import { inProcessLink } from './in-process-link';

const surface: SurfaceSpec = { kind: 'catalogue', id: 'himmelblau' };
const spec: StartMapSpec = {
  kind: 'start-map',
  optimizer: { kind: 'gd', learningRate: 0.005 },
  stop: { maxSteps: 3000, lossChangeTolerance: 1e-14, gradientNormTolerance: 1e-8 },
  seed: 1,
  box: { a: [-5, 5], b: [-5, 5] },
  axes: [0, 1],
  base: [0, 0],
  resolution: 16,
};
const minima = describeSurface(surface).knownPoints.filter((p) => p.kind === 'global-min').map((p) => ({ point: p.point, label: `minimum (${p.point.join(', ')})` }));

describe('start-point map through the worker', () => {
  const harness = inProcessLink();
  const study = createStudyStore(harness.link);
  study.start({ surface, variables: ['x', 'y'], spec, configLabel: 'GD', known: minima, basinRadius: 0.01 * Math.hypot(10, 10) });
  harness.drain();
  const s = study.store.getState();

  it('runs every cell and ends done', () => {
    expect(s.status).toBe('done');
    expect(s.done).toBe(256);
    expect(Array.from(s.cells!.filled).every((f) => f === 1)).toBe(true);
  });

  it('on Himmelblau with small-step descent every start converges, the basin shares sum to the whole grid and each of the 4 minima has a basin', () => {
    const c = s.cells!;
    const counts = new Map<number, number>();
    for (const b of c.basin) counts.set(b, (counts.get(b) ?? 0) + 1);
    expect(counts.get(-1) ?? 0).toBe(0);
    expect([...counts.keys()].sort()).toEqual([0, 1, 2, 3]);
    expect([...counts.values()].reduce((a, b) => a + b, 0)).toBe(256);
    expect(s.basinLabels).toHaveLength(4); // no cluster beyond the known minima
  });

  it("a sample of cells ends bit-identical to the same run done alone (its outcome too)", () => {
    const himmelblau = buildSurface(surface);
    const start = new Float64Array(2);
    for (const index of [0, 17, 100, 255]) {
      const cursor = new RunCursor(himmelblau, buildOptimizer(spec.optimizer), { start: Array.from(cellStart(spec, index, start)), seed: 1, stop: spec.stop });
      cursor.runToEnd();
      expect(Array.from(s.cells!.endPoints.subarray(index * 2, index * 2 + 2))).toEqual(Array.from(cursor.state.x));
      expect(s.cells!.steps[index]).toBe(cursor.state.t);
      expect(s.cells!.outcomes[index]).toEqual(cursor.outcome);
    }
  });

  it('cell starts are cell centres, and the coarse-to-fine order lists every cell once, coarse grid first', () => {
    expect(Array.from(cellStart(spec, 0, new Float64Array(2)))).toEqual([-5 + 10 / 32, -5 + 10 / 32]);
    expect(Array.from(cellStart(spec, 16 + 3, new Float64Array(2)))).toEqual([-5 + 3.5 * 10 / 16, -5 + 1.5 * 10 / 16]);
    const order = coarseToFineOrder(16, 16);
    expect(new Set(order).size).toBe(256);
    // The 8 x 8 coarse grid (i, j even) makes the first 64 cells.
    expect(Array.from(order.subarray(0, 64)).every((c) => (c % 16) % 2 === 0 && Math.floor(c / 16) % 2 === 0)).toBe(true);
  });

  it('a bad spec is reported as an error, not thrown', () => {
    const h = inProcessLink();
    const st = createStudyStore(h.link);
    st.start({ surface, variables: ['x', 'y'], spec: { ...spec, resolution: 7 }, configLabel: 'GD', known: minima, basinRadius: 0.01 * Math.hypot(10, 10) });
    h.drain();
    expect(st.store.getState()).toMatchObject({ status: 'error', message: 'start-point map: resolution must be a whole number from 16 to 512, got 7' });
  });

  it('cancel stops the study: no more cells arrive', () => {
    const h = inProcessLink();
    const st = createStudyStore(h.link);
    st.start({ surface, variables: ['x', 'y'], spec, configLabel: 'GD', known: minima, basinRadius: 0.01 * Math.hypot(10, 10) });
    st.cancel();
    h.drain();
    expect(st.store.getState().status).toBe('cancelled');
    expect(st.store.getState().done).toBe(0);
  });
});

describe('multi-start through the worker', () => {
  it('runs N seeded starts, each identical to its lone run, and returns the quartile bands of the loss', async () => {
    const { drawStarts, summariseStarts } = await import('../../src/engine');
    const h = inProcessLink();
    const st = createStudyStore(h.link);
    const ms = { kind: 'multi-start' as const, optimizer: { kind: 'adam' as const, learningRate: 0.05 }, stop: { maxSteps: 400, gradientNormTolerance: 1e-8 }, seed: 1, distribution: { kind: 'uniform' as const, box: [[-5, 5], [-5, 5]] as [number, number][] }, count: 40, startSeed: 3 };
    st.start({ surface, variables: ['x', 'y'], spec: ms, configLabel: 'Adam', known: minima, basinRadius: 0.1 });
    h.drain();
    const s = st.store.getState();
    expect(s.status).toBe('done');
    expect(s.bands).toHaveLength(3);
    const [q1, med, q3] = s.bands!;
    expect(med.length).toBe(401);
    for (let t = 0; t < med.length; t++) expect(q1[t] <= med[t] && med[t] <= q3[t]).toBe(true);
    const starts = drawStarts(ms.distribution, 2, 40, 3);
    const himmelblau = buildSurface(surface);
    const lone = new RunCursor(himmelblau, buildOptimizer(ms.optimizer), { start: Array.from(starts.subarray(14, 16)), seed: 1, stop: ms.stop });
    lone.runToEnd();
    expect(Array.from(s.cells!.endPoints.subarray(14, 16))).toEqual(Array.from(lone.state.x));
    const results = Array.from({ length: 40 }, (_, c) => ({ outcome: s.cells!.outcomes[c]!, finalLoss: s.cells!.loss[c], endPoint: s.cells!.endPoints.subarray(2 * c, 2 * c + 2), stepsToTolerance: null }));
    const summary = summariseStarts(results, 1e-6, 0);
    expect(summary.runs).toBe(40);
    expect(summary.successes).toBe(summary.converged); // every converged Adam run on Himmelblau ends at a global minimum (f = 0)
  });
});

describe('learning-rate sweep through the worker', () => {
  it('on x^2 + 10 y^2 (lambda_max = 20) the observed thresholds are 2/lambda_max for GD and 2(1+mu)/lambda_max for heavy ball, to 1e-6, as predicted', () => {
    // Standard quadratic stability results (common practice): GD stable for lr < 2/lambda_max = 0.1;
    // heavy ball with mu = 0.9 for lr < 2(1 + mu)/lambda_max = 0.19.
    const h = inProcessLink();
    const st = createStudyStore(h.link);
    const sweep = {
      kind: 'lr-sweep' as const,
      optimizers: [{ label: 'GD', spec: { kind: 'gd' as const, learningRate: 0.01 } }, { label: 'heavy ball', spec: { kind: 'momentum' as const, learningRate: 0.01, hyper: { momentum: 0.9 } } }],
      stop: { maxSteps: 2000, gradientNormTolerance: 1e-10 },
      seed: 1,
      start: [1, 1],
      range: [0.01, 1] as [number, number],
      count: 32,
    };
    st.start({ surface: { kind: 'formula', text: 'x^2 + 10*y^2' }, variables: ['x', 'y'], spec: sweep, configLabel: 'GD', known: [], basinRadius: 0.01 });
    h.drain();
    const s = st.store.getState();
    expect(s.status).toBe('done');
    expect(s.done).toBe(64);
    const [gd, hb] = s.thresholds!;
    expect(gd.lambdaMax).toBeCloseTo(20, 10);
    expect(gd.predicted).toBeCloseTo(0.1, 12);
    expect(hb.predicted).toBeCloseTo(0.19, 12);
    expect(gd.observed!.refined && hb.observed!.refined).toBe(true);
    expect(Math.abs(Math.sqrt(gd.observed!.lo * gd.observed!.hi) / 0.1 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(Math.sqrt(hb.observed!.lo * hb.observed!.hi) / 0.19 - 1)).toBeLessThan(1e-6);
    // The sweep's own cells: every GD rate below 0.1 converged, every one above diverged.
    const rates = Array.from({ length: 32 }, (_, k) => 0.01 * 100 ** (k / 31));
    rates.forEach((lr, k) => expect(s.cells!.outcomes[k]!.kind, `lr ${lr}`).toBe(lr < 0.1 ? 'converged' : 'diverged'));
  });
});
