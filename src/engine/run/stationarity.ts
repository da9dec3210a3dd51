/**
 * The scale-aware gradient test behind every "converged": a point is stationary when
 *
 *   ||grad f(x)|| <= tau * max(||grad f(x0)||, sqrt(eps) * max(1, |f(x)|))
 *
 * with tau = `stationarityTolerance` (default 1e-5): the gradient has fallen by the factor tau from
 * where the run started, so the test does not depend on the loss's units or the parameters' scale.
 * The second term only matters for a start whose gradient is already zero (a start exactly at a
 * stationary point), where it stands in for rounding (sqrt(eps) ~ 1.5e-8, common practice for a
 * numerically zero quantity). The test is the same whichever stop rule ended the run.
 */
export const DEFAULT_STATIONARITY_TOLERANCE = 1e-5;

const SQRT_EPS = Math.sqrt(Number.EPSILON);

export function stationarityThreshold(initialGradNorm: number, loss: number, tolerance = DEFAULT_STATIONARITY_TOLERANCE): number {
  return tolerance * Math.max(initialGradNorm, SQRT_EPS * Math.max(1, Math.abs(loss)));
}
