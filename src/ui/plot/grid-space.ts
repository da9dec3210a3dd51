/**
 * Grid space: fractional sample indices (i, j) of a sampled slice.
 *
 * Convention (the same as the engine's `sampleGrid`): samples sit on cell corners,
 *   a_i = a0 + i (a1 - a0) / (nx - 1),   b_j = b0 + j (b1 - b0) / (ny - 1),
 * stored row-major in a flat Float64Array at index i + j nx, with j = 0 at b0 (the bottom of the view).
 * The outermost samples lie exactly on the edges of the sampled ranges, so a minimum on the boundary of
 * a domain is sampled, and nx, ny >= 2.
 *
 * The grid's box is the engine's `GridBox` ({a, b, nx, ny}, with its validator and side cap), which a
 * grid result from the worker extends, so one can be passed straight in.
 */
import type { GridBox, ViewBox } from '../../engine';

/** A point of the slice plane (for a 2-D surface, a = x and b = y). */
export interface ParamPoint {
  a: number;
  b: number;
}

/** Fractional sample indices: i along a, j along b (j = 0 at the bottom). */
export interface GridPoint {
  i: number;
  j: number;
}

/** Parameter spacing between neighbouring samples. */
export function gridStep(grid: GridBox): { da: number; db: number } {
  return { da: (grid.a[1] - grid.a[0]) / (grid.nx - 1), db: (grid.b[1] - grid.b[0]) / (grid.ny - 1) };
}

export function gridToParam(grid: GridBox, c: GridPoint): ParamPoint {
  return {
    a: grid.a[0] + (c.i * (grid.a[1] - grid.a[0])) / (grid.nx - 1),
    b: grid.b[0] + (c.j * (grid.b[1] - grid.b[0])) / (grid.ny - 1),
  };
}

export function paramToGrid(grid: GridBox, p: ParamPoint): GridPoint {
  return {
    i: ((p.a - grid.a[0]) * (grid.nx - 1)) / (grid.a[1] - grid.a[0]),
    j: ((p.b - grid.b[0]) * (grid.ny - 1)) / (grid.b[1] - grid.b[0]),
  };
}

/** The parameter ranges a grid covers. */
export function gridView(grid: GridBox): ViewBox {
  return { a: [grid.a[0], grid.a[1]], b: [grid.b[0], grid.b[1]] };
}
