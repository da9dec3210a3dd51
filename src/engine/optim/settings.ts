/**
 * How an optimizer's own settings are described: the value types and the description each setting
 * carries for validation (checks.ts) and for the settings panel. Shared by the optimizer specs, the
 * schedules and the methods.
 */

export type HyperValue = number | boolean | string;

/** One kind-specific setting, described for validation and for the settings panel. */
export interface HyperparameterInfo {
  name: string;
  label: string;
  default: HyperValue;
  min?: number;
  max?: number;
  minExclusive?: boolean;
  maxExclusive?: boolean;
  integer?: boolean;
  /** For string settings: the allowed values. */
  choices?: string[];
  help: string;
}

/**
 * A setting as a method declares it (methods/method.ts `defineMethod`): its description without the
 * name, which is the key it is declared under; `T` is the type its value has in the method's builder.
 */
export interface Setting<T extends HyperValue> {
  readonly describe: (name: string) => HyperparameterInfo;
  /** Carries the value type only; never set. */
  readonly valueType?: T;
}

interface Described {
  help: string;
  /** Shown in the settings panel; the setting's name when left out. */
  label?: string;
}

interface NumberRange {
  min?: number;
  max?: number;
  minExclusive?: boolean;
  maxExclusive?: boolean;
  integer?: boolean;
}

/** The description under a name: name, label, default, then only the range or choice fields given, help last. */
function describer(def: HyperValue, extras: NumberRange & { choices?: string[] }, { help, label }: Described): (name: string) => HyperparameterInfo {
  const given = Object.fromEntries(Object.entries(extras).filter(([, v]) => v !== undefined));
  return (name) => ({ name, label: label ?? name, default: def, ...given, help });
}

/** A number, with an optional range. */
export function number(def: number, options: Described & NumberRange): Setting<number> {
  const { help, label, ...range } = options;
  return { describe: describer(def, range, { help, label }) };
}

/** A number in [0, 1): a decay rate or a momentum coefficient. */
export function unit(def: number, options: Described): Setting<number> {
  return number(def, { ...options, min: 0, max: 1, maxExclusive: true });
}

/** True or false. */
export function flag(def: boolean, options: Described): Setting<boolean> {
  return { describe: describer(def, {}, options) };
}

/** One of a fixed list of strings; the first is the default unless another is given. */
export function choice<const C extends readonly [string, ...string[]]>(choices: C, options: Described & { default?: C[number] }): Setting<C[number]> {
  return { describe: describer(options.default ?? choices[0], { choices: [...choices] }, options) };
}

/** The settings a method declares, by name. */
export type SettingsDeclaration = Readonly<Record<string, Setting<HyperValue>>>;

/** The values of declared settings, typed: what a method's builder receives. */
export type SettingValues<S extends SettingsDeclaration> = { readonly [K in keyof S]: S[K] extends Setting<infer T> ? T : never };
