import { describe, expect, it } from 'vitest';
import { compileFormula, createRng, nextGaussian, sharpnessAlong } from '../../../src/engine';
import { householderQuadratic } from './quadratic';

function randomPoints(count: number, n: number, seed: number): Float64Array {
  const rng = createRng(seed);
  return Float64Array.from({ length: count * n }, () => 3 * nextGaussian(rng));
}

describe('sharpnessAlong', () => {
  it('is constant and equal to lambda_max on a small quadratic (exact path)', () => {
    // 3x^2 + 2xy + 5y^2 + z^2: Hessian [[6,2,0],[2,10,0],[0,0,2]], lambda_max = 8 + sqrt(8).
    const s = compileFormula('3*x^2 + 2*x*y + 5*y^2 + z^2', { variables: ['x', 'y', 'z'] });
    const out = sharpnessAlong(s, randomPoints(7, 3, 1), 7);
    expect(out.length).toBe(7);
    for (const v of out) expect(Math.abs(v - (8 + Math.sqrt(8)))).toBeLessThanOrEqual(1e-13);
  });

  it('is constant and equal to lambda_max on a 250-parameter quadratic (Lanczos on products)', () => {
    const n = 250;
    const lambda = Float64Array.from({ length: n }, (_, i) => -2 + (i * 9) / n);
    lambda[n - 1] = 17.5;
    const s = householderQuadratic(lambda, 8);
    const out = sharpnessAlong(s, randomPoints(4, n, 2), 4, { lanczos: { maxIterations: 120 } });
    for (const v of out) expect(Math.abs(v - 17.5)).toBeLessThanOrEqual(1e-10 * 17.5);
    expect(s.hessians).toBe(0);
  });

  it('follows a changing curvature: x^4 + y^2 along the x axis has lambda_max = max(12 x^2, 2)', () => {
    const s = compileFormula('x^4 + y^2', { variables: ['x', 'y'] });
    const xs = [0, 0.2, 0.5, 1, 2];
    const out = sharpnessAlong(s, Float64Array.from(xs.flatMap((x) => [x, 0])), xs.length);
    xs.forEach((x, k) => expect(out[k]).toBeCloseTo(Math.max(12 * x * x, 2), 12));
  });

  it('gives NaN past the limits and refuses a short buffer', () => {
    const s = householderQuadratic([1, 2, 3], 1, false);
    const out = sharpnessAlong(s, new Float64Array(6), 2, { denseLimit: 2, formedHessianLimit: 2 });
    expect(Array.from(out)).toEqual([NaN, NaN]);
    expect(() => sharpnessAlong(s, new Float64Array(5), 2)).toThrow(/need 6 numbers/);
  });
});
