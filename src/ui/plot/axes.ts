/**
 * Axes: nice tick values with readable labels, laid out in frame-local pixels, and a canvas renderer.
 * The layout (`axesModel`) is plain data so the SVG export and any overlay draw the same ticks.
 *
 * Placement: the a axis runs along the bottom edge, ticks pointing down into the margin, labels below
 * them, the title centred under the labels; the b axis runs along the left edge, ticks pointing left,
 * labels right-aligned, the title rotated a quarter turn. Draw with the context translated by the
 * margins (AXES_MARGIN is a size that fits the labels).
 */
import { tickFormat, ticks } from 'd3';
import { asciiMinus } from './legend';
import { canvasFont, PLOT_STYLE, type DrawingContext } from './context';
import type { ViewTransform } from './scales';

export interface Tick {
  value: number;
  label: string;
}

export interface AxisTickA extends Tick {
  px: number;
}

export interface AxisTickB extends Tick {
  py: number;
}

export interface AxisLabels {
  /** Title of the horizontal axis (the variable along a). */
  a: string;
  /** Title of the vertical axis (the variable along b). */
  b: string;
}

export interface AxesModel {
  width: number;
  height: number;
  aTicks: AxisTickA[];
  bTicks: AxisTickB[];
  labels: AxisLabels;
}

/** Margins around the plot frame that hold the axes (pixels). */
export const AXES_MARGIN = { left: 64, right: 16, top: 12, bottom: 46 } as const;

/** About one tick per 80 px along a and per 50 px along b. */
export const TICK_SPACING_PX = { a: 80, b: 50 } as const;

/**
 * d3 `ticks` (1, 2 or 5 times a power of ten) over the range with labels from d3 `tickFormat`, whose
 * precision follows the tick step (so 0.1 steps read 0.1, 0.2 ... not 0.10000000000000001).
 */
export function niceTicks(range: readonly [number, number], approxCount: number): Tick[] {
  const [lo, hi] = range[0] <= range[1] ? range : [range[1], range[0]];
  if (!(Number.isFinite(lo) && Number.isFinite(hi))) return [];
  const count = Math.max(1, Math.round(approxCount));
  const label = tickFormat(lo, hi, count);
  return ticks(lo, hi, count).map((value) => ({ value, label: asciiMinus(label(value)) }));
}

export function axesModel(transform: ViewTransform, labels: AxisLabels): AxesModel {
  const { width, height } = transform.size;
  const aTicks = niceTicks(transform.view.a, width / TICK_SPACING_PX.a).map((t) => ({ ...t, px: transform.pxOfA(t.value) }));
  const bTicks = niceTicks(transform.view.b, height / TICK_SPACING_PX.b).map((t) => ({ ...t, py: transform.pyOfB(t.value) }));
  return { width, height, aTicks, bTicks, labels };
}

/** Where the axis titles go, relative to the frame (shared with the SVG export). */
export function axisTitlePositions(model: AxesModel): { a: { px: number; py: number }; b: { px: number; py: number } } {
  return {
    a: { px: model.width / 2, py: model.height + PLOT_STYLE.tickLength + PLOT_STYLE.tickFontSize + 22 },
    b: { px: -(AXES_MARGIN.left - 2), py: model.height / 2 },
  };
}

export function drawAxes(ctx: DrawingContext, transform: ViewTransform, labels: AxisLabels): AxesModel {
  const model = axesModel(transform, labels);
  const { width, height } = model;
  const tl = PLOT_STYLE.tickLength;
  ctx.save();
  ctx.strokeStyle = PLOT_STYLE.frameColour;
  ctx.lineWidth = 1;
  ctx.beginPath();
  ctx.rect(0, 0, width, height);
  for (const t of model.aTicks) {
    ctx.moveTo(t.px, height);
    ctx.lineTo(t.px, height + tl);
  }
  for (const t of model.bTicks) {
    ctx.moveTo(0, t.py);
    ctx.lineTo(-tl, t.py);
  }
  ctx.stroke();
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const t of model.aTicks) ctx.fillText(t.label, t.px, height + tl + 2);
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const t of model.bTicks) ctx.fillText(t.label, -tl - 3, t.py);
  const titles = axisTitlePositions(model);
  ctx.font = canvasFont(PLOT_STYLE.titleFontSize);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'bottom';
  ctx.fillText(labels.a, titles.a.px, titles.a.py);
  ctx.translate(titles.b.px, titles.b.py);
  ctx.rotate(-Math.PI / 2);
  ctx.textBaseline = 'top';
  ctx.fillText(labels.b, 0, 0);
  ctx.restore();
  return model;
}
