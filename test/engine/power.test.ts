import { describe, expect, it } from 'vitest';
import { biasCorrection, cachedPower, power } from '../../src/engine/power';

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

describe('biasCorrection: 1 - power(beta, t) with the squares made once', () => {
  it('gives the same double as 1 - power(beta, t) at every step, across the saturation point', () => {
    // 0.9 saturates from t = 512 and 0.999 from t = 65,536 (power.ts); the others never saturate.
    for (const beta of [0.9, 0.999, 0.99, 0.5, 0, 0.9999999, -0.5, 1, 1.0001]) {
      const correction = biasCorrection(beta);
      const last = beta === 0.999 ? 140_000 : 5_000;
      for (let t = 1; t <= last; t++) if (!Object.is(correction(t), 1 - power(beta, t))) throw new Error(`beta ${beta}, t ${t}: ${correction(t)} vs ${1 - power(beta, t)}`);
    }
  });

  it('saturates exactly where the first power falls to 2^-54 or below, and agrees past 2^31 and off the integers', () => {
    const correction = biasCorrection(0.9);
    expect(1 - power(0.9, 511)).toBe(1); // already 1 before the saturation point: the shortcut only skips work
    expect(power(0.9, 512)).toBeLessThanOrEqual(2 ** -54);
    for (const t of [2 ** 20, 2 ** 31, 2 ** 31 + 1, 2.5, 0, -3]) expect(Object.is(correction(t), 1 - power(0.9, t))).toBe(true);
  });
});

describe('cachedPower: power with the squares of recent bases kept', () => {
  it('gives the same double as power for every base and exponent, several bases interleaved', () => {
    const bases = [0.9, 0.999, -0.5, -0, 0, 1, -1, 2, 1e-3, 1.0001, Number.NaN, Infinity, -Infinity, 1e200, 0.5, 0.25, 3];
    const exponents = [0, 1, 2, 3, 7, 64, 1000, 65_535, 65_536, 200_001, 2 ** 31, 2 ** 31 + 1, -1, -3, 0.5, 2.5, -0, Number.NaN, Infinity];
    for (const b of exponents) for (const a of bases) expect(Object.is(cachedPower(a, b), power(a, b))).toBe(true);
    // Step by step, two bases alternating as a rule's bias corrections do.
    for (let t = 1; t <= 5000; t++) {
      expect(Object.is(cachedPower(0.9, t), power(0.9, t))).toBe(true);
      expect(Object.is(cachedPower(0.999, t), power(0.999, t))).toBe(true);
    }
  });
});
