import { describe, expect, it } from 'vitest';
import { distance, lastPoint, pointAt, runSpec } from './run';
import { quadratic, rosenbrock, saddle } from './surfaces';

describe("Newton's method", () => {
  it('plain Newton is drawn to a saddle point; saddle-free Newton is pushed away (Dauphin et al., NeurIPS 2014)', () => {
    // f = x^2 - y^2 from (1, 1): g = (2, -2), H = diag(2, -2).
    // Plain: x - H^-1 g = (0, 0), the saddle. Saddle-free: x - |H|^-1 g = (1 - 1, 1 + 1) = (0, 2).
    const plain = runSpec(saddle, { kind: 'newton', learningRate: 1 }, [1, 1], { maxSteps: 1 }).batch;
    expect(pointAt(plain, 1)).toEqual([0, 0]);
    const free = runSpec(saddle, { kind: 'newton', learningRate: 1, hyper: { variant: 'saddle-free' } }, [1, 1], { maxSteps: 3 }).batch;
    expect(pointAt(free, 1)).toEqual([0, 2]);
    // ... and keeps descending along the negative-curvature direction: y doubles each step.
    expect(pointAt(free, 3)).toEqual([0, 8]);
    expect(free.loss[3]).toBeLessThan(free.loss[1]);
  });

  it('the saddle-free eigenvalue floor bounds the step where the curvature vanishes', () => {
    // f = x^2 + 0 * y (flat in y) would give an infinite plain step; use f = x^2 + y (gradient (2x, 1)).
    const tilted = quadratic([2, 0, 0, 0], [0, 0]);
    const surface = {
      ...tilted,
      value: (p: ArrayLike<number>) => tilted.value(p) + p[1],
      valueGradient(p: ArrayLike<number>, g: Float64Array) {
        const f = tilted.valueGradient(p, g);
        g[1] += 1;
        return f + p[1];
      },
      valueGradientHessian(p: ArrayLike<number>, g: Float64Array, h: Float64Array) {
        const f = tilted.valueGradientHessian(p, g, h);
        g[1] += 1;
        return f + p[1];
      },
    };
    const b = runSpec(surface, { kind: 'newton', learningRate: 1, hyper: { variant: 'saddle-free', eigenvalueFloor: 0.5 } }, [1, 0], { maxSteps: 1 }).batch;
    // x: Newton step to 0; y: step -1 / 0.5 = -2.
    expect(pointAt(b, 1)[0]).toBeCloseTo(0, 15);
    expect(pointAt(b, 1)[1]).toBeCloseTo(-2, 15);
  });

  it('backtracking Newton never raises the loss on Rosenbrock and converges in a few dozen steps', () => {
    const { batch, cursor } = runSpec(rosenbrock, { kind: 'newton', learningRate: 1, hyper: { lineSearch: 'backtracking' } }, [-1.2, 1], {
      maxSteps: 100,
      gradientNormTolerance: 1e-10,
    });
    expect(cursor.outcome?.kind).toBe('converged');
    expect(cursor.state.t).toBeLessThan(40);
    for (let k = 1; k < batch.count; k++) expect(batch.loss[k]).toBeLessThanOrEqual(batch.loss[k - 1]);
    expect(distance(lastPoint(batch), [1, 1])).toBeLessThan(1e-9);
    // Pure Newton raised f at steps 2 and 4 (reference section 11); the search must have cut some steps.
    expect(Array.from(batch.learningRate.subarray(1)).some((a) => a < 1)).toBe(true);
  });

  it('with backtracking at a saddle, descends along -g instead of stepping to the saddle', () => {
    const b = runSpec(saddle, { kind: 'newton', learningRate: 1, hyper: { lineSearch: 'backtracking' } }, [1, 1], { maxSteps: 1 }).batch;
    // The Newton direction (-1, -1) has g.p = -2 + 2 = 0: not a descent direction. Along -g = (-2, 2),
    // a = 1 gives (-1, 3) with f = -8 <= 0 + 1e-4 * (-8): accepted.
    expect(pointAt(b, 1)).toEqual([-1, 3]);
    expect(b.learningRate[1]).toBe(1);
  });

  it('damped Newton with lr = 0.5 halves the distance to the minimum of a quadratic each step', () => {
    const b = runSpec(quadratic([3, 1, 1, 2], [1, -1]), { kind: 'newton', learningRate: 0.5 }, [3, 3], { maxSteps: 3 }).batch;
    for (let t = 1; t <= 3; t++) {
      const p = pointAt(b, t);
      expect(p[0]).toBeCloseTo(1 + 2 * 0.5 ** t, 14);
      expect(p[1]).toBeCloseTo(-1 + 4 * 0.5 ** t, 14);
    }
  });

  it('on an indefinite Hessian, plain Newton solves by LU (Cholesky fails) and lands on the critical point', () => {
    // f = 1/2 (x - c)^T A (x - c), A indefinite: the only critical point is c.
    const b = runSpec(quadratic([1, 2, 2, 1], [0.5, -0.5]), { kind: 'newton', learningRate: 1 }, [2, 2], { maxSteps: 1 }).batch;
    expect(pointAt(b, 1)[0]).toBeCloseTo(0.5, 14);
    expect(pointAt(b, 1)[1]).toBeCloseTo(-0.5, 14);
  });
});
