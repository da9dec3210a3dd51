/**
 * Start points for a start-point map: one run per cell of a grid over a 2-D box of two coordinates,
 * the others held at a base point.
 */
export interface StartGrid {
  /** nx * ny x n starts, row-major: cell (i, j) is run i + j nx, j = 0 at the bottom (b0). */
  starts: Float64Array;
  nx: number;
  ny: number;
  dimension: number;
}

export interface StartBox {
  /** Range of the first axis coordinate [lo, hi]. */
  a: readonly [number, number];
  /** Range of the second axis coordinate [lo, hi]. */
  b: readonly [number, number];
}

/**
 * Starts at the cell centres of an nx x ny grid over `box`: cell (i, j) starts at
 * a = a0 + (i + 1/2)(a1 - a0)/nx, b = b0 + (j + 1/2)(b1 - b0)/ny (so each pixel of the map shows the
 * run from its own centre). For a surface of n > 2 coordinates, `base` gives all n and `axes` the two
 * that vary (default [0, 1]); the rest are held at base.
 */
export function startGrid(box: StartBox, resolution: number | { nx: number; ny: number }, options: { base?: ArrayLike<number>; axes?: readonly [number, number] } = {}): StartGrid {
  const { nx, ny } = typeof resolution === 'number' ? { nx: resolution, ny: resolution } : resolution;
  if (!Number.isInteger(nx) || !Number.isInteger(ny) || nx < 1 || ny < 1) throw new Error(`startGrid: resolution must be whole numbers >= 1, got ${nx} x ${ny}`);
  for (const [name, [lo, hi]] of [['a', box.a], ['b', box.b]] as const)
    if (!(Number.isFinite(lo) && Number.isFinite(hi) && lo < hi)) throw new Error(`startGrid: box.${name} must be finite with lo < hi, got [${lo}, ${hi}]`);
  const base = options.base ?? [0, 0];
  const n = base.length;
  const [p, q] = options.axes ?? [0, 1];
  if (!(Number.isInteger(p) && Number.isInteger(q) && p >= 0 && q >= 0 && p < n && q < n && p !== q))
    throw new Error(`startGrid: axes must be two different coordinates of the ${n}, got [${p}, ${q}]`);
  const starts = new Float64Array(nx * ny * n);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) gridCellStart(box, nx, ny, i, j, base, [p, q], starts.subarray((i + j * nx) * n, (i + j * nx + 1) * n));
  return { starts, nx, ny, dimension: n };
}

/**
 * The start of cell (i, j) of an nx x ny grid over `box` (the formula above), written into `out`:
 * `base` everywhere, the two axis coordinates at the cell's centre. The one home of that formula, for
 * a whole grid (startGrid) and for one cell (a start-point map's cell, a clicked cell).
 */
export function gridCellStart(box: StartBox, nx: number, ny: number, i: number, j: number, base: ArrayLike<number>, axes: readonly [number, number], out: Float64Array): Float64Array {
  for (let k = 0; k < out.length; k++) out[k] = base[k];
  out[axes[0]] = box.a[0] + ((i + 0.5) * (box.a[1] - box.a[0])) / nx;
  out[axes[1]] = box.b[0] + ((j + 0.5) * (box.b[1] - box.b[0])) / ny;
  return out;
}

/**
 * A permutation of the cells of an nx x ny grid (indices i + j nx) so a map can be filled coarse to
 * fine: level by level, stride S = the largest power of two <= max(nx, ny), then S/2, ..., 1, each
 * level listing (row-major) the cells with i and j multiples of its stride that no coarser level
 * listed. The first ceil(nx/S') ceil(ny/S') entries are then exactly the full grid of stride S' for
 * every power of two S' (for a 64 x 64 grid: the first 1/16 of cells form the 16 x 16 grid of stride
 * 4, the first 1/4 the 32 x 32 grid of stride 2).
 */
export function coarseToFineOrder(nx: number, ny: number): Int32Array {
  if (!Number.isInteger(nx) || !Number.isInteger(ny) || nx < 1 || ny < 1) throw new Error(`coarseToFineOrder: grid must be whole numbers >= 1, got ${nx} x ${ny}`);
  let stride = 1;
  while (stride * 2 <= Math.max(nx, ny)) stride *= 2;
  const order = new Int32Array(nx * ny);
  let k = 0;
  for (let s = stride; s >= 1; s /= 2)
    for (let j = 0; j < ny; j += s)
      for (let i = 0; i < nx; i += s) {
        const coarser = s < stride && i % (2 * s) === 0 && j % (2 * s) === 0;
        if (!coarser) order[k++] = i + j * nx;
      }
  return order;
}

/** The rows of `starts` (count x n) in the given order: the starts of a sweep run coarse to fine. */
export function permuteStarts(starts: Float64Array, n: number, order: Int32Array): Float64Array {
  if (order.length * n !== starts.length) throw new Error(`permuteStarts: ${order.length} indices for ${starts.length / n} starts`);
  const out = new Float64Array(starts.length);
  for (let k = 0; k < order.length; k++) out.set(starts.subarray(order[k] * n, order[k] * n + n), k * n);
  return out;
}
