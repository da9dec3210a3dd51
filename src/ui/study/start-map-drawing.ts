/**
 * Drawing a start-point map on any drawing context (the panel's canvas, a figure's PNG or SVG): the
 * cells of paintStartMap as rectangles (one per run of equal colour along a row, so a 256 x 256 map
 * of a few basins stays a few thousand rectangles), and the known minima as the map's glyph.
 */
import type { KnownPoint as BasinPoint } from '../../engine';
import { drawKnownPoints, viewTransform, type DrawingContext, type PixelSize } from '../plot';
import type { ViewBox } from '../../engine';

/** Paints `rgba` (resolution x resolution, row 0 at the top) over a `size` box at the origin; clear pixels stay unpainted. */
export function drawMapCells(ctx: DrawingContext, rgba: Uint8ClampedArray, resolution: number, size: PixelSize): void {
  const cw = size.width / resolution;
  const ch = size.height / resolution;
  ctx.save();
  for (let row = 0; row < resolution; row++) {
    let i = 0;
    while (i < resolution) {
      const p = (row * resolution + i) * 4;
      let end = i + 1;
      while (end < resolution && sameColour(rgba, p, (row * resolution + end) * 4)) end++;
      if (rgba[p + 3] > 0) {
        ctx.fillStyle = `rgb(${rgba[p]}, ${rgba[p + 1]}, ${rgba[p + 2]})`;
        // A hair wider than the cell so neighbouring rectangles leave no antialiased seam.
        ctx.fillRect(i * cw, row * ch, (end - i) * cw + 0.5, ch + 0.5);
      }
      i = end;
    }
  }
  ctx.restore();
}

function sameColour(rgba: Uint8ClampedArray, p: number, q: number): boolean {
  return rgba[p] === rgba[q] && rgba[p + 1] === rgba[q + 1] && rgba[p + 2] === rgba[q + 2] && rgba[p + 3] === rgba[q + 3];
}

/** The known minima that lie in the map's box, as minimum glyphs at their places in the map's plane. */
export function drawMapMinima(ctx: DrawingContext, known: readonly BasinPoint[], box: ViewBox, axes: readonly [number, number], size: PixelSize): void {
  const points = known.map((k) => ({ at: { a: k.point[axes[0]], b: k.point[axes[1]] }, kind: 'minimum' as const }))
    .filter((p) => p.at.a >= box.a[0] && p.at.a <= box.a[1] && p.at.b >= box.b[0] && p.at.b <= box.b[1]);
  drawKnownPoints(ctx, points, viewTransform(box, size));
}
