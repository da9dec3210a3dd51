import { scaleLinear } from 'd3';
import type { DataTable, ModelSpec } from '../../problems';
import { beginChart, canvasFont, drawMarker, drawVerticalTitle, finiteExtent, MARKER_SHAPES, niceTicks, PLOT_STYLE, RUN_COLOURS, strokeChartFrame, type DrawingContext, type PixelSize } from '../plot';

export type Task = 'regression' | 'binary' | 'multiclass';

export function taskOf(model: ModelSpec): Task {
  if (model.kind === 'logistic') return 'binary';
  if (model.kind === 'softmax') return 'multiclass';
  if (model.kind === 'mlp') return model.head === 'regression' ? 'regression' : model.head === 'binary' ? 'binary' : 'multiclass';
  return 'regression';
}

export interface DataScene {
  table: DataTable;
  inputs: readonly string[];
  target: string;
  task: Task;
  /**
   * The model's outputs at the rows of `predictionRows` (count x width, row-major; computed in the
   * worker), or null to draw the data alone.
   */
  predictions: { outputs: Float64Array; width: number } | null;
}

const MARGIN = { left: 56, right: 12, top: 12, bottom: 40 };

/** Most rows drawn as points: more only overplot, and would make every redraw (each run update) slow. */
export const MAX_DRAWN_ROWS = 2000;

/** Step between drawn rows: 1 up to MAX_DRAWN_ROWS rows, else an evenly spread subset of about that many. */
export function rowStride(rows: number): number {
  return Math.max(1, Math.ceil(rows / MAX_DRAWN_ROWS));
}
/** Points of the fitted curve of a regression on one input. */
const CURVE_POINTS = 201;
/** Side of the lattice of the first two inputs on which a classifier's predicted class is shaded. */
export const REGION_SIDE = 64;

/**
 * The input rows (original units, in the model's input order) whose predictions the scene draws: the
 * CURVE_POINTS abscissae of the fitted curve, the drawn rows (every rowStride-th) of a regression on
 * several inputs, or the REGION_SIDE^2 lattice centres of a classifier's regions (other inputs at
 * their column means, row j = 0 at the top); none for a classifier on one input.
 */
export function predictionRows(table: DataTable, inputs: readonly string[], task: Task): { rows: Float64Array; count: number } {
  const d = inputs.length;
  if (task === 'regression' && d === 1) {
    const [lo, hi] = extent(column(table, inputs[0]));
    const rows = Float64Array.from({ length: CURVE_POINTS }, (_, k) => lo + ((hi - lo) * k) / (CURVE_POINTS - 1));
    return { rows, count: CURVE_POINTS };
  }
  if (task === 'regression') {
    const stride = rowStride(table.rows);
    const m = table.columns.length;
    const idx = inputs.map((c) => table.columns.indexOf(c));
    const count = Math.ceil(table.rows / stride);
    const rows = new Float64Array(count * d);
    for (let k = 0; k < count; k++) idx.forEach((j, q) => (rows[k * d + q] = table.values[k * stride * m + j]));
    return { rows, count };
  }
  if (d < 2) return { rows: new Float64Array(0), count: 0 };
  const xr = extent(column(table, inputs[0]));
  const yr = extent(column(table, inputs[1]));
  const means = inputs.map((c) => {
    const v = column(table, c);
    return v.reduce((s, x) => s + x, 0) / v.length;
  });
  const n = REGION_SIDE;
  const rows = new Float64Array(n * n * d);
  for (let j = 0; j < n; j++)
    for (let i = 0; i < n; i++) {
      const at = (j * n + i) * d;
      rows.set(means, at);
      rows[at] = xr[0] + ((i + 0.5) * (xr[1] - xr[0])) / n;
      rows[at + 1] = yr[1] - ((j + 0.5) * (yr[1] - yr[0])) / n;
    }
  return { rows, count: n * n };
}

/** The predicted class of output row k: the most probable class, or P(y = 1) >= 0.5 for one output. */
export function predictedClass(outputs: Float64Array, width: number, k: number): number {
  if (width === 1) return outputs[k] >= 0.5 ? 1 : outputs[k] < 0.5 ? 0 : -1;
  let best = -1;
  let top = -Infinity;
  for (let c = 0; c < width; c++) if (outputs[k * width + c] > top) [best, top] = [c, outputs[k * width + c]];
  return best;
}

/** Class colours of the data view (Okabe-Ito, the same palette as runs; classes and runs never share a plot). */
const CLASS_COLOURS = RUN_COLOURS;

function column(table: DataTable, name: string): Float64Array {
  const j = table.columns.indexOf(name);
  const m = table.columns.length;
  const out = new Float64Array(table.rows);
  for (let i = 0; i < table.rows; i++) out[i] = table.values[i * m + j];
  return out;
}

/** The range of a column (finite, as every table is), widened by `pad` of its width on each side. */
function extent(v: Float64Array, pad = 0.05): [number, number] {
  let [lo, hi] = finiteExtent(v);
  if (!(hi > lo)) [lo, hi] = [lo - 1, hi + 1];
  const d = (hi - lo) * pad;
  return [lo - d, hi + d];
}

/**
 * The data beside the landscape: for regression on one input, the points and the fitted curve; on
 * several inputs, predicted against observed; for a classifier, the class regions over the first two
 * inputs (others held at their means) under the points, coloured and shaped by class.
 */
export function drawDataScene(ctx: DrawingContext, size: PixelSize, scene: DataScene): string {
  const { w, h } = beginChart(ctx, size, MARGIN);
  const { table, inputs, target, task, predictions } = scene;
  const y = column(table, target);
  const stride = rowStride(table.rows);
  let caption: string;
  let xTitle: string;
  let yTitle: string;
  let xr: [number, number];
  let yr: [number, number];
  if (task === 'regression' && inputs.length === 1) {
    const x = column(table, inputs[0]);
    xr = extent(x);
    yr = extent(y, 0.1);
    [xTitle, yTitle] = [inputs[0], target];
    const sx = scaleLinear().domain(xr).range([0, w]);
    const sy = scaleLinear().domain(yr).range([h, 0]);
    strokeChartFrame(ctx, w, h);
    for (let i = 0; i < table.rows; i += stride) drawMarker(ctx, 'circle', { px: sx(x[i]), py: sy(y[i]) }, 5, { fill: '#56B4E9', outline: '#1b4965', outlineWidth: 0.75 });
    if (predictions) {
      ctx.beginPath();
      const { rows } = predictionRows(table, inputs, task);
      for (let k = 0; k < CURVE_POINTS; k++) {
        const py = Math.max(-1e4, Math.min(1e4, sy(predictions.outputs[k])));
        if (k === 0) ctx.moveTo(sx(rows[k]), py);
        else ctx.lineTo(sx(rows[k]), py);
      }
      ctx.strokeStyle = '#D55E00';
      ctx.lineWidth = 2;
      ctx.stroke();
    }
    caption = 'points: the data; line: the model at the run\'s current parameters';
  } else if (task === 'regression') {
    // Row i = k stride was predicted as output k (predictionRows).
    const fittedAt = (i: number) => (predictions ? predictions.outputs[i / stride] : Number.NaN);
    xr = extent(y, 0.1);
    yr = xr;
    [xTitle, yTitle] = [`observed ${target}`, `predicted ${target}`];
    const sx = scaleLinear().domain(xr).range([0, w]);
    const sy = scaleLinear().domain(yr).range([h, 0]);
    strokeChartFrame(ctx, w, h);
    ctx.beginPath();
    ctx.moveTo(sx(xr[0]), sy(xr[0]));
    ctx.lineTo(sx(xr[1]), sy(xr[1]));
    ctx.strokeStyle = '#999999';
    ctx.setLineDash([4, 4]);
    ctx.stroke();
    ctx.setLineDash([]);
    for (let i = 0; i < table.rows; i += stride) {
      const fitted = fittedAt(i);
      if (Number.isFinite(fitted)) drawMarker(ctx, 'circle', { px: sx(y[i]), py: Math.max(-50, Math.min(h + 50, sy(fitted))) }, 5, { fill: '#56B4E9', outline: '#1b4965', outlineWidth: 0.75 });
    }
    caption = 'each point: one row, observed against predicted; on the dashed line the fit is exact';
  } else {
    const a = column(table, inputs[0]);
    const b = inputs.length > 1 ? column(table, inputs[1]) : y;
    xr = extent(a);
    yr = extent(b);
    [xTitle, yTitle] = [inputs[0], inputs.length > 1 ? inputs[1] : target];
    const sx = scaleLinear().domain(xr).range([0, w]);
    const sy = scaleLinear().domain(yr).range([h, 0]);
    if (predictions && inputs.length > 1) regions(ctx, w, h, predictions);
    strokeChartFrame(ctx, w, h);
    for (let i = 0; i < table.rows; i += stride) {
      const k = Math.round(y[i]);
      drawMarker(ctx, MARKER_SHAPES[k % MARKER_SHAPES.length], { px: sx(a[i]), py: sy(b[i]) }, 6, { fill: CLASS_COLOURS[k % CLASS_COLOURS.length], outline: '#222222', outlineWidth: 0.6 });
    }
    caption =
      inputs.length > 2
        ? `shaded: the class the model predicts over ${inputs[0]} and ${inputs[1]}, other inputs at their means`
        : 'shaded: the class the model predicts; points: the data, by class';
  }
  if (stride > 1) caption += ` (1 row in ${stride} of ${table.rows} drawn)`;
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  ticks(ctx, w, h, xr, yr);
  ctx.fillText(xTitle, w / 2, h + 24);
  drawVerticalTitle(ctx, yTitle, -MARGIN.left + 10, h);
  ctx.restore();
  return caption;
}

function ticks(ctx: DrawingContext, w: number, h: number, xr: [number, number], yr: [number, number]): void {
  const sx = scaleLinear().domain(xr).range([0, w]);
  const sy = scaleLinear().domain(yr).range([h, 0]);
  for (const t of niceTicks(xr, w / 80)) ctx.fillText(t.label, sx(t.value), h + 5);
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const t of niceTicks(yr, h / 45)) ctx.fillText(t.label, -5, sy(t.value));
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
}

/**
 * The predicted class over the REGION_SIDE^2 lattice of predictionRows, shaded under the points. Runs of
 * equal cells along a row are one rectangle, drawn class by class: a cell each (4,096 fills with a
 * colour change between most) took tens of milliseconds per redraw.
 */
function regions(ctx: DrawingContext, w: number, h: number, { outputs, width }: { outputs: Float64Array; width: number }): void {
  const n = REGION_SIDE;
  if (outputs.length !== n * n * width) return;
  const cw = w / n;
  const ch = h / n;
  const classes = Int32Array.from({ length: n * n }, (_, k) => predictedClass(outputs, width, k));
  const runs = new Map<number, [number, number, number][]>(); // class -> [row, first cell, cells]
  for (let j = 0; j < n; j++)
    for (let i = 0; i < n; ) {
      const k = classes[j * n + i];
      let end = i + 1;
      while (end < n && classes[j * n + end] === k) end++;
      if (k >= 0) {
        if (!runs.has(k)) runs.set(k, []);
        runs.get(k)!.push([j, i, end - i]);
      }
      i = end;
    }
  ctx.save();
  ctx.globalAlpha = 0.28;
  for (const [k, list] of runs) {
    ctx.fillStyle = CLASS_COLOURS[k % CLASS_COLOURS.length];
    for (const [j, i, cells] of list) ctx.fillRect(i * cw, j * ch, cells * cw + 0.5, ch + 0.5);
  }
  ctx.restore();
}
