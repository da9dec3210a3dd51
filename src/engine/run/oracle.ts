import type { RowwiseSurface, Surface } from '../surface';
import type { Oracle } from '../optim/types';
import { nextGaussian, type RngState } from '../rng';

/**
 * The surface as the optimizer and the end judgement see it: with a run's gradient noise, on a
 * minibatch, or counting evaluations. Shared by the run loop (cursor.ts) and the sweep engine
 * (../sweep), so both draw the same noise in the same order from the same seed.
 */

/** Adds i.i.d. N(0, std^2) noise to every entry of g, drawing from `rng` in index order. */
export function addNoise(g: Float64Array, std: number, rng: RngState): void {
  addNoiseAt(g, 0, g.length, std, rng);
}

/** addNoise on the n entries g[at..at+n) (a vector inside flat storage), in the same order. */
export function addNoiseAt(g: Float64Array, at: number, n: number, std: number, rng: RngState): void {
  for (let i = at; i < at + n; i++) g[i] += std * nextGaussian(rng);
}

/** The surface with every evaluation added to the run's count (explanations of undefined points pass through uncounted). */
export function countingSurface(surface: Surface, counter: { evaluations: number }): Surface {
  const counted: Surface = {
    dimension: surface.dimension,
    variables: surface.variables,
    value: (x) => (counter.evaluations++, surface.value(x)),
    valueGradient: (x, g) => (counter.evaluations++, surface.valueGradient(x, g)),
    valueGradientHessian: (x, g, h) => (counter.evaluations++, surface.valueGradientHessian(x, g, h)),
  };
  if (surface.explainUndefined) counted.explainUndefined = surface.explainUndefined.bind(surface);
  const withProducts = surface as Surface & { hessianVector?: (x: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array) => void };
  if (withProducts.hessianVector) {
    const hv = withProducts.hessianVector.bind(surface);
    (counted as typeof withProducts).hessianVector = (x, v, out) => (counter.evaluations++, hv(x, v, out));
  }
  return counted;
}

export interface RowBatch {
  indices: Int32Array;
  count: number;
}

/** The surface as optimizers see it: with the run's gradient noise (drawn from `state.rng`). */
export function noisyOracle(surface: Surface, std: number, state: { rng: RngState }): Oracle {
  return {
    dimension: surface.dimension,
    value(x) {
      return surface.value(x);
    },
    valueGradient(x, grad) {
      const f = surface.valueGradient(x, grad);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
    valueGradientHessian(x, grad, hessian) {
      const f = surface.valueGradientHessian(x, grad, hessian);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
  };
}

/**
 * The surface as optimizers see it on a minibatch run: the current batch's loss (line searches and
 * Newton steps work on the same batch the step's gradient came from), with the run's gradient noise.
 */
export function batchOracle(surface: RowwiseSurface, batch: RowBatch, std: number, state: { rng: RngState }): Oracle {
  const scratch = new Float64Array(surface.dimension);
  return {
    dimension: surface.dimension,
    value(x) {
      return surface.valueGradientOnRows(x, scratch, batch.indices, batch.count);
    },
    valueGradient(x, grad) {
      const f = surface.valueGradientOnRows(x, grad, batch.indices, batch.count);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
    valueGradientHessian(x, grad, hessian) {
      const f = surface.valueGradientHessianOnRows(x, grad, hessian, batch.indices, batch.count);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
  };
}
