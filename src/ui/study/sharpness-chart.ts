import { scaleLinear, scaleLog } from 'd3';
import { CHART_MARGIN } from '../chart/loss-chart';
import { beginChart, canvasFont, drawVerticalTitle, formatValue, niceTicks, PLOT_STYLE, strokeChartFrame, type DrawingContext, type PixelSize } from '../plot';

/**
 * Sharpness along a run: the largest Hessian eigenvalue at sampled steps (solid, with dots), and
 * 2 / lr_t, the sharpness above which a gradient step of that size is unstable on the local quadratic
 * (dashed; Cohen et al., ICLR 2021, "Gradient descent on neural networks typically occurs at the edge
 * of stability"). Log vertical axis when every value is positive, linear otherwise.
 */
/** Colours of the sharpness curve and of the 2 / lr line (the figure's key uses the same). */
export const SHARPNESS_STYLE = { sharpness: '#0072b2', limit: '#d55e00' } as const;

export function drawSharpnessChart(ctx: DrawingContext, size: PixelSize, steps: ArrayLike<number>, sharpness: ArrayLike<number>, limit: { steps: ArrayLike<number>; values: ArrayLike<number> } | null): void {
  const { w, h } = beginChart(ctx, size, CHART_MARGIN);
  const all = [...Array.from(sharpness), ...(limit ? Array.from(limit.values) : [])].filter(Number.isFinite);
  const positive = all.length > 0 && all.every((v) => v > 0);
  let lo = Math.min(...all);
  let hi = Math.max(...all);
  if (!all.length) [lo, hi] = [0, 1];
  if (hi <= lo) [lo, hi] = positive ? [lo / 2, hi * 2] : [lo - 1, hi + 1];
  const maxStep = Math.max(1, ...Array.from(steps));
  const x = scaleLinear().domain([0, maxStep]).range([0, w]);
  const y = (positive ? scaleLog() : scaleLinear()).domain([lo, hi]).range([h, 0]).nice();
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const v of y.ticks(5)) ctx.fillText(formatValue(v), -6, y(v));
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const t of niceTicks([0, maxStep], Math.max(2, w / 90))) if (Number.isInteger(t.value)) ctx.fillText(t.label, x(t.value), h + 6);
  strokeChartFrame(ctx, w, h);
  ctx.fillText('step', w / 2, h + 22);
  drawVerticalTitle(ctx, 'largest Hessian eigenvalue', -CHART_MARGIN.left + 14, h);
  ctx.beginPath();
  ctx.rect(0, 0, w, h);
  ctx.clip();
  if (limit) {
    ctx.setLineDash([6, 4]);
    ctx.beginPath();
    for (let k = 0; k < limit.steps.length; k++) if (Number.isFinite(limit.values[k])) ctx.lineTo(x(limit.steps[k]), y(limit.values[k]));
    ctx.strokeStyle = SHARPNESS_STYLE.limit;
    ctx.lineWidth = 1.5;
    ctx.stroke();
    ctx.setLineDash([]);
  }
  ctx.beginPath();
  for (let k = 0; k < steps.length; k++) if (Number.isFinite(sharpness[k])) ctx.lineTo(x(steps[k]), y(sharpness[k]));
  ctx.strokeStyle = SHARPNESS_STYLE.sharpness;
  ctx.lineWidth = 2;
  ctx.stroke();
  ctx.fillStyle = SHARPNESS_STYLE.sharpness;
  for (let k = 0; k < steps.length; k++) if (Number.isFinite(sharpness[k])) ctx.fillRect(x(steps[k]) - 1.5, y(sharpness[k]) - 1.5, 3, 3);
  ctx.restore();
}
