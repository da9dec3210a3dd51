import type { ResolvedSpec } from '../spec';
import { chain, type GradientTransform } from '../transform';
import { addDecoupledWeightDecay, addL2Penalty, clipByGlobalNorm, scaleByLearningRate } from '../transforms';
import type { Optimizer } from '../types';

/**
 * The options every first-order method shares, wrapped around its own transforms:
 *   [clip by global norm] -> [add L2 penalty] -> ...core... -> [add decoupled decay] -> scale by -lr_t.
 * Clipping comes first (PyTorch users clip before `optimizer.step`, which then adds its L2 term).
 */
export function wrapFirstOrder(spec: ResolvedSpec, core: readonly GradientTransform[], decay = spec.weightDecay): GradientTransform[] {
  return [
    ...(spec.clipNorm !== undefined ? [clipByGlobalNorm(spec.clipNorm)] : []),
    ...(spec.l2Penalty > 0 ? [addL2Penalty(spec.l2Penalty)] : []),
    ...core,
    ...(decay > 0 ? [addDecoupledWeightDecay(decay)] : []),
    scaleByLearningRate(spec.learningRate, spec.schedule),
  ];
}

export function firstOrderChain(label: string, spec: ResolvedSpec, core: readonly GradientTransform[], decay?: number): Optimizer {
  return chain(label, wrapFirstOrder(spec, core, decay));
}
