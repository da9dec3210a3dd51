import { describe, expect, it } from 'vitest';
import { learningRateAt, type ScheduleSpec } from '../../../src/engine';
import { runSpec } from './run';
import { quadratic } from './surfaces';

/** Values hand-computed from each schedule's formula (doc comments in src/engine/optim/schedule.ts). */
describe('learningRateAt', () => {
  const cases: [string, ScheduleSpec | undefined, [number, number][]][] = [
    ['none = constant', undefined, [[1, 0.1], [1000, 0.1]]],
    ['constant', { kind: 'constant' }, [[1, 0.1], [77, 0.1]]],
    // PyTorch StepLR(step_size=10, gamma=0.5): k = t - 1 = 0..9 -> 0.1, 10..19 -> 0.05, 20 -> 0.025.
    ['step decay', { kind: 'step', decayRate: 0.5, decaySteps: 10 }, [[1, 0.1], [10, 0.1], [11, 0.05], [20, 0.05], [21, 0.025]]],
    // PyTorch ExponentialLR(gamma=0.9): 0.1 * 0.9^k.
    ['exponential per step', { kind: 'exponential', decayRate: 0.9 }, [[1, 0.1], [2, 0.09], [3, 0.081]]],
    // Keras ExponentialDecay(decay_steps=100, decay_rate=0.5): 0.1 * 0.5^(k/100).
    ['exponential over 100 steps', { kind: 'exponential', decayRate: 0.5, decaySteps: 100 }, [[1, 0.1], [101, 0.05], [51, 0.1 * Math.SQRT1_2]]],
    // Keras InverseTimeDecay(decay_steps=1, decay_rate=1): 0.1 / (1 + k).
    ['inverse time', { kind: 'inverse-time', decayRate: 1 }, [[1, 0.1], [2, 0.05], [4, 0.025]]],
    ['inverse sqrt', { kind: 'inverse-time', decayRate: 1, power: 0.5 }, [[1, 0.1], [4, 0.05], [100, 0.01]]],
    ['inverse time over 10 steps', { kind: 'inverse-time', decayRate: 0.5, decaySteps: 10 }, [[21, 0.05]]],
    // Cosine over 10 steps, floor 10 %: k = 5 is half-way: 0.1 * (0.1 + 0.9 * 0.5) = 0.055.
    ['cosine with floor', { kind: 'cosine', horizon: 10, floorFraction: 0.1 }, [[1, 0.1], [6, 0.055], [11, 0.01], [500, 0.01]]],
    ['cosine to zero', { kind: 'cosine', horizon: 4 }, [[1, 0.1], [2, 0.1 * (1 + Math.SQRT1_2) / 2], [3, 0.05], [5, 0]]],
    // Warm-up W = 4: t / (W + 1) of the base for t <= 4, then the schedule from k = 0.
    ['warm-up then constant', { kind: 'constant', warmupSteps: 4 }, [[1, 0.02], [2, 0.04], [4, 0.08], [5, 0.1], [50, 0.1]]],
    ['warm-up then step decay', { kind: 'step', decayRate: 0.5, decaySteps: 10, warmupSteps: 4 }, [[3, 0.06], [5, 0.1], [14, 0.1], [15, 0.05]]],
    ['warm-up then cosine', { kind: 'cosine', horizon: 10, warmupSteps: 2 }, [[1, 0.1 / 3], [3, 0.1], [8, 0.05], [13, 0]]],
  ];
  it.each(cases)('%s', (_, schedule, points) => {
    for (const [t, expected] of points) expect(learningRateAt(schedule, 0.1, t), `t = ${t}`).toBeCloseTo(expected, 15);
  });
});

describe('schedules inside a run', () => {
  it('GD on f = x^2 follows x_t = x_{t-1} (1 - 2 lr_t) and reports lr_t each step', () => {
    const schedule: ScheduleSpec = { kind: 'exponential', decayRate: 0.8, warmupSteps: 2 };
    const { batch } = runSpec(quadratic([2], [0]), { kind: 'gd', learningRate: 0.3, schedule }, [1], { maxSteps: 8 });
    let x = 1;
    for (let t = 1; t <= 8; t++) {
      const lr = learningRateAt(schedule, 0.3, t);
      x *= 1 - 2 * lr;
      expect(batch.learningRate[t]).toBe(lr);
      expect(batch.points[t]).toBeCloseTo(x, 15);
    }
  });
});
