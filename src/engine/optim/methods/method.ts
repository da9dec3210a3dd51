import type { HyperparameterInfo, SettingsDeclaration, SettingValues } from '../settings';
import type { OptimizerInfo, OptimizerKind, ResolvedSpec } from '../spec';
import type { Optimizer } from '../types';

/**
 * Everything Fall Line knows about one optimizer kind: its metadata (label, defaults, settings with
 * their ranges, source) and how to build it from a validated, defaults-filled spec. Methods are written
 * with `defineMethod`, which derives the settings description from the declared settings.
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

/** A method as written: its metadata, its settings by name, and builders that receive them typed. */
export interface MethodDeclaration<S extends SettingsDeclaration> extends Omit<OptimizerInfo, 'hyperparameters'> {
  kind: OptimizerKind;
  settings: S;
  build(settings: SettingValues<S>, spec: ResolvedSpec): Optimizer;
  crossChecks?(settings: SettingValues<S>, spec: ResolvedSpec): [string, string][];
  settingsOf?: MethodDefinition['settingsOf'];
}

/**
 * Turns a declaration into a method: the settings description (names, labels, help, ranges, choices)
 * for validation and the settings panel, and builders fed with the spec's settings, typed from the
 * declaration. The one cast: a resolved spec has passed validation against exactly this description,
 * so each value has its declared type.
 */
export function defineMethod<S extends SettingsDeclaration>(declaration: MethodDeclaration<S>): MethodDefinition {
  const { settings, build, crossChecks, settingsOf, ...info } = declaration;
  const names = Object.keys(settings);
  const values = (spec: ResolvedSpec) => Object.fromEntries(names.map((name) => [name, spec.hyper[name]])) as SettingValues<S>;
  return {
    info: { ...info, hyperparameters: names.map((name) => settings[name].describe(name)) },
    build: (spec) => build(values(spec), spec),
    ...(crossChecks ? { crossChecks: (spec: ResolvedSpec) => crossChecks(values(spec), spec) } : {}),
    ...(settingsOf ? { settingsOf } : {}),
  };
}
