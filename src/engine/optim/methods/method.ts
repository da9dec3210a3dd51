import type { HyperparameterInfo } from '../settings';
import type { OptimizerInfo, ResolvedSpec } from '../spec';
import type { Optimizer } from '../types';

/**
 * Everything Fall Line knows about one optimizer kind: its metadata (label, defaults, settings with
 * their ranges, source) and how to build it from a validated, defaults-filled spec.
 */
export interface MethodDefinition {
  info: OptimizerInfo;
  build(spec: ResolvedSpec): Optimizer;
  /**
   * Constraints between settings that single-setting ranges cannot express, as [field, message]
   * pairs (message without the kind prefix). Called only when every setting is individually valid.
   */
  crossChecks?(spec: ResolvedSpec): [string, string][];
  /**
   * For kinds whose settings depend on the spec itself (a rule declares its own): the settings of
   * this spec, or the [field, message] that makes it unusable. Replaces `info.hyperparameters`.
   */
  settingsOf?(spec: Record<string, unknown>): { settings: HyperparameterInfo[] } | { field: string; message: string };
}

export const num = (spec: ResolvedSpec, name: string): number => spec.hyper[name] as number;
export const str = <T extends string>(spec: ResolvedSpec, name: string): T => spec.hyper[name] as T;
export const bool = (spec: ResolvedSpec, name: string): boolean => spec.hyper[name] as boolean;
