import type { GradientTransform } from '../transform';

function addScaledParams(name: string, coefficient: number): GradientTransform<null> {
  return {
    name,
    elementwise: true,
    init: () => null,
    // update's operation on one entry (lockstep.ts): k = [coefficient].
    lockstep: { arrays: [], constants: [coefficient], steps: 0, code: ({ u, p, k: [a] }) => `${u} += ${a} * ${p};` },
    update(u, _s, params) {
      for (let i = 0; i < u.length; i++) u[i] += coefficient * params[i];
      return null;
    },
  };
}

/**
 * Coupled L2 penalty, placed first in a chain: g <- g + l2 x, the gradient of f + l2/2 |x|^2, so the
 * penalty passes through momentum and adaptive scaling like the loss gradient does (PyTorch's
 * `weight_decay` argument of SGD, Adam, RMSprop, Adagrad).
 */
export function addL2Penalty(l2: number): GradientTransform<null> {
  return addScaledParams('addL2Penalty', l2);
}

/**
 * Decoupled weight decay, placed after the method's scaling and before `scaleByLearningRate`:
 * u <- u + lambda x, so the step is x <- x - lr_t (u + lambda x). Loshchilov & Hutter, "Decoupled
 * Weight Decay Regularization", ICLR 2019. This is the Optax `add_decayed_weights` placement and
 * equals PyTorch AdamW's "x <- x - lr lambda x, then the Adam step" (the Adam step does not depend on
 * x). The paper's own form (decay scaled by the schedule multiplier but not by alpha) is this
 * transform with lambda / alpha.
 */
export function addDecoupledWeightDecay(lambda: number): GradientTransform<null> {
  return addScaledParams('addDecoupledWeightDecay', lambda);
}
