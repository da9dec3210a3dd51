import { describe, expect, it } from 'vitest';
import { compileRule, power, RULE_LIBRARY, ruleOptimizer, type Oracle } from '../../../src/engine';
import { quadratic } from '../optim/surfaces';
import { runRule } from './run';

/** A 3-parameter bowl f = 1/2 sum d_i x_i^2 with d = (1, 4, 9): gradients differ per coordinate. */
const bowl3 = quadratic([1, 0, 0, 0, 4, 0, 0, 0, 9], [0, 0, 0]);
const start = [1, -0.5, 0.25];
const grad = (x: number[]) => [x[0], 4 * x[1], 9 * x[2]];
const oracle: Oracle = { dimension: 3, value: () => 0, valueGradient: () => 0, valueGradientHessian: () => 0 };

/** Runs `steps` steps of a rule and of a plain-JavaScript loop `step(x, g, t)` and compares every iterate exactly. */
function agrees(text: string, lr: number, step: (x: number[], g: number[], t: number) => number[], steps = 5) {
  const batch = runRule(bowl3, text, { learningRate: lr }, start, steps);
  let x = [...start];
  for (let t = 1; t <= steps; t++) {
    x = step(x, grad(x), t);
    expect(Array.from(batch.points.subarray(3 * t, 3 * t + 3))).toEqual(x);
  }
}

describe('rule semantics: element-wise statements in order, reductions over all parameters', () => {
  it('plain gradient descent', () => agrees('x = x - lr * g', 0.1, (x, g) => x.map((v, i) => v - 0.1 * g[i])));

  it('reductions: norm, sum, dot, largest', () => {
    agrees('x = x - lr * g / norm(g)', 0.1, (x, g) => {
      const n = Math.sqrt(g.reduce((s, v) => s + v * v, 0));
      return x.map((v, i) => v - (0.1 * g[i]) / n);
    });
    agrees('x = x - lr * (g - sum(g) / 3) + lr * dot(g, x) * 0.01 - lr * largest(abs(g)) * 0.001', 0.1, (x, g) => {
      const s = g.reduce((a, v) => a + v, 0);
      const d = g.reduce((a, v, i) => a + v * x[i], 0);
      const m = Math.max(...g.map(Math.abs));
      return x.map((v, i) => v - 0.1 * (g[i] - s / 3) + 0.1 * d * 0.01 - 0.1 * m * 0.001);
    });
  });

  it('a reduction sees the values assigned by the lines above it (the loop is split there)', () => {
    const text = 'state m = 0\nm = 0.5 * m + g\nlet u = m / norm(m)\nx = x - lr * u\nm = m + norm(u)';
    let m = [0, 0, 0];
    agrees(text, 0.1, (x, g) => {
      m = m.map((v, i) => 0.5 * v + g[i]);
      const n = Math.sqrt(m.reduce((s, v) => s + v * v, 0));
      const u = m.map((v) => v / n);
      const nu = Math.sqrt(u.reduce((s, v) => s + v * v, 0));
      m = m.map((v) => v + nu);
      return x.map((v, i) => v - 0.1 * u[i]);
    });
    // Three loops: before norm(m), before norm(u); u is read across loops, so it lives in a scratch array.
    const source = compileRule(text).source;
    expect(source.match(/for \(let i = 0; i < n; i\+\+\) \{$/gm)).toHaveLength(3 + 1); // + the initial-state loop
    expect(source).toContain('w0[i]');
  });

  it('initial values may read the start point; clip, sign, min and max are element-wise', () => {
    const text = 'state anchor = x\nstate k = 2\nx = x - lr * clip(g, -1, 1) - lr * 0.1 * (x - anchor) * min(k, 3, max(t, 1))';
    agrees(text, 0.1, (x, g, t) => x.map((v, i) => v - 0.1 * Math.min(Math.max(g[i], -1), 1) - 0.1 * 0.1 * (v - start[i]) * Math.min(Math.min(2, 3), Math.max(t, 1))));
  });

  it('per-step numbers (t, lr, settings) are hoisted out of the loop and computed once', () => {
    const source = compileRule('hyper b = 0.9\nx = x - lr * g * (1 - b^t)').source;
    expect(source).toMatch(/const k0 = \(1 - m_pow\(h0, t\)\);\nfor/);
  });

  it('a setting written as a power is folded with products only, as the generated code computes it', () => {
    // 0.9^7: Math.pow in Node 20 differs from the products-only power in the last bit (engine/power.ts).
    expect(Object.is(Math.pow(0.9, 7), power(0.9, 7))).toBe(false);
    expect(Object.is(compileRule('hyper b = 0.9^7\nx = x - lr * b * g').hyperparameters[0].default, power(0.9, 7))).toBe(true);
  });

  it('every library rule compiles without warnings and lowers the loss on a bowl', () => {
    for (const r of RULE_LIBRARY) {
      const rule = compileRule(r.text);
      expect(rule.warnings, r.id).toEqual([]);
      const batch = runRule(bowl3, r.text, { learningRate: Math.min(r.defaultLearningRate * 10, 0.05) }, start, 200);
      expect(batch.loss[200], r.id).toBeLessThan(batch.loss[0]);
    }
  });
});

describe('rule run state is plain data', () => {
  it('survives structuredClone: a cloned state continues exactly like the original', () => {
    const opt = ruleOptimizer(compileRule(RULE_LIBRARY.find((r) => r.id === 'adam')!.text), { label: 'Adam', learningRate: 0.05 });
    const x = Float64Array.from(start);
    const state = opt.init(x);
    const g = new Float64Array(3);
    const take = (p: Float64Array, s: typeof state, t: number) => {
      g.set(grad(Array.from(p)));
      opt.step(p, g, s, { t, loss: 0, oracle });
    };
    for (let t = 1; t <= 5; t++) take(x, state, t);
    const copy = structuredClone({ x, state });
    expect(copy.state.states[0]).toBeInstanceOf(Float64Array);
    for (let t = 6; t <= 10; t++) {
      take(x, state, t);
      take(copy.x, copy.state, t);
    }
    expect(Array.from(copy.x)).toEqual(Array.from(x));
    expect(copy.state).toEqual(state);
  });

  it('reports the scheduled learning rate of the step', () => {
    const opt = ruleOptimizer(compileRule('x = x - lr * g'), { label: 'gd', learningRate: 0.1, schedule: { kind: 'exponential', decayRate: 0.5 } });
    const x = Float64Array.from(start);
    const s = opt.init(x);
    expect(opt.step(x, Float64Array.from(grad(start)), s, { t: 3, loss: 0, oracle }).learningRate).toBeCloseTo(0.1 * 0.25, 15);
  });
});
