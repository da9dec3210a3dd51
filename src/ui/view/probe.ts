import type { Surface } from '../../engine';

/** Loss and gradient norm at a point (the hover readout: one evaluation, not a grid). */
export function probe(surface: Surface, x: number[]): { loss: number; gradNorm: number; grad: Float64Array } {
  const grad = new Float64Array(surface.dimension);
  const loss = surface.valueGradient(x, grad);
  return { loss, gradNorm: Math.hypot(...grad), grad };
}
