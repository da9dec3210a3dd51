/**
 * The frame shared by the small value charts (loss against step, the loss profile along a segment,
 * the data view): a white canvas, a plotting area inset by the chart's margins, a 1 px frame around it
 * and a vertical axis title turned a quarter turn. Coordinates inside the area run from (0, 0) at its
 * top-left to (w, h).
 */
import { PLOT_STYLE, type DrawingContext } from './context';
import type { PixelSize } from './scales';

/** Space around the plotting area for tick labels and titles, in CSS pixels. */
export interface ChartMargin {
  readonly left: number;
  readonly right: number;
  readonly top: number;
  readonly bottom: number;
}

/**
 * Saves the context, paints the whole canvas white and moves the origin to the plotting area's
 * top-left corner. Returns the area's width and height; the caller ends with one `ctx.restore()`.
 */
export function beginChart(ctx: DrawingContext, size: PixelSize, margin: ChartMargin): { w: number; h: number } {
  const w = size.width - margin.left - margin.right;
  const h = size.height - margin.top - margin.bottom;
  ctx.save();
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, size.width, size.height);
  ctx.translate(margin.left, margin.top);
  return { w, h };
}

/** Strokes the frame around the w x h plotting area (1 px, PLOT_STYLE.frameColour). */
export function strokeChartFrame(ctx: DrawingContext, w: number, h: number): void {
  ctx.strokeStyle = PLOT_STYLE.frameColour;
  ctx.lineWidth = 1;
  ctx.beginPath();
  ctx.rect(0, 0, w, h);
  ctx.stroke();
}

/**
 * The vertical axis title, turned a quarter turn anticlockwise and centred on the area's height, its
 * middle `x` pixels from the area's left edge (negative: in the left margin). Uses the current fill
 * colour, font and alignment; leaves the context as it found it.
 */
export function drawVerticalTitle(ctx: DrawingContext, text: string, x: number, h: number): void {
  ctx.save();
  ctx.translate(x, h / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.textBaseline = 'middle';
  ctx.fillText(text, 0, 0);
  ctx.restore();
}

/** The least and greatest finite values ([Infinity, -Infinity] when there are none). */
export function finiteExtent(values: ArrayLike<number>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let k = 0; k < values.length; k++) {
    const v = values[k];
    if (Number.isFinite(v)) {
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  return [lo, hi];
}
