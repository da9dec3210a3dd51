import { describe, expect, it } from 'vitest';
import { FormulaSyntaxError, compileModel } from '../../../src/engine/expr';

describe('compileModel', () => {
  // An exponential-rise model, y = b1 (1 - exp(-b2 x)). By hand, with E = exp(-b2 x):
  //   df/db1 = 1 - E,  df/db2 = b1 x E,
  //   d2f/db1^2 = 0,  d2f/db1 db2 = x E,  d2f/db2^2 = -b1 x^2 E.
  const model = compileModel('b1 * (1 - exp(-b2 * x))', { parameters: ['b1', 'b2'], inputs: ['x'] });

  it('differentiates with respect to the parameters only', () => {
    expect(model.parameters).toEqual(['b1', 'b2']);
    expect(model.inputs).toEqual(['x']);
    for (const [b1, b2, x] of [[240, 0.5, 1], [-3, 0.02, 7.5], [1, 2, 0]]) {
      const E = Math.exp(-b2 * x);
      const grad = new Float64Array(2);
      const hessian = new Float64Array(4);
      const value = model.valueGradientHessian([b1, b2], [x], grad, hessian);
      expect(value).toBeCloseTo(b1 * (1 - E), 12);
      expect(model.value([b1, b2], [x])).toBe(value);
      expect(grad[0]).toBeCloseTo(1 - E, 14);
      expect(grad[1]).toBeCloseTo(b1 * x * E, 12);
      expect(hessian[0]).toBe(0);
      expect(hessian[1]).toBeCloseTo(x * E, 14);
      expect(hessian[2]).toBe(hessian[1]);
      expect(hessian[3]).toBeCloseTo(-b1 * x * x * E, 10);
      const g2 = new Float64Array(2);
      expect(model.valueGradient([b1, b2], [x], g2)).toBe(value);
      expect(Array.from(g2)).toEqual(Array.from(grad));
    }
  });

  it('reads inputs per row and constants from its table', () => {
    const logistic = compileModel('sigmoid(w0 + w1*x1 + w2*x2) * scale', {
      parameters: ['w0', 'w1', 'w2'],
      inputs: ['x1', 'x2'],
      constants: { scale: 2 },
    });
    // d/dw of scale * s(w . (1, x1, x2)) = scale * s (1 - s) * (1, x1, x2)  (chain rule, by hand)
    const w = [0.1, -0.4, 0.25];
    for (const row of [[1, 2], [-3, 0.5]]) {
      const z = w[0] + w[1] * row[0] + w[2] * row[1];
      const s = 1 / (1 + Math.exp(-z));
      const grad = new Float64Array(3);
      expect(logistic.valueGradient(w, row, grad)).toBeCloseTo(2 * s, 14);
      [1, row[0], row[1]].forEach((feature, i) => expect(grad[i]).toBeCloseTo(2 * s * (1 - s) * feature, 14));
    }
    const halved = logistic.withConstants({ scale: 1 });
    expect(halved.value(w, [0, 0])).toBeCloseTo(logistic.value(w, [0, 0]) / 2, 15);
  });

  it('rejects names in two roles and names in neither', () => {
    const messages = (run: () => unknown) => {
      try {
        run();
      } catch (error) {
        if (error instanceof FormulaSyntaxError) return error.errors.map((e) => e.message);
        throw error;
      }
      throw new Error('expected an error');
    };
    expect(messages(() => compileModel('a * x', { parameters: ['a', 'x'], inputs: ['x'] }))).toEqual(["'x' is both a parameter and an input"]);
    expect(messages(() => compileModel('a * x + q', { parameters: ['a'], inputs: ['x'] }))).toEqual([
      "unknown name 'q' at column 9; parameters: a; inputs: x",
    ]);
    expect(messages(() => compileModel('a * k', { parameters: ['a'], inputs: ['k'], constants: { k: 1 } }))).toEqual([
      "'k' is both an input and a constant",
    ]);
  });
});
