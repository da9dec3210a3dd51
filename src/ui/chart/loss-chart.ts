import { scaleLinear, scaleLog } from 'd3';
import { beginChart, canvasFont, drawMarker, drawVerticalTitle, formatValue, niceTicks, PLOT_STYLE, strokeChartFrame, type DrawingContext, type PixelSize, type RunStyle } from '../plot';

export interface LossSeries {
  loss: Float64Array;
  count: number;
  style: RunStyle;
  label: string;
}

/**
 * What the vertical axis shows. With a known minimum value f*, the gap loss - f* on a log axis (how far
 * from the minimum, which is what "converged" means); without one, the loss itself on a log axis when it
 * stays positive, and on a linear axis otherwise.
 */
export type LossAxis = { kind: 'gap'; minimum: number } | { kind: 'log' } | { kind: 'linear' };

/** Gaps below this are drawn at it: float64 cannot resolve a loss closer to its minimum in most surfaces. */
export const GAP_FLOOR = 1e-16;

export function chooseLossAxis(series: readonly LossSeries[], knownMinimum: number | null): LossAxis {
  if (knownMinimum !== null) return { kind: 'gap', minimum: knownMinimum };
  for (const s of series) for (let k = 0; k < s.count; k++) if (!(s.loss[k] > 0) && Number.isFinite(s.loss[k])) return { kind: 'linear' };
  return { kind: 'log' };
}

export function axisValue(axis: LossAxis, loss: number): number {
  if (axis.kind === 'gap') return Math.max(loss - axis.minimum, GAP_FLOOR);
  return loss;
}

export const CHART_MARGIN = { left: 70, right: 24, top: 10, bottom: 40 } as const;

/** Draws every run's loss against step. */
export function drawLossChart(ctx: DrawingContext, size: PixelSize, series: readonly LossSeries[], axis: LossAxis): void {
  const { w, h } = beginChart(ctx, size, CHART_MARGIN);
  let maxStep = 1;
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of series) {
    maxStep = Math.max(maxStep, s.count - 1);
    for (let k = 0; k < s.count; k++) {
      const v = axisValue(axis, s.loss[k]);
      if (!Number.isFinite(v) || (axis.kind !== 'linear' && v <= 0)) continue;
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  if (!Number.isFinite(lo)) [lo, hi] = axis.kind === 'linear' ? [0, 1] : [1e-3, 1];
  if (hi <= lo) hi = axis.kind === 'linear' ? lo + 1 : lo * 10;
  const x = scaleLinear().domain([0, maxStep]).range([0, w]);
  const y = axis.kind === 'linear' ? scaleLinear().domain([lo, hi]).range([h, 0]).nice() : scaleLog().domain([lo, hi]).range([h, 0]).nice();

  // Axes and grid lines.
  ctx.strokeStyle = '#e3e3e3';
  ctx.lineWidth = 1;
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.fillStyle = PLOT_STYLE.textColour;
  const yTicks = axis.kind === 'linear' ? y.ticks(5) : logDecades(y.domain() as [number, number]);
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const v of yTicks) {
    const py = y(v);
    ctx.beginPath();
    ctx.moveTo(0, py);
    ctx.lineTo(w, py);
    ctx.stroke();
    ctx.fillText(formatValue(v), -6, py);
  }
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const t of niceTicks([0, maxStep], Math.max(2, w / 90))) {
    if (!Number.isInteger(t.value)) continue;
    const px = x(t.value);
    ctx.beginPath();
    ctx.moveTo(px, 0);
    ctx.lineTo(px, h);
    ctx.stroke();
    ctx.fillText(t.label, px, h + 6);
  }
  strokeChartFrame(ctx, w, h);
  ctx.fillText('step', w / 2, h + 22);
  drawVerticalTitle(ctx, axis.kind === 'gap' ? 'loss − minimum' : 'loss', -CHART_MARGIN.left + 14, h);

  // Series, clipped to the frame.
  ctx.beginPath();
  ctx.rect(0, 0, w, h);
  ctx.clip();
  for (const s of series) {
    const stride = Math.max(1, Math.floor(s.count / (2 * w)));
    ctx.beginPath();
    let pen = false;
    for (let k = 0; k < s.count; k += k + stride < s.count ? stride : Math.max(1, s.count - 1 - k)) {
      const v = axisValue(axis, s.loss[k]);
      if (!Number.isFinite(v) || (axis.kind !== 'linear' && v <= 0)) {
        pen = false;
        continue;
      }
      const px = x(k);
      const py = Math.max(-1e4, Math.min(1e4, y(v)));
      if (pen) ctx.lineTo(px, py);
      else ctx.moveTo(px, py);
      pen = true;
      if (k === s.count - 1) break;
    }
    ctx.strokeStyle = s.style.colour;
    ctx.lineWidth = 1.75;
    ctx.stroke();
    // A few markers along each curve so runs differ by shape as well as colour.
    const every = Math.max(1, Math.ceil(s.count / 8));
    for (let k = 0; k < s.count; k += every) {
      const v = axisValue(axis, s.loss[k]);
      if (Number.isFinite(v) && (axis.kind === 'linear' || v > 0)) drawMarker(ctx, s.style.marker, { px: x(k), py: y(v) }, 7, { fill: s.style.colour, outline: s.style.halo, outlineWidth: 1 });
    }
  }
  ctx.restore();
}

function logDecades([lo, hi]: [number, number]): number[] {
  const out: number[] = [];
  const k0 = Math.ceil(Math.log10(lo));
  const k1 = Math.floor(Math.log10(hi));
  const stepK = Math.max(1, Math.ceil((k1 - k0 + 1) / 7));
  for (let k = k0; k <= k1; k += stepK) out.push(10 ** k);
  return out.length ? out : [lo, hi];
}
