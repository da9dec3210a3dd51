import * as tf from '@tensorflow/tfjs-core';
import '@tensorflow/tfjs-backend-cpu';
import { beforeAll, describe, expect, it } from 'vitest';
import { adadeltaRule, type Surface } from '../../../src/engine';
import { quadratic, rosenbrock, rotatedDiagonal } from '../optim/surfaces';
import { runRule } from './run';

/**
 * Reference library: @tensorflow/tfjs-core 4.22.0 `tf.train.adadelta(learningRate, rho, epsilon)` on
 * the CPU backend (float32). Read from node_modules/@tensorflow/tfjs-core/dist/optimizers/
 * adadelta_optimizer.js, its step is
 *   update = sqrt(accUpdate + eps) / sqrt(accGrad + eps) * g,   accGrad <- rho accGrad + (1 - rho) g^2,
 *   accUpdate <- rho accUpdate + (1 - rho) update^2,            x <- x - lr update,
 * where the denominator uses the accumulated squared gradient from BEFORE this step's g is added.
 * Zeiler's Algorithm 1 (our library rule) adds g^2 first. The rule language writes either: the tfjs
 * order is the library rule with its `sq = ...` line moved below `let d = ...`. The tfjs order is
 * checked to float32 accuracy, and the paper's order is shown to differ from tfjs.
 */
beforeAll(async () => {
  await tf.setBackend('cpu');
});

function runTfjs(surface: Surface, start: number[], steps: number, lr: number, rho: number, eps: number): number[][] {
  const x = tf.variable(tf.tensor1d(start, 'float32'));
  const opt: tf.Optimizer = tf.train.adadelta(lr, rho, eps);
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

/** The library rule with the accumulated squared gradient updated after the step is formed (tfjs order). */
function tfjsOrder(text: string): string {
  const lines = text.split('\n');
  const sq = lines.findIndex((l) => l.startsWith('sq = '));
  const d = lines.findIndex((l) => l.startsWith('let d = '));
  const moved = [...lines];
  moved.splice(d + 1, 0, lines[sq]);
  moved.splice(sq, 1);
  return moved.join('\n');
}

const STEPS = 50;
const valley = quadratic(rotatedDiagonal(1, 10, Math.PI / 6), [1, 1]);
const cases = [
  // The tfjs order takes a plain gradient step lr g first (its ratio is sqrt(eps) / sqrt(eps) = 1), so
  // the rates are small enough for that step on each surface.
  { name: 'a rotated quadratic', surface: valley, start: [-1, 2], lr: 0.05, rho: 0.9, eps: 1e-3 },
  { name: 'Rosenbrock', surface: rosenbrock, start: [-1.2, 1], lr: 0.001, rho: 0.95, eps: 1e-3 },
];

function worstGap(path: ArrayLike<number>, ref: number[][], dim: number): number {
  let worst = 0;
  for (let k = 0; k <= STEPS; k++)
    for (let i = 0; i < dim; i++) worst = Math.max(worst, Math.abs(path[k * dim + i] - ref[k][i]) / Math.max(1, Math.abs(ref[k][i])));
  return worst;
}

describe('Adadelta as a rule against tfjs-core 4.22.0 tf.train.adadelta (float32) over 50 steps', () => {
  it.each(cases)('$name: the tfjs order matches to float32 accuracy', ({ surface, start, lr, rho, eps }) => {
    const text = tfjsOrder(adadeltaRule.text);
    expect(text).not.toBe(adadeltaRule.text);
    const ref = runTfjs(surface, start, STEPS, lr, rho, eps);
    const batch = runRule(surface, text, { learningRate: lr, hyper: { rho, eps } }, start, STEPS);
    expect(Math.hypot(ref[STEPS][0] - start[0], ref[STEPS][1] - start[1])).toBeGreaterThan(0.05);
    expect(worstGap(batch.points, ref, 2)).toBeLessThan(2e-5);
  });

  it.each(cases)("$name: Zeiler's order (the library rule) differs from tfjs", ({ surface, start, lr, rho, eps }) => {
    const ref = runTfjs(surface, start, STEPS, lr, rho, eps);
    const batch = runRule(surface, adadeltaRule.text, { learningRate: lr, hyper: { rho, eps } }, start, STEPS);
    expect(worstGap(batch.points, ref, 2)).toBeGreaterThan(1e-3);
  });
});
