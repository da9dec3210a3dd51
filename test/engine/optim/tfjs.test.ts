import * as tf from '@tensorflow/tfjs-core';
import '@tensorflow/tfjs-backend-cpu';
import { beforeAll, describe, expect, it } from 'vitest';
import type { OptimizerSpec, Surface } from '../../../src/engine';
import { pointAt, runSpec } from './run';
import { quadratic, rosenbrock, rotatedDiagonal } from './surfaces';

/**
 * Reference library: @tensorflow/tfjs-core 4.22.0 with @tensorflow/tfjs-backend-cpu 4.22.0 (npm),
 * float32 on the CPU backend. Its conventions, read from node_modules/@tensorflow/tfjs-core/dist/
 * optimizers/*.js:
 *   sgd:      x <- x - lr g.
 *   momentum: a <- m a + g (a_0 = 0), x <- x - lr a; Nesterov: x <- x - lr (g + m a)
 *             = our PyTorch-style buffer with dampening 0 and the library Nesterov form.
 *   adagrad:  G <- G + g^2 with G_0 = initialAccumulatorValue (default 0.1), x <- x - lr g / sqrt(G + eps),
 *             eps = the backend epsilon 1e-7, inside the root.
 *   rmsprop:  v <- rho v + (1 - rho) g^2 (v_0 = 0); b <- mu b + lr g / sqrt(v + eps) (eps inside, default
 *             1e-7; lr inside the buffer, the same as ours for a constant lr); x <- x - b. Centred:
 *             denominator sqrt(v - gbar^2 - eps), eps subtracted, so centred runs are compared with eps 0.
 *   adam:     Algorithm 1 of Kingma & Ba, eps outside sqrt(vhat), eps default 1e-7 (set explicitly).
 * Gradients are computed here in float64 at tfjs's float32 point and handed over with applyGradients.
 */
beforeAll(async () => {
  await tf.setBackend('cpu');
});

function runTfjs(make: () => tf.Optimizer, surface: Surface, start: number[], steps: number): number[][] {
  const x = tf.variable(tf.tensor1d(start, 'float32'));
  const opt = make();
  const g = new Float64Array(surface.dimension);
  const path: number[][] = [Array.from(x.dataSync())];
  for (let k = 0; k < steps; k++) {
    surface.valueGradient(x.dataSync(), g);
    const grad = tf.tensor1d(Array.from(g), 'float32');
    opt.applyGradients({ [x.name]: grad });
    grad.dispose();
    path.push(Array.from(x.dataSync()));
  }
  opt.dispose();
  x.dispose();
  return path;
}

const STEPS = 100;
const valley = quadratic(rotatedDiagonal(1, 10, Math.PI / 6), [1, 1]);

/** Each case at a learning rate `lr`; the two surfaces use their own rates (Rosenbrock is steep). */
const cases: { name: string; lr: [number, number]; spec: (lr: number) => OptimizerSpec; tfjs: (lr: number) => tf.Optimizer }[] = [
  { name: 'sgd', lr: [0.05, 0.001], spec: (lr) => ({ kind: 'gd', learningRate: lr }), tfjs: (lr) => tf.train.sgd(lr) },
  {
    name: 'momentum',
    lr: [0.02, 0.0005],
    spec: (lr) => ({ kind: 'momentum', learningRate: lr, hyper: { momentum: 0.8 } }),
    tfjs: (lr) => tf.train.momentum(lr, 0.8),
  },
  {
    name: 'momentum (Nesterov)',
    lr: [0.02, 0.0005],
    spec: (lr) => ({ kind: 'nesterov', learningRate: lr, hyper: { momentum: 0.8 } }),
    tfjs: (lr) => tf.train.momentum(lr, 0.8, true),
  },
  {
    name: 'adagrad',
    lr: [0.3, 0.05],
    spec: (lr) => ({ kind: 'adagrad', learningRate: lr, hyper: { epsilon: 1e-7, epsilonPlacement: 'inside', initialAccumulator: 0.1 } }),
    tfjs: (lr) => tf.train.adagrad(lr, 0.1),
  },
  {
    name: 'rmsprop',
    lr: [0.01, 0.005],
    spec: (lr) => ({ kind: 'rmsprop', learningRate: lr, hyper: { decay: 0.9, epsilon: 1e-7, epsilonPlacement: 'inside' } }),
    tfjs: (lr) => tf.train.rmsprop(lr, 0.9, 0, 1e-7),
  },
  {
    name: 'rmsprop with momentum',
    lr: [0.005, 0.002],
    spec: (lr) => ({ kind: 'rmsprop', learningRate: lr, hyper: { decay: 0.9, epsilon: 1e-7, epsilonPlacement: 'inside', momentum: 0.5 } }),
    tfjs: (lr) => tf.train.rmsprop(lr, 0.9, 0.5, 1e-7),
  },
  {
    name: 'rmsprop centred (eps 0)',
    lr: [0.005, 0.002],
    spec: (lr) => ({ kind: 'rmsprop', learningRate: lr, hyper: { decay: 0.9, epsilon: 0, epsilonPlacement: 'inside', centered: true } }),
    tfjs: (lr) => tf.train.rmsprop(lr, 0.9, 0, 0, true),
  },
  {
    // A large epsilon pins where it goes: inside the root for tfjs rmsprop.
    name: 'rmsprop, epsilon 0.1',
    lr: [0.01, 0.005],
    spec: (lr) => ({ kind: 'rmsprop', learningRate: lr, hyper: { decay: 0.9, epsilon: 0.1, epsilonPlacement: 'inside' } }),
    tfjs: (lr) => tf.train.rmsprop(lr, 0.9, 0, 0.1),
  },
  {
    // ... and outside sqrt(vhat) for tfjs adam.
    name: 'adam, epsilon 0.1',
    lr: [0.05, 0.01],
    spec: (lr) => ({ kind: 'adam', learningRate: lr, hyper: { beta1: 0.9, beta2: 0.999, epsilon: 0.1 } }),
    tfjs: (lr) => tf.train.adam(lr, 0.9, 0.999, 0.1),
  },
  {
    name: 'adam',
    lr: [0.05, 0.01],
    spec: (lr) => ({ kind: 'adam', learningRate: lr, hyper: { beta1: 0.9, beta2: 0.999, epsilon: 1e-7 } }),
    tfjs: (lr) => tf.train.adam(lr, 0.9, 0.999, 1e-7),
  },
];

const surfaces: { name: string; surface: Surface; start: number[] }[] = [
  { name: 'a rotated quadratic (eigenvalues 1, 10, minimum (1, 1))', surface: valley, start: [-1, 2] },
  { name: 'Rosenbrock', surface: rosenbrock, start: [-1.2, 1] },
];

describe('optimizers agree with tfjs-core 4.22.0 (float32) over 100 steps', () => {
  surfaces.forEach((s, which) =>
    it.each(cases)(`$name on ${s.name}`, ({ lr, spec, tfjs }) => {
      const rate = lr[which];
      const ref = runTfjs(() => tfjs(rate), s.surface, s.start, STEPS);
      const { batch } = runSpec(s.surface, spec(rate), s.start, { maxSteps: STEPS });
      let worst = 0;
      for (let k = 0; k <= STEPS; k++) {
        const p = pointAt(batch, k);
        for (let i = 0; i < p.length; i++) worst = Math.max(worst, Math.abs(p[i] - ref[k][i]) / Math.max(1, Math.abs(ref[k][i])));
      }
      // Moved well away from the start (the comparison is not trivially of two static points) ...
      expect(Math.hypot(ref[STEPS][0] - s.start[0], ref[STEPS][1] - s.start[1])).toBeGreaterThan(0.05);
      // ... and agree to float32 accuracy accumulated over 100 steps.
      expect(worst).toBeLessThan(2e-5);
    }),
  );
});

describe('the tfjs comparison can tell conventions apart', () => {
  it('RMSProp with epsilon 0.1 outside the root does not match tfjs (which puts it inside)', () => {
    const ref = runTfjs(() => tf.train.rmsprop(0.01, 0.9, 0, 0.1), valley, [-1, 2], STEPS);
    const { batch } = runSpec(valley, { kind: 'rmsprop', learningRate: 0.01, hyper: { decay: 0.9, epsilon: 0.1, epsilonPlacement: 'outside' } }, [-1, 2], { maxSteps: STEPS });
    const p = pointAt(batch, STEPS);
    expect(Math.hypot(p[0] - ref[STEPS][0], p[1] - ref[STEPS][1])).toBeGreaterThan(1e-3);
  });

  it('Adam with the epsilon-hat form does not match tfjs (Algorithm 1) at epsilon 0.1', () => {
    const ref = runTfjs(() => tf.train.adam(0.05, 0.9, 0.999, 0.1), valley, [-1, 2], STEPS);
    const { batch } = runSpec(valley, { kind: 'adam', learningRate: 0.05, hyper: { epsilon: 0.1, epsilonForm: 'eps-before-correction' } }, [-1, 2], { maxSteps: STEPS });
    const p = pointAt(batch, STEPS);
    expect(Math.hypot(p[0] - ref[STEPS][0], p[1] - ref[STEPS][1])).toBeGreaterThan(1e-3);
  });
});
