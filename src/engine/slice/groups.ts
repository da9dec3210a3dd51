import type { ParameterGroup } from '../surface';

/*
 * Parameter groups (ParameterGroup in ../surface.ts) say how a model's flat parameter vector splits
 * into filters, for filter-wise normalisation of slice directions (Li et al., NeurIPS 2018): a
 * 'weights' group is one filter (for a fully connected layer, the weights feeding one output unit;
 * for a convolution, the weights producing one output channel); a 'bias' group holds bias or offset
 * parameters, which the paper's experiments treat separately.
 */

/**
 * Checks that groups are disjoint and lie inside a vector of length n; throws a message naming the
 * group otherwise. Positions in no group are allowed (slice directions leave them at 0).
 */
export function validateGroups(groups: readonly ParameterGroup[], n: number): void {
  const owner = new Map<number, string>();
  for (const g of groups) {
    if (g.kind !== 'weights' && g.kind !== 'bias') throw new Error(`parameter group '${g.name}': kind must be 'weights' or 'bias', got ${JSON.stringify(g.kind)}`);
    if (g.indices.length === 0) throw new Error(`parameter group '${g.name}': it has no indices`);
    for (const i of g.indices) {
      if (!Number.isInteger(i) || i < 0 || i >= n)
        throw new Error(`parameter group '${g.name}': index ${i} is outside the ${n} parameters`);
      const other = owner.get(i);
      if (other !== undefined) throw new Error(`parameter group '${g.name}': index ${i} is already in group '${other}'`);
      owner.set(i, g.name);
    }
  }
}

/** The single group used when a surface has none: the whole vector as one filter. */
export function wholeVectorGroup(n: number): ParameterGroup[] {
  return [{ name: 'all', indices: Array.from({ length: n }, (_, i) => i), kind: 'weights' }];
}
