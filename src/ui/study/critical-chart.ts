/**
 * The critical points found in the view's box, each a marker by its class (minimum, saddle, maximum,
 * degenerate or not classified), drawn on any drawing context; shared by the panel and its figure.
 */
import type { CriticalPoint } from '../../engine';
import { drawMarker, viewTransform, type DrawingContext, type MarkerShape, type PixelSize } from '../plot';
import type { ViewBox } from '../../engine';

export const CRITICAL_GLYPHS: Record<'minimum' | 'saddle' | 'maximum' | 'degenerate', { shape: MarkerShape; colour: string; key: string }> = {
  minimum: { shape: 'circle', colour: '#009e73', key: 'minimum' },
  saddle: { shape: 'cross', colour: '#d55e00', key: 'saddle' },
  maximum: { shape: 'triangle', colour: '#cc79a7', key: 'maximum' },
  degenerate: { shape: 'diamond', colour: '#7f7f7f', key: 'degenerate' },
};

export function glyphOf(p: CriticalPoint) {
  return CRITICAL_GLYPHS[p.classification?.kind ?? 'degenerate'];
}

/** Markers at the points inside `box`, in a `size` box at the origin (second axis up). */
export function drawCriticalPoints(ctx: DrawingContext, points: readonly CriticalPoint[], box: ViewBox, axes: readonly [number, number], size: PixelSize): void {
  const t = viewTransform(box, size);
  for (const p of points) {
    const px = t.pxOfA(p.point[axes[0]]);
    const py = t.pyOfB(p.point[axes[1]]);
    const g = glyphOf(p);
    if (px >= 0 && px <= size.width && py >= 0 && py <= size.height) drawMarker(ctx, g.shape, { px, py }, 11, { fill: g.colour, outline: '#000', outlineWidth: 1 });
  }
}
