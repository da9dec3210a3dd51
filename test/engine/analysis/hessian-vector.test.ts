import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compileFormula, hessianScratch, hessianVectorProduct, type Surface } from '../../../src/engine';

/**
 * The engine helper: through the full Hessian for a surface without `hessianVector` (a compiled
 * formula), through the method when the surface has one.
 */
describe('hessianVectorProduct', () => {
  const formula = compileFormula('x^2 * y + sin(x * z) + exp(0.3 * y) * z^2', { variables: ['x', 'y', 'z'] });

  it('multiplies by the full Hessian of a surface without hessianVector', () => {
    const scratch = hessianScratch(3);
    const out = new Float64Array(3);
    const g = new Float64Array(3);
    const h = new Float64Array(9);
    const coord = fc.double({ min: -2, max: 2, noNaN: true });
    fc.assert(
      fc.property(fc.tuple(coord, coord, coord), fc.tuple(coord, coord, coord), (x, v) => {
        hessianVectorProduct(formula, x, v, out, scratch);
        formula.valueGradientHessian(x, g, h);
        for (let i = 0; i < 3; i++) {
          const expected = h[3 * i] * v[0] + h[3 * i + 1] * v[1] + h[3 * i + 2] * v[2];
          const scale = Math.abs(h[3 * i] * v[0]) + Math.abs(h[3 * i + 1] * v[1]) + Math.abs(h[3 * i + 2] * v[2]);
          expect(Math.abs(out[i] - expected)).toBeLessThanOrEqual(1e-14 * scale);
        }
      }),
      { seed: 7, numRuns: 50 },
    );
  });

  it('uses the surface method when there is one, and forms no Hessian', () => {
    let calls = 0;
    const surface: Surface = {
      dimension: 2,
      variables: ['a', 'b'],
      value: () => 0,
      valueGradient: () => 0,
      valueGradientHessian: () => {
        throw new Error('the Hessian was formed');
      },
      hessianVector: (_x, v, out) => {
        calls++;
        out[0] = 2 * v[0] + v[1];
        out[1] = v[0] + 3 * v[1];
      },
    };
    const out = new Float64Array(2);
    hessianVectorProduct(surface, [0, 0], [1, -1], out);
    expect(calls).toBe(1);
    expect(Array.from(out)).toEqual([1, -2]);
  });

  it('refuses vectors of the wrong length', () => {
    expect(() => hessianVectorProduct(formula, [0, 0, 0], [1, 2], new Float64Array(3))).toThrow(/length 3/);
  });
});
