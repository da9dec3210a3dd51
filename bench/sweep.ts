import { buildOptimizer, defaultOptimizerSpec, power, RunCursor, Sweep } from '../src/engine';
import { buildSurface } from '../src/problems';
import { handAdamRosenbrock } from './handwritten';
import { bestMsInTurn, sink } from './measure';

const STEPS = 500;
const LR = 0.01;
const B1 = 0.9;
const B2 = 0.999;
const EPS = 1e-8;

/** side x side starts at cell centres of [-5, 5]^2 (row-major, x fastest). */
function starts(side: number): Float64Array {
  const s = new Float64Array(side * side * 2);
  for (let j = 0; j < side; j++)
    for (let i = 0; i < side; i++) {
      s[2 * (j * side + i)] = -5 + ((i + 0.5) * 10) / side;
      s[2 * (j * side + i) + 1] = -5 + ((j + 0.5) * 10) / side;
    }
  return s;
}

/** The sweep engine: Adam on the catalogue Himmelblau, STEPS steps from every start (no stop rule fires). */
function engineSweep(x0: Float64Array): Float64Array {
  const sweep = new Sweep({
    surface: buildSurface({ kind: 'catalogue', id: 'himmelblau' }),
    optimizer: { ...defaultOptimizerSpec('adam'), learningRate: LR, hyper: { beta1: B1, beta2: B2, epsilon: EPS } },
    stop: { maxSteps: STEPS },
    starts: x0,
  });
  sweep.advance(STEPS);
  if (!sweep.finished) throw new Error('bench: sweep did not finish');
  return sweep.result().endPoints;
}

/**
 * A lockstep Adam loop written by hand for Himmelblau (Kingma & Ba's Algorithm 1, as the engine's
 * default form): all points in one array, the gradient written out, no stop rules. The limit.
 */
function handSweep(x0: Float64Array): Float64Array {
  const count = x0.length / 2;
  const x = Float64Array.from(x0);
  const m = new Float64Array(x.length);
  const v = new Float64Array(x.length);
  for (let t = 1; t <= STEPS; t++) {
    const c1 = 1 - power(B1, t); // the engine's products-only power (engine/power.ts), so both ends agree bit for bit
    const c2 = 1 - power(B2, t);
    for (let r = 0; r < count; r++) {
      const i = 2 * r;
      const px = x[i];
      const py = x[i + 1];
      const u = px * px + py - 11;
      const w = px + py * py - 7;
      const g0 = 4 * px * u + 2 * w;
      const g1 = 2 * u + 4 * py * w;
      m[i] = B1 * m[i] + (1 - B1) * g0;
      m[i + 1] = B1 * m[i + 1] + (1 - B1) * g1;
      v[i] = B2 * v[i] + (1 - B2) * g0 * g0;
      v[i + 1] = B2 * v[i + 1] + (1 - B2) * g1 * g1;
      x[i] -= LR * (m[i] / c1 / (Math.sqrt(v[i] / c2) + EPS));
      x[i + 1] -= LR * (m[i + 1] / c1 / (Math.sqrt(v[i + 1] / c2) + EPS));
    }
  }
  return x;
}

/**
 * `sweep_vs_handwritten`: steps/s of the sweep engine (construction, every stop check and the recent-
 * point record included) over the hand-written loop, 4,096 starts x 500 Adam steps on Himmelblau;
 * `sweep_cost_growth`: engine time for 16,384 starts over time for 4,096 (4 would be linear).
 */
export function sweepBench() {
  const small = starts(64);
  const large = starts(128);
  const a = engineSweep(small);
  const b = handSweep(small);
  for (let k = 0; k < a.length; k++) if (!(Math.abs(a[k] - b[k]) <= 1e-9 * (1 + Math.abs(b[k])))) throw new Error(`bench: sweep and hand-written Adam differ at ${k}: ${a[k]} vs ${b[k]}`);
  const [engineMs, handMs, largeMs] = bestMsInTurn(
    [() => (sink.value += engineSweep(small)[7]), () => (sink.value += handSweep(small)[7]), () => (sink.value += engineSweep(large)[7])],
    7,
  );
  const steps = (small.length / 2) * STEPS;
  return {
    engineMs,
    handwrittenMs: handMs,
    largeMs,
    engineStepsPerS: (steps / engineMs) * 1000,
    handwrittenStepsPerS: (steps / handMs) * 1000,
    ratio: handMs / engineMs,
    growth: largeMs / engineMs,
    ...runLoopBench(),
  };
}

const RUN_STEPS = 200_000;

/**
 * `run_loop_vs_handwritten`: one Adam run on Rosenbrock from (-1.2, 1) through the ordinary run loop
 * (RunCursor: every step recorded, stop checks, the recent-point ring) over the same Adam written out
 * by hand for this surface, in this bundle so both are measured as the app's build runs them.
 */
function runLoopBench() {
  const rosenbrock = buildSurface({ kind: 'catalogue', id: 'rosenbrock' });
  const optimizer = buildOptimizer({ ...defaultOptimizerSpec('adam'), learningRate: 0.001 });
  const viaCursor = () => {
    const cursor = new RunCursor(rosenbrock, optimizer, { start: [-1.2, 1], seed: 1, stop: { maxSteps: RUN_STEPS } });
    while (!cursor.outcome) cursor.advance(10_000);
    return cursor.state.x[0];
  };
  const byHand = () => handAdamRosenbrock(RUN_STEPS, 0.001, power);
  const [cursorMs, handMs] = bestMsInTurn([() => (sink.value += viaCursor()), () => (sink.value += byHand())], 9);
  return { runLoopStepsPerS: (RUN_STEPS / cursorMs) * 1000, runLoopHandwrittenStepsPerS: (RUN_STEPS / handMs) * 1000, runLoopRatio: handMs / cursorMs };
}
