import { scaleLinear, scaleLog } from 'd3';
import { axisValue, CHART_MARGIN, type LossAxis } from '../chart/loss-chart';
import { beginChart, canvasFont, drawVerticalTitle, formatValue, niceTicks, PLOT_STYLE, strokeChartFrame, type DrawingContext, type PixelSize } from '../plot';

/**
 * The loss across the starts of a multi-start study, step by step: the band between the 25% and 75%
 * quantiles filled, the median drawn as a line (bands from engine/study/quantiles.ts). Log axis of
 * the loss, or of the gap above the known minimum when there is one, as on the loss chart.
 */
/** The band's fill and the median's colour (the figure's key uses the same). */
export const BAND_CHART_STYLE = { fill: 'rgba(0, 114, 178, 0.25)', median: '#0072b2' } as const;

export function drawBandChart(ctx: DrawingContext, size: PixelSize, bands: readonly Float64Array[], axis: LossAxis): void {
  const [q1, median, q3] = bands;
  const { w, h } = beginChart(ctx, size, CHART_MARGIN);
  const steps = median.length;
  let lo = Infinity;
  let hi = -Infinity;
  for (const band of bands)
    for (let t = 0; t < steps; t++) {
      const v = axisValue(axis, band[t]);
      if (Number.isFinite(v) && v > 0) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)];
    }
  if (!Number.isFinite(lo)) [lo, hi] = [1e-3, 1];
  if (hi <= lo) hi = lo * 10;
  const x = scaleLinear().domain([0, Math.max(1, steps - 1)]).range([0, w]);
  const y = scaleLog().domain([lo, hi]).range([h, 0]).nice();
  const py = (v: number) => {
    const a = axisValue(axis, v);
    return Number.isFinite(a) && a > 0 ? Math.max(-1e4, Math.min(1e4, y(a))) : Number.isNaN(a) ? Number.NaN : a > 0 ? -1e4 : h;
  };
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const v of y.ticks(4)) if (Math.abs(Math.log10(v) - Math.round(Math.log10(v))) < 1e-9) ctx.fillText(formatValue(v), -6, y(v));
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const t of niceTicks([0, steps - 1], Math.max(2, w / 90))) if (Number.isInteger(t.value)) ctx.fillText(t.label, x(t.value), h + 6);
  strokeChartFrame(ctx, w, h);
  ctx.fillText('step', w / 2, h + 22);
  drawVerticalTitle(ctx, axis.kind === 'gap' ? 'loss − minimum' : 'loss', -CHART_MARGIN.left + 14, h);
  ctx.beginPath();
  ctx.rect(0, 0, w, h);
  ctx.clip();
  const stride = Math.max(1, Math.floor(steps / (2 * w)));
  ctx.beginPath();
  for (let t = 0; t < steps; t += stride) ctx.lineTo(x(t), py(q3[t]));
  for (let t = (Math.ceil(steps / stride) - 1) * stride; t >= 0; t -= stride) ctx.lineTo(x(t), py(q1[t]));
  ctx.closePath();
  ctx.fillStyle = BAND_CHART_STYLE.fill;
  ctx.fill();
  ctx.beginPath();
  for (let t = 0; t < steps; t += stride) ctx.lineTo(x(t), py(median[t]));
  ctx.strokeStyle = BAND_CHART_STYLE.median;
  ctx.lineWidth = 2;
  ctx.stroke();
  ctx.restore();
}
