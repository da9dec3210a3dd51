import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildDataFitSurface } from '../../../src/problems';
import { exact, finiteGradient, finiteHessian, maxAbs, maxAbsDiff } from '../calculus';
import { SPECS } from './specs';

/**
 * Exact gradients and Hessians of every data-fit model against central finite differences
 * (calculus.ts: h = 1e-5 on the value for the gradient, on the exact gradient for the Hessian), at
 * random parameters drawn by fast-check (fixed seed, so the run is repeatable). ReLU networks are
 * differentiable except where a unit's input is exactly 0; random parameters land there with
 * probability 0, and the differences (step 1e-5) straddle a kink only rarely (the fixed seed keeps
 * the draw the same from run to run).
 */
const RANGES: Record<string, [number, number][] | undefined> = {
  'formula mse, l2': [
    [-5, 5],
    [0.005, 0.1],
  ],
  'formula rss with a constant': [
    [-3, 3],
    [-1, 1],
  ],
};

function parameters(key: string, n: number): fc.Arbitrary<number[]> {
  const ranges = RANGES[key] ?? Array.from({ length: n }, (): [number, number] => [-1.5, 1.5]);
  // Uniform on the range (fc.double favours tiny magnitudes and special values such as 0, which put
  // ReLU units exactly on their kink).
  const uniform = (min: number, max: number) => fc.noBias(fc.integer({ min: 0, max: 1_000_000 })).map((k) => min + ((max - min) * k) / 1_000_000);
  return fc.tuple(...ranges.map(([min, max]) => uniform(min, max)));
}

const close = (a: ArrayLike<number>, b: ArrayLike<number>, tol: number) => maxAbsDiff(a, b) <= tol * (1 + maxAbs(a));

describe.each(Object.keys(SPECS))('%s', (key) => {
  const surface = buildDataFitSurface(SPECS[key]);
  const n = surface.dimension;

  it('the gradient matches central differences of the value', () => {
    fc.assert(
      fc.property(parameters(key, n), (p) => {
        const d = exact(surface, p);
        const fd = finiteGradient(surface, p);
        expect(close(d.gradient, fd, 2e-6), `exact ${Array.from(d.gradient)} vs differences ${Array.from(fd)}`).toBe(true);
      }),
      { seed: 20240501, numRuns: 25 },
    );
  });

  it('the Hessian matches central differences of the gradient and is symmetric', () => {
    fc.assert(
      fc.property(parameters(key, n), (p) => {
        const d = exact(surface, p);
        const fd = finiteHessian(surface, p);
        expect(close(d.hessian, fd, 2e-6), `exact ${Array.from(d.hessian)} vs differences ${Array.from(fd)}`).toBe(true);
        for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) expect(d.hessian[i * n + j]).toBe(d.hessian[j * n + i]);
      }),
      { seed: 20240502, numRuns: 10 },
    );
  });

  it('value, valueGradient and valueGradientHessian agree on the value', () => {
    fc.assert(
      fc.property(parameters(key, n), (p) => {
        const d = exact(surface, p);
        const g = new Float64Array(n);
        const v = surface.value(p);
        expect(Math.abs(surface.valueGradient(p, g) - v)).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(v)));
        expect(Math.abs(d.value - v)).toBeLessThanOrEqual(1e-13 * Math.max(1, Math.abs(v)));
      }),
      { seed: 20240503, numRuns: 20 },
    );
  });
});
