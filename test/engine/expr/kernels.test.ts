import { describe, expect, it } from 'vitest';
import { FUNCTIONS, compileFormula } from '../../../src/engine/expr';
import { elu, relu, sigmoid, softplus } from '../../../src/engine/expr/kernels';

describe('machine-learning kernels', () => {
  it('sigmoid matches 1 / (1 + exp(-x)) where that is exact enough, and never overflows', () => {
    for (const x of [-30, -2, -0.5, 0, 0.5, 2, 30]) expect(sigmoid(x)).toBeCloseTo(1 / (1 + Math.exp(-x)), 15);
    expect(sigmoid(0)).toBe(0.5);
    expect(sigmoid(800)).toBe(1);
    expect(sigmoid(-800)).toBe(0);
    // exp(-745) is the smallest subnormal region; the stable branch keeps the tail (value from Math.exp).
    expect(sigmoid(-700)).toBe(Math.exp(-700) / (1 + Math.exp(-700)));
    expect(Number.isNaN(sigmoid(NaN))).toBe(true);
  });

  it('softplus matches log(1 + exp(x)) and stays accurate for large |x|', () => {
    for (const x of [-5, -1, 0, 1, 5]) expect(softplus(x)).toBeCloseTo(Math.log(1 + Math.exp(x)), 15);
    expect(softplus(0)).toBe(Math.LN2);
    expect(softplus(1000)).toBe(1000); // the naive form gives Infinity
    expect(softplus(-40)).toBeCloseTo(Math.exp(-40), 30); // the naive form gives 0
    expect(softplus(-40) / Math.exp(-40)).toBeCloseTo(1, 15);
  });

  it('relu and elu', () => {
    expect([relu(-2), relu(0), relu(3)]).toEqual([0, 0, 3]);
    expect(Number.isNaN(relu(NaN))).toBe(true);
    expect([elu(2), elu(0)]).toEqual([2, 0]);
    // exp(x) - 1 = x + x^2/2 + ... ; expm1 keeps that precision near 0 where exp(x) - 1 loses half the digits.
    expect(elu(-1e-10) / (-1e-10 + 5e-21)).toBeCloseTo(1, 15);
    expect(elu(-50)).toBeCloseTo(-1, 15);
  });
});

describe('the function catalogue', () => {
  /** A point inside each function's domain, away from kinks. */
  const at = (name: string) => (name === 'acos' || name === 'asin' ? 0.3 : name === 'log' || name === 'sqrt' ? 1.7 : 0.6);

  it.each([...FUNCTIONS.keys()])('%s compiles, and its derivative matches a central difference', (name) => {
    const info = FUNCTIONS.get(name)!;
    const args = Array.from({ length: info.minArgs }, (_, i) => (i === 0 ? 'x' : `${0.1 * i}`));
    const surface = compileFormula(`${name}(${args.join(', ')})`, { variables: ['x'] });
    const x = at(name);
    const g = new Float64Array(1);
    expect(surface.valueGradient([x], g)).toBe(info.evaluate([x, ...args.slice(1).map(Number)]));
    const h = 1e-6;
    const difference = (surface.value([x + h]) - surface.value([x - h])) / (2 * h);
    expect(g[0]).toBeCloseTo(difference, 7);
  });
});
