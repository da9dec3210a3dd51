import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildDataFitSurface } from '../../../src/problems';
import { SPECS } from './specs';

/**
 * Every data-fit surface's exact Hessian-vector product (hessianVector: one pass over the rows, the
 * R-operator for networks) against its full exact Hessian times v, at random parameters and random
 * vectors drawn by fast-check (fixed seeds). Agreement to 1e-10 relative to the product's rounding
 * scale max_i sum_j |H_ij v_j| (the two routes add the same terms in different orders).
 */
const uniform = (min: number, max: number) => fc.noBias(fc.integer({ min: 0, max: 1_000_000 })).map((k) => min + ((max - min) * k) / 1_000_000);
const vectorOf = (n: number, half: number) => fc.tuple(...Array.from({ length: n }, () => uniform(-half, half)));

/** Formula models need parameters where their exponentials stay moderate (as in derivatives.test.ts). */
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
  return fc.tuple(...ranges.map(([min, max]) => uniform(min, max)));
}

describe.each(Object.keys(SPECS))('%s: hessianVector', (key) => {
  const surface = buildDataFitSurface(SPECS[key]);
  const n = surface.dimension;

  it('equals the full exact Hessian times v to 1e-10 relative', () => {
    const grad = new Float64Array(n);
    const hessian = new Float64Array(n * n);
    const out = new Float64Array(n);
    fc.assert(
      fc.property(parameters(key, n), vectorOf(n, 2), (p, v) => {
        surface.valueGradientHessian(p, grad, hessian);
        surface.hessianVector(p, v, out);
        let worst = 0;
        let scale = 0;
        for (let i = 0; i < n; i++) {
          let s = 0;
          let mag = 0;
          for (let j = 0; j < n; j++) {
            s += hessian[i * n + j] * v[j];
            mag += Math.abs(hessian[i * n + j] * v[j]);
          }
          worst = Math.max(worst, Math.abs(out[i] - s));
          scale = Math.max(scale, mag);
        }
        expect(scale).toBeGreaterThan(0);
        expect(worst, `|Hv - H v| = ${worst} at scale ${scale}`).toBeLessThanOrEqual(1e-10 * scale);
      }),
      { seed: 20240611, numRuns: 20 },
    );
  });

  it('matches central differences of the exact gradient along v (independent of the Hessian code)', () => {
    // (grad f(x + h v) - grad f(x - h v)) / 2h = H v + O(h^2 |v|^3); h = 1e-5 as in calculus.ts.
    const h = 1e-5;
    const up = new Float64Array(n);
    const down = new Float64Array(n);
    const gu = new Float64Array(n);
    const gd = new Float64Array(n);
    const out = new Float64Array(n);
    fc.assert(
      fc.property(parameters(key, n), vectorOf(n, 1), (p, v) => {
        for (let j = 0; j < n; j++) {
          up[j] = p[j] + h * v[j];
          down[j] = p[j] - h * v[j];
        }
        surface.valueGradient(up, gu);
        surface.valueGradient(down, gd);
        surface.hessianVector(p, v, out);
        let worst = 0;
        let scale = 0;
        for (let i = 0; i < n; i++) {
          worst = Math.max(worst, Math.abs(out[i] - (gu[i] - gd[i]) / (2 * h)));
          scale = Math.max(scale, Math.abs(out[i]));
        }
        expect(worst).toBeLessThanOrEqual(2e-6 * (1 + scale));
      }),
      { seed: 20240612, numRuns: 10 },
    );
  });

  it('is linear in v and leaves its inputs alone', () => {
    const p = Array.from({ length: n }, (_, j) => (RANGES[key] ? RANGES[key][j][0] * 0.3 + RANGES[key][j][1] * 0.7 : 0.4 * Math.sin(j + 1)));
    const v = Float64Array.from({ length: n }, (_, j) => Math.cos(3 * j + 1));
    const vCopy = Float64Array.from(v);
    const a = new Float64Array(n);
    const b = new Float64Array(n);
    surface.hessianVector(p, v, a);
    expect(Array.from(v)).toEqual(Array.from(vCopy));
    const twice = v.map((t) => 2 * t);
    surface.hessianVector(p, twice, b);
    for (let i = 0; i < n; i++) expect(Math.abs(b[i] - 2 * a[i])).toBeLessThanOrEqual(1e-12 * (1 + Math.abs(a[i])));
  });
});
