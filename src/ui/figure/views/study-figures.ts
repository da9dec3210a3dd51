/**
 * Figures of the study views, drawn by the same functions as the panels (start-map-drawing,
 * band-chart, rate-chart, sharpness-chart, critical-chart). The panel passes what it shows (cells,
 * legend rows, curves, summary lines), so a figure holds exactly the panel's numbers; the plane
 * plots (start-point map, critical points) get axes over the study's box.
 */
import { OUTCOME_KINDS, type CriticalPoint, type KnownPoint as BasinPoint, type StartMapSpec, type ToleranceTarget } from '../../../engine';
import type { StudyCellsState } from '../../../store/study-store';
import type { LossAxis } from '../../chart/loss-chart';
import { AXES_MARGIN, drawAxes, viewTransform, type AxisLabels, type PixelSize } from '../../plot';
import type { ViewBox } from '../../../engine';
import { drawBandChart } from '../../study/band-chart';
import { BAND_STYLE } from '../../chart/loss-chart';
import { CRITICAL_GLYPHS, drawCriticalPoints, glyphOf } from '../../study/critical-chart';
import { mapShade, paintStartMap, type LegendRow } from '../../study/paint-map';
import { drawRateChart, type RateCurve } from '../../study/rate-chart';
import { drawSharpnessChart, SHARPNESS_STYLE } from '../../study/sharpness-chart';
import { drawMapCells, drawMapMinima } from '../../study/start-map-drawing';
import { basinColour, cssColour, OUTCOME_COLOURS } from '../../study/study-colours';
import type { Figure, FigureContext } from '../compose';
import type { KeyEntry } from '../key';

const fmt = (v: number) => String(+v.toPrecision(4));

/** A square plot frame over `box` with axes, as large as `size` allows. */
function drawPlanePlot(ctx: FigureContext, size: PixelSize, box: ViewBox, labels: AxisLabels, draw: (frame: PixelSize) => void): void {
  const side = Math.max(20, Math.min(size.width - AXES_MARGIN.left - AXES_MARGIN.right, size.height - AXES_MARGIN.top - AXES_MARGIN.bottom));
  const frame = { width: side, height: side };
  ctx.save();
  ctx.translate(AXES_MARGIN.left, AXES_MARGIN.top);
  ctx.save();
  ctx.beginPath();
  ctx.rect(0, 0, side, side);
  ctx.clip();
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, side, side);
  draw(frame);
  ctx.restore();
  drawAxes(ctx, viewTransform(box, frame), labels);
  ctx.restore();
}

export interface StartMapFigureInput {
  spec: StartMapSpec;
  cells: StudyCellsState;
  known: readonly BasinPoint[];
  /** What the cells' steps to tolerance were measured against (null: not measured, shaded by steps). */
  target: ToleranceTarget | null;
  legend: readonly LegendRow[];
  labels: AxisLabels;
  configLabel: string;
  surfaceLabel: string;
}

export function startMapFigure(m: StartMapFigureInput): Figure {
  const key: KeyEntry[] = m.legend.map((row) => ({
    kind: 'swatch',
    colour: cssColour(row.basin >= 0 ? basinColour(row.basin) : (OUTCOME_COLOURS[OUTCOME_KINDS[row.kindIndex]] ?? [255, 255, 255])),
    label: `${row.label}: ${row.count} starts, ${(100 * row.share).toFixed(1)}%`,
  }));
  if (m.known.length) key.push({ kind: 'known', point: 'minimum', label: 'known minimum' });
  const r = m.spec.resolution;
  return {
    title: `Start-point map of “${m.configLabel}” on ${m.surfaceLabel}, ${r} × ${r} starts`,
    keyHeading: `Where the runs ended (${mapShade(m.target, m.spec.stop.maxSteps)})`,
    key,
    drawBody: (ctx, size) =>
      drawPlanePlot(ctx, size, m.spec.box, m.labels, (frame) => {
        drawMapCells(ctx, paintStartMap(m.cells, r, m.spec.stop.maxSteps, m.target !== null), r, frame);
        drawMapMinima(ctx, m.known, m.spec.box, m.spec.axes, frame);
      }),
  };
}

export interface MultiStartFigureInput {
  bands: readonly Float64Array[];
  axis: LossAxis;
  /** The panel's summary, one line each (success rate, final loss, outcomes ...). */
  summary: readonly string[];
  count: number;
  configLabel: string;
  surfaceLabel: string;
}

export function multiStartFigure(m: MultiStartFigureInput): Figure {
  return {
    title: `Multi-start of “${m.configLabel}” on ${m.surfaceLabel}: loss across ${m.count} starts`,
    key: [
      { kind: 'line', colour: BAND_STYLE.median, dash: [...BAND_STYLE.medianDash], label: 'median across starts' },
      { kind: 'band', colour: BAND_STYLE.fill, label: '25–75% of the starts' },
      ...m.summary.map((label) => ({ kind: 'note' as const, label })),
    ],
    drawBody: (ctx, size) => drawBandChart(ctx, size, m.bands, m.axis),
  };
}

export interface RateFigureInput {
  rates: Float64Array;
  curves: readonly RateCurve[];
  surfaceLabel: string;
  startLabel: string;
}

export function rateSweepFigure(m: RateFigureInput): Figure {
  const key: KeyEntry[] = m.curves.map((c) => ({ kind: 'run', style: c.style, label: c.label }));
  key.push(
    { kind: 'line', colour: '#444444', label: 'observed divergence threshold (solid, run colour)' },
    { kind: 'line', colour: '#444444', dash: [6, 4], label: 'predicted 2/λmax or 2(1+μ)/λmax (dashed)' },
    { kind: 'marker', shape: 'cross', colour: '#444444', label: 'diverged (on the top edge)' },
  );
  for (const c of m.curves) {
    const t = c.threshold;
    const observed = t?.observed ? fmt(Math.sqrt(t.observed.lo * t.observed.hi)) : 'none in range';
    key.push({ kind: 'note', label: `${c.label}: observed ${observed}, predicted ${t?.predicted ? fmt(t.predicted) : 'none'}` });
  }
  return {
    title: `Learning-rate sweep on ${m.surfaceLabel} from the start of “${m.startLabel}”`,
    key,
    drawBody: (ctx, size) => drawRateChart(ctx, size, m.rates, m.curves),
  };
}

export interface SharpnessFigureInput {
  runLabel: string;
  surfaceLabel: string;
  steps: Int32Array;
  values: Float64Array;
  limit: { steps: Int32Array; values: Float64Array } | null;
}

export function sharpnessFigure(m: SharpnessFigureInput): Figure {
  const key: KeyEntry[] = [{ kind: 'line', colour: SHARPNESS_STYLE.sharpness, label: `λmax of the Hessian at ${m.steps.length} sampled steps` }];
  if (m.limit) key.push({ kind: 'line', colour: SHARPNESS_STYLE.limit, dash: [6, 4], label: '2 / learning rate at that step' });
  return {
    title: `Sharpness along “${m.runLabel}” on ${m.surfaceLabel}`,
    key,
    drawBody: (ctx, size) => drawSharpnessChart(ctx, size, m.steps, m.values, m.limit),
  };
}

export interface CriticalFigureInput {
  points: readonly CriticalPoint[];
  box: ViewBox;
  axes: [number, number];
  labels: AxisLabels;
  surfaceLabel: string;
}

export function criticalPointsFigure(m: CriticalFigureInput): Figure {
  const counts = new Map<string, number>();
  for (const p of m.points) counts.set(glyphOf(p).key, (counts.get(glyphOf(p).key) ?? 0) + 1);
  return {
    title: `Critical points of ${m.surfaceLabel} in the view`,
    key: Object.values(CRITICAL_GLYPHS).map((g) => ({ kind: 'marker', shape: g.shape, colour: g.colour, label: `${g.key} (${counts.get(g.key) ?? 0})` })),
    drawBody: (ctx, size) => drawPlanePlot(ctx, size, m.box, m.labels, (frame) => drawCriticalPoints(ctx, m.points, m.box, m.axes, frame)),
  };
}
