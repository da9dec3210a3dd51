import { createRng, nextGaussian } from '../rng';
import type { ParameterGroup } from '../surface';
import { validateGroups, wholeVectorGroup } from './groups';
import type { SlicePlane } from './plane';

/**
 * Options of `randomPlane`. Defaults follow Li, Xu, Taylor, Studer & Goldstein, "Visualizing the Loss
 * Landscape of Neural Nets", NeurIPS 2018 (arXiv:1712.09913), where a choice is ours it says so.
 */
export interface RandomPlaneOptions {
  /**
   * Bias groups: 'zero' (default) leaves them unperturbed, direction entries 0; 'filter' normalises each
   * bias group as one more filter. The paper's experiments do one or the other; which it takes as its
   * default we could not confirm, so 'zero' is our choice (it keeps the slice about the weights).
   */
  bias?: 'zero' | 'filter';
  /**
   * A perturbed block whose centre block has norm 0 (a filter at exactly zero): 'zero' (default) follows
   * the formula d <- d / |d| * |theta| literally and gives a zero direction block (the filter is held);
   * 'unit' gives the block unit Frobenius norm instead, so a slice through an all-zero start still moves.
   */
  zeroBlocks?: 'zero' | 'unit';
  /**
   * Make v orthogonal to u (default false: the paper relies on two independent Gaussian directions in
   * high dimension being nearly orthogonal). Done block by block, v_g <- v_g - (<v_g, u_g> / <u_g, u_g>) u_g,
   * then v_g rescaled to its filter norm again, so v keeps the per-filter norms and is exactly orthogonal
   * to u. A block of one entry (or one where v_g was parallel to u_g) has no orthogonal remainder; its v
   * block becomes 0.
   */
  orthogonalize?: boolean;
}

/**
 * A random slice plane through `centre` with filter-wise normalised directions (Li et al. 2018, Sec. 4):
 * draw d with i.i.d. standard Gaussian entries (src/engine/rng.ts, seeded), then for every filter j
 * rescale its block, d_j <- d_j / |d_j| |theta_j| (Frobenius norms), so each filter is perturbed in
 * proportion to its own scale and plots of differently scaled models are comparable. u and v are drawn
 * independently from one generator (all n entries of u, then all n of v), so the same seed always gives
 * the same plane. Without groups the whole vector is one filter (u and v then have the centre's norm);
 * positions in no group stay unperturbed. Throws when a direction comes out entirely zero (every
 * perturbed centre block is zero): pass `zeroBlocks: 'unit'` for such a centre.
 */
export function randomPlane(
  centre: ArrayLike<number>,
  groups: readonly ParameterGroup[] | undefined,
  seed: number,
  options: RandomPlaneOptions = {},
): SlicePlane {
  const n = centre.length;
  const { bias = 'zero', zeroBlocks = 'zero', orthogonalize = false } = options;
  if (bias !== 'zero' && bias !== 'filter') throw new Error(`randomPlane: bias must be 'zero' or 'filter', got ${JSON.stringify(bias)}`);
  if (zeroBlocks !== 'zero' && zeroBlocks !== 'unit') throw new Error(`randomPlane: zeroBlocks must be 'zero' or 'unit', got ${JSON.stringify(zeroBlocks)}`);
  if (n < 1) throw new Error('randomPlane: the centre has no coordinates');
  for (let k = 0; k < n; k++) if (!Number.isFinite(centre[k])) throw new Error(`randomPlane: centre coordinate ${k + 1} is ${centre[k]}`);
  const all = groups && groups.length > 0 ? groups : wholeVectorGroup(n);
  validateGroups(all, n);
  const perturbed = all.filter((g) => g.kind === 'weights' || bias === 'filter');

  const rng = createRng(seed);
  const rawU = Array.from({ length: n }, () => nextGaussian(rng));
  const rawV = Array.from({ length: n }, () => nextGaussian(rng));
  const u = new Array<number>(n).fill(0);
  const v = new Array<number>(n).fill(0);
  for (const g of perturbed) {
    const centreNorm = blockNorm(centre, g.indices);
    const target = centreNorm > 0 ? centreNorm : zeroBlocks === 'unit' ? 1 : 0;
    if (target === 0) continue;
    setBlock(u, rawU, g.indices, target);
    if (orthogonalize) removeComponent(rawV, u, g.indices);
    setBlock(v, rawV, g.indices, target);
  }
  if (u.every((x) => x === 0))
    throw new Error("randomPlane: every perturbed block of the centre is zero, so the normalised directions are zero; use zeroBlocks: 'unit'");
  if (v.every((x) => x === 0)) throw new Error('randomPlane: the second direction has no part orthogonal to the first (every perturbed block has one entry)');
  return { origin: Array.from(centre), u, v };
}

/** Frobenius norm of x restricted to `indices`. */
export function blockNorm(x: ArrayLike<number>, indices: readonly number[]): number {
  let s = 0;
  for (const i of indices) s += x[i] * x[i];
  return Math.sqrt(s);
}

/** out[indices] = raw[indices] scaled to norm `target` (left 0 if the raw block is 0). */
function setBlock(out: number[], raw: readonly number[], indices: readonly number[], target: number): void {
  const r = blockNorm(raw, indices);
  // A Gaussian block is 0 with probability 0; a block emptied by orthogonalisation stays 0.
  if (!(r > 0)) return;
  for (const i of indices) out[i] = (raw[i] / r) * target;
}

/** raw[indices] -= (<raw, u> / <u, u>) u over the block; a remainder at rounding level is set to 0. */
function removeComponent(raw: number[], u: readonly number[], indices: readonly number[]): void {
  let ru = 0, uu = 0, rr = 0;
  for (const i of indices) {
    ru += raw[i] * u[i];
    uu += u[i] * u[i];
    rr += raw[i] * raw[i];
  }
  if (uu === 0) return;
  let left = 0;
  for (const i of indices) {
    raw[i] -= (ru / uu) * u[i];
    left += raw[i] * raw[i];
  }
  if (left <= 1e-24 * rr) for (const i of indices) raw[i] = 0;
}
