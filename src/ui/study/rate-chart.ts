import { scaleLog } from 'd3';
import { OUTCOME_KINDS } from '../../engine';
import type { StudyThreshold } from '../../protocol';
import { beginChart, canvasFont, drawMarker, drawVerticalTitle, formatValue, PLOT_STYLE, strokeChartFrame, type DrawingContext, type PixelSize, type RunStyle } from '../plot';

export interface RateCurve {
  label: string;
  style: RunStyle;
  /** Final loss per learning rate (NaN where the run diverged). */
  finalLoss: Float64Array;
  /** Outcome kind index per learning rate (-1: not yet run). */
  kinds: Int8Array;
  threshold: StudyThreshold | null;
}

export const RATE_MARGIN = { left: 70, right: 16, top: 10, bottom: 46 } as const;

/**
 * Final loss against learning rate, both on log axes, one curve per optimizer in its run's colour and
 * marker; a diverged rate is drawn as a cross on the top edge (its last loss says nothing). Vertical
 * lines: the observed divergence threshold (solid, the optimizer's colour) and the predicted one from
 * the Hessian at the start (dashed, same colour), labelled in the legend.
 */
export function drawRateChart(ctx: DrawingContext, size: PixelSize, rates: Float64Array, curves: readonly RateCurve[]): void {
  const { w, h } = beginChart(ctx, size, RATE_MARGIN);
  let lo = Infinity;
  let hi = -Infinity;
  const diverged = OUTCOME_KINDS.indexOf('diverged');
  for (const c of curves) c.finalLoss.forEach((v, k) => { if (v > 0 && Number.isFinite(v) && c.kinds[k] >= 0 && c.kinds[k] !== diverged) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)]; });
  if (!Number.isFinite(lo)) [lo, hi] = [1e-3, 1];
  if (hi <= lo) hi = lo * 10;
  const x = scaleLog().domain([rates[0], rates[rates.length - 1]]).range([0, w]);
  const y = scaleLog().domain([Math.max(lo, 1e-300), hi]).range([h, 0]).nice();
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const v of decades(y.domain() as [number, number], 6)) ctx.fillText(formatValue(v), -6, y(v));
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const v of decades(x.domain() as [number, number], 8)) ctx.fillText(formatValue(v), x(v), h + 6);
  strokeChartFrame(ctx, w, h);
  ctx.fillText('learning rate', w / 2, h + 24);
  drawVerticalTitle(ctx, 'final loss', -RATE_MARGIN.left + 14, h);
  ctx.save();
  ctx.beginPath();
  ctx.rect(0, 0, w, h);
  ctx.clip();
  for (const c of curves) {
    const t = c.threshold;
    ctx.strokeStyle = c.style.colour;
    ctx.lineWidth = 2;
    if (t?.observed) line(ctx, x(Math.sqrt(t.observed.lo * t.observed.hi)), h, []);
    if (t?.predicted) line(ctx, x(t.predicted), h, [6, 4]);
    ctx.beginPath();
    let pen = false;
    c.finalLoss.forEach((v, k) => {
      if (!(v > 0 && Number.isFinite(v)) || c.kinds[k] < 0 || c.kinds[k] === diverged) return void (pen = false);
      if (pen) ctx.lineTo(x(rates[k]), y(v));
      else ctx.moveTo(x(rates[k]), y(v));
      pen = true;
    });
    ctx.lineWidth = 1.5;
    ctx.stroke();
    c.finalLoss.forEach((v, k) => {
      if (c.kinds[k] === diverged) drawMarker(ctx, 'cross', { px: x(rates[k]), py: 6 }, 8, { fill: c.style.colour, outline: c.style.halo, outlineWidth: 1 });
      else if (v > 0 && Number.isFinite(v) && c.kinds[k] >= 0) drawMarker(ctx, c.style.marker, { px: x(rates[k]), py: y(v) }, 6, { fill: c.style.colour, outline: c.style.halo, outlineWidth: 1 });
    });
  }
  ctx.restore();
  ctx.restore();
}

function line(ctx: DrawingContext, px: number, h: number, dash: number[]): void {
  ctx.setLineDash(dash);
  ctx.beginPath();
  ctx.moveTo(px, 0);
  ctx.lineTo(px, h);
  ctx.stroke();
  ctx.setLineDash([]);
}

function decades([lo, hi]: [number, number], most: number): number[] {
  const k0 = Math.ceil(Math.log10(lo) - 1e-9);
  const k1 = Math.floor(Math.log10(hi) + 1e-9);
  const step = Math.max(1, Math.ceil((k1 - k0 + 1) / most));
  const out: number[] = [];
  for (let k = k0; k <= k1; k += step) out.push(10 ** k);
  return out;
}
