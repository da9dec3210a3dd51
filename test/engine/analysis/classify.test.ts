import { describe, expect, it } from 'vitest';
import { classifyPoint, compileFormula, countSigns } from '../../../src/engine';
import { householderQuadratic } from './quadratic';

/** classifyPoint on closed-form cases; Himmelblau's nine points are in test/problems/himmelblau-analysis.test.ts. */
const formula = (text: string) => compileFormula(text, { variables: ['x', 'y'] });

describe('classifyPoint, exact path', () => {
  it('x^2 + 3 y^2 at 0 is a minimum with eigenvalues 2 and 6', () => {
    const c = classifyPoint(formula('x^2 + 3*y^2'), [0, 0]);
    expect(c).toMatchObject({ kind: 'minimum', method: 'exact', negative: 0, zero: 0, positive: 2, smallest: 2, largest: 6 });
  });

  it('x^2 - y^2 at 0 is a saddle of index 1', () => {
    const c = classifyPoint(formula('x^2 - y^2'), [0, 0]);
    expect(c).toMatchObject({ kind: 'saddle', method: 'exact', negative: 1, zero: 0, positive: 1, smallest: -2, largest: 2 });
  });

  it('-(x^2 + y^2) - x y at 0 is a maximum', () => {
    const c = classifyPoint(formula('-(x^2 + y^2) - x*y'), [0, 0]);
    expect(c?.kind).toBe('maximum');
    expect(c?.negative).toBe(2);
    expect(c?.smallest).toBeCloseTo(-3, 14);
    expect(c?.largest).toBeCloseTo(-1, 14);
  });

  it('x^4 + y^2 at 0 is degenerate (one zero eigenvalue), and away from 0 not', () => {
    const s = formula('x^4 + y^2');
    expect(classifyPoint(s, [0, 0])).toMatchObject({ kind: 'degenerate', negative: 0, zero: 1, positive: 1, smallest: 0, largest: 2 });
    // The default zero band is n eps max|lambda| = 2 * 2.2e-16 * 2 = 8.9e-16 (rounding only): at x = 1e-4
    // the curvature 12 x^2 = 1.2e-7 is well above it, so the point is a (weakly curved) minimum ...
    expect(classifyPoint(s, [1e-4, 0])?.kind).toBe('minimum');
    // ... while a wider band of 1e-6 * 2 counts 1.2e-7 as zero; at x = 1e-2 (1.2e-3) it does not.
    expect(classifyPoint(s, [1e-4, 0], { zeroTolerance: 1e-6 })?.kind).toBe('degenerate');
    expect(classifyPoint(s, [1e-2, 0], { zeroTolerance: 1e-6 })?.kind).toBe('minimum');
  });

  it('a saddle with a zero direction is still a saddle (x^2 - y^2 + z^4)', () => {
    const s = compileFormula('x^2 - y^2 + z^4', { variables: ['x', 'y', 'z'] });
    expect(classifyPoint(s, [0, 0, 0])).toMatchObject({ kind: 'saddle', negative: 1, zero: 1, positive: 1 });
  });

  it('a zero Hessian is degenerate with every eigenvalue zero', () => {
    expect(classifyPoint(formula('x^3 + y^3'), [0, 0])).toMatchObject({ kind: 'degenerate', negative: 0, zero: 2, positive: 0 });
  });

  it('counts by the stated zero rule, |lambda| <= tol * max |lambda|', () => {
    expect(countSigns([-1, -1e-7, 0, 1e-6, 2e-6, 1], 1e-6)).toEqual({ negative: 1, zero: 3, positive: 2 });
    expect(countSigns([0, 0], 1e-6)).toEqual({ negative: 0, zero: 2, positive: 0 });
  });

  it('refuses a point of the wrong length', () => {
    expect(() => classifyPoint(formula('x + y'), [0])).toThrow(/length 2/);
  });
});

describe('classifyPoint, Lanczos path (n > 200)', () => {
  const n = 300;
  const spectrum = (lo: number, hi: number) => Float64Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));

  it('a positive-definite quadratic is a minimum, from products only', () => {
    const s = householderQuadratic(spectrum(0.5, 40), 1);
    const c = classifyPoint(s, new Float64Array(n), { lanczos: { maxIterations: n } });
    expect(c?.method).toBe('lanczos');
    expect(c?.kind).toBe('minimum');
    expect(c?.negative).toBeUndefined();
    expect(c?.smallest).toBeCloseTo(0.5, 8);
    expect(c?.largest).toBeCloseTo(40, 8);
    expect(s.hessians).toBe(0);
    expect(s.products).toBeGreaterThan(0);
  });

  it('an indefinite quadratic is a saddle, a negative-definite one a maximum', () => {
    const saddle = classifyPoint(householderQuadratic(spectrum(-3, 10), 2), new Float64Array(n), { lanczos: { maxIterations: n } });
    expect(saddle).toMatchObject({ kind: 'saddle', method: 'lanczos', converged: true });
    expect(saddle?.smallest).toBeCloseTo(-3, 8);
    const maximum = classifyPoint(householderQuadratic(spectrum(-9, -1), 3), new Float64Array(n), { lanczos: { maxIterations: n } });
    expect(maximum?.kind).toBe('maximum');
  });

  it('a zero extreme eigenvalue makes it degenerate', () => {
    const lambda = spectrum(0, 5);
    const c = classifyPoint(householderQuadratic(lambda, 4), new Float64Array(n), { lanczos: { maxIterations: n } });
    expect(c?.kind).toBe('degenerate');
  });

  it('without hessianVector the Hessian is formed once, and beyond the limits nothing is classified', () => {
    const s = householderQuadratic(spectrum(1, 2), 5, false);
    const c = classifyPoint(s, new Float64Array(n), { lanczos: { maxIterations: n } });
    expect(c?.kind).toBe('minimum');
    expect(s.hessians).toBe(1);
    expect(classifyPoint(s, new Float64Array(n), { formedHessianLimit: 250 })).toBeNull();
    expect(classifyPoint(householderQuadratic(spectrum(1, 2), 6), new Float64Array(n), { lanczosLimit: 299 })).toBeNull();
  });
});
