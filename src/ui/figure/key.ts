/**
 * The key of a figure (what each colour, line and glyph means): plain-data entries and their drawing.
 * A run entry shows the run's line and marker, a line entry a stroke (solid or dashed), a band entry a
 * translucent block, a swatch a solid block, a known-point entry the map's glyph for that kind, a
 * marker entry a marker alone, and a note entry text only (a summary figure or "and 3 more").
 */
import { canvasFont, drawMarker, knownPointGlyph, KNOWN_POINT_DEFAULTS, PLOT_STYLE, type DrawingContext, type KnownPointKind, type MarkerShape, type RunStyle } from '../plot';

export type KeyEntry =
  | { kind: 'run'; style: RunStyle; label: string }
  | { kind: 'line'; colour: string; dash?: number[]; width?: number; label: string }
  | { kind: 'band'; colour: string; label: string }
  | { kind: 'swatch'; colour: string; label: string }
  | { kind: 'known'; point: KnownPointKind; label: string }
  | { kind: 'marker'; shape: MarkerShape; colour: string; label: string }
  | { kind: 'note'; label: string };

/** Room for the glyph before each label, and the label's font. */
export const KEY_GLYPH_WIDTH = 26;
export const KEY_ROW_HEIGHT = 18;
export const KEY_FONT = canvasFont(PLOT_STYLE.tickFontSize + 1);

/** Draws entry's glyph in the KEY_GLYPH_WIDTH x KEY_ROW_HEIGHT box whose left edge is x and middle is y, then its label. */
export function drawKeyEntry(ctx: DrawingContext, entry: KeyEntry, label: string, x: number, y: number): void {
  ctx.save();
  const g0 = x + 2;
  const g1 = x + KEY_GLYPH_WIDTH - 6;
  const mid = (g0 + g1) / 2;
  switch (entry.kind) {
    case 'run':
      stroke(ctx, g0, g1, y, entry.style.colour, 2, []);
      drawMarker(ctx, entry.style.marker, { px: mid, py: y }, 8, { fill: entry.style.colour, outline: entry.style.halo, outlineWidth: 1 });
      break;
    case 'line':
      stroke(ctx, g0, g1, y, entry.colour, entry.width ?? 2, entry.dash ?? []);
      break;
    case 'band':
    case 'swatch':
      ctx.fillStyle = entry.colour;
      ctx.fillRect(g0, y - 6, g1 - g0, 12);
      ctx.strokeStyle = PLOT_STYLE.frameColour;
      ctx.lineWidth = 0.75;
      ctx.beginPath();
      ctx.rect(g0, y - 6, g1 - g0, 12);
      ctx.stroke();
      break;
    case 'known':
      knownGlyph(ctx, entry.point, mid, y);
      break;
    case 'marker':
      drawMarker(ctx, entry.shape, { px: mid, py: y }, 10, { fill: entry.colour, outline: '#000000', outlineWidth: 1 });
      break;
    case 'note':
      break;
  }
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.font = KEY_FONT;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  ctx.fillText(label, entry.kind === 'note' ? x : x + KEY_GLYPH_WIDTH, y);
  ctx.restore();
}

function stroke(ctx: DrawingContext, x0: number, x1: number, y: number, colour: string, width: number, dash: number[]): void {
  ctx.strokeStyle = colour;
  ctx.lineWidth = width;
  ctx.setLineDash(dash);
  ctx.beginPath();
  ctx.moveTo(x0, y);
  ctx.lineTo(x1, y);
  ctx.stroke();
  ctx.setLineDash([]);
}

/** The known-point glyph as the map draws it (light halo stroke, then dark stroke). */
function knownGlyph(ctx: DrawingContext, kind: KnownPointKind, cx: number, cy: number): void {
  for (const [colour, width] of [[KNOWN_POINT_DEFAULTS.halo, 3.5], [KNOWN_POINT_DEFAULTS.colour, 1.5]] as const) {
    ctx.strokeStyle = colour;
    ctx.fillStyle = colour;
    ctx.lineWidth = width;
    for (const part of knownPointGlyph(kind, 11)) {
      ctx.beginPath();
      if (part.kind === 'circle') {
        ctx.moveTo(cx + part.r, cy);
        ctx.arc(cx, cy, part.r, 0, 2 * Math.PI);
        if (part.filled) ctx.fill();
      } else {
        part.points.forEach((q, k) => (k === 0 ? ctx.moveTo(cx + q.px, cy + q.py) : ctx.lineTo(cx + q.px, cy + q.py)));
        if (part.closed) ctx.closePath();
      }
      ctx.stroke();
    }
  }
}
