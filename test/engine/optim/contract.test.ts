import { describe, expect, it } from 'vitest';
import {
  buildOptimizer,
  chain,
  concatBatches,
  defaultOptimizerSpec,
  learningRateAt,
  OPTIMIZERS,
  RunCursor,
  scaleByAdam,
  scaleByLearningRate,
  type Optimizer,
  type Oracle,
  type OptimizerSpec,
  type Surface,
} from '../../../src/engine';
import { counting, rosenbrock } from './surfaces';

/** Settings that keep every kind well-behaved on Rosenbrock for a few dozen steps. */
const specs: OptimizerSpec[] = OPTIMIZERS.flatMap((o) => {
  const base = { ...defaultOptimizerSpec(o.kind), learningRate: o.family === 'first-order' ? 1e-3 : 1 };
  if (o.kind === 'nesterov') return [base, { ...base, hyper: { ...base.hyper, form: 'record-base-point' } }];
  if (o.kind === 'newton') return [base, { ...base, hyper: { ...base.hyper, lineSearch: 'backtracking' } }, { ...base, hyper: { ...base.hyper, variant: 'saddle-free' } }];
  if (o.kind === 'lbfgs') return [base, { ...base, learningRate: 0.01, hyper: { ...base.hyper, lineSearch: 'none' } }];
  return [{ ...base, schedule: { kind: 'cosine', horizon: 30, warmupSteps: 3 } }];
});

const name = (s: OptimizerSpec) => `${s.kind} ${JSON.stringify(s.hyper ?? {})}`;

function oracleFor(surface: Surface): Oracle {
  return {
    dimension: surface.dimension,
    value: (x) => surface.value(x),
    valueGradient: (x, g) => surface.valueGradient(x, g),
    valueGradientHessian: (x, g, h) => surface.valueGradientHessian(x, g, h),
  };
}

describe('the Optimizer contract, for every kind', () => {
  it.each(specs.map((s) => [name(s), s] as const))('%s: counts its evaluations honestly', (_, spec) => {
    const surface = counting(rosenbrock);
    const cursor = new RunCursor(surface, buildOptimizer(spec), { start: [-1.2, 1], seed: 3, stop: { maxSteps: 40 } });
    cursor.runToEnd(7);
    expect(cursor.state.evaluations).toBe(surface.calls);
  });

  it.each(specs.map((s) => [name(s), s] as const))('%s: keeps plain-data state that resumes identically after structuredClone', (_, spec) => {
    const opt = buildOptimizer(spec);
    const oracle = oracleFor(rosenbrock);
    /** Steps t = from .. from + steps - 1 the way the run loop does (no noise). */
    const advance = (x: Float64Array, state: unknown, from: number, steps: number) => {
      const g = new Float64Array(2);
      let loss = rosenbrock.valueGradient(x, g);
      for (let t = from; t < from + steps; t++) loss = opt.step(x, g, state, { t, loss, oracle }).lossAtNewPoint ?? rosenbrock.valueGradient(x, g);
    };
    const x = Float64Array.from([-1.2, 1]);
    const state = opt.init(Float64Array.from(x));
    advance(x, state, 1, 10);
    const copyX = Float64Array.from(x);
    const copyState = structuredClone(state);
    expect(copyState).toEqual(state);
    advance(x, state, 11, 10);
    advance(copyX, copyState, 11, 10);
    expect(Array.from(copyX)).toEqual(Array.from(x));
    expect(copyState).toEqual(state);
  });

  it.each(specs.filter((s) => OPTIMIZERS.find((o) => o.kind === s.kind)!.family === 'first-order').map((s) => [name(s), s] as const))(
    '%s: reports the scheduled learning rate',
    (_, spec) => {
      const cursor = new RunCursor(rosenbrock, buildOptimizer(spec), { start: [-1.2, 1], seed: 1, stop: { maxSteps: 40 } });
      const b = concatBatches(cursor.runToEnd(), 2);
      for (let t = 1; t < b.count; t++) expect(b.learningRate[t]).toBe(learningRateAt(spec.schedule, spec.learningRate, t));
    },
  );

  it.each(specs.map((s) => [name(s), s] as const))('%s: runs with gradient noise without failing', (_, spec) => {
    const cursor = new RunCursor(rosenbrock, buildOptimizer(spec), { start: [-1.2, 1], seed: 9, stop: { maxSteps: 30 }, gradientNoise: 0.5 });
    const b = concatBatches(cursor.runToEnd(), 2);
    expect(b.count).toBeGreaterThan(1);
    expect(Array.from(b.points).every(Number.isFinite)).toBe(true);
  });
});

describe('chain', () => {
  it('demands exactly one learning-rate transform (the one minus sign)', () => {
    expect(() => chain('no rate', [scaleByAdam(0.9, 0.999, 1e-8)])).toThrow('expected exactly one learning-rate transform');
    expect(() => chain('two rates', [scaleByLearningRate(0.1), scaleByLearningRate(0.1)])).toThrow('got 2');
  });

  it('a hand-built chain equals the named optimizer', () => {
    const hand = chain('my adam', [scaleByAdam(0.9, 0.999, 1e-8), scaleByLearningRate(0.01)]);
    const named = buildOptimizer({ kind: 'adam', learningRate: 0.01 });
    const run = (o: Optimizer) => Array.from(concatBatches(new RunCursor(rosenbrock, o, { start: [-1.2, 1], seed: 1, stop: { maxSteps: 50 } }).runToEnd(), 2).points);
    expect(run(hand)).toEqual(run(named));
  });
});
