import { METHODS, methodFor } from './methods';
import type { HyperValue, OptimizerInfo, OptimizerKind, OptimizerSpec } from './spec';

/** Metadata of every optimizer kind (labels, defaults, settings with ranges, sources). */
export const OPTIMIZERS: readonly OptimizerInfo[] = METHODS.map((m) => m.info);

export function optimizerInfo(kind: OptimizerKind): OptimizerInfo {
  const m = methodFor(kind);
  if (!m) throw new Error(`unknown optimizer kind '${String(kind)}'`);
  return m.info;
}

/** A complete spec with every setting at its default (constant schedule, no clipping or penalty). */
export function defaultOptimizerSpec(kind: OptimizerKind): OptimizerSpec {
  const info = optimizerInfo(kind);
  const hyper: Record<string, HyperValue> = {};
  for (const h of info.hyperparameters) hyper[h.name] = h.default;
  const spec: OptimizerSpec = { kind, learningRate: info.defaultLearningRate, hyper };
  if (info.usesSchedule) spec.schedule = { kind: 'constant' };
  if (info.defaultWeightDecay > 0) spec.weightDecay = info.defaultWeightDecay;
  return spec;
}
