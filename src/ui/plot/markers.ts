/**
 * Marker and glyph geometry, shared by the canvas and SVG renderers so both draw the same shapes.
 *
 * Run markers are filled shapes with a halo outline; `size` is the nominal diameter in pixels and the
 * shapes are scaled to similar visual weight (the square has the circle's area). Cross and plus are
 * filled 12-sided polygons, so every marker is "fill + outline".
 *
 * Known points (minima, saddle points, maxima of the surface) use hollow glyphs, which no run marker
 * is: minimum = ring with a centre dot, saddle point = bow tie, maximum = ring with four outward ticks.
 */
import { canvasFont, PLOT_STYLE, type DrawingContext } from './context';
import type { MarkerShape } from './run-style';
import type { ParamPoint } from './grid-space';
import type { PixelPoint, ViewTransform } from './scales';

/** Offsets from the marker centre in pixels (py down). */
export type MarkerGeometry = { kind: 'circle'; r: number } | { kind: 'polygon'; points: PixelPoint[] };

export function markerGeometry(shape: MarkerShape, size: number): MarkerGeometry {
  const d = size;
  switch (shape) {
    case 'circle':
      return { kind: 'circle', r: d / 2 };
    case 'square': {
      const h = (0.886 * d) / 2;
      return polygon([[-h, -h], [h, -h], [h, h], [-h, h]]);
    }
    case 'diamond': {
      const h = 0.65 * d;
      return polygon([[0, -h], [h, 0], [0, h], [-h, 0]]);
    }
    case 'triangle':
    case 'inverted-triangle': {
      const s = 1.2 * d;
      const height = (s * Math.sqrt(3)) / 2;
      const flip = shape === 'triangle' ? 1 : -1;
      return polygon([[0, (-2 * height * flip) / 3], [s / 2, (height * flip) / 3], [-s / 2, (height * flip) / 3]]);
    }
    case 'plus':
      return polygon(plusPoints(d, 0));
    case 'cross':
      return polygon(plusPoints(d, Math.PI / 4));
    case 'star': {
      const outer = 0.62 * d;
      const inner = 0.25 * d;
      const pts: [number, number][] = [];
      for (let k = 0; k < 10; k++) {
        const r = k % 2 === 0 ? outer : inner;
        const angle = -Math.PI / 2 + (k * Math.PI) / 5;
        pts.push([r * Math.cos(angle), r * Math.sin(angle)]);
      }
      return polygon(pts);
    }
  }
}

function plusPoints(d: number, angle: number): [number, number][] {
  const h = d / 2;
  const t = 0.17 * d;
  const base: [number, number][] = [
    [-t, -h], [t, -h], [t, -t], [h, -t], [h, t], [t, t], [t, h], [-t, h], [-t, t], [-h, t], [-h, -t], [-t, -t],
  ];
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  return base.map(([x, y]) => [x * c - y * s, x * s + y * c]);
}

function polygon(pts: [number, number][]): MarkerGeometry {
  return { kind: 'polygon', points: pts.map(([px, py]) => ({ px, py })) };
}

export interface MarkerPaint {
  fill: string;
  outline?: string;
  outlineWidth?: number;
}

/** Draws one run marker centred at `at` (frame-local pixels). */
export function drawMarker(ctx: DrawingContext, shape: MarkerShape, at: PixelPoint, size: number, paint: MarkerPaint | string): void {
  const p = typeof paint === 'string' ? { fill: paint } : paint;
  ctx.save();
  ctx.beginPath();
  traceGeometry(ctx, markerGeometry(shape, size), at);
  ctx.fillStyle = p.fill;
  ctx.fill();
  if (p.outline) {
    ctx.strokeStyle = p.outline;
    ctx.lineWidth = p.outlineWidth ?? 1.5;
    ctx.lineJoin = 'round';
    ctx.stroke();
  }
  ctx.restore();
}

function traceGeometry(ctx: DrawingContext, g: MarkerGeometry, at: PixelPoint): void {
  if (g.kind === 'circle') {
    ctx.moveTo(at.px + g.r, at.py);
    ctx.arc(at.px, at.py, g.r, 0, 2 * Math.PI);
  } else {
    g.points.forEach((q, k) => (k === 0 ? ctx.moveTo(at.px + q.px, at.py + q.py) : ctx.lineTo(at.px + q.px, at.py + q.py)));
  }
  ctx.closePath();
}

export type KnownPointKind = 'minimum' | 'saddle' | 'maximum';

/** A stationary point of the surface to mark on the plot (from the catalogue or from analysis). */
export interface KnownPoint {
  at: ParamPoint;
  kind: KnownPointKind;
  label?: string;
}

/** Stroke-only parts of a known-point glyph, offsets in pixels. */
export type GlyphPart = { kind: 'circle'; r: number; filled: boolean } | { kind: 'polyline'; points: PixelPoint[]; closed: boolean };

export function knownPointGlyph(kind: KnownPointKind, size: number): GlyphPart[] {
  const r = size / 2;
  switch (kind) {
    case 'minimum':
      return [
        { kind: 'circle', r, filled: false },
        { kind: 'circle', r: Math.max(1, size * 0.12), filled: true },
      ];
    case 'saddle':
      return [{ kind: 'polyline', closed: true, points: [{ px: -r, py: -r * 0.8 }, { px: r, py: r * 0.8 }, { px: r, py: -r * 0.8 }, { px: -r, py: r * 0.8 }] }];
    case 'maximum': {
      const ring = 0.6 * r;
      const tick = (dx: number, dy: number): GlyphPart => ({
        kind: 'polyline',
        closed: false,
        points: [{ px: dx * ring, py: dy * ring }, { px: dx * r * 1.25, py: dy * r * 1.25 }],
      });
      return [{ kind: 'circle', r: ring, filled: false }, tick(1, 0), tick(-1, 0), tick(0, 1), tick(0, -1)];
    }
  }
}

export interface KnownPointOptions {
  size?: number;
  /** Draw each point's label (if it has one) to its upper right. */
  labels?: boolean;
  colour?: string;
  halo?: string;
}

export const KNOWN_POINT_DEFAULTS = { size: 12, colour: '#000000', halo: '#ffffff' } as const;

/** Draws known stationary points: a light halo stroke then a dark stroke, so they read on any colour. */
export function drawKnownPoints(ctx: DrawingContext, points: readonly KnownPoint[], transform: ViewTransform, options: KnownPointOptions = {}): void {
  const size = options.size ?? KNOWN_POINT_DEFAULTS.size;
  const colour = options.colour ?? KNOWN_POINT_DEFAULTS.colour;
  const halo = options.halo ?? KNOWN_POINT_DEFAULTS.halo;
  ctx.save();
  ctx.lineJoin = 'round';
  ctx.lineCap = 'round';
  for (const point of points) {
    const at = transform.toPixel(point.at);
    if (!(Number.isFinite(at.px) && Number.isFinite(at.py))) continue;
    const parts = knownPointGlyph(point.kind, size);
    for (const [stroke, width] of [[halo, 3.5], [colour, 1.5]] as const) {
      ctx.strokeStyle = stroke;
      ctx.fillStyle = stroke;
      ctx.lineWidth = width;
      for (const part of parts) {
        ctx.beginPath();
        if (part.kind === 'circle') {
          ctx.moveTo(at.px + part.r, at.py);
          ctx.arc(at.px, at.py, part.r, 0, 2 * Math.PI);
          if (part.filled) ctx.fill();
        } else {
          part.points.forEach((q, k) => (k === 0 ? ctx.moveTo(at.px + q.px, at.py + q.py) : ctx.lineTo(at.px + q.px, at.py + q.py)));
          if (part.closed) ctx.closePath();
        }
        ctx.stroke();
      }
    }
    if (options.labels && point.label) {
      ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
      ctx.textAlign = 'left';
      ctx.textBaseline = 'bottom';
      ctx.lineWidth = 3;
      ctx.strokeStyle = halo;
      ctx.fillStyle = colour;
      const x = at.px + size * 0.7;
      const y = at.py - size * 0.4;
      ctx.strokeText(point.label, x, y);
      ctx.fillText(point.label, x, y);
    }
  }
  ctx.restore();
}

