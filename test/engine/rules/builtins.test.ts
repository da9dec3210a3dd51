import { describe, expect, it } from 'vitest';
import { adamRule, buildOptimizer, concatBatches, heavyBallRule, rmspropRule, RunCursor, type OptimizerSpec, type Surface } from '../../../src/engine';
import { buildSurface } from '../../../src/problems';
import { rosenbrock } from '../optim/surfaces';
import { runRule } from './run';

/**
 * The built-in Adam, RMSProp and heavy-ball momentum (src/engine/optim/methods) written as rules
 * (src/engine/rules/library) give the same iterates bit for bit over 1,000 steps, through the same run
 * loop, on Rosenbrock and on a data-fit loss (linear regression, mean squared error, over the seed-pods
 * demo data; the bench's data-fit surface). The oracle is the built-in optimizer itself.
 */
const STEPS = 1000;

const datafit = buildSurface({
  kind: 'datafit',
  dataset: { kind: 'demo', id: 'seed-pods', seed: 1, rows: 200 },
  model: { kind: 'linear', inputs: ['length_mm', 'ripe'], target: 'mass_g', loss: 'mse' },
  standardise: true,
});

const surfaces: { name: string; surface: Surface; start: number[]; lr: number }[] = [
  { name: 'Rosenbrock', surface: rosenbrock, start: [-1.2, 1], lr: 0.002 },
  // Near the origin the coordinates are small, so a one-ulp change in a step shows in the point (from
  // (-1.2, 1) most such changes are absorbed when the step is added): see the last tests.
  { name: 'Rosenbrock from near the origin', surface: rosenbrock, start: [0.01, -0.02], lr: 0.002 },
  { name: 'a data-fit loss (seed pods, linear, MSE)', surface: datafit, start: [0.5, -0.5, 0.25], lr: 0.01 },
];

const cases: { name: string; text: string; spec: (lr: number) => OptimizerSpec; hyper?: Record<string, number> }[] = [
  { name: 'Adam', text: adamRule.text, spec: (lr) => ({ kind: 'adam', learningRate: lr }) },
  { name: 'Adam, other settings', text: adamRule.text, spec: (lr) => ({ kind: 'adam', learningRate: lr, hyper: { beta1: 0.8, beta2: 0.99, epsilon: 1e-6 } }), hyper: { beta1: 0.8, beta2: 0.99, eps: 1e-6 } },
  { name: 'RMSProp', text: rmspropRule.text, spec: (lr) => ({ kind: 'rmsprop', learningRate: lr }) },
  { name: 'heavy ball', text: heavyBallRule.text, spec: (lr) => ({ kind: 'momentum', learningRate: lr / 10 }) },
  { name: 'heavy ball with dampening 0.3', text: heavyBallRule.text, spec: (lr) => ({ kind: 'momentum', learningRate: lr / 10, hyper: { momentum: 0.8, dampening: 0.3 } }), hyper: { momentum: 0.8, dampening: 0.3 } },
];

function runBuiltin(surface: Surface, spec: OptimizerSpec, start: number[]) {
  const cursor = new RunCursor(surface, buildOptimizer(spec), { start, seed: 1, stop: { maxSteps: STEPS } });
  return concatBatches(cursor.runToEnd(1000), surface.dimension);
}

describe('built-in optimizers written as rules reproduce them bit for bit over 1,000 steps', () => {
  for (const s of surfaces) {
    it.each(cases)(`$name on ${s.name}`, ({ text, spec, hyper }) => {
      const builtIn = spec(s.lr);
      const expected = runBuiltin(s.surface, builtIn, s.start);
      const actual = runRule(s.surface, text, { learningRate: builtIn.learningRate, hyper }, s.start, STEPS);
      expect(actual.count).toBe(STEPS + 1);
      expect(expected.count).toBe(STEPS + 1);
      // Every coordinate of every iterate and every loss, as doubles (Object.is: no tolerance, -0 too).
      expect(Array.from(actual.points)).toEqual(Array.from(expected.points));
      expect(Array.from(actual.loss)).toEqual(Array.from(expected.loss));
      // The runs went somewhere (two static runs would agree trivially).
      const last = actual.points.subarray(STEPS * s.surface.dimension);
      expect(Math.hypot(...Array.from(last, (v, i) => v - s.start[i]))).toBeGreaterThan(0.05);
    });
  }

  it.each([
    ['(1 - beta2) * g * g', '(1 - beta2) * g^2'],
    ['x - lr * (m / (1 - beta1^t) / (sqrt(v / (1 - beta2^t)) + eps))', 'x - lr * m / (1 - beta1^t) / (sqrt(v / (1 - beta2^t)) + eps)'],
  ])('can tell a different order of operations apart: %s written as %s', (from, to) => {
    const reordered = adamRule.text.replace(from, to);
    expect(reordered).not.toBe(adamRule.text);
    const start = [0.01, -0.02];
    const expected = runBuiltin(rosenbrock, { kind: 'adam', learningRate: 0.002 }, start);
    const actual = runRule(rosenbrock, reordered, { learningRate: 0.002 }, start, STEPS);
    expect(Array.from(actual.points)).not.toEqual(Array.from(expected.points));
  });

  it('follows a learning-rate schedule as the built-in does (step decay with warm-up)', () => {
    const schedule = { kind: 'step', decayRate: 0.5, decaySteps: 100, warmupSteps: 20 } as const;
    const expected = runBuiltin(rosenbrock, { kind: 'adam', learningRate: 0.01, schedule }, [-1.2, 1]);
    const actual = runRule(rosenbrock, adamRule.text, { learningRate: 0.01, schedule }, [-1.2, 1], STEPS);
    expect(Array.from(actual.points)).toEqual(Array.from(expected.points));
    expect(Array.from(actual.learningRate)).toEqual(Array.from(expected.learningRate));
  });
});

describe("the optimizer kind 'rule' (OptimizerSpec, buildOptimizer)", () => {
  it('runs a rule by spec, with clipNorm and l2Penalty applied to g as the built-in chain does', () => {
    const extras = { clipNorm: 5, l2Penalty: 0.01, schedule: { kind: 'cosine', horizon: STEPS } } as const;
    const expected = runBuiltin(rosenbrock, { kind: 'adam', learningRate: 0.01, ...extras }, [0.01, -0.02]);
    const viaSpec = runBuiltin(rosenbrock, { kind: 'rule', learningRate: 0.01, ...extras, rule: { name: 'Adam (rule)', text: adamRule.text } }, [0.01, -0.02]);
    expect(Array.from(viaSpec.points)).toEqual(Array.from(expected.points));
  });

  it("labels the optimizer with the rule's name and passes the spec's settings to the rule", () => {
    const spec: OptimizerSpec = { kind: 'rule', learningRate: 0.01, hyper: { momentum: 0.5 }, rule: { name: 'My heavy ball', text: heavyBallRule.text } };
    expect(buildOptimizer(spec).label).toBe('My heavy ball');
    const expected = runBuiltin(rosenbrock, { kind: 'momentum', learningRate: 0.01, hyper: { momentum: 0.5 } }, [0.01, -0.02]);
    expect(Array.from(runBuiltin(rosenbrock, spec, [0.01, -0.02]).points)).toEqual(Array.from(expected.points));
  });
});
