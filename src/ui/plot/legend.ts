/**
 * The colour legend: a stepped bar with one block per contour band and ticks labelled with actual loss
 * values (never the shifted ones used inside the log scale).
 *
 * Log ticks: candidates sit at the decades of the shifted value s = v - min + offset, i.e. s = 10^k,
 * and each is rounded to a multiple of 10^k in loss units, so for a loss with minimum 0 they are the
 * powers of ten themselves (0.01, 0.1, 1, 10 ...) and for the six-hump camel (min -1.0316) they read
 * -1.04, -0.9, 0, 10, 100. With fewer than three decades in range, 2 x 10^k and 5 x 10^k are added.
 * Ticks closer than 0.6 / approxCount of the bar to an accepted one are dropped (decades win). If fewer
 * than two remain, linear ticks are used. Linear ticks: d3 `ticks` and `tickFormat`.
 */
import { tickFormat, ticks } from 'd3';
import { asciiMinus, formatValue } from '../../io/number-text';
import type { ValueScale } from './colour';
import { canvasFont, PLOT_STYLE, type DrawingContext } from './context';

export interface LegendTick {
  /** Actual loss value. */
  value: number;
  /** Position along the bar, 0 at the minimum end and 1 at the maximum end. */
  position: number;
  label: string;
}

export interface LegendBand {
  from: number;
  to: number;
  colour: string;
}

export interface LegendModel {
  min: number;
  max: number;
  kind: ValueScale['kind'];
  bands: LegendBand[];
  ticks: LegendTick[];
}

export { asciiMinus, formatValue } from '../../io/number-text';

export function legendTicks(scale: ValueScale, approxCount = 6): LegendTick[] {
  if (!Number.isFinite(scale.min)) return [];
  const count = Math.max(2, Math.round(approxCount));
  if (scale.kind === 'log') {
    const chosen = logTicks(scale, count);
    if (chosen.length >= 2) return chosen;
  }
  return linearTicks(scale, count);
}

function linearTicks(scale: ValueScale, count: number): LegendTick[] {
  const label = tickFormat(scale.min, scale.max, count);
  return ticks(scale.min, scale.max, count).map((value) => ({ value, position: scale.normalise(value), label: asciiMinus(label(value)) }));
}

function logTicks(scale: ValueScale, count: number): LegendTick[] {
  const base = scale.min - scale.offset;
  const s0 = scale.offset;
  const s1 = scale.max - base;
  const k0 = Math.ceil(Math.log10(s0) - 1e-9);
  const k1 = Math.floor(Math.log10(s1) + 1e-9);
  const candidates: { value: number; priority: number }[] = [];
  const add = (s: number, k: number, priority: number) => {
    const step = Math.pow(10, k);
    const value = roundTo(base + s, step);
    if (value >= scale.min && value <= scale.max) candidates.push({ value, priority });
  };
  for (let k = k0; k <= k1; k++) add(Math.pow(10, k), k, 0);
  if (k1 - k0 + 1 < 3)
    for (let k = k0 - 1; k <= k1; k++) for (const m of [2, 5]) if (m * Math.pow(10, k) >= s0 && m * Math.pow(10, k) <= s1) add(m * Math.pow(10, k), k, 1);
  const gap = 0.6 / count;
  const accepted: LegendTick[] = [];
  candidates.sort((x, y) => x.priority - y.priority);
  for (const c of candidates) {
    const position = scale.normalise(c.value);
    if (accepted.every((t) => Math.abs(t.position - position) >= gap)) accepted.push({ value: c.value, position, label: formatValue(c.value) });
  }
  return accepted.sort((x, y) => x.position - y.position);
}

/** Rounds to a multiple of step, cleaning the binary noise (0.30000000000000004 -> 0.3). */
function roundTo(v: number, step: number): number {
  const r = Math.round(v / step) * step;
  return Number(r.toPrecision(12)) + 0; // + 0 turns -0 into 0
}

/** Bands (one block per contour level, same colours as the plot) and ticks for the legend bar. */
export function legendModel(scale: ValueScale, thresholds: readonly number[], colours: readonly string[], approxTicks = 6): LegendModel {
  const bands = thresholds.map((t, k) => ({
    from: scale.normalise(t),
    to: k + 1 < thresholds.length ? scale.normalise(thresholds[k + 1]) : 1,
    colour: colours[k % Math.max(1, colours.length)],
  }));
  return { min: scale.min, max: scale.max, kind: scale.kind, bands, ticks: legendTicks(scale, approxTicks) };
}

/** A rectangle in frame-local pixels. */
export interface PixelRect {
  px: number;
  py: number;
  width: number;
  height: number;
}

/**
 * Draws a vertical legend bar in `rect` (minimum at the bottom), tick marks and labels to its right and
 * an optional title above it.
 */
export function drawLegend(ctx: DrawingContext, model: LegendModel, rect: PixelRect, title?: string): void {
  ctx.save();
  const yOf = (u: number) => rect.py + rect.height * (1 - u);
  for (const band of model.bands) {
    if (!(band.to > band.from)) continue;
    ctx.fillStyle = band.colour;
    const top = yOf(band.to);
    ctx.fillRect(rect.px, top, rect.width, yOf(band.from) - top);
  }
  ctx.strokeStyle = PLOT_STYLE.frameColour;
  ctx.lineWidth = 1;
  ctx.beginPath();
  ctx.rect(rect.px, rect.py, rect.width, rect.height);
  for (const t of model.ticks) {
    const y = yOf(t.position);
    ctx.moveTo(rect.px + rect.width, y);
    ctx.lineTo(rect.px + rect.width + PLOT_STYLE.tickLength, y);
  }
  ctx.stroke();
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  for (const t of model.ticks) ctx.fillText(t.label, rect.px + rect.width + PLOT_STYLE.tickLength + 3, yOf(t.position));
  if (title) {
    ctx.textBaseline = 'bottom';
    ctx.fillText(title, rect.px, rect.py - 6);
  }
  ctx.restore();
}
