import { describe, expect, it } from 'vitest';
import { backtrackingSearch, cubicMinimizer, safeguardedCubic, strongWolfeSearch, type LinePoint } from '../../../src/engine';

describe('cubicMinimizer (Nocedal & Wright eq. 3.59)', () => {
  it('recovers the exact minimiser of a cubic from two points: phi = a^3 - 3a has its minimum at 1', () => {
    const phi = (a: number) => a ** 3 - 3 * a;
    const d = (a: number) => 3 * a * a - 3;
    expect(cubicMinimizer(0, phi(0), d(0), 2, phi(2), d(2))).toBeCloseTo(1, 14);
    expect(cubicMinimizer(2, phi(2), d(2), 0.5, phi(0.5), d(0.5))).toBeCloseTo(1, 14);
  });

  it('is exact for a quadratic too: (a - 0.3)^2', () => {
    expect(cubicMinimizer(0, 0.09, -0.6, 1, 0.49, 1.4)).toBeCloseTo(0.3, 14);
  });

  it('keeps trials at least 10 % of the interval from its ends, and bisects when the cubic has no minimiser', () => {
    // phi = -a on [0, 1]: no interior minimiser (the formula breaks down): midpoint.
    expect(safeguardedCubic(0, 0, -1, 1, -1, -1)).toBe(0.5);
    expect(safeguardedCubic(0, 0.09, -0.6, 1, 0.49, 1.4)).toBeCloseTo(0.3, 14);
    // (a - 0.01)^2: minimiser 0.01, within 10 % of the left end: pulled in to 0.1.
    expect(safeguardedCubic(0, 1e-4, -0.02, 1, 0.9801, 1.98)).toBeCloseTo(0.1, 15);
    // The same from the other side (interval given as (1, 0)).
    expect(safeguardedCubic(1, 0.9801, 1.98, 0, 1e-4, -0.02)).toBeCloseTo(0.1, 15);
  });
});

/**
 * Test functions 1 and 2 of J. J. More & D. J. Thuente, "Line search algorithms with guaranteed
 * sufficient decrease", ACM TOMS 20(3), 1994 (forms from memory):
 *   phi1(a) = -a / (a^2 + beta), beta = 2;  phi2(a) = (a + beta)^5 - 2 (a + beta)^4, beta = 0.004.
 * Whatever the first trial, an accepted 'wolfe' step must meet both strong Wolfe conditions.
 */
const functions: { name: string; f: (a: number) => number; d: (a: number) => number }[] = [
  { name: 'More-Thuente 1', f: (a) => -a / (a * a + 2), d: (a) => (a * a - 2) / (a * a + 2) ** 2 },
  { name: 'More-Thuente 2', f: (a) => (a + 0.004) ** 5 - 2 * (a + 0.004) ** 4, d: (a) => 5 * (a + 0.004) ** 4 - 8 * (a + 0.004) ** 3 },
  { name: 'quadratic (a - 2)^2', f: (a) => (a - 2) ** 2, d: (a) => 2 * (a - 2) },
];

describe('strongWolfeSearch (Nocedal & Wright Alg. 3.5/3.6)', () => {
  for (const fn of functions)
    for (const c2 of fn.name === 'More-Thuente 2' ? [0.9] : [0.9, 0.1])
      it.each([1e-3, 0.1, 1, 10, 1000])(`${fn.name}, c2 = ${c2}, first trial %s`, (a1) => {
        const phi = (a: number, out: LinePoint) => {
          out.f = fn.f(a);
          out.d = fn.d(a);
        };
        const phi0 = fn.f(0);
        const dphi0 = fn.d(0);
        expect(dphi0).toBeLessThan(0);
        const c1 = 1e-4;
        const r = strongWolfeSearch(phi, phi0, dphi0, a1, { c1, c2, maxEvaluations: 30 });
        expect(r.status).toBe('wolfe');
        const { a } = r.point;
        expect(a).toBeGreaterThan(0);
        expect(fn.f(a)).toBeLessThanOrEqual(phi0 + c1 * a * dphi0);
        expect(Math.abs(fn.d(a))).toBeLessThanOrEqual(c2 * Math.abs(dphi0));
        expect(r.evaluations).toBeLessThanOrEqual(30);
      });

  it('More-Thuente 2 with c2 = 0.1 asks for more than float64 can resolve, and still ends next to the minimiser', () => {
    // phi'(0) = -5.1e-7, so |phi'(a)| <= 5.1e-8 needs |a - 1.596| < 2.5e-9, where phi differs from its
    // minimum by ~1e-16, below the spacing of doubles near phi = -2.62. The search must end with
    // sufficient decrease within a few 1e-9 of the minimiser a* = 1.6 - 0.004.
    const fn = functions[1];
    for (const a1 of [1e-3, 0.1, 1, 10, 1000]) {
      const r = strongWolfeSearch((a, out) => ((out.f = fn.f(a)), (out.d = fn.d(a))), fn.f(0), fn.d(0), a1, { c1: 1e-4, c2: 0.1, maxEvaluations: 30 });
      expect(r.status).not.toBe('failed');
      expect(Math.abs(r.point.a - 1.596)).toBeLessThan(1e-8);
    }
  });

  it('accepts the first trial when it already satisfies both conditions (one evaluation)', () => {
    const r = strongWolfeSearch((a, out) => ((out.f = (a - 1) ** 2), (out.d = 2 * (a - 1))), 1, -2, 1, { c1: 1e-4, c2: 0.9, maxEvaluations: 20 });
    expect([r.status, r.point.a, r.evaluations]).toEqual(['wolfe', 1, 1]);
  });

  it('reports failure when no step decreases the function (an ascent direction disguised as descent)', () => {
    const r = strongWolfeSearch((a, out) => ((out.f = a), (out.d = 1)), 0, -1, 1, { c1: 1e-4, c2: 0.9, maxEvaluations: 10 });
    expect(r.status).toBe('failed');
    expect(r.evaluations).toBeLessThanOrEqual(10);
  });
});

describe('backtrackingSearch (Armijo; Nocedal & Wright Alg. 3.1)', () => {
  it('halves until sufficient decrease: on (a - 0.1)^2 from a0 = 1 the first Armijo step is 0.125', () => {
    // phi(0) = 0.01, phi'(0) = -0.2; 1, 0.5, 0.25 fail (phi = 0.81, 0.16, 0.0225 > 0.01 - 2e-5 a), 0.125 passes (0.000625).
    const r = backtrackingSearch((a) => (a - 0.1) ** 2, 0.01, -0.2, 1, 1e-4, 0.5, 30);
    expect(r).toEqual({ step: 0.125, value: (0.125 - 0.1) ** 2, evaluations: 4 });
  });

  it('gives up with step 0 after the trial budget', () => {
    expect(backtrackingSearch((a) => a, 0, -1, 1, 1e-4, 0.5, 5)).toEqual({ step: 0, value: 0, evaluations: 5 });
  });
});
