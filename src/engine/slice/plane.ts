/**
 * A plane through n-dimensional parameter space: point(a, b) = origin + a u + b v.
 *
 * An axis-aligned slice of a formula in n variables is origin = the held values, u = e_i, v = e_j, so
 * (a, b) are simply (x_i, x_j) with the other coordinates held. Data-fit slices use random or principal
 * directions; nothing here assumes u and v are orthonormal.
 */
export interface SlicePlane {
  origin: number[];
  u: number[];
  v: number[];
}

/** The plane through `at` spanned by coordinate axes i and j (a = x_i, b = x_j). */
export function axisPlane(at: readonly number[], i: number, j: number): SlicePlane {
  const n = at.length;
  if (!(Number.isInteger(i) && Number.isInteger(j) && i >= 0 && j >= 0 && i < n && j < n) || i === j)
    throw new Error(`slice: axes must be two different variables among ${n}, got ${i + 1} and ${j + 1}`);
  const origin = at.slice();
  origin[i] = 0;
  origin[j] = 0;
  const u = new Array<number>(n).fill(0);
  const v = new Array<number>(n).fill(0);
  u[i] = 1;
  v[j] = 1;
  return { origin, u, v };
}

/** Writes origin + a u + b v into `out`. */
export function planePoint(plane: SlicePlane, a: number, b: number, out: Float64Array): Float64Array {
  const { origin, u, v } = plane;
  for (let k = 0; k < out.length; k++) out[k] = origin[k] + a * u[k] + b * v[k];
  return out;
}

/**
 * Coordinates (a, b) of the point of the plane nearest to x (least squares on u, v), which is how a run
 * in the full space is drawn on the slice. For an axis plane this is just (x_i, x_j).
 */
export function projectToPlane(plane: SlicePlane, x: ArrayLike<number>): { a: number; b: number } {
  const { origin, u, v } = plane;
  let uu = 0, uv = 0, vv = 0, ud = 0, vd = 0;
  for (let k = 0; k < origin.length; k++) {
    const d = x[k] - origin[k];
    uu += u[k] * u[k];
    uv += u[k] * v[k];
    vv += v[k] * v[k];
    ud += u[k] * d;
    vd += v[k] * d;
  }
  const det = uu * vv - uv * uv;
  if (!(Math.abs(det) > 1e-300)) throw new Error('slice: the two directions are parallel; they do not span a plane');
  return { a: (vv * ud - uv * vd) / det, b: (uu * vd - uv * ud) / det };
}

/** Distance from x to the plane: how far a projected run point really is from the drawn slice. */
export function distanceToPlane(plane: SlicePlane, x: ArrayLike<number>): number {
  const { a, b } = projectToPlane(plane, x);
  let s = 0;
  for (let k = 0; k < plane.origin.length; k++) {
    const d = x[k] - (plane.origin[k] + a * plane.u[k] + b * plane.v[k]);
    s += d * d;
  }
  return Math.sqrt(s);
}
