import { describe, expect, it } from 'vitest';
import { compileFormula, createRng, findCriticalPoints, nextUniform } from '../../../src/engine';

/** findCriticalPoints on closed-form cases; Himmelblau's nine points are in test/problems/himmelblau-analysis.test.ts. */
const formula = (text: string) => compileFormula(text, { variables: ['x', 'y'] });

function boxStarts(count: number, half: number, seed: number): number[][] {
  const rng = createRng(seed);
  return Array.from({ length: count }, () => [half * (2 * nextUniform(rng) - 1), half * (2 * nextUniform(rng) - 1)]);
}

describe('findCriticalPoints', () => {
  it('a pure saddle: every start reaches the origin, classified as a saddle of index 1', () => {
    const r = findCriticalPoints(formula('x^2 - y^2 + x*y'), boxStarts(20, 4, 1));
    expect(r.points.length).toBe(1);
    const [p] = r.points;
    expect(p.hits).toBe(20);
    expect(Math.max(Math.abs(p.point[0]), Math.abs(p.point[1]))).toBeLessThanOrEqual(1e-12);
    expect(p.classification).toMatchObject({ kind: 'saddle', negative: 1 });
    expect(p.iterations).toBeLessThanOrEqual(2);
  });

  it('x^4 + y^2: the degenerate minimum at 0 (Newton converges only linearly in x)', () => {
    // Classified with a zero band of 1e-6 of the largest curvature (the default n eps would call the
    // 1e-13 curvature left at x ~ 1e-7 a weak minimum, which in floating point it is).
    const r = findCriticalPoints(formula('x^4 + y^2'), boxStarts(10, 2, 2), { classify: { zeroTolerance: 1e-6 } });
    expect(r.points.length).toBe(1);
    expect(r.failed).toBe(0);
    const [p] = r.points;
    expect(p.gradientNorm).toBeLessThanOrEqual(1e-10);
    // Near 0 the curvature 12 x^2 falls below 1e-13 of the other one (x ~ 1e-7), the Hessian counts as
    // singular and the damped steps stop moving: the flat direction is located to about 1e-7.
    expect(Math.abs(p.point[0])).toBeLessThan(1e-6);
    expect(Math.abs(p.point[1])).toBeLessThanOrEqual(1e-12);
    expect(p.classification?.kind).toBe('degenerate');
  });

  it('a ring of degenerate minima and a maximum: (x^2 + y^2 - 1)^2 (singular Hessians on the ring)', () => {
    const r = findCriticalPoints(formula('(x^2 + y^2 - 1)^2'), boxStarts(30, 2, 3));
    expect(r.failed).toBe(0);
    for (const p of r.points) {
      const radius = Math.hypot(p.point[0], p.point[1]);
      if (radius < 1e-6) expect(p.classification?.kind).toBe('maximum');
      else {
        expect(Math.abs(radius - 1)).toBeLessThanOrEqual(1e-8);
        expect(p.classification).toMatchObject({ kind: 'degenerate', zero: 1, positive: 1 });
      }
    }
    expect(r.points.some((p) => Math.hypot(p.point[0], p.point[1]) > 0.5)).toBe(true);
  });

  it('reports failure where there is no critical point: x + y^2', () => {
    const r = findCriticalPoints(formula('x + y^2'), boxStarts(5, 3, 4));
    expect(r.points).toEqual([]);
    expect(r.failed).toBe(5);
    expect(r.converged).toBe(0);
  });

  it('merges end points by the stated distance rule and keeps the best', () => {
    // Two starts on either side of the same minimum; a third far away ends at the other one.
    const r = findCriticalPoints(formula('(x^2 - 4)^2 + y^2'), [
      [1.9, 0.1],
      [2.3, -0.2],
      [-2.5, 1],
    ]);
    expect(r.points.length).toBe(2);
    const right = r.points.find((p) => p.point[0] > 0)!;
    expect(right.hits).toBe(2);
    expect(right.point[0]).toBeCloseTo(2, 12);
    expect(r.points.find((p) => p.point[0] < 0)!.hits).toBe(1);
  });

  it('refuses a start of the wrong length and a surface above maxDimension', () => {
    expect(() => findCriticalPoints(formula('x^2 + y^2'), [[1]])).toThrow(/length 1, expected 2/);
    expect(() => findCriticalPoints(formula('x^2 + y^2'), [[1, 1]], { maxDimension: 1 })).toThrow(/maxDimension/);
  });
});
