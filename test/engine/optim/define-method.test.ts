/**
 * Methods are declared with typed settings (methods/method.ts `defineMethod`, settings.ts builders):
 * the description the validator and the settings panel read is derived from the declaration, the
 * builder receives the spec's values under the declared names, and the family replaces the old
 * double meaning of "uses a schedule".
 */
import { describe, expect, it } from 'vitest';
import { buildOptimizer, OPTIMIZERS, optimizerInfo, validateOptimizerSpec } from '../../../src/engine';
import { choice, flag, number, unit } from '../../../src/engine/optim/settings';
import { defineMethod } from '../../../src/engine/optim/methods/method';
import { chain } from '../../../src/engine/optim/transform';
import { scaleByLearningRate } from '../../../src/engine/optim/transforms';

describe('setting builders', () => {
  it('describe a setting under the name it is declared with', () => {
    expect(unit(0.9, { help: 'h' }).describe('beta1')).toEqual({ name: 'beta1', label: 'beta1', default: 0.9, min: 0, max: 1, maxExclusive: true, help: 'h' });
    expect(number(3, { label: 'n', min: 1, integer: true, help: 'h' }).describe('count')).toEqual({ name: 'count', label: 'n', default: 3, min: 1, integer: true, help: 'h' });
    expect(flag(false, { help: 'h' }).describe('on')).toEqual({ name: 'on', label: 'on', default: false, help: 'h' });
    expect(choice(['a', 'b'], { help: 'h' }).describe('form')).toEqual({ name: 'form', label: 'form', default: 'a', choices: ['a', 'b'], help: 'h' });
    expect(choice(['a', 'b'], { default: 'b', help: 'h' }).describe('form').default).toBe('b');
  });
});

describe('defineMethod', () => {
  it('hands the builder the spec values under the declared names, typed', () => {
    const seen: unknown[] = [];
    const method = defineMethod({
      kind: 'gd',
      label: 'Test',
      defaultLearningRate: 0.1,
      family: 'first-order',
      defaultWeightDecay: 0,
      summary: 's',
      source: 'none',
      settings: { rate: unit(0.5, { help: 'h' }), form: choice(['x', 'y'], { help: 'h' }), on: flag(true, { help: 'h' }) },
      build: (s, spec) => {
        const rate: number = s.rate;
        const form: 'x' | 'y' = s.form;
        const on: boolean = s.on;
        seen.push(rate, form, on);
        return chain('Test', [scaleByLearningRate(spec.learningRate, spec.schedule)]);
      },
    });
    expect(method.info.hyperparameters.map((h) => h.name)).toEqual(['rate', 'form', 'on']);
    method.build({ kind: 'gd', learningRate: 0.1, hyper: { rate: 0.25, form: 'y', on: false }, schedule: { kind: 'constant' }, clipNorm: undefined, l2Penalty: 0, weightDecay: 0 });
    expect(seen).toEqual([0.25, 'y', false]);
  });
});

describe('the registry', () => {
  it('has one method per kind, each declaring its own kind', () => {
    const kinds = OPTIMIZERS.map((o) => o.kind);
    expect(new Set(kinds).size).toBe(kinds.length);
    for (const kind of kinds) expect(optimizerInfo(kind).kind).toBe(kind);
  });

  it('refuses the schedule outside the first-order family, and accepts it inside', () => {
    for (const o of OPTIMIZERS) {
      if (o.kind === 'rule') continue;
      const problems = validateOptimizerSpec({ kind: o.kind, learningRate: 0.01, schedule: { kind: 'constant' } }).map((e) => e.field);
      expect(problems.includes('schedule'), o.kind).toBe(o.family !== 'first-order');
    }
    expect(OPTIMIZERS.filter((o) => o.family !== 'first-order').map((o) => o.kind)).toEqual(['lbfgs', 'newton']);
  });

  it('Nesterov, Sutskever form, first step: theta_1 = theta_0 - lr g(theta_0) (v_0 = 0, so the look-ahead is theta_0)', () => {
    // Sutskever, Martens, Dahl & Hinton (ICML 2013), eq. 3-4, worked by hand on f = x^2 / 2 + y^2:
    // g(1, 1) = (1, 2), lr = 0.1: theta_1 = (0.9, 0.8), v_1 = (-0.1, -0.2); then the look-ahead
    // theta_1 + 0.9 v_1 = (0.81, 0.62), g there = (0.81, 1.24), v_2 = 0.9 v_1 - 0.1 g = (-0.171, -0.304),
    // theta_2 = (0.729, 0.496).
    const opt = buildOptimizer({ kind: 'nesterov', learningRate: 0.1, hyper: { momentum: 0.9, form: 'record-base-point' } });
    const grad = (p: ArrayLike<number>, g: Float64Array) => {
      g[0] = p[0];
      g[1] = 2 * p[1];
      return p[0] ** 2 / 2 + p[1] ** 2;
    };
    const oracle = { dimension: 2, value: (p: ArrayLike<number>) => grad(p, new Float64Array(2)), valueGradient: grad, valueGradientHessian: () => Number.NaN };
    const x = new Float64Array([1, 1]);
    const g = new Float64Array(2);
    const state = opt.init(x);
    for (let t = 1; t <= 2; t++) {
      const loss = grad(x, g);
      opt.step(x, g, state, { t, loss, oracle });
    }
    expect(x[0]).toBeCloseTo(0.729, 14);
    expect(x[1]).toBeCloseTo(0.496, 14);
  });
});
