import { describe, expect, it } from 'vitest';
import { RunCursor, concatBatches, type Surface } from '../../../src/engine';
import { plainDescent } from './optimizers';

/** f = x^2 + 10 y^2: the quadratic of the reference worked examples. */
const bowl: Surface = {
  dimension: 2,
  variables: ['x', 'y'],
  value: (p) => p[0] * p[0] + 10 * p[1] * p[1],
  valueGradient(p, g) {
    g[0] = 2 * p[0];
    g[1] = 20 * p[1];
    return this.value(p);
  },
  valueGradientHessian(p, g, h) {
    h.set([2, 0, 0, 20]);
    return this.valueGradient(p, g);
  },
};

describe('RunCursor', () => {
  it('records step 0 then each step; GD lr=0.05 from (1,1) gives the worked-example iterates', () => {
    // Worked example (reference optimizer-rules.md, section 12): (0.9, 0), (0.81, 0), (0.729, 0).
    const c = new RunCursor(bowl, plainDescent(0.05), { start: [1, 1], seed: 1, stop: { maxSteps: 3 } });
    const b = concatBatches(c.runToEnd(2), 2);
    expect(b.count).toBe(4);
    expect(Array.from(b.points)).toEqual([1, 1, 0.9, 0, 0.81, 0, 0.7290000000000001, 0]);
    expect(b.loss[0]).toBe(11);
    expect(b.loss[3]).toBeCloseTo(0.531441, 12);
    expect(Number.isNaN(b.learningRate[0])).toBe(true);
    expect(b.learningRate[1]).toBe(0.05);
    expect(c.outcome).toMatchObject({ kind: 'step-limit', step: 3, point: { stationary: false, curvature: null } });
    // |grad| at (0.729, 0) is 1.458; the start's is |(2, 20)| = 20.0998, so the test is 1e-5 of that.
    expect(c.outcome && 'point' in c.outcome && c.outcome.point.gradNorm).toBeCloseTo(1.458, 12);
  });

  it('batches continue where the previous one ended', () => {
    const c = new RunCursor(bowl, plainDescent(0.01), { start: [1, 1], seed: 1, stop: { maxSteps: 10 } });
    const a = c.advance(4);
    const b = c.advance(4);
    expect([a.firstStep, a.count, b.firstStep, b.count]).toEqual([0, 5, 5, 4]);
  });

  it('converges by the gradient-norm rule and says at which step', () => {
    const c = new RunCursor(bowl, plainDescent(0.05), {
      start: [1, 1],
      seed: 1,
      stop: { maxSteps: 1000, gradientNormTolerance: 1e-6 },
    });
    c.runToEnd();
    // |x_t| = 0.9^t and grad = 2 x: 2 * 0.9^t <= 1e-6 first at t = ceil(log(5e-7)/log(0.9)) = 138.
    expect(c.outcome).toMatchObject({ kind: 'converged', rule: 'gradient-norm', step: 138, point: { stationary: true, curvature: { kind: 'minimum', smallest: 2, largest: 20 } } });
  });

  it('a loss-change rule that fires at a large gradient is "stalled", not converged', () => {
    const c = new RunCursor(bowl, plainDescent(0.05), {
      start: [1, 1],
      seed: 1,
      stop: { maxSteps: 1000, lossChangeTolerance: 1e-3, lossChangePatience: 2 },
    });
    c.runToEnd();
    // f_t = 0.81^t for t >= 1; |f_t - f_{t-1}| = 0.19 * 0.81^(t-1) <= 1e-3 from t = 26 on (0.19*0.81^25 = 9.2e-4),
    // and t = 1 changes by 10.19 from f_0 = 11; so the second calm step is t = 27. There |grad| = 2 * 0.9^27
    // = 0.116, far above the stationarity test 1e-5 * 20.0998: the rule fired, the run did not converge.
    expect(c.outcome).toMatchObject({ kind: 'stalled', rule: 'loss-change', step: 27, point: { stationary: false } });
    expect(c.outcome && 'detail' in c.outcome && c.outcome.detail).toMatch(/loss stopped changing .* at gradient norm 0\.116, above the stationarity test 0\.000201/);
  });

  it('the same loss-change rule, once the gradient has fallen by 1e-5, is "converged"', () => {
    const c = new RunCursor(bowl, plainDescent(0.05), { start: [1, 1], seed: 1, stop: { maxSteps: 1000, lossChangeTolerance: 1e-12, lossChangePatience: 2 } });
    c.runToEnd();
    // 0.19 * 0.81^(t-1) <= 1e-12 from t = 125 (0.81^124 = 4.6e-12 * ...); second calm step t = 126; |grad| = 2 * 0.9^126 = 3.3e-6 <= 2.0e-4.
    expect(c.outcome).toMatchObject({ kind: 'converged', rule: 'loss-change', point: { stationary: true } });
    const o = c.outcome!;
    expect(0.19 * 0.81 ** (o.step - 1)).toBeLessThanOrEqual(1e-12);
    expect(0.19 * 0.81 ** (o.step - 3)).toBeGreaterThan(1e-12);
  });

  it('reports divergence with its step: GD above 2/lambda_max blows up', () => {
    const c = new RunCursor(bowl, plainDescent(0.2), { start: [1, 1], seed: 1, stop: { maxSteps: 10_000 } });
    c.runToEnd();
    const o = c.outcome!;
    expect(o.kind).toBe('diverged');
    // y_t = (1 - 0.2*20)^t = (-3)^t, so f ~ 10 * 9^t exceeds 11 + 1e8 * 11 first at t = 9.
    expect(o.step).toBe(9);
  });

  it('catches a non-finite loss and names the step', () => {
    const cliff: Surface = { ...bowl, value: (p) => (p[0] < 0.5 ? Number.NaN : p[0] * p[0]), valueGradient(p, g) { g[0] = 2 * p[0]; g[1] = 0; return this.value(p); } };
    const c = new RunCursor(cliff, plainDescent(0.1), { start: [1, 0], seed: 1, stop: { maxSteps: 100 } });
    c.runToEnd();
    // x_t = 0.8^t < 0.5 first at t = 4.
    expect(c.outcome).toMatchObject({ kind: 'diverged', reason: 'non-finite', step: 4 });
  });

  it('same seed, same noisy numbers; another seed, other numbers; recorded gradient norm stays exact', () => {
    const settings = (seed: number) => ({ start: [1, 1], seed, gradientNoise: 0.5, stop: { maxSteps: 50 } });
    const run = (seed: number) => concatBatches(new RunCursor(bowl, plainDescent(0.01), settings(seed)).runToEnd(), 2);
    const a = run(7);
    const b = run(7);
    const c = run(8);
    expect(Array.from(a.points)).toEqual(Array.from(b.points));
    expect(Array.from(a.points)).not.toEqual(Array.from(c.points));
    const last = a.count - 1;
    const [x, y] = [a.points[2 * last], a.points[2 * last + 1]];
    expect(a.gradNorm[last]).toBeCloseTo(Math.hypot(2 * x, 20 * y), 12);
  });

  it('rejects bad settings with the field named', () => {
    expect(() => new RunCursor(bowl, plainDescent(0.1), { start: [1], seed: 1, stop: { maxSteps: 5 } })).toThrow(/start: expected 2 coordinates, got 1/);
    expect(() => new RunCursor(bowl, plainDescent(0.1), { start: [1, Number.NaN], seed: 1, stop: { maxSteps: 5 } })).toThrow(/coordinate 2 must be a finite number/);
    expect(() => new RunCursor(bowl, plainDescent(0.1), { start: [1, 1], seed: 1, stop: { maxSteps: 0 } })).toThrow(/maxSteps must be a whole number/);
  });
});

describe('outcome text', () => {
  it('says which rule, or at which step and why', async () => {
    const { describeOutcome, outcomeLabel } = await import('../../../src/engine');
    const point = { gradNorm: 1e-9, gradThreshold: 1e-4, stationary: true, newtonStep: 1e-9, curvature: { kind: 'minimum' as const, negative: 0, zero: 0, positive: 2, smallest: 2, largest: 20, eigenvalues: [2, 20], method: 'exact' as const } };
    expect(describeOutcome({ kind: 'converged', rule: 'gradient-norm', step: 138, point })).toBe('converged at step 138');
    expect(describeOutcome({ kind: 'saddle', rule: 'no-step', step: 7, index: 1, point })).toBe('saddle point (index 1) at step 7');
    expect(outcomeLabel({ kind: 'diverged', reason: 'blow-up', step: 9, detail: 'the loss rose to 1e9' })).toBe('diverged at step 9 (loss blew up)');
    expect(outcomeLabel({ kind: 'step-limit', step: 5, point: { ...point, stationary: false, curvature: null } })).toBe('step limit');
    expect(describeOutcome({ kind: 'undefined', step: 0, detail: 'log of a negative number' })).toBe('undefined at start: log of a negative number');
  });
});

describe('loss-change rule and a schedule that decays to zero', () => {
  it('a run whose learning rate reached 0 ends at the step limit, not "converged"', async () => {
    const { buildOptimizer } = await import('../../../src/engine');
    // Cosine to a floor of 0 over 10 steps on the bowl from (1, 1): far from the minimum when the rate hits 0.
    const optimizer = buildOptimizer({ kind: 'gd', learningRate: 0.001, schedule: { kind: 'cosine', horizon: 10 } });
    const c = new RunCursor(bowl, optimizer, { start: [1, 1], seed: 1, stop: { maxSteps: 40, lossChangeTolerance: 1e-9 } });
    const b = concatBatches(c.runToEnd(), 2);
    expect(b.learningRate[11]).toBe(0);
    expect(b.loss[b.count - 1]).toBeGreaterThan(5);
    expect(c.outcome).toMatchObject({ kind: 'step-limit', step: 40, point: { stationary: false } });
  });
});
