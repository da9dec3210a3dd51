import { describe, expect, it } from 'vitest';
import {
  buildOptimizer,
  concatBatches,
  createMinibatchState,
  createRng,
  isRowwiseSurface,
  nextMinibatch,
  RunCursor,
  stepsForEpochs,
  type Optimizer,
  type RowwiseSurface,
  type Surface,
} from '../../../src/engine';
import { plainDescent } from './optimizers';

/**
 * A hand-written row-wise surface: the mean squared error of the line y = w0 + w1 t over five rows,
 * plus 0.1/2 |w|^2, written out here so the run loop is tested apart from the data-fit models.
 */
const T = [0, 1, 2, 3, 4];
const Y = [1, 2.5, 2.9, 4.2, 5.1];
const L2 = 0.1;

function lineFit(): RowwiseSurface {
  const onRows = (w: ArrayLike<number>, g: Float64Array, h: Float64Array | null, rows: ArrayLike<number>, count: number) => {
    let f = 0;
    g.fill(0);
    h?.fill(0);
    const scale = 1 / count;
    for (let k = 0; k < count; k++) {
      const i = rows[k];
      const r = w[0] + w[1] * T[i] - Y[i];
      f += scale * r * r;
      g[0] += 2 * scale * r;
      g[1] += 2 * scale * r * T[i];
      if (h) {
        h[0] += 2 * scale;
        h[1] += 2 * scale * T[i];
        h[3] += 2 * scale * T[i] * T[i];
      }
    }
    if (h) {
      h[2] = h[1];
      h[0] += L2;
      h[3] += L2;
    }
    g[0] += L2 * w[0];
    g[1] += L2 * w[1];
    return f + 0.5 * L2 * (w[0] * w[0] + w[1] * w[1]);
  };
  const all = Int32Array.from(T.keys());
  const scratch = new Float64Array(2);
  return {
    dimension: 2,
    variables: ['w0', 'w1'],
    rows: T.length,
    value: (w) => onRows(w, scratch, null, all, all.length),
    valueGradient: (w, g) => onRows(w, g, null, all, all.length),
    valueGradientHessian: (w, g, h) => onRows(w, g, h, all, all.length),
    valueGradientOnRows: (w, g, rows, count) => onRows(w, g, null, rows, count),
    valueGradientHessianOnRows: (w, g, h, rows, count) => onRows(w, g, h, rows, count),
  };
}

/** An optimizer that never moves and records what it was shown. */
function recorder(): Optimizer<null> & { seen: { loss: number; grad: number[] }[] } {
  const seen: { loss: number; grad: number[] }[] = [];
  return {
    label: 'recorder',
    seen,
    init: () => null,
    step(_x, g, _s, ctx) {
      seen.push({ loss: ctx.loss, grad: Array.from(g) });
      return { learningRate: 0, extraEvaluations: 0 };
    },
  };
}

describe('stepsForEpochs', () => {
  it('is epochs * ceil(rows / batch)', () => {
    expect(stepsForEpochs(150, 150, 3)).toBe(3);
    expect(stepsForEpochs(150, 32, 2)).toBe(10);
    expect(stepsForEpochs(5, 1, 4)).toBe(20);
  });

  it('refuses sizes it cannot mean', () => {
    expect(() => stepsForEpochs(10, 0, 1)).toThrow('stepsForEpochs: batchSize must be a whole number >= 1, got 0');
    expect(() => stepsForEpochs(10, 11, 1)).toThrow('stepsForEpochs: batchSize must be at most rows (10), got 11');
    expect(() => stepsForEpochs(10, 2, 1.5)).toThrow('stepsForEpochs: epochs must be a whole number >= 1, got 1.5');
  });
});

describe('nextMinibatch', () => {
  it('uses every row once per epoch, the last batch holding the remainder', () => {
    const state = createMinibatchState(7);
    const rng = createRng(3);
    const batch = new Int32Array(3);
    for (let epoch = 1; epoch <= 4; epoch++) {
      const seen: number[] = [];
      const counts: number[] = [];
      for (let k = 0; k < 3; k++) {
        const count = nextMinibatch(state, 3, rng, batch);
        counts.push(count);
        seen.push(...batch.subarray(0, count));
        expect(state.epoch).toBe(epoch);
      }
      expect(counts).toEqual([3, 3, 1]);
      expect(seen.sort()).toEqual([0, 1, 2, 3, 4, 5, 6]);
    }
  });

  it('shuffles each epoch afresh, the same way for the same seed', () => {
    const orders = (seed: number) => {
      const state = createMinibatchState(20);
      const rng = createRng(seed);
      const batch = new Int32Array(20);
      return [1, 2, 3].map(() => (nextMinibatch(state, 20, rng, batch), Array.from(batch)));
    };
    const a = orders(11);
    expect(orders(11)).toEqual(a);
    expect(orders(12)).not.toEqual(a);
    expect(a[0]).not.toEqual(a[1]);
  });
});

describe('RunCursor with minibatches', () => {
  const start = [0, 0];

  it('the test surface is row-wise; a plain surface is not', () => {
    expect(isRowwiseSurface(lineFit())).toBe(true);
    const plain: Surface = { dimension: 1, variables: ['x'], value: () => 0, valueGradient: () => 0, valueGradientHessian: () => 0 };
    expect(isRowwiseSurface(plain)).toBe(false);
    expect(() => new RunCursor(plain, plainDescent(0.1), { start: [0], seed: 1, stop: { maxSteps: 3 }, minibatch: { size: 1 } })).toThrow(
      'minibatch: this surface has no data rows, so it cannot be split into batches',
    );
  });

  it.each([
    [0, 'got 0'],
    [6, 'got 6'],
    [2.5, 'got 2.5'],
  ])('rejects batch size %s', (size, got) => {
    expect(() => new RunCursor(lineFit(), plainDescent(0.1), { start, seed: 1, stop: { maxSteps: 3 }, minibatch: { size } })).toThrow(
      `minibatch: size must be a whole number from 1 to 5 (the number of rows), ${got}`,
    );
  });

  it('the optimizer sees batch losses and gradients that average to the full ones over an epoch', () => {
    const surface = lineFit();
    const x = [0.3, 0.7];
    const opt = recorder();
    // Batches of 2 over 5 rows: sizes 2, 2, 1 per epoch; weights count / rows.
    const cursor = new RunCursor(surface, opt, { start: x, seed: 5, stop: { maxSteps: 6 }, minibatch: { size: 2 } });
    cursor.runToEnd();
    const fullGrad = new Float64Array(2);
    const fullLoss = surface.valueGradient(x, fullGrad);
    for (const epoch of [opt.seen.slice(0, 3), opt.seen.slice(3, 6)]) {
      const weights = [2 / 5, 2 / 5, 1 / 5];
      // The penalty is in every batch in full, so the weighted mean of the batch values is the full value.
      const loss = epoch.reduce((acc, s, k) => acc + weights[k] * s.loss, 0);
      const g0 = epoch.reduce((acc, s, k) => acc + weights[k] * s.grad[0], 0);
      const g1 = epoch.reduce((acc, s, k) => acc + weights[k] * s.grad[1], 0);
      expect(loss).toBeCloseTo(fullLoss, 12);
      expect(g0).toBeCloseTo(fullGrad[0], 12);
      expect(g1).toBeCloseTo(fullGrad[1], 12);
      expect(epoch[0].grad).not.toEqual(epoch[1].grad);
    }
    expect(cursor.state.minibatch?.epoch).toBe(2);
  });

  it('records the exact full-data loss and gradient norm, not the batch ones', () => {
    const surface = lineFit();
    const b = concatBatches(new RunCursor(surface, plainDescent(0.05), { start, seed: 2, stop: { maxSteps: 40 }, minibatch: { size: 1 } }).runToEnd(), 2);
    const g = new Float64Array(2);
    for (const k of [0, 1, 17, 40]) {
      const p = b.points.subarray(2 * k, 2 * k + 2);
      expect(b.loss[k]).toBe(surface.valueGradient(p, g));
      expect(b.gradNorm[k]).toBeCloseTo(Math.hypot(g[0], g[1]), 14);
    }
  });

  it('a batch of every row follows the full-batch run (same sums in another order)', () => {
    const full = concatBatches(new RunCursor(lineFit(), plainDescent(0.05), { start, seed: 1, stop: { maxSteps: 30 } }).runToEnd(), 2);
    const batched = concatBatches(new RunCursor(lineFit(), plainDescent(0.05), { start, seed: 1, stop: { maxSteps: 30 }, minibatch: { size: 5 } }).runToEnd(), 2);
    expect(batched.count).toBe(full.count);
    for (let i = 0; i < full.points.length; i++) expect(batched.points[i]).toBeCloseTo(full.points[i], 12);
  });

  it('same seed, same batches and path; another seed, another path', () => {
    const run = (seed: number) =>
      Array.from(concatBatches(new RunCursor(lineFit(), plainDescent(0.05), { start, seed, stop: { maxSteps: 25 }, minibatch: { size: 2 } }).runToEnd(), 2).points);
    expect(run(9)).toEqual(run(9));
    expect(run(9)).not.toEqual(run(10));
  });

  it('line-search and Newton steps work on the current batch; the recorded loss is still the full one', () => {
    for (const spec of [
      { kind: 'lbfgs' as const, learningRate: 1 },
      { kind: 'newton' as const, learningRate: 1, hyper: { lineSearch: 'backtracking' } },
    ]) {
      const surface = lineFit();
      const cursor = new RunCursor(surface, buildOptimizer(spec), { start, seed: 4, stop: { maxSteps: 12 }, minibatch: { size: 2 } });
      const b = concatBatches(cursor.runToEnd(), 2);
      const last = b.count - 1;
      expect(b.loss[last]).toBe(surface.value(b.points.subarray(2 * last, 2 * last + 2)));
      // Newton with a batch Hessian lands on the batch's own minimiser, which is not the full one.
      expect(b.loss[last]).toBeLessThan(b.loss[0]);
    }
  });

  it('counts one evaluation per batch', () => {
    const cursor = new RunCursor(lineFit(), plainDescent(0.05), { start, seed: 1, stop: { maxSteps: 10 }, minibatch: { size: 2 } });
    cursor.runToEnd();
    // The start, then per step one batch evaluation and one full evaluation for the record.
    expect(cursor.state.evaluations).toBe(1 + 10 * 2);
  });
});
