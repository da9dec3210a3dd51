import { scaleLinear } from 'd3';
import { beginChart, canvasFont, finiteExtent, niceTicks, PLOT_STYLE, strokeChartFrame, type DrawingContext, type PixelSize } from '../plot';

const M = { left: 60, right: 12, top: 10, bottom: 36 };

/** The loss along the segment, alpha on the horizontal axis; dashed lines at alpha = 0 and 1 (the two end points). */
export function drawProfile(ctx: DrawingContext, size: PixelSize, alphas: Float64Array, values: Float64Array): void {
  const { w, h } = beginChart(ctx, size, M);
  let [lo, hi] = finiteExtent(values);
  if (!(hi > lo)) [lo, hi] = [lo - 1, lo + 1];
  const ar: [number, number] = [alphas[0], alphas[alphas.length - 1]];
  const x = scaleLinear().domain(ar).range([0, w]);
  const y = scaleLinear().domain([lo, hi]).range([h, 0]).nice();
  strokeChartFrame(ctx, w, h);
  ctx.setLineDash([4, 4]);
  ctx.strokeStyle = '#888888';
  ctx.beginPath();
  for (const a of [0, 1]) {
    ctx.moveTo(x(a), 0);
    ctx.lineTo(x(a), h);
  }
  ctx.stroke();
  ctx.setLineDash([]);
  ctx.beginPath();
  let pen = false;
  alphas.forEach((a, k) => {
    const v = values[k];
    if (!Number.isFinite(v)) return void (pen = false);
    if (pen) ctx.lineTo(x(a), y(v));
    else ctx.moveTo(x(a), y(v));
    pen = true;
  });
  ctx.strokeStyle = '#0072B2';
  ctx.lineWidth = 2;
  ctx.stroke();
  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.font = canvasFont(PLOT_STYLE.tickFontSize);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  for (const t of niceTicks(ar, w / 70)) ctx.fillText(t.label, x(t.value), h + 4);
  ctx.fillText('alpha (0 = start, 1 = end)', w / 2, h + 19);
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  for (const t of niceTicks(y.domain() as [number, number], h / 35)) ctx.fillText(t.label, -5, y(t.value));
  ctx.restore();
}
