import { describe, expect, it } from 'vitest';
import { adamRule, type OptimizerSpec } from '../../../src/engine';
import { distance, lastPoint, runSpec } from './run';
import { quadratic, rosenbrock, rotatedDiagonal } from './surfaces';

/**
 * Every optimizer, with settings a practitioner would pick for the problem, reaches the minimum of a
 * convex quadratic and of Rosenbrock's function from the classic start (-1.2, 1) within a step budget.
 * Minimum of Rosenbrock: (1, 1), value 0 (Rosenbrock, Comput. J. 3, 1960). The budgets are generous
 * upper bounds, not measured speeds. Step-size choices are common practice (from experience, not a
 * published table); adaptive methods get a cosine schedule so their constant-rate jitter dies down.
 */
const valley = quadratic(rotatedDiagonal(1, 25, 0.4), [1, 1]);

interface Case {
  spec: OptimizerSpec;
  maxSteps: number;
  tolerance: number;
}

/** A case whose cosine schedule spans the step budget, so the rate has decayed to 0 by the last step. */
const withCosine = (spec: OptimizerSpec, maxSteps: number, tolerance: number): Case => ({
  spec: { ...spec, schedule: { kind: 'cosine', horizon: maxSteps } },
  maxSteps,
  tolerance,
});

const table: { name: string; quadratic: Case; rosenbrock: Case }[] = [
  {
    name: 'gd',
    quadratic: { spec: { kind: 'gd', learningRate: 0.07 }, maxSteps: 2000, tolerance: 1e-6 },
    // lr must stay below 2 / lambda_max = 0.001997 of the Hessian at (1, 1) (lambda_max ~ 1001.6), or GD
    // ends in a 2-cycle around the minimum (it did, at 0.002).
    rosenbrock: { spec: { kind: 'gd', learningRate: 0.001 }, maxSteps: 100000, tolerance: 1e-3 },
  },
  {
    name: 'momentum',
    quadratic: { spec: { kind: 'momentum', learningRate: 0.02, hyper: { momentum: 0.8 } }, maxSteps: 2000, tolerance: 1e-6 },
    rosenbrock: { spec: { kind: 'momentum', learningRate: 0.0005, hyper: { momentum: 0.9 } }, maxSteps: 40000, tolerance: 1e-3 },
  },
  {
    name: 'nesterov',
    quadratic: { spec: { kind: 'nesterov', learningRate: 0.02, hyper: { momentum: 0.8 } }, maxSteps: 2000, tolerance: 1e-6 },
    rosenbrock: { spec: { kind: 'nesterov', learningRate: 0.0005, hyper: { momentum: 0.9 } }, maxSteps: 40000, tolerance: 1e-3 },
  },
  {
    name: 'nesterov (record-base-point form)',
    quadratic: { spec: { kind: 'nesterov', learningRate: 0.02, hyper: { momentum: 0.8, form: 'record-base-point' } }, maxSteps: 2000, tolerance: 1e-6 },
    rosenbrock: { spec: { kind: 'nesterov', learningRate: 0.0005, hyper: { momentum: 0.9, form: 'record-base-point' } }, maxSteps: 40000, tolerance: 1e-3 },
  },
  {
    name: 'adagrad',
    quadratic: { spec: { kind: 'adagrad', learningRate: 0.5 }, maxSteps: 5000, tolerance: 1e-6 },
    rosenbrock: { spec: { kind: 'adagrad', learningRate: 0.5 }, maxSteps: 40000, tolerance: 1e-3 },
  },
  {
    name: 'rmsprop',
    quadratic: withCosine({ kind: 'rmsprop', learningRate: 0.01 }, 3000, 1e-4),
    rosenbrock: withCosine({ kind: 'rmsprop', learningRate: 0.001 }, 20000, 1e-2),
  },
  {
    name: 'adam',
    quadratic: withCosine({ kind: 'adam', learningRate: 0.05 }, 3000, 1e-4),
    rosenbrock: withCosine({ kind: 'adam', learningRate: 0.02 }, 10000, 1e-3),
  },
  {
    name: 'adamw',
    quadratic: withCosine({ kind: 'adamw', learningRate: 0.05, weightDecay: 0 }, 3000, 1e-4),
    rosenbrock: withCosine({ kind: 'adamw', learningRate: 0.02, weightDecay: 0 }, 10000, 1e-3),
  },
  {
    name: 'amsgrad',
    quadratic: withCosine({ kind: 'amsgrad', learningRate: 0.05 }, 3000, 1e-4),
    rosenbrock: withCosine({ kind: 'amsgrad', learningRate: 0.05 }, 20000, 1e-3),
  },
  {
    name: 'nadam',
    quadratic: withCosine({ kind: 'nadam', learningRate: 0.05 }, 3000, 1e-4),
    rosenbrock: withCosine({ kind: 'nadam', learningRate: 0.02 }, 10000, 1e-3),
  },
  {
    name: 'lbfgs',
    quadratic: { spec: { kind: 'lbfgs', learningRate: 1 }, maxSteps: 20, tolerance: 1e-8 },
    rosenbrock: { spec: { kind: 'lbfgs', learningRate: 1 }, maxSteps: 100, tolerance: 1e-8 },
  },
  {
    name: 'newton',
    quadratic: { spec: { kind: 'newton', learningRate: 1 }, maxSteps: 1, tolerance: 1e-12 },
    rosenbrock: { spec: { kind: 'newton', learningRate: 1, hyper: { lineSearch: 'backtracking' } }, maxSteps: 100, tolerance: 1e-8 },
  },
  {
    name: 'newton (saddle-free)',
    quadratic: { spec: { kind: 'newton', learningRate: 1, hyper: { variant: 'saddle-free' } }, maxSteps: 1, tolerance: 1e-12 },
    rosenbrock: { spec: { kind: 'newton', learningRate: 1, hyper: { variant: 'saddle-free', lineSearch: 'backtracking' } }, maxSteps: 100, tolerance: 1e-8 },
  },
  {
    // Adam written as a rule (the kind's default rule), at Adam's rates.
    name: 'rule',
    quadratic: withCosine({ kind: 'rule', learningRate: 0.05, rule: { name: 'Adam (rule)', text: adamRule.text } }, 3000, 1e-4),
    rosenbrock: withCosine({ kind: 'rule', learningRate: 0.02, rule: { name: 'Adam (rule)', text: adamRule.text } }, 10000, 1e-3),
  },
];

describe('every optimizer converges on a convex quadratic and on Rosenbrock from (-1.2, 1)', () => {
  it('the table covers every optimizer kind', async () => {
    const { OPTIMIZERS } = await import('../../../src/engine');
    const covered = new Set(table.map((r) => r.quadratic.spec.kind));
    expect([...covered].sort()).toEqual(OPTIMIZERS.map((o) => o.kind).sort());
  });

  it.each(table)('$name', ({ quadratic: q, rosenbrock: r }) => {
    const stop = (c: Case) => ({ maxSteps: c.maxSteps, gradientNormTolerance: 1e-10 });
    const onQuadratic = runSpec(valley, q.spec, [-2, 3], stop(q));
    const dq = distance(lastPoint(onQuadratic.batch), [1, 1]);
    const onRosenbrock = runSpec(rosenbrock, r.spec, [-1.2, 1], stop(r));
    const dr = distance(lastPoint(onRosenbrock.batch), [1, 1]);
    expect(onQuadratic.cursor.outcome?.kind).not.toBe('diverged');
    expect(dq).toBeLessThan(q.tolerance);
    expect(onRosenbrock.cursor.outcome?.kind).not.toBe('diverged');
    expect(dr).toBeLessThan(r.tolerance);
  });
});
