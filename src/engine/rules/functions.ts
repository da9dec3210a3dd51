import { FUNCTIONS, type Arity } from '../expr';

/**
 * The functions a rule may call: every function of the formula language, `clip`, and the reductions.
 *
 * Element-wise (applied to each parameter separately): the formula language's functions (`sign`,
 * `min`, `max`, `sqrt`, ...) and `clip(v, lo, hi)` = min(max(v, lo), hi).
 *
 * Reductions (one number over all parameters, the same for every element): `sum(v)` = sum_i v_i,
 * `dot(a, b)` = sum_i a_i b_i, `norm(v)` = sqrt(sum_i v_i^2) (Euclidean), `largest(v)` = max_i v_i.
 * Their arguments are element-wise expressions; reductions do not nest.
 */
export type ReductionName = 'sum' | 'dot' | 'norm' | 'largest';

export const REDUCTIONS: ReadonlyMap<ReductionName, Arity & { summary: string }> = new Map([
  ['sum', { minArgs: 1, maxArgs: 1, summary: 'sum over all parameters' }],
  ['dot', { minArgs: 2, maxArgs: 2, summary: 'dot product over all parameters' }],
  ['norm', { minArgs: 1, maxArgs: 1, summary: 'Euclidean norm over all parameters' }],
  ['largest', { minArgs: 1, maxArgs: 1, summary: 'largest value over all parameters' }],
] as const);

export function isReduction(name: string): name is ReductionName {
  return REDUCTIONS.has(name as ReductionName);
}

/** clip(v, lo, hi) = min(max(v, lo), hi); NaN stays NaN. */
export function clip(v: number, lo: number, hi: number): number {
  return Math.min(Math.max(v, lo), hi);
}

/** Every callable name with its argument count. A Map, so `constructor` never resolves. */
export const RULE_FUNCTIONS: ReadonlyMap<string, Arity> = new Map<string, Arity>([
  ...FUNCTIONS,
  ['clip', { minArgs: 3, maxArgs: 3 }],
  ...REDUCTIONS,
]);
