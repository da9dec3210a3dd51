import * as tf from '@tensorflow/tfjs-core';
import '@tensorflow/tfjs-backend-cpu';
import '@tensorflow/tfjs-core/dist/register_all_gradients';
import { buildOptimizer, defaultOptimizerSpec, power, RunCursor } from '../src/engine';
import { handAdamRosenbrock } from './handwritten';
import { sink } from './measure';
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

/** The same Adam loop written out by hand (bench/handwritten.ts): the limit for any engine. */
function handAdam(steps: number): number {
  const t0 = performance.now();
  sink.value += handAdamRosenbrock(steps, LR, power);
  return steps / (performance.now() - t0);
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
