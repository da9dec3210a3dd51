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

/** The model's output for one input row, as a function of the current parameters. */
export type Predictor = (inputs: ArrayLike<number>) => number | number[];

export interface DataScene {
  table: DataTable;
  inputs: readonly string[];
  target: string;
  task: Task;
  predict: Predictor | null;
}

const MARGIN = { left: 56, right: 12, top: 12, bottom: 40 };

/** Most rows drawn as points: more only overplot, and would make every redraw (each run update) slow. */
export const MAX_DRAWN_ROWS = 2000;

/** Step between drawn rows: 1 up to MAX_DRAWN_ROWS rows, else an evenly spread subset of about that many. */
export function rowStride(rows: number): number {
  return Math.max(1, Math.ceil(rows / MAX_DRAWN_ROWS));
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
  const { table, inputs, target, task, predict } = scene;
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
    if (predict) {
      ctx.beginPath();
      const row = new Float64Array(1);
      for (let k = 0; k <= 200; k++) {
        row[0] = xr[0] + ((xr[1] - xr[0]) * k) / 200;
        const p = predict(row) as number;
        const py = Math.max(-1e4, Math.min(1e4, sy(p)));
        if (k === 0) ctx.moveTo(sx(row[0]), py);
        else ctx.lineTo(sx(row[0]), py);
      }
      ctx.strokeStyle = '#D55E00';
      ctx.lineWidth = 2;
      ctx.stroke();
    }
    caption = 'points: the data; line: the model at the run\'s current parameters';
  } else if (task === 'regression') {
    const fitted = new Float64Array(table.rows);
    const m = table.columns.length;
    const idx = inputs.map((c) => table.columns.indexOf(c));
    const row = new Float64Array(inputs.length);
    fitted.fill(Number.NaN);
    for (let i = 0; i < table.rows; i += stride) {
      idx.forEach((j, k) => (row[k] = table.values[i * m + j]));
      fitted[i] = predict ? (predict(row) as number) : Number.NaN;
    }
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
    for (let i = 0; i < table.rows; i += stride) if (Number.isFinite(fitted[i])) drawMarker(ctx, 'circle', { px: sx(y[i]), py: Math.max(-50, Math.min(h + 50, sy(fitted[i]))) }, 5, { fill: '#56B4E9', outline: '#1b4965', outlineWidth: 0.75 });
    caption = 'each point: one row, observed against predicted; on the dashed line the fit is exact';
  } else {
    const a = column(table, inputs[0]);
    const b = inputs.length > 1 ? column(table, inputs[1]) : y;
    xr = extent(a);
    yr = extent(b);
    [xTitle, yTitle] = [inputs[0], inputs.length > 1 ? inputs[1] : target];
    const sx = scaleLinear().domain(xr).range([0, w]);
    const sy = scaleLinear().domain(yr).range([h, 0]);
    if (predict && inputs.length > 1) regions(ctx, w, h, xr, yr, scene, predict);
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

/** Predicted class over a 64 x 64 lattice of the first two inputs, the others at their column means. */
function regions(ctx: DrawingContext, w: number, h: number, xr: [number, number], yr: [number, number], scene: DataScene, predict: Predictor): void {
  const n = 64;
  const means = scene.inputs.map((c) => {
    const v = column(scene.table, c);
    return v.reduce((s, x) => s + x, 0) / v.length;
  });
  const row = Float64Array.from(means);
  const cw = w / n;
  const ch = h / n;
  ctx.save();
  ctx.globalAlpha = 0.28;
  for (let j = 0; j < n; j++)
    for (let i = 0; i < n; i++) {
      row[0] = xr[0] + ((i + 0.5) * (xr[1] - xr[0])) / n;
      row[1] = yr[1] - ((j + 0.5) * (yr[1] - yr[0])) / n;
      const out = predict(row);
      const k = Array.isArray(out) ? out.indexOf(Math.max(...out)) : out >= 0.5 ? 1 : 0;
      if (k < 0) continue;
      ctx.fillStyle = CLASS_COLOURS[k % CLASS_COLOURS.length];
      ctx.fillRect(i * cw, j * ch, cw + 0.5, ch + 0.5);
    }
  ctx.restore();
}
