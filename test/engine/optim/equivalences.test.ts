import { describe, expect, it } from 'vitest';
import type { OptimizerSpec, Surface } from '../../../src/engine';
import { pointAt, runSpec } from './run';
import { bowl, flat, quadratic, rosenbrock, rotatedDiagonal } from './surfaces';

/** Identities that must hold between configurations (DESIGN.md habit 9: equivalences as oracles). */
const path = (surface: Surface, spec: OptimizerSpec, start: number[], steps = 200) => Array.from(runSpec(surface, spec, start, { maxSteps: steps }).batch.points);

const valley = quadratic(rotatedDiagonal(1, 10, 0.3), [1, 1]);

describe('equivalences', () => {
  it('momentum with beta = 0 is gradient descent (same floats)', () => {
    expect(path(rosenbrock, { kind: 'momentum', learningRate: 0.001, hyper: { momentum: 0 } }, [-1.2, 1])).toEqual(
      path(rosenbrock, { kind: 'gd', learningRate: 0.001 }, [-1.2, 1]),
    );
  });

  it('Nesterov with beta = 0 is gradient descent, in both forms', () => {
    const gd = path(rosenbrock, { kind: 'gd', learningRate: 0.001 }, [-1.2, 1]);
    expect(path(rosenbrock, { kind: 'nesterov', learningRate: 0.001, hyper: { momentum: 0 } }, [-1.2, 1])).toEqual(gd);
    expect(path(rosenbrock, { kind: 'nesterov', learningRate: 0.001, hyper: { momentum: 0, form: 'record-base-point' } }, [-1.2, 1])).toEqual(gd);
  });

  it("Nesterov 'record-look-ahead' stores the look-ahead point theta_t + mu v_t of the 'record-base-point' form (reference section 3)", () => {
    const mu = 0.9;
    const lib = runSpec(valley, { kind: 'nesterov', learningRate: 0.01, hyper: { momentum: mu } }, [-1, 2], { maxSteps: 50 }).batch;
    const sut = runSpec(valley, { kind: 'nesterov', learningRate: 0.01, hyper: { momentum: mu, form: 'record-base-point' } }, [-1, 2], { maxSteps: 51 }).batch;
    // theta_t + mu v_t = theta_t + mu (theta_t - theta_{t-1}).
    for (let t = 1; t <= 50; t++) {
      const a = pointAt(sut, t);
      const b = pointAt(sut, t - 1);
      const look = a.map((v, i) => v + mu * (v - b[i]));
      const stored = pointAt(lib, t);
      for (let i = 0; i < 2; i++) expect(stored[i]).toBeCloseTo(look[i], 12);
    }
  });

  it('AdamW with weight decay 0 is Adam (same floats)', () => {
    expect(path(rosenbrock, { kind: 'adamw', learningRate: 0.01, weightDecay: 0 }, [-1.2, 1])).toEqual(path(rosenbrock, { kind: 'adam', learningRate: 0.01 }, [-1.2, 1]));
  });

  it("Adam with the decoupled weightDecay option is AdamW's 'times-learning-rate' form", () => {
    expect(path(rosenbrock, { kind: 'adam', learningRate: 0.01, weightDecay: 0.05 }, [-1.2, 1])).toEqual(
      path(rosenbrock, { kind: 'adamw', learningRate: 0.01, weightDecay: 0.05 }, [-1.2, 1]),
    );
  });

  it("AdamW's 'times-schedule' form with lambda equals the 'times-learning-rate' form with lambda / alpha (reference section 7)", () => {
    const paper = path(valley, { kind: 'adamw', learningRate: 0.05, weightDecay: 0.01, hyper: { decayForm: 'times-schedule' }, schedule: { kind: 'cosine', horizon: 200 } }, [-1, 2]);
    const library = path(valley, { kind: 'adamw', learningRate: 0.05, weightDecay: 0.01 / 0.05, schedule: { kind: 'cosine', horizon: 200 } }, [-1, 2]);
    paper.forEach((v, i) => expect(v).toBeCloseTo(library[i], 13));
  });

  it("AMSGrad's running maximum of the second moment never decreases", () => {
    // Reddi et al. 2018: the denominator sqrt(vmax) never decreases. Checked through the state.
    const { cursor } = runSpec(rosenbrock, { kind: 'amsgrad', learningRate: 0.01 }, [-1.2, 1], { maxSteps: 1 });
    let previous = new Float64Array(2);
    for (let k = 0; k < 300; k++) {
      cursor.advance(1);
      const vMax = (cursor.state.optimizerState as { stages: { vMax?: Float64Array }[] }).stages.find((s) => s && 'vMax' in s)!.vMax!;
      for (let i = 0; i < 2; i++) expect(vMax[i]).toBeGreaterThanOrEqual(previous[i]);
      previous = Float64Array.from(vMax);
    }
  });
});

describe('gradient clipping by global norm (Pascanu, Mikolov & Bengio 2013)', () => {
  it('rescales a long gradient to the clip norm, keeping its direction', () => {
    // At (1, 1) on the bowl g = (2, 20), |g| = sqrt(404); clipped to 1, the GD step is lr g / |g|.
    const { batch } = runSpec(bowl, { kind: 'gd', learningRate: 0.1, clipNorm: 1 }, [1, 1], { maxSteps: 1 });
    const n = Math.sqrt(404);
    expect(pointAt(batch, 1)[0]).toBeCloseTo(1 - (0.1 * 2) / n, 15);
    expect(pointAt(batch, 1)[1]).toBeCloseTo(1 - (0.1 * 20) / n, 15);
  });

  it('leaves a gradient shorter than the clip norm alone', () => {
    expect(path(bowl, { kind: 'momentum', learningRate: 0.01, clipNorm: 100 }, [1, 1], 50)).toEqual(path(bowl, { kind: 'momentum', learningRate: 0.01 }, [1, 1], 50));
  });

  it('bounds every GD step by lr * clipNorm on a steep surface', () => {
    const { batch } = runSpec(rosenbrock, { kind: 'gd', learningRate: 0.01, clipNorm: 2 }, [-1.2, 1], { maxSteps: 100 });
    for (let t = 1; t <= 100; t++) {
      const a = pointAt(batch, t);
      const b = pointAt(batch, t - 1);
      expect(Math.hypot(a[0] - b[0], a[1] - b[1])).toBeLessThanOrEqual(0.02 * (1 + 1e-12));
    }
  });
});

describe('coupled L2 penalty against decoupled weight decay (Loshchilov & Hutter, ICLR 2019)', () => {
  it('coincide under plain GD, where the decay is multiplied by the learning rate', () => {
    const l2 = path(valley, { kind: 'gd', learningRate: 0.05, l2Penalty: 0.3 }, [-1, 2]);
    const decoupled = path(valley, { kind: 'gd', learningRate: 0.05, weightDecay: 0.3 }, [-1, 2]);
    expect(l2).toEqual(decoupled);
  });

  it('coincide under plain GD with a schedule too', () => {
    const schedule = { kind: 'step' as const, decayRate: 0.5, decaySteps: 20 };
    expect(path(valley, { kind: 'gd', learningRate: 0.05, l2Penalty: 0.3, schedule }, [-1, 2])).toEqual(
      path(valley, { kind: 'gd', learningRate: 0.05, weightDecay: 0.3, schedule }, [-1, 2]),
    );
  });

  it('differ under Adam: the L2 gradient is normalised away, the decoupled decay is not', () => {
    // On a flat surface only the penalty acts. Adam + L2 sees g = l2 x and its first step is
    // lr * sign(x) (|mhat| / sqrt(vhat) = 1), whatever l2 is; decoupled decay shrinks x by lr * lambda * x.
    const start = [2, -0.5];
    const lr = 0.01;
    const lambda = 0.1;
    const coupled = runSpec(flat, { kind: 'adam', learningRate: lr, l2Penalty: lambda }, start, { maxSteps: 1 }).batch;
    const decoupled = runSpec(flat, { kind: 'adam', learningRate: lr, weightDecay: lambda }, start, { maxSteps: 1 }).batch;
    const c = pointAt(coupled, 1);
    const d = pointAt(decoupled, 1);
    expect(c[0]).toBeCloseTo(2 - lr, 6);
    expect(c[1]).toBeCloseTo(-0.5 + lr, 6);
    expect(d[0]).toBeCloseTo(2 * (1 - lr * lambda), 15);
    expect(d[1]).toBeCloseTo(-0.5 * (1 - lr * lambda), 15);
  });

  it('differ under Adam on a real surface: different end points after 500 steps', () => {
    const a = runSpec(valley, { kind: 'adam', learningRate: 0.02, l2Penalty: 0.5 }, [-1, 2], { maxSteps: 500 }).batch;
    const b = runSpec(valley, { kind: 'adam', learningRate: 0.02, weightDecay: 0.5 }, [-1, 2], { maxSteps: 500 }).batch;
    const pa = pointAt(a, 500);
    const pb = pointAt(b, 500);
    expect(Math.hypot(pa[0] - pb[0], pa[1] - pb[1])).toBeGreaterThan(1e-3);
  });

  it("L-BFGS and Newton minimise f + l2/2 |x|^2 when given an l2 penalty", () => {
    // Minimiser of 1/2 (x - c)^T A (x - c) + l2/2 |x|^2 solves (A + l2 I) x = A c.
    const A = [3, 1, 1, 2];
    const c = [1, 1];
    const l2 = 0.5;
    const M = [A[0] + l2, A[1], A[2], A[3] + l2];
    const rhs = [A[0] * c[0] + A[1] * c[1], A[2] * c[0] + A[3] * c[1]];
    const det = M[0] * M[3] - M[1] * M[2];
    const expected = [(M[3] * rhs[0] - M[1] * rhs[1]) / det, (M[0] * rhs[1] - M[2] * rhs[0]) / det];
    const surface = quadratic(A, c);
    const newton = runSpec(surface, { kind: 'newton', learningRate: 1, l2Penalty: l2 }, [-3, 4], { maxSteps: 1 }).batch;
    expect(pointAt(newton, 1)[0]).toBeCloseTo(expected[0], 13);
    expect(pointAt(newton, 1)[1]).toBeCloseTo(expected[1], 13);
    const lbfgs = runSpec(surface, { kind: 'lbfgs', learningRate: 1, l2Penalty: l2 }, [-3, 4], { maxSteps: 30 }).batch;
    const end = pointAt(lbfgs, lbfgs.count - 1);
    expect(end[0]).toBeCloseTo(expected[0], 8);
    expect(end[1]).toBeCloseTo(expected[1], 8);
  });
});
