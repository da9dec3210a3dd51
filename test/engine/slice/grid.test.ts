import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { axisPlane, distanceToPlane, finiteRange, planePoint, projectToPlane, sampleGrid, validateGridRequest, type Surface } from '../../../src/engine';

const sumOfSquares: Surface = {
  dimension: 3,
  variables: ['x', 'y', 'z'],
  value: (p) => p[0] * p[0] + 2 * p[1] * p[1] + 3 * p[2] * p[2],
  valueGradient: () => Number.NaN,
  valueGradientHessian: () => Number.NaN,
};

describe('slice planes', () => {
  it('an axis plane holds the other coordinates and maps (a, b) to (x_i, x_j)', () => {
    const plane = axisPlane([5, 6, 7], 2, 0);
    expect(Array.from(planePoint(plane, 1.5, -2, new Float64Array(3)))).toEqual([-2, 6, 1.5]);
    expect(projectToPlane(plane, [4, 6, 9])).toEqual({ a: 9, b: 4 });
  });

  it('rejects equal or out-of-range axes', () => {
    expect(() => axisPlane([0, 0], 1, 1)).toThrow(/two different variables/);
    expect(() => axisPlane([0, 0], 0, 2)).toThrow(/among 2/);
  });

  it('projection inverts planePoint for non-orthogonal directions (property)', () => {
    const plane = { origin: [1, -2, 0.5, 3], u: [1, 2, 0, -1], v: [0.5, -1, 3, 2] };
    fc.assert(
      fc.property(fc.double({ min: -100, max: 100, noNaN: true }), fc.double({ min: -100, max: 100, noNaN: true }), (a, b) => {
        const p = planePoint(plane, a, b, new Float64Array(4));
        const q = projectToPlane(plane, p);
        expect(q.a).toBeCloseTo(a, 9);
        expect(q.b).toBeCloseTo(b, 9);
        expect(distanceToPlane(plane, p)).toBeLessThan(1e-9);
      }),
    );
  });

  it('parallel directions are reported, not divided by zero', () => {
    expect(() => projectToPlane({ origin: [0, 0], u: [1, 1], v: [2, 2] }, [1, 0])).toThrow(/parallel/);
  });
});

describe('sampleGrid', () => {
  const req = { plane: axisPlane([0, 0, 1], 0, 1), a: [-1, 1] as [number, number], b: [0, 2] as [number, number], nx: 3, ny: 5 };

  it('samples cell corners row-major with j = 0 at the bottom', () => {
    const g = sampleGrid(sumOfSquares, req);
    expect(g.length).toBe(15);
    // (a, b) = (-1, 0): 1 + 0 + 3 ; (1, 2) at index 2 + 4*3: 1 + 8 + 3
    expect(g[0]).toBe(4);
    expect(g[14]).toBe(12);
    // centre column, row j = 2 (b = 1): 0 + 2 + 3
    expect(g[1 + 2 * 3]).toBe(5);
  });

  it('bands of rows fill the same grid as one pass', () => {
    const whole = sampleGrid(sumOfSquares, req);
    const parts = new Float64Array(15);
    sampleGrid(sumOfSquares, req, parts, 0, 2);
    sampleGrid(sumOfSquares, req, parts, 2, 5);
    expect(Array.from(parts)).toEqual(Array.from(whole));
  });

  it('validates its request with specific messages', () => {
    expect(() => validateGridRequest({ ...req, nx: 1 }, 3)).toThrow(/nx must be a whole number from 2/);
    expect(() => validateGridRequest({ ...req, b: [2, 2] }, 3)).toThrow(/the b range must be two finite numbers, low < high/);
    expect(() => validateGridRequest(req, 2)).toThrow(/has 3 coordinates but the surface has 2/);
  });

  it('finiteRange ignores NaN and infinities', () => {
    expect(finiteRange([Number.NaN, 3, -Infinity, -2, Infinity])).toEqual({ min: -2, max: 3 });
    expect(Number.isNaN(finiteRange([Number.NaN]).min)).toBe(true);
  });
});
