import { adamRule } from '../rules/library';
import { compileRule } from '../rules/compile';
import { METHODS, methodFor } from './methods';
import type { HyperparameterInfo, HyperValue } from './settings';
import type { OptimizerInfo, OptimizerKind, OptimizerSpec } from './spec';

/** Metadata of every optimizer kind (labels, defaults, settings with ranges, sources). */
export const OPTIMIZERS: readonly OptimizerInfo[] = METHODS.map((m) => m.info);

export function optimizerInfo(kind: OptimizerKind): OptimizerInfo {
  const m = methodFor(kind);
  if (!m) throw new Error(`unknown optimizer kind '${String(kind)}'`);
  return m.info;
}

/**
 * A complete spec with every setting at its default (constant schedule, no clipping or penalty). For
 * kind 'rule' the rule is Adam written as a rule (the library's first template).
 */
export function defaultOptimizerSpec(kind: OptimizerKind): OptimizerSpec {
  const info = optimizerInfo(kind);
  const hyper: Record<string, HyperValue> = {};
  if (kind === 'rule') {
    for (const h of compileRule(adamRule.text).hyperparameters) hyper[h.name] = h.default;
    return { kind, learningRate: adamRule.defaultLearningRate, hyper, schedule: { kind: 'constant' }, rule: { name: adamRule.label, text: adamRule.text } };
  }
  for (const h of info.hyperparameters) hyper[h.name] = h.default;
  const spec: OptimizerSpec = { kind, learningRate: info.defaultLearningRate, hyper };
  if (info.family === 'first-order') spec.schedule = { kind: 'constant' };
  if (info.defaultWeightDecay > 0) spec.weightDecay = info.defaultWeightDecay;
  return spec;
}

/** The name a run's optimizer goes by in the page, the table and CSV files: a rule's own name, else the kind's label. */
export function optimizerLabel(spec: Pick<OptimizerSpec, 'kind' | 'rule'>): string {
  return spec.kind === 'rule' && spec.rule ? spec.rule.name : optimizerInfo(spec.kind).label;
}

/** The settings a spec's optimizer has: the kind's own, or for a rule the rule's hyper lines ([] if the rule does not compile). */
export function optimizerSettings(spec: OptimizerSpec): readonly HyperparameterInfo[] {
  const method = methodFor(spec.kind);
  if (!method) return [];
  if (!method.settingsOf) return method.info.hyperparameters;
  const own = method.settingsOf(spec as unknown as Record<string, unknown>);
  return 'settings' in own ? own.settings : [];
}
