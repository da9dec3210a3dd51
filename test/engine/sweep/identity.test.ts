import { describe, expect, it } from 'vitest';
import { buildOptimizer, defaultOptimizerSpec, RunCursor, Sweep, type OptimizerKind, type OptimizerSpec, type StopRules, type Surface } from '../../../src/engine';
import { buildSurface } from '../../../src/problems';
import { gridStarts, runAlone } from './alone';

const himmelblau = buildSurface({ kind: 'catalogue', id: 'himmelblau' });
const rosenbrock = buildSurface({ kind: 'catalogue', id: 'rosenbrock' });
/** Eigenvalues 2 and 20: GD at lr = 2/20 = 0.1 flips y exactly (y <- -y), an undamped cycle. */
const bowl = buildSurface({ kind: 'formula', text: 'x^2 + 10*y^2' });

function spec(kind: OptimizerKind, learningRate: number, hyper?: OptimizerSpec['hyper']): OptimizerSpec {
  return { ...defaultOptimizerSpec(kind), learningRate, ...(hyper ? { hyper } : {}) };
}

interface Case {
  name: string;
  surface: Surface;
  optimizer: OptimizerSpec;
  stop: StopRules;
  starts: Float64Array;
}

const loose: StopRules = { maxSteps: 400, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-10 };
const CASES: Case[] = [
  { name: 'GD on Himmelblau', surface: himmelblau, optimizer: spec('gd', 0.01), stop: loose, starts: gridStarts(-6, 6, -6, 6, 12) },
  { name: 'momentum on Himmelblau', surface: himmelblau, optimizer: spec('momentum', 0.005), stop: loose, starts: gridStarts(-6, 6, -6, 6, 12) },
  { name: 'Adam on Himmelblau', surface: himmelblau, optimizer: spec('adam', 0.05), stop: { maxSteps: 150, lossChangeTolerance: 1e-12 }, starts: gridStarts(-5, 5, -5, 5, 12) },
  { name: 'L-BFGS on Himmelblau', surface: himmelblau, optimizer: spec('lbfgs', 1), stop: loose, starts: gridStarts(-5, 5, -5, 5, 12) },
  { name: 'Newton on Himmelblau', surface: himmelblau, optimizer: spec('newton', 1), stop: loose, starts: gridStarts(-5, 5, -5, 5, 12) },
  { name: 'GD on Rosenbrock', surface: rosenbrock, optimizer: spec('gd', 0.002), stop: { maxSteps: 300, lossChangeTolerance: 1e-12 }, starts: gridStarts(-2, 2, -1, 3, 12) },
  { name: 'Adam on Rosenbrock', surface: rosenbrock, optimizer: spec('adam', 0.02), stop: { maxSteps: 300, lossChangeTolerance: 1e-14 }, starts: gridStarts(-2, 2, -1, 3, 12) },
  { name: 'L-BFGS on Rosenbrock', surface: rosenbrock, optimizer: spec('lbfgs', 1), stop: loose, starts: gridStarts(-2, 2, -1, 3, 12) },
  { name: 'Newton on Rosenbrock', surface: rosenbrock, optimizer: spec('newton', 1), stop: loose, starts: gridStarts(-2, 2, -1, 3, 12) },
  { name: 'GD at 2/lambda_max on the bowl', surface: bowl, optimizer: spec('gd', 0.1), stop: { maxSteps: 200, lossChangeTolerance: 1e-12 }, starts: gridStarts(-3, 3, -3, 3, 12) },
  { name: 'GD above 2/lambda_max on the bowl', surface: bowl, optimizer: spec('gd', 0.11), stop: { maxSteps: 400 }, starts: gridStarts(-3, 3, -3, 3, 12) },
  { name: 'momentum on the bowl', surface: bowl, optimizer: spec('momentum', 0.02), stop: loose, starts: gridStarts(-3, 3, -3, 3, 12) },
  { name: 'Adam on the bowl', surface: bowl, optimizer: spec('adam', 0.1), stop: loose, starts: gridStarts(-3, 3, -3, 3, 12) },
  { name: 'Newton on the bowl', surface: bowl, optimizer: spec('newton', 1), stop: loose, starts: gridStarts(-3, 3, -3, 3, 12) },
];

function expectSameAsAlone(sweep: Sweep, alone: ReturnType<typeof runAlone>) {
  const res = sweep.result();
  const n = res.dimension;
  for (let r = 0; r < res.count; r++) {
    const a = alone[r];
    const where = `run ${r}`;
    expect(Array.from(res.endPoints.subarray(r * n, (r + 1) * n)), where).toEqual(a.point);
    expect(Object.is(res.losses[r], a.loss), `${where} loss ${res.losses[r]} vs ${a.loss}`).toBe(true);
    expect(res.steps[r], where).toBe(a.steps);
    expect(res.evaluations[r], where).toBe(a.evaluations);
    expect(res.outcomes[r], where).toEqual(a.outcome);
  }
}

describe('Sweep: every run equals the same run done alone by RunCursor', () => {
  const kinds = new Set<string>();
  for (const c of CASES)
    it(c.name, () => {
      const sweep = new Sweep({ surface: c.surface, optimizer: c.optimizer, stop: c.stop, starts: c.starts });
      // Uneven slices, as a worker streaming it would take.
      while (!sweep.finished) sweep.advance(37);
      expectSameAsAlone(sweep, runAlone(c.surface, c.optimizer, c.stop, c.starts));
      for (const o of sweep.result().outcomes) kinds.add(o!.kind);
    });

  it('the cases above cover converging, diverging, oscillating and step-limited runs', () => {
    for (const k of ['converged', 'diverged', 'oscillating', 'step-limit']) expect([...kinds]).toContain(k);
  });

  it('with gradient noise and a seed per run', () => {
    const starts = gridStarts(-5, 5, -5, 5, 12);
    const seeds = Float64Array.from({ length: 144 }, (_, i) => 1000 + 7 * i);
    const stop: StopRules = { maxSteps: 120, lossChangeTolerance: 1e-9 };
    for (const optimizer of [spec('adam', 0.05), spec('lbfgs', 1), spec('newton', 0.5)]) {
      const sweep = new Sweep({ surface: himmelblau, optimizer, stop, starts, seeds, gradientNoise: 0.5 });
      sweep.advance(1000);
      expect(sweep.finished).toBe(true);
      expectSameAsAlone(sweep, runAlone(himmelblau, optimizer, stop, starts, { seeds, gradientNoise: 0.5 }));
    }
  });

  it('cancel judges each live run as RunCursor.cancel does, on the block path and run by run', () => {
    const starts = gridStarts(-5, 5, -5, 5, 6);
    const stop: StopRules = { maxSteps: 1000 };
    for (const [optimizer, rounds] of [[spec('adam', 0.05), 12], [spec('lbfgs', 1), 2]] as const) {
      const sweep = new Sweep({ surface: himmelblau, optimizer, stop, starts });
      sweep.advance(rounds);
      sweep.cancel();
      expect(sweep.finished).toBe(true);
      const res = sweep.result();
      for (let r = 0; r < 36; r++) {
        const c = new RunCursor(himmelblau, buildOptimizer(optimizer), { start: Array.from(starts.subarray(2 * r, 2 * r + 2)), stop, seed: 0 });
        c.advance(rounds);
        expect(res.outcomes[r]).toEqual(c.outcome ?? c.cancel());
        expect(res.evaluations[r]).toBe(c.state.evaluations);
      }
      expect(res.outcomes.filter((o) => o?.kind === 'cancelled').length).toBeGreaterThan(0);
    }
  });

  it('advanceFor reads only the clock it is given and takes at least one round', () => {
    const sweep = new Sweep({ surface: bowl, optimizer: spec('gd', 0.01), stop: { maxSteps: 100 }, starts: gridStarts(-1, 1, -1, 1, 4) });
    let now = 0;
    const clock = () => (now += 1);
    // Reads: start 1; batch of 1 round between 2 and 3, 4 and 5, 6 and 7; 7 - 1 >= 5 ends it. The
    // batch never doubles: four times a 1-tick batch does not fit in the ticks left.
    const p = sweep.advanceFor(5, clock);
    expect(p.rounds).toBe(3);
    expect(p.steps).toBe(3 * 16);
    expect(sweep.advanceFor(0, clock).rounds).toBe(4);
    // A generous budget on a fast clock: batches double, and the sweep runs to its end.
    let slow = 0;
    expect(sweep.advanceFor(1e9, () => (slow += 1e-3)).rounds).toBe(100);
    expect(sweep.advance(1000)).toEqual({ done: 16, total: 16, steps: 1600, rounds: 100 });
    expect(sweep.finished).toBe(true);
  });

  it('refuses a minibatch plan and bad per-run arrays with the field named', () => {
    const base = { surface: bowl, optimizer: spec('gd', 0.01), stop: { maxSteps: 10 }, starts: new Float64Array(4) };
    expect(() => new Sweep({ ...base, minibatch: { size: 2 } } as never)).toThrow('minibatch runs are not supported');
    expect(() => new Sweep({ ...base, learningRates: Float64Array.of(0.1) })).toThrow('one value per run (2)');
    expect(() => new Sweep({ ...base, starts: Float64Array.of(0, NaN) })).toThrow('start of run 0, coordinate 2');
  });

  it('every other first-order kind, with a schedule, weight decay, L2 and clipping', () => {
    const starts = gridStarts(-5, 5, -5, 5, 12);
    const stop: StopRules = { maxSteps: 200, lossChangeTolerance: 1e-12 };
    const specs: OptimizerSpec[] = [
      spec('nesterov', 0.005),
      spec('nesterov', 0.005, { form: 'record-base-point' }),
      spec('adagrad', 0.5),
      spec('rmsprop', 0.01),
      spec('adamw', 0.05),
      spec('amsgrad', 0.05),
      spec('nadam', 0.05),
      { ...spec('adam', 0.1), schedule: { kind: 'step', decayRate: 0.5, decaySteps: 50, warmupSteps: 10 } },
      { ...spec('momentum', 0.005), l2Penalty: 0.01, weightDecay: 0.001 },
      { ...spec('adam', 0.1), clipNorm: 1 },
    ];
    for (const optimizer of specs) {
      const sweep = new Sweep({ surface: himmelblau, optimizer, stop, starts });
      while (!sweep.finished) sweep.advance(23);
      expectSameAsAlone(sweep, runAlone(himmelblau, optimizer, stop, starts));
    }
  });

  it('with a learning rate per run', () => {
    const starts = new Float64Array(24).fill(1);
    const learningRates = Float64Array.from({ length: 12 }, (_, i) => 0.02 * (i + 1));
    const stop: StopRules = { maxSteps: 300, lossChangeTolerance: 1e-12 };
    const optimizer = spec('gd', 0.01);
    const sweep = new Sweep({ surface: bowl, optimizer, stop, starts, learningRates });
    sweep.advance(10_000);
    const alone = runAlone(bowl, optimizer, stop, starts, { learningRates });
    expectSameAsAlone(sweep, alone);
    // The smallest rates are still closing in at step 300 (no stop rule saw them end: step limit).
    expect(new Set(alone.map((a) => a.outcome!.kind))).toEqual(new Set(['step-limit', 'converged', 'oscillating', 'diverged']));
  });
});
