import type { OptimizerSpec } from '../optim/spec';
import { SettingError } from '../optim/types';
import type { StopRules } from '../run';
import { gridCellStart } from '../sweep/grid';

/**
 * A start-point map as plain data: one run of one configuration from every cell centre of a
 * resolution x resolution grid over a box in the plane of two parameters (`axes`); the other
 * coordinates stay as `base` holds them (for surfaces of more than two parameters the map is a slice).
 * Cell (i, j) has index i + j * resolution and its start at the centre of the cell: a_lo + (i + 1/2)
 * (a_hi - a_lo) / resolution along the first axis, likewise b with j along the second (the same cells
 * as sweep/grid.ts `startGrid`, one at a time, by its `gridCellStart`). Cells run in `coarseToFineOrder(resolution,
 * resolution)` (sweep/grid.ts).
 */
export interface StartMapSpec {
  kind: 'start-map';
  optimizer: OptimizerSpec;
  stop: StopRules;
  seed: number;
  box: { a: [number, number]; b: [number, number] };
  axes: [number, number];
  base: number[];
  resolution: number;
}

export const START_MAP_RESOLUTIONS = [16, 32, 64, 128, 256, 512] as const;

export function validateStartMap(spec: StartMapSpec, dimension: number): void {
  const r = spec.resolution;
  if (!Number.isInteger(r) || r < 16 || r > 512) throw new SettingError('resolution', `start-point map: resolution must be a whole number from 16 to 512, got ${r}`);
  if (spec.base.length !== dimension) throw new SettingError('base', `start-point map: base must have ${dimension} coordinates, got ${spec.base.length}`);
  const [p, q] = spec.axes;
  if (!(Number.isInteger(p) && Number.isInteger(q) && p >= 0 && q >= 0 && p < dimension && q < dimension && p !== q))
    throw new SettingError('axes', `start-point map: axes must be two different parameter indices below ${dimension}, got [${p}, ${q}]`);
  for (const [name, [lo, hi]] of [['a', spec.box.a], ['b', spec.box.b]] as const)
    if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo < hi)) throw new SettingError(`box.${name}`, `start-point map: box.${name} must be finite with lo < hi, got [${lo}, ${hi}]`);
}

/** The start of cell `index` (full coordinates), written into `out`. */
export function cellStart(spec: StartMapSpec, index: number, out: Float64Array): Float64Array {
  const r = spec.resolution;
  const i = index % r;
  return gridCellStart(spec.box, r, r, i, (index - i) / r, spec.base, spec.axes, out);
}
