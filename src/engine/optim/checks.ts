import type { HyperparameterInfo } from './settings';

/**
 * Checks one setting against its description and returns the problem in words (without the
 * "adam: " prefix), or null when the value is acceptable. Messages read like
 * "beta1 must be in [0, 1), got 1.2".
 */
export function checkSetting(info: HyperparameterInfo, value: unknown, label = info.name): string | null {
  if (typeof info.default === 'boolean') {
    return typeof value === 'boolean' ? null : `${label} must be true or false, got ${show(value)}`;
  }
  if (typeof info.default === 'string') {
    const choices = info.choices ?? [];
    if (typeof value !== 'string' || !choices.includes(value))
      return `${label} must be one of ${choices.map((c) => `'${c}'`).join(', ')}, got ${show(value)}`;
    return null;
  }
  if (typeof value !== 'number') return `${label} must be a number, got ${show(value)}`;
  const ok =
    Number.isFinite(value) &&
    (!info.integer || Number.isInteger(value)) &&
    (info.min === undefined || (info.minExclusive ? value > info.min : value >= info.min)) &&
    (info.max === undefined || (info.maxExclusive ? value < info.max : value <= info.max));
  return ok ? null : `${label} must be ${describeRange(info)}, got ${show(value)}`;
}

/** "in [0, 1)", "a finite number > 0", "a whole number in [1, 1000]", "a whole number >= 1". */
export function describeRange(r: Pick<HyperparameterInfo, 'min' | 'max' | 'minExclusive' | 'maxExclusive' | 'integer'>): string {
  const what = r.integer ? 'a whole number' : 'a finite number';
  if (r.min !== undefined && r.max !== undefined) {
    const interval = `${r.minExclusive ? '(' : '['}${r.min}, ${r.max}${r.maxExclusive ? ')' : ']'}`;
    return r.integer ? `${what} in ${interval}` : `in ${interval}`;
  }
  if (r.min !== undefined) return `${what} ${r.minExclusive ? '>' : '>='} ${r.min}`;
  if (r.max !== undefined) return `${what} ${r.maxExclusive ? '<' : '<='} ${r.max}`;
  return what;
}

/** A value as it appears in a message: numbers plain, strings quoted, the rest as JSON. */
export function show(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return `'${value}'`;
  if (value === undefined) return 'nothing';
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}

export function isPlainObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}
