import type { Surface } from '../../../src/engine';

/**
 * Small surfaces with hand-written gradients and Hessians for the optimizer tests (the problem
 * catalogue is built separately; these keep the optimizer tests self-contained).
 */

/** f(x) = 1/2 (x - c)^T A (x - c), A symmetric (row-major n x n). Minimum c, value 0. */
export function quadratic(a: number[], center: number[]): Surface {
  const n = center.length;
  if (a.length !== n * n) throw new Error('quadratic: A must be n x n');
  const d = new Float64Array(n);
  const apply = (x: ArrayLike<number>, g: Float64Array): number => {
    for (let i = 0; i < n; i++) d[i] = x[i] - center[i];
    let f = 0;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += a[i * n + j] * d[j];
      g[i] = s;
      f += 0.5 * d[i] * s;
    }
    return f;
  };
  const scratch = new Float64Array(n);
  return {
    dimension: n,
    variables: Array.from({ length: n }, (_, i) => `x${i + 1}`),
    value: (x) => apply(x, scratch),
    valueGradient: (x, g) => apply(x, g),
    valueGradientHessian(x, g, h) {
      h.set(a);
      return apply(x, g);
    },
  };
}

/** f = x^2 + 10 y^2, the bowl of the reference worked examples (Hessian diag(2, 20)). */
export const bowl: Surface = quadratic([2, 0, 0, 20], [0, 0]);

/** A = R diag(l1, l2) R^T with R the rotation by `angle`. */
export function rotatedDiagonal(l1: number, l2: number, angle: number): number[] {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  return [c * c * l1 + s * s * l2, c * s * (l1 - l2), c * s * (l1 - l2), s * s * l1 + c * c * l2];
}

/**
 * Rosenbrock's function f = (a - x)^2 + b (y - x^2)^2, a = 1, b = 100 (H. H. Rosenbrock, "An
 * automatic method for finding the greatest or least value of a function", Comput. J. 3, 1960).
 * Minimum (1, 1), value 0.
 */
export const rosenbrock: Surface = {
  dimension: 2,
  variables: ['x', 'y'],
  value: (p) => (1 - p[0]) ** 2 + 100 * (p[1] - p[0] * p[0]) ** 2,
  valueGradient(p, g) {
    const [x, y] = [p[0], p[1]];
    const r = y - x * x;
    g[0] = -2 * (1 - x) - 400 * x * r;
    g[1] = 200 * r;
    return (1 - x) ** 2 + 100 * r * r;
  },
  valueGradientHessian(p, g, h) {
    const [x, y] = [p[0], p[1]];
    h[0] = 2 - 400 * (y - x * x) + 800 * x * x;
    h[1] = h[2] = -400 * x;
    h[3] = 200;
    return this.valueGradient(p, g);
  },
};

/** f = x^2 - y^2: a saddle at the origin (Hessian diag(2, -2)). */
export const saddle: Surface = {
  dimension: 2,
  variables: ['x', 'y'],
  value: (p) => p[0] * p[0] - p[1] * p[1],
  valueGradient(p, g) {
    g[0] = 2 * p[0];
    g[1] = -2 * p[1];
    return p[0] * p[0] - p[1] * p[1];
  },
  valueGradientHessian(p, g, h) {
    h.set([2, 0, 0, -2]);
    return this.valueGradient(p, g);
  },
};

/** A constant surface: zero gradient everywhere (isolates what penalties and decay do). */
export const flat: Surface = {
  dimension: 2,
  variables: ['x', 'y'],
  value: () => 0,
  valueGradient(_p, g) {
    g.fill(0);
    return 0;
  },
  valueGradientHessian(_p, g, h) {
    h.fill(0);
    g.fill(0);
    return 0;
  },
};

/** Wraps a surface and counts every evaluation of any kind. */
export function counting(surface: Surface): Surface & { calls: number } {
  const c = {
    dimension: surface.dimension,
    variables: surface.variables,
    calls: 0,
    value(x: ArrayLike<number>) {
      c.calls++;
      return surface.value(x);
    },
    valueGradient(x: ArrayLike<number>, g: Float64Array) {
      c.calls++;
      return surface.valueGradient(x, g);
    },
    valueGradientHessian(x: ArrayLike<number>, g: Float64Array, h: Float64Array) {
      c.calls++;
      return surface.valueGradientHessian(x, g, h);
    },
  };
  return c;
}
