/**
 * The primitives table (src/engine/expr/primitives.ts) is the one list of the language's functions:
 * the parser knows exactly its names, and each function's compiled value and exact derivative agree
 * with an outside reference at points away from kinks: the value with the closed form it names (Math.*
 * or the formula in its summary), the derivative with a five-point central difference of that
 * reference (Abramowitz & Stegun, Handbook of Mathematical Functions, 25.3.6), to 1e-7 relative.
 */
import { describe, expect, it } from 'vitest';
import { compileFormula, FUNCTIONS, parseFormula, prettyFormula, printFormula, UNARY_PRIMITIVES, VARIADIC_PRIMITIVES } from '../../../src/engine/expr';

type Name = keyof typeof UNARY_PRIMITIVES;

/** Independent closed forms (not the project's kernels). */
const REFERENCE: Record<Name, (x: number) => number> = {
  sin: Math.sin,
  cos: Math.cos,
  tan: Math.tan,
  asin: Math.asin,
  acos: Math.acos,
  atan: Math.atan,
  sinh: (x) => (Math.exp(x) - Math.exp(-x)) / 2,
  cosh: (x) => (Math.exp(x) + Math.exp(-x)) / 2,
  tanh: (x) => (Math.exp(2 * x) - 1) / (Math.exp(2 * x) + 1),
  exp: (x) => Math.E ** x,
  expm1: (x) => Math.exp(x) - 1,
  log: Math.log,
  log1p: (x) => Math.log(1 + x),
  sqrt: (x) => x ** 0.5,
  abs: (x) => (x < 0 ? -x : x),
  sign: (x) => (x > 0 ? 1 : x < 0 ? -1 : 0),
  sigmoid: (x) => 1 / (1 + Math.exp(-x)),
  softplus: (x) => Math.log(1 + Math.exp(x)),
  relu: (x) => (x > 0 ? x : 0),
  elu: (x) => (x > 0 ? x : Math.exp(x) - 1),
};

/** Points inside each domain ((-1, 1) for asin and acos, x > 0 for log and sqrt) and away from the kinks at 0. */
const pointsFor = (name: Name): number[] => (name === 'log' || name === 'sqrt' ? [0.31, 0.64, 1.7, 2.9] : [-0.83, -0.31, 0.27, 0.64]);

function centralDifference(f: (x: number) => number, x: number, h = 1e-4): number {
  return (f(x - 2 * h) - 8 * f(x - h) + 8 * f(x + h) - f(x + 2 * h)) / (12 * h);
}

describe('the primitives table', () => {
  it('is exactly the set of functions the parser knows', () => {
    expect([...FUNCTIONS.keys()].sort()).toEqual([...Object.keys(UNARY_PRIMITIVES), ...Object.keys(VARIADIC_PRIMITIVES)].sort());
    expect(Object.keys(REFERENCE).sort()).toEqual(Object.keys(UNARY_PRIMITIVES).sort());
    for (const [name, info] of FUNCTIONS) expect(info.summary.length, name).toBeGreaterThan(5);
  });

  it.each(Object.keys(UNARY_PRIMITIVES) as Name[])('%s: compiled value and exact derivative match the reference', (name) => {
    const surface = compileFormula(`${name}(x) + 0*y`, { variables: ['x', 'y'] });
    const g = new Float64Array(2);
    for (const x of pointsFor(name)) {
      const value = surface.valueGradient(new Float64Array([x, 0]), g);
      const want = REFERENCE[name](x);
      expect(Math.abs(value - want), `${name}(${x})`).toBeLessThanOrEqual(1e-14 * (1 + Math.abs(want)));
      const slope = centralDifference(REFERENCE[name], x);
      expect(Math.abs(g[0] - slope), `${name}'(${x}): ${g[0]} vs ${slope}`).toBeLessThanOrEqual(1e-7 * (1 + Math.abs(slope)));
    }
  });

  it('min and max: the value of the pairwise kernel, the derivative of the chosen argument, ties to the first', () => {
    const min = compileFormula('min(x, 2*y, 3)', { variables: ['x', 'y'] });
    const g = new Float64Array(2);
    expect(min.valueGradient(new Float64Array([1, 4]), g)).toBe(1);
    expect([...g]).toEqual([1, 0]);
    expect(min.valueGradient(new Float64Array([5, 1]), g)).toBe(2);
    expect([...g]).toEqual([0, 2]);
    expect(min.valueGradient(new Float64Array([2, 1]), g)).toBe(2); // tie x = 2y: the first argument
    expect([...g]).toEqual([1, 0]);
    const max = compileFormula('max(x, y)', { variables: ['x', 'y'] });
    expect(max.valueGradient(new Float64Array([3, 3]), g)).toBe(3);
    expect([...g]).toEqual([1, 0]);
  });
});

describe('the operator table: parser and printer agree', () => {
  it.each([
    ['-x^2', '(-(x ^ 2))'],
    ['2^3^2', '(2 ^ (3 ^ 2))'],
    ['2^-1', '(2 ^ (-1))'],
    ['a - b - c', '((a - b) - c)'],
    ['a / b * c', '((a / b) * c)'],
    ['-x * y', '((-x) * y)'],
    ['(a + b)^2', '((a + b) ^ 2)'],
  ])('%s parses as %s and prints back unchanged', (text, full) => {
    const parsed = parseFormula(text);
    if (!parsed.ok) throw new Error(`did not parse: ${text}`);
    expect(printFormula(parsed.ast)).toBe(full);
    expect(prettyFormula(parsed.ast)).toBe(text);
  });
});
