/** Hand-written value and gradient of the benchmark functions: the limit the compiled formulas are measured against. */

export const ROSENBROCK = '(1 - x)^2 + 100*(y - x^2)^2';
export function rosenbrock(x: number, y: number): number {
  const a = 1 - x;
  const b = y - x * x;
  return a * a + 100 * b * b;
}
export function rosenbrockGrad(p: ArrayLike<number>, g: Float64Array): number {
  const x = p[0];
  const y = p[1];
  const a = 1 - x;
  const b = y - x * x;
  g[0] = -2 * a - 400 * x * b;
  g[1] = 200 * b;
  return a * a + 100 * b * b;
}

export const HIMMELBLAU = '(x^2 + y - 11)^2 + (x + y^2 - 7)^2';
export function himmelblauGrad(p: ArrayLike<number>, g: Float64Array): number {
  const x = p[0];
  const y = p[1];
  const u = x * x + y - 11;
  const v = x + y * y - 7;
  g[0] = 4 * x * u + 2 * v;
  g[1] = 2 * u + 4 * y * v;
  return u * u + v * v;
}

/** A formula of 35 nodes mixing the elementary functions. */
export const MIXED = 'sin(x*y) + exp(-(x^2 + y^2)/4)*cos(3*x) + log1p(x^2*y^2) + tanh(x - y)';
export function mixed(x: number, y: number): number {
  return Math.sin(x * y) + Math.exp(-(x * x + y * y) / 4) * Math.cos(3 * x) + Math.log1p(x * x * y * y) + Math.tanh(x - y);
}
export function mixedGrad(p: ArrayLike<number>, g: Float64Array): number {
  const x = p[0];
  const y = p[1];
  const xy = x * y;
  const c = Math.cos(xy);
  const e = Math.exp(-(x * x + y * y) / 4);
  const c3 = Math.cos(3 * x);
  const q = 1 + xy * xy;
  const t = Math.tanh(x - y);
  const dt = 1 - t * t;
  g[0] = y * c - 0.5 * x * e * c3 - 3 * e * Math.sin(3 * x) + (2 * x * y * y) / q + dt;
  g[1] = x * c - 0.5 * y * e * c3 + (2 * x * x * y) / q - dt;
  return Math.sin(xy) + e * c3 + Math.log1p(xy * xy) + t;
}

/**
 * Adam (Kingma & Ba, Algorithm 1; beta1 0.9, beta2 0.999, eps 1e-8) on Rosenbrock from (-1.2, 1),
 * written out by hand: the limit for one run through any engine. The bias corrections use the
 * engine's products-only power, as the engine does. Returns the final x.
 */
export function handAdamRosenbrock(steps: number, lr: number, power: (a: number, b: number) => number): number {
  let x = -1.2, y = 1, m0 = 0, m1 = 0, v0 = 0, v1 = 0;
  for (let t = 1; t <= steps; t++) {
    const a = 1 - x;
    const b = y - x * x;
    const g0 = -2 * a - 400 * x * b;
    const g1 = 200 * b;
    m0 = 0.9 * m0 + 0.1 * g0;
    m1 = 0.9 * m1 + 0.1 * g1;
    v0 = 0.999 * v0 + 0.001 * g0 * g0;
    v1 = 0.999 * v1 + 0.001 * g1 * g1;
    const c1 = 1 - power(0.9, t);
    const c2 = 1 - power(0.999, t);
    x -= (lr * (m0 / c1)) / (Math.sqrt(v0 / c2) + 1e-8);
    y -= (lr * (m1 / c1)) / (Math.sqrt(v1 / c2) + 1e-8);
  }
  if (!Number.isFinite(x + y)) throw new Error('bench: hand-written Adam diverged');
  return x;
}
