import { methodFor } from './methods';
import type { OptimizerSpec } from './spec';
import type { Optimizer } from './types';
import { resolveSpec, validateOptimizerSpec } from './validate';

/** Validates the spec (throwing its first SettingError) and builds the optimizer it describes. */
export function buildOptimizer(spec: OptimizerSpec): Optimizer {
  const errors = validateOptimizerSpec(spec);
  if (errors.length > 0) throw errors[0];
  return methodFor(spec.kind)!.build(resolveSpec(spec));
}
