/** Test helpers: central finite differences and the closed-form eigenvalues of a symmetric 2x2 matrix. */
import type { Surface } from '../../src/engine';

export interface Derivatives {
  value: number;
  gradient: Float64Array;
  hessian: Float64Array;
}

export function exact(surface: Surface, point: number[]): Derivatives {
  const n = surface.dimension;
  const gradient = new Float64Array(n);
  const hessian = new Float64Array(n * n);
  const value = surface.valueGradientHessian(point, gradient, hessian);
  return { value, gradient, hessian };
}

/**
 * Difference step h = 1e-5: truncation error ~ h^2 |f'''| / 6 against rounding ~ eps |f| / h. A fixed
 * absolute step (not scaled by |x|) keeps the truncation error small on oscillating surfaces far out.
 */
const H = 1e-5;

/** Central differences of the value: (f(x + h e_i) - f(x - h e_i)) / 2h. */
export function finiteGradient(surface: Surface, point: number[]): Float64Array {
  const g = new Float64Array(point.length);
  for (let i = 0; i < point.length; i++) {
    const h = H;
    const up = [...point];
    const down = [...point];
    up[i] += h;
    down[i] -= h;
    g[i] = (surface.value(up) - surface.value(down)) / (2 * h);
  }
  return g;
}

/** Central differences of the exact gradient, row i = d grad / d x_i. */
export function finiteHessian(surface: Surface, point: number[]): Float64Array {
  const n = point.length;
  const out = new Float64Array(n * n);
  const gu = new Float64Array(n);
  const gd = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const h = H;
    const up = [...point];
    const down = [...point];
    up[i] += h;
    down[i] -= h;
    surface.valueGradient(up, gu);
    surface.valueGradient(down, gd);
    for (let j = 0; j < n; j++) out[i * n + j] = (gu[j] - gd[j]) / (2 * h);
  }
  return out;
}

/** Eigenvalues of [[p, q], [q, r]], ascending: (p + r)/2 -/+ sqrt(((p - r)/2)^2 + q^2). */
export function eigen2(h: ArrayLike<number>): [number, number] {
  const p = h[0];
  const q = h[1];
  const r = h[3];
  const mean = (p + r) / 2;
  const radius = Math.sqrt(((p - r) / 2) ** 2 + q * q);
  return [mean - radius, mean + radius];
}

/** min / max / saddle from the signs of the eigenvalues. */
export function classify([low, high]: [number, number]): 'min' | 'max' | 'saddle' | 'degenerate' {
  if (low > 0) return 'min';
  if (high < 0) return 'max';
  if (low < 0 && high > 0) return 'saddle';
  return 'degenerate';
}

export function maxAbs(a: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i]));
  return m;
}

export function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}
