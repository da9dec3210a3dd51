import * as tf from '@tensorflow/tfjs-core';
import '@tensorflow/tfjs-backend-cpu';
import '@tensorflow/tfjs-core/dist/register_all_gradients';
import { buildOptimizer, defaultOptimizerSpec, RunCursor } from '../src/engine';
import { buildSurface } from '../src/problems';

const LR = 0.001;

/** Adam steps per millisecond on 2-D Rosenbrock through the engine's run loop (recording every step). */
function engineAdam(steps: number): number {
  const cursor = new RunCursor(buildSurface({ kind: 'catalogue', id: 'rosenbrock' }), buildOptimizer({ ...defaultOptimizerSpec('adam'), learningRate: LR }), {
    start: [-1.2, 1],
    seed: 1,
    stop: { maxSteps: steps },
  });
  const t0 = performance.now();
  while (!cursor.outcome) cursor.advance(10_000);
  return steps / (performance.now() - t0);
}

/** The same Adam loop written out by hand: the limit for any engine. */
function handAdam(steps: number): number {
  let x = -1.2, y = 1, m0 = 0, m1 = 0, v0 = 0, v1 = 0, b1t = 1, b2t = 1;
  const t0 = performance.now();
  for (let t = 1; t <= steps; t++) {
    const a = 1 - x;
    const b = y - x * x;
    const g0 = -2 * a - 400 * x * b;
    const g1 = 200 * b;
    m0 = 0.9 * m0 + 0.1 * g0;
    m1 = 0.9 * m1 + 0.1 * g1;
    v0 = 0.999 * v0 + 0.001 * g0 * g0;
    v1 = 0.999 * v1 + 0.001 * g1 * g1;
    b1t *= 0.9;
    b2t *= 0.999;
    x -= (LR * (m0 / (1 - b1t))) / (Math.sqrt(v0 / (1 - b2t)) + 1e-8);
    y -= (LR * (m1 / (1 - b1t))) / (Math.sqrt(v1 / (1 - b2t)) + 1e-8);
  }
  const ms = performance.now() - t0;
  if (!Number.isFinite(x + y)) throw new Error('bench: hand-written Adam diverged');
  return steps / ms;
}

/** tfjs-core 4.22.0 on its CPU backend: optimizer.minimize with tfjs's own gradient. */
async function tfjsAdam(steps: number): Promise<number> {
  await tf.setBackend('cpu');
  const v = tf.variable(tf.tensor1d([-1.2, 1]));
  const opt = tf.train.adam(LR, 0.9, 0.999, 1e-8);
  const loss = () =>
    tf.tidy(() => {
      const x = tf.slice(v, 0, 1);
      const y = tf.slice(v, 1, 1);
      return tf.sum(tf.add(tf.square(tf.sub(1, x)), tf.mul(100, tf.square(tf.sub(y, tf.square(x)))))) as tf.Scalar;
    });
  for (let k = 0; k < 50; k++) opt.minimize(loss);
  const t0 = performance.now();
  for (let k = 0; k < steps; k++) opt.minimize(loss);
  const ms = performance.now() - t0;
  v.dispose();
  opt.dispose();
  return steps / ms;
}

export async function adamVsTfjs() {
  engineAdam(20_000); // warm-up
  const engine = Math.max(engineAdam(200_000), engineAdam(200_000), engineAdam(200_000));
  const hand = Math.max(handAdam(2_000_000), handAdam(2_000_000));
  const tfjs = await tfjsAdam(2000);
  return { engineStepsPerMs: engine, handwrittenStepsPerMs: hand, tfjsStepsPerMs: tfjs, ratio: engine / tfjs, handwrittenRatio: hand / tfjs };
}
