import { describe, expect, it } from 'vitest';
import { RunCursor, type Optimizer } from '../../../src/engine';
import { FormulaSyntaxError, compileFormula, type FormulaSurface } from '../../../src/engine/expr';

function evaluate(surface: FormulaSurface, at: number[]) {
  const n = surface.dimension;
  const gradient = new Float64Array(n);
  const hessian = new Float64Array(n * n);
  const value = surface.valueGradientHessian(at, gradient, hessian);
  // `+ 0` turns -0 into 0: the sign of a zero derivative carries no meaning here.
  return { value, gradient: Array.from(gradient, (v) => v + 0), hessian: Array.from(hessian, (v) => v + 0) };
}

function thrown(run: () => unknown): FormulaSyntaxError {
  try {
    run();
  } catch (error) {
    if (error instanceof FormulaSyntaxError) return error;
    throw error;
  }
  throw new Error('expected a FormulaSyntaxError');
}

describe('compileFormula on textbook surfaces', () => {
  it('Rosenbrock: value, gradient and Hessian match the hand derivation', () => {
    // f = (1-x)^2 + 100 (y-x^2)^2 (Rosenbrock 1960); grad = (-2(1-x) - 400x(y-x^2), 200(y-x^2));
    // H = [[2 - 400(y - x^2) + 800x^2, -400x], [-400x, 200]]. Minimum 0 at (1, 1).
    const surface = compileFormula('(1-x)^2 + 100*(y-x^2)^2');
    expect(surface.variables).toEqual(['x', 'y']);
    expect(surface.dimension).toBe(2);
    for (const [x, y] of [[-1.2, 1], [0.5, -0.25], [2, 3]]) {
      const r = evaluate(surface, [x, y]);
      expect(r.value).toBeCloseTo((1 - x) ** 2 + 100 * (y - x * x) ** 2, 12);
      expect(r.gradient[0]).toBeCloseTo(-2 * (1 - x) - 400 * x * (y - x * x), 10);
      expect(r.gradient[1]).toBeCloseTo(200 * (y - x * x), 10);
      expect(r.hessian[0]).toBeCloseTo(2 - 400 * (y - x * x) + 800 * x * x, 10);
      expect(r.hessian[1]).toBeCloseTo(-400 * x, 10);
      expect(r.hessian[2]).toBe(r.hessian[1]);
      expect(r.hessian[3]).toBe(200);
    }
    expect(evaluate(surface, [1, 1])).toEqual({ value: 0, gradient: [0, 0], hessian: [802, -400, -400, 200] });
  });

  it('Himmelblau: zero value and gradient at the minimum (3, 2)', () => {
    // Himmelblau (1972), "Applied Nonlinear Programming": f = (x^2 + y - 11)^2 + (x + y^2 - 7)^2,
    // minimum f(3, 2) = 0. Hessian there by hand: [[74, 20], [20, 34]].
    const r = evaluate(compileFormula('(x^2+y-11)^2 + (x+y^2-7)^2'), [3, 2]);
    expect(r).toEqual({ value: 0, gradient: [0, 0], hessian: [74, 20, 20, 34] });
  });

  it('folds numeric subexpressions: d/dx of 2*pi*x is exactly 2*pi', () => {
    expect(evaluate(compileFormula('2*pi*x + e'), [0.3]).gradient).toEqual([2 * Math.PI]);
  });

  it('works as a Surface for the run loop: plain descent on Himmelblau reaches (3, 2)', () => {
    const surface = compileFormula('(x^2+y-11)^2 + (x+y^2-7)^2');
    const descent: Optimizer<null> = {
      label: 'test descent',
      init: () => null,
      step(x, g) {
        for (let i = 0; i < x.length; i++) x[i] -= 0.01 * g[i];
        return { learningRate: 0.01, extraEvaluations: 0 };
      },
    };
    const cursor = new RunCursor(surface, descent, { start: [1, 1], seed: 1, stop: { maxSteps: 2000 } });
    cursor.runToEnd(500);
    expect(cursor.state.x[0]).toBeCloseTo(3, 6);
    expect(cursor.state.x[1]).toBeCloseTo(2, 6);
  });
});

describe('compileFormula: variables and constants', () => {
  it('orders default variables alphabetically and leaves constants out', () => {
    const surface = compileFormula('a*(y - 1)^2 + b*x', { constants: { b: 100, a: 1 } });
    expect(surface.variables).toEqual(['x', 'y']);
    expect(surface.constants).toEqual({ a: 1, b: 100 });
    expect(evaluate(surface, [2, 3])).toEqual({ value: 204, gradient: [100, 4], hessian: [0, 0, 0, 2] });
  });

  it('follows an explicit variable order, including variables the formula does not use', () => {
    const surface = compileFormula('x^2 + 3*y', { variables: ['y', 'w', 'x'] });
    expect(evaluate(surface, [1, 5, 2])).toEqual({
      value: 7,
      gradient: [3, 0, 4],
      hessian: [0, 0, 0, 0, 0, 0, 0, 0, 2],
    });
  });

  it('withConstants changes values without touching the original', () => {
    const base = compileFormula('a*x^2', { constants: { a: 1 } });
    const steeper = base.withConstants({ a: 3 });
    expect(steeper.value([2])).toBe(12);
    expect(base.value([2])).toBe(4);
    expect(steeper.constants).toEqual({ a: 3 });
    expect(() => base.withConstants({ q: 1 })).toThrow("'q' is not a constant of this formula (constants: a)");
    expect(() => base.withConstants({ a: NaN })).toThrow("constant 'a' must be a finite number, got NaN");
  });

  it.each<[string, Parameters<typeof compileFormula>[1], string[]]>([
    ['x + z', { variables: ['x', 'y'] }, ["unknown variable 'z' at column 5; variables: x, y"]],
    ['z + z*x', { variables: ['x'], constants: { a: 1 } }, [
      "unknown variable 'z' at column 1; variables: x; constants: a",
      "unknown variable 'z' at column 5; variables: x; constants: a",
    ]],
    ['a*x', { variables: ['x', 'a'], constants: { a: 2 } }, ["'a' is both a variable and a constant"]],
    ['a*x', { constants: { a: Infinity } }, ["constant 'a' must be a finite number, got Infinity"]],
    ['x', { variables: ['x', 'x'] }, ["variable 'x' is listed twice"]],
    ['x', { variables: ['x', 'sin'] }, ["variable name 'sin' is a function"]],
    ['x', { variables: ['x'], constants: { pi: 3 } }, ["constant name 'pi' is a built-in constant"]],
    ['x', { variables: ['x y'] }, ["variable name 'x y' is not a valid identifier"]],
    ['sin(x', {}, ["unmatched '(' at column 4"]],
  ])('%j with %j is rejected', (text, options, messages) => {
    expect(thrown(() => compileFormula(text, options)).errors.map((e) => e.message)).toEqual(messages);
  });

  it('puts the span of an unknown variable on its characters', () => {
    expect(thrown(() => compileFormula('x + zed', { variables: ['x'] })).errors[0]).toMatchObject({ start: 4, end: 7 });
  });
});

describe('compileFormula: conventions at non-differentiable points', () => {
  it('abs, relu and sign have derivative 0 at 0; elu has 1', () => {
    expect(evaluate(compileFormula('abs(x)'), [0]).gradient).toEqual([0]);
    expect(evaluate(compileFormula('relu(x)'), [0]).gradient).toEqual([0]);
    expect(evaluate(compileFormula('sign(x)'), [0]).gradient).toEqual([0]);
    expect(evaluate(compileFormula('elu(x)'), [0])).toEqual({ value: 0, gradient: [1], hessian: [1] });
    expect(evaluate(compileFormula('abs(x)'), [-2]).gradient).toEqual([-1]);
    expect(evaluate(compileFormula('relu(x)'), [2]).gradient).toEqual([1]);
  });

  it('min and max follow their first argument at a tie', () => {
    expect(evaluate(compileFormula('min(x, y)'), [1, 1]).gradient).toEqual([1, 0]);
    expect(evaluate(compileFormula('max(x, y)'), [1, 1]).gradient).toEqual([1, 0]);
    expect(evaluate(compileFormula('max(y, x)'), [1, 1]).gradient).toEqual([0, 1]);
    expect(evaluate(compileFormula('min(x, y, z)', {}), [2, 1, 1]).gradient).toEqual([0, 1, 0]);
    expect(evaluate(compileFormula('max(x^2, 2*y)'), [3, 1]).gradient).toEqual([6, 0]);
  });

  it('sqrt at 0 gives an infinite derivative (the run loop reports divergence)', () => {
    const r = evaluate(compileFormula('sqrt(x)'), [0]);
    expect(r.value).toBe(0);
    expect(r.gradient).toEqual([Infinity]);
    expect(Number.isFinite(r.hessian[0])).toBe(false);
  });

  it('powers with a constant exponent differentiate at negative bases', () => {
    expect(evaluate(compileFormula('x^3'), [-2])).toEqual({ value: -8, gradient: [12], hessian: [-12] });
    expect(evaluate(compileFormula('x^-1'), [-2])).toEqual({ value: -0.5, gradient: [-0.25], hessian: [-0.25] });
  });

  it('keeps the machine-learning kernels finite far out', () => {
    expect(evaluate(compileFormula('softplus(x)'), [1000])).toEqual({ value: 1000, gradient: [1], hessian: [0] });
    expect(evaluate(compileFormula('softplus(x)'), [-1000])).toEqual({ value: 0, gradient: [0], hessian: [0] });
    expect(evaluate(compileFormula('sigmoid(x)'), [-800])).toEqual({ value: 0, gradient: [0], hessian: [0] });
  });
});
