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
