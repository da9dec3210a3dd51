import type { OptimizerKind } from '../spec';
import { adagrad } from './adagrad';
import { adam } from './adam';
import { adamw } from './adamw';
import { amsgrad } from './amsgrad';
import { gd } from './gd';
import { lbfgs } from './lbfgs';
import type { MethodDefinition } from './method';
import { momentum } from './momentum';
import { nadam } from './nadam';
import { nesterov } from './nesterov';
import { newton } from './newton';
import { rmsprop } from './rmsprop';
import { rule } from './rule';

/**
 * The registry: one method per optimizer kind, in the order the settings panel lists them. The mapped
 * type makes the compiler insist on a method for every member of `OptimizerKind` (spec.ts); the schema
 * of the experiment file and every list of kinds are read from here.
 */
const BY_KIND: { readonly [K in OptimizerKind]: MethodDefinition } = {
  gd,
  momentum,
  nesterov,
  adagrad,
  rmsprop,
  adam,
  adamw,
  amsgrad,
  nadam,
  lbfgs,
  newton,
  rule,
};

export const METHODS: readonly MethodDefinition[] = Object.values(BY_KIND);

for (const [kind, method] of Object.entries(BY_KIND))
  if (method.info.kind !== kind) throw new Error(`optimizer registry: the method under '${kind}' declares kind '${method.info.kind}'`);

export function methodFor(kind: OptimizerKind): MethodDefinition | undefined {
  return Object.hasOwn(BY_KIND, kind) ? BY_KIND[kind] : undefined;
}

export type { MethodDefinition } from './method';
export { wrapFirstOrder, firstOrderChain } from './firstOrder';
export type { LbfgsState } from './lbfgs';
