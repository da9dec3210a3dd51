/**
 * The six-hump camel function, sampled on its usual domain [-3, 3] x [-2, 2] (test fixture; the formula
 * is the standard one, e.g. Molga & Smutnicki 2005, "Test functions for optimization needs"; global
 * minimum about -1.0316 at (+-0.0898, -+0.7126), quoted from memory). A surface with a negative minimum.
 */
export function camel(x: number, y: number): number {
  return (4 - 2.1 * x * x + (x * x * x * x) / 3) * x * x + x * y + (-4 + 4 * y * y) * y * y;
}

export const CAMEL_GRID = { a: [-3, 3] as [number, number], b: [-2, 2] as [number, number], nx: 121, ny: 81 };

export function camelValues(): Float64Array {
  const { nx, ny, a, b } = CAMEL_GRID;
  const out = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++)
    for (let i = 0; i < nx; i++) out[i + j * nx] = camel(a[0] + (i * (a[1] - a[0])) / (nx - 1), b[0] + (j * (b[1] - b[0])) / (ny - 1));
  return out;
}
