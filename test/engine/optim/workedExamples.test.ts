import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import type { OptimizerSpec, Surface } from '../../../src/engine';
import { pointAt, runSpec } from './run';
import { bowl, rosenbrock } from './surfaces';

/**
 * Source: test/fixtures/optimizers/optimizer-worked-examples.csv, a copy of the shared reference file
 * of that name (hand-computed iterates, 12 significant digits; see the fixture README). Checked to
 * 1e-10 (relative to max(1, |value|)) through the real run loop.
 */
interface Row {
  method_and_convention: string;
  iteration: string;
  x: string;
  y: string;
  f: string;
}
const csv = readFileSync(resolve(__dirname, '../../fixtures/optimizers/optimizer-worked-examples.csv'), 'utf8');
const rows = Papa.parse<Row>(csv, { header: true, skipEmptyLines: true }).data;

const adamBetas = { beta1: 0.9, beta2: 0.999, epsilon: 1e-8 };
const heavyBall: OptimizerSpec = { kind: 'momentum', learningRate: 0.05, hyper: { momentum: 0.9 } };

/** Every convention in the fixture, matched by the start of its name, with the spec that expresses it. */
interface Case {
  prefix: string;
  spec: OptimizerSpec;
  surface?: Surface;
  start?: number[];
}
const cases = (
  [
  { prefix: 'GD lr=0.05', spec: { kind: 'gd', learningRate: 0.05 } },
  { prefix: 'Momentum (heavy ball)', spec: heavyBall },
  { prefix: 'Polyak heavy ball', spec: heavyBall },
  { prefix: 'Nesterov, Sutskever', spec: { kind: 'nesterov', learningRate: 0.05, hyper: { momentum: 0.9, form: 'record-base-point' } } },
  { prefix: 'Nesterov, PyTorch/Keras/Optax', spec: { kind: 'nesterov', learningRate: 0.05, hyper: { momentum: 0.9 } } },
  { prefix: 'AdaGrad lr=0.5 eps=1e-8 outside', spec: { kind: 'adagrad', learningRate: 0.5, hyper: { epsilon: 1e-8, epsilonPlacement: 'outside', initialAccumulator: 0 } } },
  { prefix: 'AdaGrad lr=0.5 eps=1e-8 inside', spec: { kind: 'adagrad', learningRate: 0.5, hyper: { epsilon: 1e-8, epsilonPlacement: 'inside', initialAccumulator: 0 } } },
  { prefix: 'RMSProp lr=0.01 rho=0.9 eps=1e-8 outside', spec: { kind: 'rmsprop', learningRate: 0.01, hyper: { decay: 0.9, epsilon: 1e-8, epsilonPlacement: 'outside' } } },
  { prefix: 'RMSProp lr=0.01 rho=0.9 eps=1e-8 inside sqrt, v_0=0', spec: { kind: 'rmsprop', learningRate: 0.01, hyper: { decay: 0.9, epsilon: 1e-8, epsilonPlacement: 'inside' } } },
  { prefix: 'RMSProp lr=0.01 rho=0.9 eps=1e-8 inside sqrt, v_0=1', spec: { kind: 'rmsprop', learningRate: 0.01, hyper: { decay: 0.9, epsilon: 1e-8, epsilonPlacement: 'inside', initialMeanSquare: 1 } } },
  { prefix: 'Adam Alg.1', spec: { kind: 'adam', learningRate: 0.1, hyper: { ...adamBetas, epsilonForm: 'eps-after-correction' } } },
  { prefix: 'Adam eps-hat', spec: { kind: 'adam', learningRate: 0.1, hyper: { ...adamBetas, epsilonForm: 'eps-before-correction' } } },
  { prefix: 'EXTRA AMSGrad lr=0.1 (PyTorch', spec: { kind: 'amsgrad', learningRate: 0.1, hyper: { ...adamBetas, form: 'max-raw-moment' } } },
  { prefix: 'EXTRA AMSGrad lr=0.1 (Optax', spec: { kind: 'amsgrad', learningRate: 0.1, hyper: { ...adamBetas, form: 'max-corrected-moment' } } },
  { prefix: 'EXTRA AMSGrad lr=0.1 (Reddi', spec: { kind: 'amsgrad', learningRate: 0.1, hyper: { ...adamBetas, epsilon: 0, form: 'no-bias-correction' } } },
  { prefix: 'EXTRA NAdam lr=0.1 psi=0.004', spec: { kind: 'nadam', learningRate: 0.1, hyper: { ...adamBetas, momentumDecay: 0.004, form: 'rising-momentum' } } },
  { prefix: 'EXTRA NAdam lr=0.1 (Optax', spec: { kind: 'nadam', learningRate: 0.1, hyper: { ...adamBetas, form: 'constant-momentum' } } },
  { prefix: 'EXTRA AdamW lr=0.1 weight_decay=0.01 (PyTorch', spec: { kind: 'adamw', learningRate: 0.1, weightDecay: 0.01, hyper: adamBetas } },
  { prefix: 'EXTRA AdamW alpha=0.1 lambda=0.01', spec: { kind: 'adamw', learningRate: 0.1, weightDecay: 0.01, hyper: { ...adamBetas, decayForm: 'times-schedule' } } },
  { prefix: 'Pure Newton Rosenbrock', spec: { kind: 'newton', learningRate: 1 }, surface: rosenbrock, start: [-1.2, 1] },
  ] satisfies Case[]
).map((c: Case) => ({ surface: bowl, start: [1, 1], ...c }));

const close = (actual: number, expected: number) => Math.abs(actual - expected) <= 1e-10 * Math.max(1, Math.abs(expected));

describe('worked examples (reference optimizer-worked-examples.csv)', () => {
  const methods = [...new Set(rows.map((r) => r.method_and_convention))];

  it('the fixture is there and every convention in it is covered by a case', () => {
    expect(rows.length).toBe(63);
    for (const m of methods) expect(cases.filter((c) => m.startsWith(c.prefix)), m).toHaveLength(1);
  });

  it.each(methods)('%s', (method) => {
    const c = cases.find((k) => method.startsWith(k.prefix))!;
    const expected = rows.filter((r) => r.method_and_convention === method).sort((a, b) => +a.iteration - +b.iteration);
    const { batch } = runSpec(c.surface, c.spec, c.start, { maxSteps: expected.length });
    for (const r of expected) {
      const k = +r.iteration;
      const [x, y] = pointAt(batch, k);
      const where = `${method}, t = ${k}`;
      expect(close(x, +r.x), `${where}: x = ${x}, expected ${r.x}`).toBe(true);
      expect(close(y, +r.y), `${where}: y = ${y}, expected ${r.y}`).toBe(true);
      expect(close(batch.loss[k], +r.f), `${where}: f = ${batch.loss[k]}, expected ${r.f}`).toBe(true);
    }
  });

  it("Newton's full step reaches the minimiser (0, 0) of the bowl in one step (reference section 12, extra cases)", () => {
    const { batch } = runSpec(bowl, { kind: 'newton', learningRate: 1 }, [1, 1], { maxSteps: 1 });
    // Cholesky of diag(2, 20) goes through sqrt(2), so the float64 result is 0 to within rounding.
    for (const v of pointAt(batch, 1)) expect(Math.abs(v)).toBeLessThan(1e-15);
  });

  it('the exact first pure-Newton iterate on Rosenbrock is (-523/445, 3072/2225) (reference section 11)', () => {
    const { batch } = runSpec(rosenbrock, { kind: 'newton', learningRate: 1 }, [-1.2, 1], { maxSteps: 1 });
    const [x, y] = pointAt(batch, 1);
    expect(x).toBeCloseTo(-523 / 445, 14);
    expect(y).toBeCloseTo(3072 / 2225, 14);
  });
});
