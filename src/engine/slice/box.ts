/**
 * The one box type of the slice plane, used by the engine, the worker, the store and the plots: a range
 * of a (the first drawn axis) and of b (the second), and the same box sampled as a grid of nx by ny
 * corner samples (the sample convention is in grid.ts). The grid side is capped here, once.
 */

/** A box of the slice plane, low < high on each axis. */
export interface ViewBox {
  a: [number, number];
  b: [number, number];
}

/** A box sampled at nx by ny cell corners, the outermost on its edges (so nx, ny >= 2). */
export interface GridBox extends ViewBox {
  nx: number;
  ny: number;
}

/** The largest number of samples along one side of a grid. */
export const MAX_GRID_SIDE = 2048;

export function validateViewBox(box: ViewBox, what = 'grid'): void {
  for (const [name, r] of [['a', box.a], ['b', box.b]] as const)
    if (!(Number.isFinite(r[0]) && Number.isFinite(r[1]) && r[0] < r[1]))
      throw new Error(`${what}: the ${name} range must be two finite numbers, low < high, got [${r[0]}, ${r[1]}]`);
}

export function validateGridBox(box: GridBox): void {
  for (const [name, n] of [['nx', box.nx], ['ny', box.ny]] as const)
    if (!Number.isInteger(n) || n < 2 || n > MAX_GRID_SIDE)
      throw new Error(`grid: ${name} must be a whole number from 2 to ${MAX_GRID_SIDE}, got ${n}`);
  validateViewBox(box);
}
