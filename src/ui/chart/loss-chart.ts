/**
 * The loss chart: every visible run's loss against step (log axis of the gap above the known minimum
 * when there is one), over the median and quartile band of a multi-start study when one has results.
 */
import { scaleLinear, scaleLog } from 'd3';
import type { LiveRuns } from '../../store/live-runs';
import { lossExtremes, type LossExtremes } from './loss-range';
import { beginChart, canvasFont, drawMarker, drawVerticalTitle, formatValue, niceTicks, PLOT_STYLE, runStyle, strokeChartFrame, type DrawingContext, type PixelSize, type RunStyle } from '../plot';

export interface LossSeries {
  loss: Float64Array;
  count: number;
  /** Step number of each row, where rows skip steps (a thinned page buffer); absent, row k is step k. */
  steps?: Float64Array;
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
  for (const s of series) if (lossExtremes(s.loss, s.count).nonPositive) return { kind: 'linear' };
  return { kind: 'log' };
}

export function axisValue(axis: LossAxis, loss: number): number {
  if (axis.kind === 'gap') return Math.max(loss - axis.minimum, GAP_FLOOR);
  return loss;
}

/**
 * The smallest and largest axis value (axisValue) over the rows the extremes summarise, skipping what
 * the axis cannot show (non-finite values; values <= 0 on a log axis); [Infinity, -Infinity] if none.
 * axisValue is non-decreasing in the loss, so the extremes of the loss give those of the axis value.
 */
export function axisRange(axis: LossAxis, e: LossExtremes): [number, number] {
  if (axis.kind === 'gap')
    return e.minBelowInf <= e.maxBelowInf ? [axisValue(axis, e.minBelowInf), axisValue(axis, e.maxBelowInf)].map((v) => (Number.isFinite(v) ? v : GAP_FLOOR)) as [number, number] : [Infinity, -Infinity];
  if (axis.kind === 'log') return [e.minPositive, e.maxPositive];
  return [e.minFinite, e.maxFinite];
}

export const CHART_MARGIN = { left: 70, right: 24, top: 10, bottom: 40 } as const;

/**
 * The multi-start band drawn under the runs: the 25%, 50% and 75% quantiles of the loss across the
 * starts per step (engine/study/quantiles.ts), filled between the quartiles with the median as a line.
 */
export interface LossBand {
  quantiles: readonly Float64Array[];
}

export const BAND_STYLE = { fill: 'rgba(0, 114, 178, 0.22)', median: '#0072b2', medianDash: [5, 3] } as const;

/** Draws every run's loss against step, over the multi-start band when one is given. */
export function drawLossChart(ctx: DrawingContext, size: PixelSize, series: readonly LossSeries[], axis: LossAxis, band: LossBand | null = null): void {
  const { w, h } = beginChart(ctx, size, CHART_MARGIN);
  let maxStep = 1;
  let lo = Infinity;
  let hi = -Infinity;
  const include = (loss: ArrayLike<number>, count: number) => {
    maxStep = Math.max(maxStep, count - 1);
    const [a, b] = axisRange(axis, lossExtremes(loss, count));
    lo = Math.min(lo, a);
    hi = Math.max(hi, b);
  };
  for (const s of series) {
    include(s.loss, s.count);
    if (s.steps && s.count) maxStep = Math.max(maxStep, s.steps[s.count - 1]);
  }
  for (const q of band?.quantiles ?? []) include(q, q.length);
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
  if (band) drawBand(ctx, band, axis, x, y, w);
  for (const s of series) {
    const stepAt = (k: number) => (s.steps ? s.steps[k] : k);
    const stride = Math.max(1, Math.floor(s.count / (2 * w)));
    ctx.beginPath();
    let pen = false;
    for (let k = 0; k < s.count; k += k + stride < s.count ? stride : Math.max(1, s.count - 1 - k)) {
      const v = axisValue(axis, s.loss[k]);
      if (!Number.isFinite(v) || (axis.kind !== 'linear' && v <= 0)) {
        pen = false;
        continue;
      }
      const px = x(stepAt(k));
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
      if (Number.isFinite(v) && (axis.kind === 'linear' || v > 0)) drawMarker(ctx, s.style.marker, { px: x(stepAt(k)), py: y(v) }, 7, { fill: s.style.colour, outline: s.style.halo, outlineWidth: 1 });
    }
  }
  ctx.restore();
}

/** The band between the quartiles, filled, and the median as a dashed line (so it is not taken for a run). */
function drawBand(ctx: DrawingContext, band: LossBand, axis: LossAxis, x: (v: number) => number, y: (v: number) => number, w: number): void {
  const [q1, median, q3] = band.quantiles;
  const steps = median.length;
  if (!steps) return;
  const at = (v: number) => {
    const a = axisValue(axis, v);
    return Number.isFinite(a) && (axis.kind === 'linear' || a > 0) ? Math.max(-1e4, Math.min(1e4, y(a))) : Number.NaN;
  };
  const stride = Math.max(1, Math.floor(steps / (2 * w)));
  const last = steps - 1;
  const indices: number[] = [];
  for (let t = 0; t < last; t += stride) indices.push(t);
  indices.push(last);
  ctx.save();
  ctx.beginPath();
  for (const t of indices) if (Number.isFinite(at(q3[t]))) ctx.lineTo(x(t), at(q3[t]));
  for (const t of [...indices].reverse()) if (Number.isFinite(at(q1[t]))) ctx.lineTo(x(t), at(q1[t]));
  ctx.closePath();
  ctx.fillStyle = BAND_STYLE.fill;
  ctx.fill();
  ctx.beginPath();
  let pen = false;
  for (const t of indices) {
    const py = at(median[t]);
    if (!Number.isFinite(py)) pen = false;
    else if (pen) ctx.lineTo(x(t), py);
    else {
      ctx.moveTo(x(t), py);
      pen = true;
    }
  }
  ctx.strokeStyle = BAND_STYLE.median;
  ctx.lineWidth = 2;
  ctx.setLineDash([...BAND_STYLE.medianDash]);
  ctx.stroke();
  ctx.restore();
}

/** The visible runs' loss series, read from the live buffers. */
export function lossSeriesOf(runs: readonly { id: string; hidden?: boolean; style: number; label: string }[], live: Pick<LiveRuns, 'trajectory'>): LossSeries[] {
  const series: LossSeries[] = [];
  for (const r of runs) {
    const b = live.trajectory(r.id);
    if (!r.hidden && b && b.count) series.push({ loss: b.loss, count: b.count, ...(b.keepEvery > 1 ? { steps: b.steps } : {}), style: runStyle(r.style), label: r.label });
  }
  return series;
}

/** The lowest known global-minimum value, or null when the surface lists none. */
export function knownMinimumOf(points: readonly { kind: string; value: number }[]): number | null {
  const minima = points.filter((p) => p.kind === 'global-min').map((p) => p.value);
  return minima.length ? Math.min(...minima) : null;
}

function logDecades([lo, hi]: [number, number]): number[] {
  const out: number[] = [];
  const k0 = Math.ceil(Math.log10(lo));
  const k1 = Math.floor(Math.log10(hi));
  const stepK = Math.max(1, Math.ceil((k1 - k0 + 1) / 7));
  for (let k = k0; k <= k1; k += stepK) out.push(10 ** k);
  return out.length ? out : [lo, hi];
}
