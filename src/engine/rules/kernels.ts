import { KERNEL_TABLE } from '../expr';
import { cachedPower } from '../power';
import { clip } from './functions';

/**
 * The table handed to generated rule code: the formula language's kernels and `clip`, with `pow` as
 * cachedPower (the same doubles as the formulas' `power`; a rule raises its betas to t every step).
 * Frozen and without a prototype, so only these names resolve.
 */
export const RULE_KERNELS: Readonly<Record<string, (...args: number[]) => number>> = Object.freeze(
  Object.assign(Object.create(null) as Record<string, (...args: number[]) => number>, KERNEL_TABLE, { clip, pow: cachedPower }),
);

export function isRuleKernel(name: string): boolean {
  return Object.prototype.hasOwnProperty.call(RULE_KERNELS, name);
}
