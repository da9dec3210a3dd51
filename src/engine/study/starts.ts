import { createRng, nextGaussian, nextUniform } from '../rng';
import type { ParameterGroup } from '../surface';

/**
 * Where the starts of a multi-start study come from, as plain data. Every draw is seeded: the same
 * distribution, count and seed give the same starts, bit for bit.
 *
 * - 'uniform': each coordinate uniform on its [lo, hi] (a box, e.g. the current view).
 * - 'gaussian': centre + sd * N(0, 1) per coordinate (sd one number or one per coordinate).
 * - 'glorot': the usual initialisation of a network's weights, uniform U(-r, r) with
 *   r = sqrt(6 / (fan_in + fan_out)) (X. Glorot & Y. Bengio, "Understanding the difficulty of training
 *   deep feedforward neural networks", AISTATS 2010); biases 0.
 * - 'he': normal N(0, 2 / fan_in) (K. He, X. Zhang, S. Ren & J. Sun, "Delving deep into rectifiers",
 *   ICCV 2015); biases 0.
 * The two network initialisations need the surface's parameter groups (every data-fit surface has
 * them): a layer is a run of 'weights' groups (one per unit, each the unit's incoming weights) closed by
 * its 'bias' group, so fan_in is a group's length and fan_out the number of units in the layer.
 */
export type StartDistribution =
  | { kind: 'uniform'; box: [number, number][] }
  | { kind: 'gaussian'; centre: number[]; sd: number | number[] }
  | { kind: 'glorot' }
  | { kind: 'he' };

export const MAX_STARTS = 1_000_000;

/** count x n starts, row-major. Throws a RangeError naming the field for bad input. */
export function drawStarts(d: StartDistribution, n: number, count: number, seed: number, groups?: readonly ParameterGroup[]): Float64Array {
  if (!Number.isInteger(count) || count < 1 || count > MAX_STARTS) throw new RangeError(`starts: count must be a whole number from 1 to ${MAX_STARTS}, got ${count}`);
  if (!Number.isFinite(seed)) throw new RangeError(`starts: seed must be a finite number, got ${seed}`);
  const rng = createRng(seed);
  const out = new Float64Array(count * n);
  switch (d.kind) {
    case 'uniform': {
      checkLength('box', d.box.length, n);
      d.box.forEach(([lo, hi], i) => {
        if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo <= hi)) throw new RangeError(`starts: box[${i}] must be finite with lo <= hi, got [${lo}, ${hi}]`);
      });
      for (let r = 0; r < count; r++) for (let i = 0; i < n; i++) out[r * n + i] = d.box[i][0] + (d.box[i][1] - d.box[i][0]) * nextUniform(rng);
      return out;
    }
    case 'gaussian': {
      checkLength('centre', d.centre.length, n);
      const sd = typeof d.sd === 'number' ? new Array<number>(n).fill(d.sd) : d.sd;
      checkLength('sd', sd.length, n);
      sd.forEach((s, i) => {
        if (!(s >= 0 && Number.isFinite(s))) throw new RangeError(`starts: sd[${i}] must be a finite number >= 0, got ${s}`);
      });
      for (let r = 0; r < count; r++) for (let i = 0; i < n; i++) out[r * n + i] = d.centre[i] + sd[i] * nextGaussian(rng);
      return out;
    }
    case 'glorot':
    case 'he': {
      const layers = networkLayers(groups, n, d.kind);
      for (let r = 0; r < count; r++)
        for (const layer of layers) {
          const bound = Math.sqrt(6 / (layer.fanIn + layer.fanOut));
          const sd = Math.sqrt(2 / layer.fanIn);
          for (const i of layer.weights) out[r * n + i] = d.kind === 'glorot' ? bound * (2 * nextUniform(rng) - 1) : sd * nextGaussian(rng);
        }
      return out;
    }
  }
}

export interface NetworkLayer {
  fanIn: number;
  fanOut: number;
  /** Indices of the layer's weights, unit by unit. */
  weights: number[];
}

/** The layers of a network read from its parameter groups (see StartDistribution). */
export function networkLayers(groups: readonly ParameterGroup[] | undefined, n: number, what: string): NetworkLayer[] {
  if (!groups || groups.length === 0) throw new RangeError(`starts: '${what}' initialisation needs a surface with parameter groups (a model fitted to data)`);
  const layers: NetworkLayer[] = [];
  let units: ParameterGroup[] = [];
  for (const g of groups) {
    if (g.kind === 'weights') {
      if (units.length && units[0].indices.length !== g.indices.length) throw new RangeError(`starts: units of one layer have ${units[0].indices.length} and ${g.indices.length} incoming weights`);
      units.push(g);
      continue;
    }
    if (units.length) layers.push({ fanIn: units[0].indices.length, fanOut: units.length, weights: units.flatMap((u) => u.indices) });
    units = [];
  }
  if (units.length) layers.push({ fanIn: units[0].indices.length, fanOut: units.length, weights: units.flatMap((u) => u.indices) });
  for (const l of layers) for (const i of l.weights) if (!(i >= 0 && i < n)) throw new RangeError(`starts: a parameter group names index ${i}, outside 0..${n - 1}`);
  return layers;
}

function checkLength(field: string, got: number, n: number): void {
  if (got !== n) throw new RangeError(`starts: ${field} must have ${n} entries (one per parameter), got ${got}`);
}
