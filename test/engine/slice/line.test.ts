import { describe, expect, it } from 'vitest';
import { createRng, DEFAULT_ALPHAS, gridRangeForProjection, lineProfile, nextGaussian, type Surface } from '../../../src/engine';
import { buildSurface } from '../../../src/problems';

// Linear interpolation between two parameter vectors: Goodfellow, Vinyals & Saxe, "Qualitatively
// characterizing neural network optimization problems", ICLR 2015.

/** f(x) = 1/2 x^T A x + c^T x with A = B B^T + I (convex), written out by hand. */
function convexQuadratic(n: number, seed: number): Surface & { A: Float64Array; c: Float64Array } {
  const rng = createRng(seed);
  const B = Float64Array.from({ length: n * n }, () => nextGaussian(rng));
  const A = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = i === j ? 1 : 0;
      for (let k = 0; k < n; k++) s += B[i * n + k] * B[j * n + k];
      A[i * n + j] = s;
    }
  const c = Float64Array.from({ length: n }, () => nextGaussian(rng));
  const value = (x: ArrayLike<number>) => {
    let f = 0;
    for (let i = 0; i < n; i++) {
      let ax = 0;
      for (let j = 0; j < n; j++) ax += A[i * n + j] * x[j];
      f += 0.5 * x[i] * ax + c[i] * x[i];
    }
    return f;
  };
  return { dimension: n, variables: Array.from({ length: n }, (_, i) => `x${i}`), value, valueGradient: () => Number.NaN, valueGradientHessian: () => Number.NaN, A, c };
}

describe('lineProfile', () => {
  it('on a convex quadratic the profile is the parabola f(t0) + alpha g.d + alpha^2 d^T A d / 2', () => {
    const n = 12;
    const q = convexQuadratic(n, 4);
    const rng = createRng(5);
    const t0 = Array.from({ length: n }, () => 2 * nextGaussian(rng));
    const t1 = Array.from({ length: n }, () => nextGaussian(rng));
    const d = t1.map((x, k) => x - t0[k]);
    let gd = 0, dAd = 0;
    for (let i = 0; i < n; i++) {
      let ad = 0, at0 = 0;
      for (let j = 0; j < n; j++) {
        ad += q.A[i * n + j] * d[j];
        at0 += q.A[i * n + j] * t0[j];
      }
      dAd += d[i] * ad;
      gd += (at0 + q.c[i]) * d[i];
    }
    expect(dAd).toBeGreaterThan(0);
    const { alphas, values } = lineProfile(q, t0, t1, { from: -1, to: 2, count: 31 });
    const f0 = q.value(t0);
    for (let s = 0; s < alphas.length; s++) {
      const a = alphas[s];
      const expected = f0 + a * gd + 0.5 * a * a * dAd;
      expect(Math.abs(values[s] - expected)).toBeLessThan(1e-10 * (1 + Math.abs(expected)));
    }
    // Constant positive second difference: convex in alpha.
    const h = alphas[1] - alphas[0];
    for (let s = 1; s < values.length - 1; s++)
      expect((values[s + 1] - 2 * values[s] + values[s - 1]) / (h * h)).toBeCloseTo(dAd, 5);
  });

  it('Himmelblau between two minima is c alpha^2 (1 - alpha)^2 with J(0.5) = 71.0804595707217', () => {
    // Closed form and value: ../shared/reference/landscape-methods.md, "A closed-form interpolation
    // test" (computed by the reference's author); end points are Himmelblau's minima (3, 2) and
    // (-2.8051180869527449, 3.1313125182505730). The surface is the catalogue entry.
    const himmelblau = buildSurface({ kind: 'catalogue', id: 'himmelblau' });
    const J5 = 71.0804595707217;
    const c = 16 * J5;
    const { alphas, values } = lineProfile(himmelblau, [3, 2], [-2.8051180869527449, 3.131312518250573], { from: -0.5, to: 1.5, count: 41 });
    for (let s = 0; s < alphas.length; s++) {
      const a = alphas[s];
      const expected = c * a * a * (1 - a) * (1 - a);
      expect(Math.abs(values[s] - expected)).toBeLessThan(1e-9 * (1 + expected));
    }
    const mid = lineProfile(himmelblau, [3, 2], [-2.8051180869527449, 3.131312518250573], [0.5]);
    expect(mid.values[0]).toBeCloseTo(J5, 9);
    // The barrier's top on [0, 1] is at alpha = 0.5: a fine scan finds nothing higher.
    const scan = lineProfile(himmelblau, [3, 2], [-2.8051180869527449, 3.131312518250573], { from: 0, to: 1, count: 1001 });
    let top = 0;
    for (let s = 1; s < scan.values.length; s++) if (scan.values[s] > scan.values[top]) top = s;
    expect(scan.alphas[top]).toBeCloseTo(0.5, 12);
  });

  it('hits both end points exactly, defaults to -0.5 .. 1.5 in 101 steps, and takes an explicit list', () => {
    const q = convexQuadratic(3, 1);
    const t0 = [0.1, 0.2, 0.3];
    const t1 = [-1, 4, 2.5];
    const { alphas, values } = lineProfile(q, t0, t1);
    expect(alphas.length).toBe(DEFAULT_ALPHAS.count);
    expect([alphas[0], alphas[100]]).toEqual([-0.5, 1.5]);
    expect(values[25]).toBe(q.value(t0));
    expect(values[75]).toBe(q.value(t1));
    expect(Array.from(lineProfile(q, t0, t1, [1, 0]).values)).toEqual([q.value(t1), q.value(t0)]);
  });

  it('rejects mismatched points and bad alphas', () => {
    const q = convexQuadratic(3, 1);
    expect(() => lineProfile(q, [0, 0], [0, 0, 0])).toThrow('lineProfile: the end points have 2 and 3 coordinates but the surface has 3');
    expect(() => lineProfile(q, [0, 0, 0], [1, 1, 1], { from: 1, to: 0, count: 5 })).toThrow(/from < to/);
    expect(() => lineProfile(q, [0, 0, 0], [1, 1, 1], { from: 0, to: 1, count: 1 })).toThrow(/count must be a whole number of at least 2/);
    expect(() => lineProfile(q, [0, 0, 0], [1, 1, 1], [0, Number.NaN])).toThrow('lineProfile: alpha 2 is NaN');
  });
});

describe('gridRangeForProjection', () => {
  it('covers the path and the origin with a margin on each side', () => {
    const r = gridRangeForProjection(Float64Array.from([-4, -1, -2, 0.5, 0, 0]), 0.25);
    expect(r.a).toEqual([-5, 1]);
    expect(r.b).toEqual([-1.375, 0.875]);
  });

  it('an axis without extent borrows the other span; no extent at all gives [-1, 1]^2; non-finite pairs are skipped', () => {
    expect(gridRangeForProjection([-2, 0, 0, 0], 0)).toEqual({ a: [-2, 0], b: [-1, 1] });
    expect(gridRangeForProjection([0, 0, 0, 0])).toEqual({ a: [-1, 1], b: [-1, 1] });
    expect(gridRangeForProjection([Number.NaN, 5, 1, 1], 0)).toEqual({ a: [0, 1], b: [0, 1] });
    expect(() => gridRangeForProjection([1, 2, 3])).toThrow(/pairs/);
    expect(() => gridRangeForProjection([1, 2], -1)).toThrow(/margin/);
  });
});
