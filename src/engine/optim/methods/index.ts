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

/** Every optimizer kind, in the order the settings panel lists them. */
export const METHODS: readonly MethodDefinition[] = [gd, momentum, nesterov, adagrad, rmsprop, adam, adamw, amsgrad, nadam, lbfgs, newton, rule];

export function methodFor(kind: OptimizerKind): MethodDefinition | undefined {
  return METHODS.find((m) => m.info.kind === kind);
}

export type { MethodDefinition } from './method';
export { wrapFirstOrder, firstOrderChain } from './firstOrder';
export type { LbfgsState } from './lbfgs';
