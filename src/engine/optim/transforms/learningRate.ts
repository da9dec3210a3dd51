import { learningRateAt, type ScheduleSpec } from '../schedule';
import type { GradientTransform } from '../transform';

/**
 * u <- -lr_t u, with lr_t = learningRateAt(schedule, base, t). The one place where the minus sign of
 * descent lives (Optax's `scale_by_learning_rate` plays the same part).
 */
export function scaleByLearningRate(base: number, schedule?: ScheduleSpec): GradientTransform<null> {
  return {
    name: 'scaleByLearningRate',
    elementwise: true,
    init: () => null,
    // update's operation on one entry (lockstep.ts): q = [-lr_t].
    lockstep: {
      arrays: [],
      constants: [],
      steps: 1,
      step(t, out, at) {
        out[at] = -learningRateAt(schedule, base, t);
      },
      code: ({ u, q: [minusRate] }) => `${u} = ${u} * ${minusRate};`,
    },
    update(u, _s, _p, t) {
      const lr = learningRateAt(schedule, base, t);
      for (let i = 0; i < u.length; i++) u[i] *= -lr;
      return null;
    },
    learningRate: (t) => learningRateAt(schedule, base, t),
  };
}
