/**
 * Grid space: fractional sample indices (i, j) of a sampled slice.
 *
 * Convention (the same as the engine's `sampleGrid`): samples sit on cell corners,
 *   a_i = a0 + i (a1 - a0) / (nx - 1),   b_j = b0 + j (b1 - b0) / (ny - 1),
 * stored row-major in a flat Float64Array at index i + j nx, with j = 0 at b0 (the bottom of the view).
 * The outermost samples lie exactly on the edges of the sampled ranges, so a minimum on the boundary of
 * a domain is sampled, and nx, ny >= 2.
 *
 * A `GridSpec` has the same fields as the engine's `GridRequest` ({a, b, nx, ny}), so a grid result from
 * the worker can be passed straight in.
 */
import type { ParamPoint, ViewBox } from './scales';

export interface GridSpec extends ViewBox {
  nx: number;
  ny: number;
}

/** Fractional sample indices: i along a, j along b (j = 0 at the bottom). */
export interface GridPoint {
  i: number;
  j: number;
}

export function validateGridSpec(grid: GridSpec): void {
  for (const [name, n] of [['nx', grid.nx], ['ny', grid.ny]] as const)
    if (!(Number.isInteger(n) && n >= 2)) throw new Error(`grid: ${name} must be a whole number of at least 2, got ${n}`);
  for (const [name, r] of [['a', grid.a], ['b', grid.b]] as const)
    if (!(Number.isFinite(r[0]) && Number.isFinite(r[1]) && r[0] < r[1]))
      throw new Error(`grid: the ${name} range must be two finite numbers, low < high, got [${r[0]}, ${r[1]}]`);
}

/** Parameter spacing between neighbouring samples. */
export function gridStep(grid: GridSpec): { da: number; db: number } {
  return { da: (grid.a[1] - grid.a[0]) / (grid.nx - 1), db: (grid.b[1] - grid.b[0]) / (grid.ny - 1) };
}

export function gridToParam(grid: GridSpec, c: GridPoint): ParamPoint {
  return {
    a: grid.a[0] + (c.i * (grid.a[1] - grid.a[0])) / (grid.nx - 1),
    b: grid.b[0] + (c.j * (grid.b[1] - grid.b[0])) / (grid.ny - 1),
  };
}

export function paramToGrid(grid: GridSpec, p: ParamPoint): GridPoint {
  return {
    i: ((p.a - grid.a[0]) * (grid.nx - 1)) / (grid.a[1] - grid.a[0]),
    j: ((p.b - grid.b[0]) * (grid.ny - 1)) / (grid.b[1] - grid.b[0]),
  };
}

/** The parameter ranges a grid covers. */
export function gridView(grid: GridSpec): ViewBox {
  return { a: [grid.a[0], grid.a[1]], b: [grid.b[0], grid.b[1]] };
}
