import { describe, expect, it } from 'vitest';
import { power } from '../../src/engine/power';

describe('power: whole exponents by products only (the same double in every engine)', () => {
  it.each([
    [2, 10, 1024],
    [-2, 3, -8],
    [3, 0, 1],
    [Number.NaN, 0, 1],
    [0, -1, Infinity],
    [-0, -1, -Infinity],
    [-0, 3, -0],
    [2, -2, 0.25],
    [Infinity, 2, Infinity],
  ])('%d ^ %d = %d (the same special values as Math.pow)', (a, b, expected) => {
    expect(power(a, b)).toBe(expected);
    expect(Object.is(power(a, b), Math.pow(a, b))).toBe(true);
  });

  it('agrees with Math.pow to within about |b| ulp (2|b| machine epsilons) for whole exponents', () => {
    for (const a of [0.9, 0.999, 1.0001, -1.5139806227527415, 3.7]) {
      for (const b of [3, 4, 6, 17, 100, 1000, -5]) {
        const exact = Math.pow(a, b);
        if (!Number.isFinite(exact)) continue; // 3.7^1000 overflows in both
        expect(Math.abs(power(a, b) - exact)).toBeLessThanOrEqual(2 * Math.abs(b) * Number.EPSILON * Math.abs(exact));
      }
    }
  });

  it('is x * x for squares and Math.pow for fractional exponents', () => {
    expect(power(1.1, 2)).toBe(1.1 * 1.1);
    expect(power(2, 0.5)).toBe(Math.SQRT2);
    expect(power(-8, 1 / 3)).toBeNaN();
  });
});
