/**
 * The gradient arrows of a map: the surface's gradient restricted to the slice plane, (u . grad,
 * v . grad), sampled on the frame (plot/arrows.ts). Shared by the on-screen view and its figure export.
 */
import type { Surface } from '../../engine';
import { slicePlane, slicePoint } from '../../store/slice-plane';
import type { SliceSettings } from '../../store/workspace';
import { gradientArrows, type Arrow, type ViewTransform } from '../plot';

/** Spacing of the arrows in pixels, on the single map and on a panel of the grid. */
export const ARROW_SPACING = 36;
export const COMPACT_ARROW_SPACING = 28;

export function planeArrows(surface: Surface, slice: SliceSettings, transform: ViewTransform, spacingPx: number): Arrow[] {
  const n = surface.dimension;
  const plane = slicePlane(slice, n);
  const g = new Float64Array(n);
  return gradientArrows((p) => {
    surface.valueGradient(slicePoint(slice, n, p.a, p.b), g);
    return gradientInPlane(plane, g);
  }, transform, spacingPx);
}

/** A gradient restricted to the slice plane: (u . g, v . g). */
export function gradientInPlane(plane: { u: ArrayLike<number>; v: ArrayLike<number> }, g: ArrayLike<number>): { da: number; db: number } {
  let da = 0;
  let db = 0;
  for (let k = 0; k < g.length; k++) {
    da += plane.u[k] * g[k];
    db += plane.v[k] * g[k];
  }
  return { da, db };
}
