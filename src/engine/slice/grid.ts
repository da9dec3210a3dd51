import type { Surface } from '../surface';
import { validateGridBox, type GridBox } from './box';
import { planePoint, type SlicePlane } from './plane';

/**
 * A regular grid of samples on a slice plane. Samples sit on cell corners:
 * a_i = a[0] + i (a[1] - a[0]) / (nx - 1), b_j = b[0] + j (b[1] - b[0]) / (ny - 1), stored row-major in a
 * flat Float64Array at index i + j nx, with j = 0 at b[0] (the bottom of the view).
 */
export interface GridRequest extends GridBox {
  plane: SlicePlane;
}

export function validateGridRequest(req: GridRequest, dimension: number): void {
  const { plane } = req;
  validateGridBox(req);
  if (plane.origin.length !== dimension || plane.u.length !== dimension || plane.v.length !== dimension)
    throw new Error(`grid: the slice plane has ${plane.origin.length} coordinates but the surface has ${dimension}`);
}

export function gridA(req: GridRequest, i: number): number {
  return req.a[0] + (i * (req.a[1] - req.a[0])) / (req.nx - 1);
}

export function gridB(req: GridRequest, j: number): number {
  return req.b[0] + (j * (req.b[1] - req.b[0])) / (req.ny - 1);
}

/**
 * Evaluates the surface on rows j0 <= j < j1 of the grid into `out` (length nx * ny), so the work can be
 * split into bands for progress reports or for several workers. Returns `out`.
 */
export function sampleGrid(
  surface: Surface,
  req: GridRequest,
  out: Float64Array = new Float64Array(req.nx * req.ny),
  j0 = 0,
  j1 = req.ny,
): Float64Array {
  return sampleGridRows(surface, req, out, j0, j1, 0);
}

/**
 * Like `sampleGrid`, for a buffer that holds only the rows from `firstRow` on: row j goes to
 * out[(j - firstRow) nx + i]. A worker sampling one band of rows [j0, j1) passes firstRow = j0 and a
 * buffer of nx (j1 - j0) values; the numbers are bit-identical to those of one whole-grid call.
 */
export function sampleGridRows(surface: Surface, req: GridRequest, out: Float64Array, j0: number, j1: number, firstRow: number): Float64Array {
  const { nx, plane } = req;
  const n = surface.dimension;
  const p = new Float64Array(n);
  const rowBase = new Float64Array(n);
  const axis = unitAxis(plane.u);
  for (let j = j0; j < j1; j++) {
    const b = gridB(req, j);
    const row = (j - firstRow) * nx;
    if (axis >= 0) {
      // Axis-aligned a direction: only one coordinate changes along a row.
      planePoint(plane, 0, b, p);
      const base = p[axis];
      for (let i = 0; i < nx; i++) {
        p[axis] = base + gridA(req, i);
        out[row + i] = surface.value(p);
      }
    } else {
      planePoint(plane, 0, b, rowBase);
      for (let i = 0; i < nx; i++) {
        const a = gridA(req, i);
        for (let k = 0; k < n; k++) p[k] = rowBase[k] + a * plane.u[k];
        out[row + i] = surface.value(p);
      }
    }
  }
  return out;
}

/** The index i when u is the unit vector e_i, else -1. */
function unitAxis(u: readonly number[]): number {
  let axis = -1;
  for (let k = 0; k < u.length; k++) {
    if (u[k] === 0) continue;
    if (u[k] !== 1 || axis >= 0) return -1;
    axis = k;
  }
  return axis;
}

/** Smallest and largest finite values (NaN when none is finite). */
export function finiteRange(values: ArrayLike<number>): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let k = 0; k < values.length; k++) {
    const v = values[k];
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return Number.isFinite(min) && Number.isFinite(max) ? { min, max } : { min: Number.NaN, max: Number.NaN };
}
