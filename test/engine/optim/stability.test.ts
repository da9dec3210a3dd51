import { describe, expect, it } from 'vitest';
import { symmetricEigen } from '../../../src/engine';
import { distance, lastPoint, runSpec } from './run';
import { quadratic, rotatedDiagonal } from './surfaces';

/**
 * Source: reference optimizer-rules.md, section 1. On f = 1/2 (x - c)^T A (x - c) the error obeys
 * e_t = (I - lr A) e_{t-1}, so fixed-step GD converges from every start iff 0 < lr < 2 / lambda_max
 * (Polyak, Introduction to Optimization, 1987, Sec. 1.4; Nesterov, convex optimization textbook,
 * Kluwer 2004, Thm 2.1.15; both from memory in the reference). Heavy ball: per eigenvalue the
 * characteristic polynomial z^2 - (1 + beta - lr lambda) z + beta is stable iff 0 < lr lambda < 2 (1 + beta)
 * (derived in the reference, section 1).
 */
const quadratics = [
  { name: 'x^2 + 10 y^2 (eigenvalues 2, 20)', a: [2, 0, 0, 20], center: [0, 0], start: [1, 1] },
  { name: 'rotated, eigenvalues 0.5 and 8', a: rotatedDiagonal(0.5, 8, 0.7), center: [1, -2], start: [3, 1] },
  { name: '3-D, eigenvalues 1, 3, 7 (non-diagonal)', a: [3, 1, 0, 1, 3, 2, 0, 2, 5], center: [0.5, 0.5, 0.5], start: [2, -1, 1] },
];

const lambdaMax = (a: number[], n: number) => symmetricEigen(a, n).values[n - 1];

const stop = { maxSteps: 20000, gradientNormTolerance: 1e-9 };

describe('GD on a quadratic: converges iff 0 < lr < 2 / lambda_max', () => {
  it.each(quadratics)('$name', ({ a, center, start }) => {
    const n = center.length;
    const boundary = 2 / lambdaMax(a, n);
    const surface = quadratic(a, center);
    const below = runSpec(surface, { kind: 'gd', learningRate: 0.99 * boundary }, start, stop);
    expect(below.cursor.outcome?.kind).toBe('converged');
    expect(distance(lastPoint(below.batch), center)).toBeLessThan(1e-8);
    const above = runSpec(surface, { kind: 'gd', learningRate: 1.01 * boundary }, start, stop);
    expect(above.cursor.outcome?.kind).toBe('diverged');
  });

  it('the best fixed step 2 / (lambda_min + lambda_max) contracts the error by (kappa - 1) / (kappa + 1) per step (reference section 1)', () => {
    // x^2 + 10 y^2: lr* = 2/22, rate 9/11 (reference section 1); the error is exactly multiplied by
    // (1 - lr* lambda_i) = -+9/11 in each coordinate.
    const { batch } = runSpec(quadratic([2, 0, 0, 20], [0, 0]), { kind: 'gd', learningRate: 2 / 22 }, [1, 1], { maxSteps: 40 });
    const r = Math.hypot(batch.points[80], batch.points[81]) / Math.hypot(batch.points[78], batch.points[79]);
    expect(r).toBeCloseTo(9 / 11, 12);
  });
});

describe('heavy-ball momentum on a quadratic: stable iff lr lambda_max < 2 (1 + beta)', () => {
  for (const beta of [0, 0.5, 0.9])
    it.each(quadratics)(`beta = ${beta}: $name`, ({ a, center, start }) => {
      const n = center.length;
      const boundary = (2 * (1 + beta)) / lambdaMax(a, n);
      const surface = quadratic(a, center);
      const spec = (lr: number) => ({ kind: 'momentum' as const, learningRate: lr, hyper: { momentum: beta } });
      const below = runSpec(surface, spec(0.99 * boundary), start, stop);
      expect(below.cursor.outcome?.kind).toBe('converged');
      expect(distance(lastPoint(below.batch), center)).toBeLessThan(1e-8);
      const above = runSpec(surface, spec(1.01 * boundary), start, stop);
      expect(above.cursor.outcome?.kind).toBe('diverged');
    });

  it("Polyak's tuning for L = 20, mu = 2 gives spectral radius (sqrt(10) - 1)/(sqrt(10) + 1) = 0.519493853296 (reference section 1)", () => {
    // lr = 0.115443078510, beta = 0.269873863612 (reference, checked numerically there). The error in
    // the stiff coordinate shrinks like rho^t (times a polynomial factor for the double root), so the
    // t-th root of the error approaches rho.
    const { batch } = runSpec(quadratic([2, 0, 0, 20], [0, 0]), { kind: 'momentum', learningRate: 0.11544307851, hyper: { momentum: 0.269873863612 } }, [1, 1], {
      maxSteps: 40,
    });
    const e40 = Math.hypot(batch.points[80], batch.points[81]);
    const e30 = Math.hypot(batch.points[60], batch.points[61]);
    expect(Math.pow(e40 / e30, 1 / 10)).toBeGreaterThan(0.5);
    expect(Math.pow(e40 / e30, 1 / 10)).toBeLessThan(0.56);
  });
});
