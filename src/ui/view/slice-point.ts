import { axisPlane, planePoint, type Surface } from '../../engine';
import type { SliceSettings } from '../../store/workspace';

/** Full coordinates of the slice point (a, b): the two drawn axes set, the others at their held values. */
export function fullPoint(slice: SliceSettings, dimension: number, a: number, b: number): number[] {
  if (dimension === 2 && slice.axes[0] === 0 && slice.axes[1] === 1) return [a, b];
  const at = Array.from({ length: dimension }, (_, k) => slice.at[k] ?? 0);
  return Array.from(planePoint(axisPlane(at, slice.axes[0], slice.axes[1]), a, b, new Float64Array(dimension)));
}

/** Loss and gradient norm at a point (the hover readout: one evaluation, not a grid). */
export function probe(surface: Surface, x: number[]): { loss: number; gradNorm: number; grad: Float64Array } {
  const grad = new Float64Array(surface.dimension);
  const loss = surface.valueGradient(x, grad);
  return { loss, gradNorm: Math.hypot(...grad), grad };
}
