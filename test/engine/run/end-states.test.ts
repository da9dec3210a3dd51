import { describe, expect, it } from 'vitest';
import { buildOptimizer, compileFormula, RunCursor, type OptimizerSpec, type RunOutcome, type StopRules, type Surface } from '../../../src/engine';
import { buildSurface } from '../../../src/problems';
import functions from '../../fixtures/test-functions.json';

/**
 * One constructed case per end state (README: Outcomes), each with the expected outcome and detail.
 * Sources: published Himmelblau points from test/fixtures/test-functions.json (copied from the shared
 * reference file); the stability line of gradient descent on a quadratic, lr < 2 / lambda_max
 * (common practice: the iteration matrix I - lr H has spectral radius < 1 exactly then); the other
 * surfaces are worked out by hand in each case's comment.
 */
function run(surface: Surface, spec: OptimizerSpec, start: number[], stop: StopRules): RunOutcome {
  const cursor = new RunCursor(surface, buildOptimizer(spec), { start, seed: 1, stop });
  cursor.runToEnd(512);
  return cursor.outcome!;
}

const gd = (learningRate: number): OptimizerSpec => ({ kind: 'gd', learningRate });
const plainNewton: OptimizerSpec = { kind: 'newton', learningRate: 1 };
const STOP: StopRules = { maxSteps: 3000, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-8 };

/** f = x^2 + 10 y^2: eigenvalues 2 and 20, so lambda_max = 20 and 2 / lambda_max = 0.1. */
const bowl = compileFormula('x^2 + 10*y^2');

describe('gradient descent at the stability line of a quadratic (2 / lambda_max = 0.1)', () => {
  it('exactly at 2 / lambda_max: y flips sign forever, the loss stops changing, and the outcome is oscillating, not converged', () => {
    const o = run(bowl, gd(0.1), [1, 1], STOP);
    // y_{t+1} = (1 - 0.1 * 20) y_t = -y_t exactly; x_t = 0.8^t dies out; f -> 10, |grad| -> 20.
    expect(o).toMatchObject({ kind: 'oscillating', period: 2, point: { stationary: false } });
    if (o.kind !== 'oscillating') throw new Error('unreachable');
    expect(o.amplitude).toBeCloseTo(1, 12);
    expect(o.point.gradNorm).toBeCloseTo(20, 10);
  });

  it('with no loss-change rule it is still called oscillating at the step limit', () => {
    expect(run(bowl, gd(0.1), [1, 1], { maxSteps: 500 })).toMatchObject({ kind: 'oscillating', period: 2, step: 500 });
  });

  it('just below (0.99 x) it converges to the minimum; just above (1.01 x) it diverges', () => {
    expect(run(bowl, gd(0.099), [1, 1], STOP)).toMatchObject({ kind: 'converged', point: { stationary: true, curvature: { kind: 'minimum', smallest: 2, largest: 20 } } });
    expect(run(bowl, gd(0.101), [1, 1], STOP)).toMatchObject({ kind: 'diverged', reason: 'blow-up' });
  });
});

describe('Himmelblau: plain Newton is drawn to whatever stationary point is near', () => {
  const himmelblau = buildSurface({ kind: 'catalogue', id: 'himmelblau' });
  const points = functions.functions.himmelblau.points;

  it.each(points.filter((p) => p.kind === 'saddle'))('stops at the published saddle ($x, $y) and says saddle of index 1', (p) => {
    const o = run(himmelblau, plainNewton, [p.x + 0.05, p.y - 0.05], STOP);
    expect(o).toMatchObject({ kind: 'saddle', index: 1, point: { stationary: true, curvature: { kind: 'saddle', negative: 1, positive: 1 } } });
    if (o.kind !== 'saddle') throw new Error('unreachable');
    expect(o.point.curvature!.smallest).toBeCloseTo(p.hessianEigenvalues[0], 5);
    expect(o.point.curvature!.largest).toBeCloseTo(p.hessianEigenvalues[1], 5);
  });

  it('stops at the published local maximum and says maximum', () => {
    const p = points.find((q) => q.kind === 'local-max')!;
    expect(run(himmelblau, plainNewton, [p.x + 0.05, p.y + 0.05], STOP)).toMatchObject({ kind: 'maximum', point: { curvature: { kind: 'maximum', negative: 2 } } });
  });

  it('the robust variant (saddle-free with backtracking) from the same start reaches a minimum', () => {
    const p = points.find((q) => q.kind === 'saddle')!;
    const robust: OptimizerSpec = { kind: 'newton', learningRate: 1, hyper: { variant: 'saddle-free', lineSearch: 'backtracking' } };
    expect(run(himmelblau, robust, [p.x + 0.05, p.y - 0.05], STOP)).toMatchObject({ kind: 'converged', point: { curvature: { kind: 'minimum' } } });
  });
});

describe('runs that leave for infinity', () => {
  it('Newton on exp(-x) + y^2 drifts along the flat direction (gradient -> 0, step stays 1): escaping, not converged', () => {
    // f' = -exp(-x), f'' = exp(-x): the Newton step in x is +1 forever while |grad| = exp(-x) -> 0.
    const o = run(compileFormula('exp(-x) + y^2'), plainNewton, [0, 1], STOP);
    expect(o.kind).toBe('escaping');
    if (o.kind !== 'escaping') throw new Error('unreachable');
    expect(o.detail).toMatch(/drifting along a flat direction/);
  });

  it('Newton on log(1 + x^2) from x = 2 runs off (x_{k+1} = 2 x^3 / (x^2 - 1)) with the loss climbing: escaping', () => {
    // (200 steps take x to about 1e60; much later x^2 overflows and the garbage Hessian throws the point back to 0.)
    const o = run(compileFormula('log(1 + x^2) + y^2'), plainNewton, [2, 0], { maxSteps: 200, lossChangeTolerance: 1e-12 });
    expect(o.kind).toBe('escaping');
    if (o.kind !== 'escaping') throw new Error('unreachable');
    expect(o.detail).toMatch(/parameters keep growing/);
  });

  it('gradient descent on x^2 - y^2 (unbounded below) from just off the saddle: the loss falls without bound, escaping', () => {
    // y_t = 0.01 * 1.2^t: |y| passes 1e29 by step 400 and the loss -1e58.
    const o = run(compileFormula('x^2 - y^2'), gd(0.1), [1, 0.01], { maxSteps: 400 });
    expect(o.kind).toBe('escaping');
    if (o.kind !== 'escaping') throw new Error('unreachable');
    expect(o.detail).toMatch(/loss keeps falling without bound/);
  });

  it('and on -x^2 - y^2 run long enough to overflow: the loss reaches -Infinity, escaping (not diverged)', () => {
    expect(run(compileFormula('-(x^2) - y^2'), gd(0.5), [1, 1], { maxSteps: 5000 })).toMatchObject({ kind: 'escaping' });
  });
});

describe('points where the surface is undefined', () => {
  it('a start outside the domain says so and why, at the start, not "diverged"', () => {
    const o = run(compileFormula('log(x) + y^2'), gd(0.1), [-2, 0], STOP);
    expect(o).toEqual({ kind: 'undefined', step: 0, detail: 'the loss is not defined at the start (log of a negative number (-2) (columns 1-6))' });
  });

  it("a start at Ackley's published minimum (a cone point) says the gradient does not exist there", () => {
    const o = run(buildSurface({ kind: 'catalogue', id: 'ackley' }), gd(0.01), [0, 0], STOP);
    expect(o.kind).toBe('undefined');
    expect(o.step).toBe(0);
    if (o.kind !== 'undefined') throw new Error('unreachable');
    expect(o.detail).toMatch(/gradient does not exist at the start.*sqrt at 0 has no derivative/);
  });

  it('a step that leaves the domain is reported at that step with the reason', () => {
    // x_1 = 1 - 2 * 0.75 * ... : GD on sqrt(x) + y^2 from x = 0.01 with lr 1 steps to x = 0.01 - 1/(2 sqrt(0.01)) = -4.99.
    const o = run(compileFormula('sqrt(x) + y^2'), gd(1), [0.01, 0], STOP);
    expect(o).toMatchObject({ kind: 'undefined', step: 1 });
    if (o.kind !== 'undefined') throw new Error('unreachable');
    expect(o.detail).toMatch(/left the surface's domain: square root of a negative number/);
  });
});

describe('stalled and flat ends', () => {
  it('a loss-change rule that fires on a plateau far from the minimum is stalled, with the gradient in the detail', () => {
    // f = 1 - exp(-(x^2 + y^2)) at (4, 0): |grad| = 8 exp(-16) = 9.0e-7, so a step of lr 1 changes the
    // loss by about |grad|^2 = 8e-13 <= 1e-12 (relative to max(1, f) = 1); the minimum is at the origin.
    const o = run(compileFormula('1 - exp(-(x^2 + y^2))'), gd(1), [4, 0], { maxSteps: 3000, lossChangeTolerance: 1e-12 });
    expect(o.kind).toBe('stalled');
    if (o.kind !== 'stalled') throw new Error('unreachable');
    expect(o.detail).toMatch(/^the loss stopped changing .* at gradient norm .* above the stationarity test/);
  });

  it('the step limit reports the end point (gradient norm, not stationary)', () => {
    expect(run(buildSurface({ kind: 'catalogue', id: 'rosenbrock' }), gd(0.001), [-1.2, 1], { maxSteps: 100 })).toMatchObject({ kind: 'step-limit', step: 100, point: { stationary: false, curvature: null } });
  });

  it('cancel judges the point where the run stands', () => {
    const cursor = new RunCursor(bowl, buildOptimizer(gd(0.05)), { start: [1, 1], seed: 1, stop: { maxSteps: 1000 } });
    cursor.advance(10);
    expect(cursor.cancel()).toMatchObject({ kind: 'cancelled', step: 10, point: { stationary: false } });
  });
});
