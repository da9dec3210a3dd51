/**
 * The negative gradient field as a lattice of arrows of equal length.
 *
 * Arrows sit on a square lattice of frame pixels (`spacingPx` apart, centred in the frame), so their
 * density on screen does not change with zoom. Each points along the image on screen of the step
 * direction -grad f: in pixels (-g_a pxPerA, +g_b pxPerB), the + because py grows downward. With unequal
 * scales on the two axes this is not perpendicular to the drawn contours, and it should not be: it is
 * where a small gradient step really moves. Every arrow is `lengthFraction * spacingPx` long, centred
 * on its lattice point; the gradient norm is kept in `magnitude` for optional styling. Points where
 * the gradient is missing, non-finite or zero get no arrow.
 */
import type { DrawingContext } from './context';
import { validateGridBox, type GridBox } from '../../engine';
import type { ParamPoint } from './grid-space';
import type { ViewTransform } from './scales';

/** A direction or displacement in parameter space. */
export interface ParamVector {
  da: number;
  db: number;
}

/** The gradient of the surface restricted to the slice plane, (df/da, df/db); null where unknown. */
export type SliceGradient = (p: ParamPoint) => ParamVector | null;

export interface Arrow {
  tail: ParamPoint;
  head: ParamPoint;
  /** Euclidean norm of the slice gradient at the arrow's centre. */
  magnitude: number;
}

export const DEFAULT_ARROW_SPACING_PX = 36;

export function gradientArrows(
  gradient: SliceGradient,
  transform: ViewTransform,
  spacingPx = DEFAULT_ARROW_SPACING_PX,
  lengthFraction = 0.7,
): Arrow[] {
  if (!(Number.isFinite(spacingPx) && spacingPx >= 4)) throw new Error(`arrows: spacing must be at least 4 pixels, got ${spacingPx}`);
  const { width, height } = transform.size;
  const cols = Math.max(1, Math.floor(width / spacingPx));
  const rows = Math.max(1, Math.floor(height / spacingPx));
  const x0 = (width - (cols - 1) * spacingPx) / 2;
  const y0 = (height - (rows - 1) * spacingPx) / 2;
  const half = (lengthFraction * spacingPx) / 2;
  const arrows: Arrow[] = [];
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < cols; c++) {
      const px = x0 + c * spacingPx;
      const py = y0 + r * spacingPx;
      const centre = transform.toParam({ px, py });
      const g = gradient(centre);
      if (!g || !(Number.isFinite(g.da) && Number.isFinite(g.db))) continue;
      const magnitude = Math.hypot(g.da, g.db);
      const dx = -g.da * transform.pxPerA;
      const dy = g.db * transform.pxPerB;
      const len = Math.hypot(dx, dy);
      if (!(magnitude > 0 && len > 0 && Number.isFinite(len))) continue;
      const ux = (dx / len) * half;
      const uy = (dy / len) * half;
      arrows.push({ tail: transform.toParam({ px: px - ux, py: py - uy }), head: transform.toParam({ px: px + ux, py: py + uy }), magnitude });
    }
  return arrows;
}

/**
 * A slice gradient read from sampled gradient grids (ga = df/da, gb = df/db on the grid of grid-space.ts)
 * by bilinear interpolation; null outside the grid or next to a missing sample.
 */
export function sampledGradient(grid: GridBox, ga: Float64Array, gb: Float64Array): SliceGradient {
  validateGridBox(grid);
  const { nx, ny } = grid;
  if (ga.length !== nx * ny || gb.length !== nx * ny) throw new Error(`arrows: gradient grids must hold ${nx * ny} values, got ${ga.length} and ${gb.length}`);
  return (p) => {
    const fi = ((p.a - grid.a[0]) * (nx - 1)) / (grid.a[1] - grid.a[0]);
    const fj = ((p.b - grid.b[0]) * (ny - 1)) / (grid.b[1] - grid.b[0]);
    if (!(fi >= 0 && fi <= nx - 1 && fj >= 0 && fj <= ny - 1)) return null;
    const i = Math.min(nx - 2, Math.floor(fi));
    const j = Math.min(ny - 2, Math.floor(fj));
    const s = fi - i;
    const t = fj - j;
    const k = i + j * nx;
    const lerp = (g: Float64Array) =>
      (1 - t) * ((1 - s) * g[k] + s * g[k + 1]) + t * ((1 - s) * g[k + nx] + s * g[k + nx + 1]);
    const da = lerp(ga);
    const db = lerp(gb);
    return Number.isFinite(da) && Number.isFinite(db) ? { da, db } : null;
  };
}

export interface ArrowStyle {
  colour?: string;
  /** Drawn first, wider, so the arrows read on both the dark and the bright end of the map. */
  halo?: string | null;
  width?: number;
  /** Length of each side of the head in pixels. */
  headPx?: number;
}

export const ARROW_DEFAULTS = { colour: 'rgba(255,255,255,0.9)', halo: 'rgba(0,0,0,0.45)', width: 1.2, headPx: 5 } as const;

/** Pixel segments of one arrow: the shaft and the two sides of the head. */
export function arrowSegments(arrow: Arrow, transform: ViewTransform, headPx: number = ARROW_DEFAULTS.headPx): [number, number, number, number][] {
  const t = transform.toPixel(arrow.tail);
  const h = transform.toPixel(arrow.head);
  const len = Math.hypot(h.px - t.px, h.py - t.py);
  if (!(len > 0)) return [];
  const ux = (h.px - t.px) / len;
  const uy = (h.py - t.py) / len;
  const side = Math.min(headPx, len * 0.5);
  const wing = (sign: number): [number, number, number, number] => {
    const c = Math.cos((sign * 5 * Math.PI) / 6);
    const s = Math.sin((sign * 5 * Math.PI) / 6);
    return [h.px, h.py, h.px + side * (ux * c - uy * s), h.py + side * (ux * s + uy * c)];
  };
  return [[t.px, t.py, h.px, h.py], wing(1), wing(-1)];
}

export function drawArrows(ctx: DrawingContext, arrows: readonly Arrow[], transform: ViewTransform, style: ArrowStyle = {}): void {
  const width = style.width ?? ARROW_DEFAULTS.width;
  const halo = style.halo === undefined ? ARROW_DEFAULTS.halo : style.halo;
  ctx.save();
  ctx.lineCap = 'round';
  ctx.beginPath();
  for (const arrow of arrows)
    for (const [x1, y1, x2, y2] of arrowSegments(arrow, transform, style.headPx)) {
      ctx.moveTo(x1, y1);
      ctx.lineTo(x2, y2);
    }
  if (halo) {
    ctx.strokeStyle = halo;
    ctx.lineWidth = width + 1.6;
    ctx.stroke();
  }
  ctx.strokeStyle = style.colour ?? ARROW_DEFAULTS.colour;
  ctx.lineWidth = width;
  ctx.stroke();
  ctx.restore();
}

