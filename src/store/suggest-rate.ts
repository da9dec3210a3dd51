import { symmetricEigen, type OptimizerKind, type OptimizerSpec, type Surface } from '../engine';

/** Plain gradient steps (x - lr g, with or without momentum): stable on a quadratic for lr < 2 / lambda_max. */
export const GRADIENT_STEP_KINDS: readonly OptimizerKind[] = ['gd', 'momentum', 'nesterov'];
/** Per-coordinate adaptive steps: the rate is roughly a step length in parameter units. */
export const ADAPTIVE_KINDS: readonly OptimizerKind[] = ['adagrad', 'rmsprop', 'adam', 'adamw', 'amsgrad', 'nadam'];
/** The fraction of 2 / lambda_max a new plain-gradient run gets. */
export const SAFE_FRACTION = 0.5;
/** Above this many parameters the dense Hessian's eigenvalues are not computed. */
export const MAX_EIGEN_DIMENSION = 200;

export interface CurvatureAtStart {
  /** The largest eigenvalue of the exact Hessian at the point. */
  lambdaMax: number;
  /** 2 / lambda_max: plain gradient descent on the local quadratic model is stable below it (null when lambda_max <= 0). */
  stableRate: number | null;
  /** SAFE_FRACTION * stableRate, rounded down to two significant digits (null without a stable rate). */
  suggestedRate: number | null;
}

/** Curvature of the surface at x from its exact Hessian; null above MAX_EIGEN_DIMENSION or where it is not finite. */
export function curvatureAt(surface: Surface, x: readonly number[]): CurvatureAtStart | null {
  const n = surface.dimension;
  if (n > MAX_EIGEN_DIMENSION || x.length !== n || !x.every(Number.isFinite)) return null;
  const grad = new Float64Array(n);
  const hessian = new Float64Array(n * n);
  let lambdaMax: number;
  try {
    const f = surface.valueGradientHessian(x, grad, hessian);
    if (!Number.isFinite(f)) return null;
    lambdaMax = Math.max(...symmetricEigen(hessian, n).values);
  } catch {
    return null;
  }
  if (!Number.isFinite(lambdaMax)) return null;
  const stableRate = lambdaMax > 0 ? 2 / lambdaMax : null;
  return { lambdaMax, stableRate, suggestedRate: stableRate === null ? null : roundDown(SAFE_FRACTION * stableRate, 2) };
}

/** Rounds a positive number down to `digits` significant digits (so a safe rate stays safe). */
export function roundDown(v: number, digits: number): number {
  const scale = 10 ** (Math.floor(Math.log10(v)) - digits + 1);
  const r = Math.floor(v / scale + 1e-9) * scale;
  return Number(r.toPrecision(digits));
}

/** Which rate family a kind belongs to; rates carry over between kinds of one family only. */
export function rateFamily(kind: OptimizerKind): 'gradient' | 'adaptive' | 'own' {
  return GRADIENT_STEP_KINDS.includes(kind) ? 'gradient' : ADAPTIVE_KINDS.includes(kind) ? 'adaptive' : 'own';
}

/**
 * The spec after the user picks another optimizer: the new kind's defaults (from `defaults`), keeping
 * the learning rate when the two kinds' rates mean the same thing (both plain-gradient or both
 * adaptive); a plain-gradient kind arriving from elsewhere takes `suggested` when there is one.
 */
export function switchedOptimizer(previous: OptimizerSpec, kind: OptimizerKind, defaults: OptimizerSpec, suggested: number | null): OptimizerSpec {
  const from = rateFamily(previous.kind);
  const to = rateFamily(kind);
  if (to !== 'own' && from === to) return { ...defaults, learningRate: previous.learningRate };
  if (to === 'gradient' && suggested !== null) return { ...defaults, learningRate: suggested };
  return defaults;
}
