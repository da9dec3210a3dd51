import type { GridState } from '../../store/app-store';
import type { DisplaySettings } from '../../store/workspace';
import {
  bandColours,
  contourBands,
  drawAxes,
  drawFilledContours,
  drawKnownPoints,
  drawLegend,
  drawTrajectory,
  legendModel,
  thresholdsFor,
  valueScale,
  drawArrows,
  type Arrow,
  type ContourBand,
  type DrawingContext,
  type GridSpec,
  type KnownPoint,
  type LegendModel,
  type RunStyle,
  type ViewBox,
} from '../plot';
import { frameTransform, LEGEND_WIDTH, type FrameLayout } from './frame';

/** The contoured surface: computed once per grid and display setting, drawn by every panel. */
export interface SurfacePicture {
  grid: GridSpec;
  bands: ContourBand[];
  colours: string[];
  legend: LegendModel;
}

const pictures = new WeakMap<Float64Array, { key: string; picture: SurfacePicture }>();

/** Contours and legend for the current grid (cached per grid values and display settings). */
export function surfacePicture(grid: GridState, display: DisplaySettings, logOffset?: number): SurfacePicture | null {
  if (!grid.values || !grid.request) return null;
  const key = `${display.scale}|${display.levels}|${display.colourMap}|${logOffset ?? ''}`;
  const cached = pictures.get(grid.values);
  if (cached?.key === key) return cached.picture;
  const spec: GridSpec = { a: grid.request.a, b: grid.request.b, nx: grid.request.nx, ny: grid.request.ny };
  const scale = valueScale(grid.min, grid.max, display.scale, display.scale === 'log' ? logOffset : undefined);
  const thresholds = thresholdsFor(scale, display.levels);
  const bands = contourBands(grid.values, spec, thresholds, scale.transform);
  const colours = bandColours(thresholds, scale, display.colourMap);
  const picture = { grid: spec, bands, colours, legend: legendModel(scale, thresholds, colours) };
  pictures.set(grid.values, { key, picture });
  return picture;
}

export interface BaseLayer {
  layout: FrameLayout;
  view: ViewBox;
  picture: SurfacePicture | null;
  axisLabels: { a: string; b: string };
  knownPoints: KnownPoint[];
  arrows: Arrow[];
  title?: string;
}

/** Contours, arrows, known points, axes and legend: everything that does not move while runs stream. */
export function drawBase(ctx: DrawingContext, base: BaseLayer): void {
  const { layout, picture } = base;
  const t = frameTransform(base.view, layout);
  ctx.save();
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, layout.canvas.width, layout.canvas.height);
  ctx.translate(layout.left, layout.top);
  ctx.save();
  ctx.beginPath();
  ctx.rect(0, 0, layout.frame.width, layout.frame.height);
  ctx.clip();
  ctx.fillStyle = '#eeeeee';
  ctx.fillRect(0, 0, layout.frame.width, layout.frame.height);
  if (picture) drawFilledContours(ctx, picture.bands, t, picture.colours, { grid: picture.grid });
  if (base.arrows.length) drawArrows(ctx, base.arrows, t);
  if (base.knownPoints.length) drawKnownPoints(ctx, base.knownPoints, t);
  ctx.restore();
  drawAxes(ctx, t, base.axisLabels);
  if (layout.withLegend && picture) {
    drawLegend(ctx, picture.legend, { px: layout.frame.width + 24, py: 18, width: 14, height: Math.max(40, layout.frame.height - 24) }, 'loss');
  }
  if (base.title) {
    ctx.fillStyle = '#222222';
    ctx.font = '600 12px system-ui, sans-serif';
    ctx.textAlign = 'left';
    ctx.textBaseline = 'top';
    ctx.fillText(base.title, 6, 6);
  }
  ctx.restore();
}

export interface TrajectoryLayerItem {
  points: Float64Array;
  count: number;
  dimension: number;
  style: RunStyle;
  selected: boolean;
}

export interface OverlayLayer {
  layout: FrameLayout;
  view: ViewBox;
  axes: [number, number];
  trajectories: TrajectoryLayerItem[];
  /** Linked hover position in parameter space (drawn as a crosshair). */
  hover: { a: number; b: number } | null;
}

/** Trajectories and the hover crosshair, redrawn at most once per animation frame while runs stream. */
export function drawOverlay(ctx: DrawingContext, overlay: OverlayLayer): void {
  const { layout } = overlay;
  const t = frameTransform(overlay.view, layout);
  ctx.save();
  ctx.translate(layout.left, layout.top);
  ctx.beginPath();
  ctx.rect(0, 0, layout.frame.width, layout.frame.height);
  ctx.clip();
  for (const tr of overlay.trajectories) {
    drawTrajectory(ctx, tr.points, tr.count, t, tr.style, {
      layout: { stride: tr.dimension, a: overlay.axes[0], b: overlay.axes[1] },
      markerEvery: markerInterval(tr.count),
      lineWidth: tr.selected ? 2.75 : 1.75,
    });
  }
  if (overlay.hover) {
    const p = t.toPixel(overlay.hover);
    ctx.strokeStyle = 'rgba(255,255,255,0.8)';
    ctx.lineWidth = 1;
    ctx.setLineDash([4, 4]);
    ctx.beginPath();
    ctx.moveTo(p.px, 0);
    ctx.lineTo(p.px, layout.frame.height);
    ctx.moveTo(0, p.py);
    ctx.lineTo(layout.frame.width, p.py);
    ctx.stroke();
  }
  ctx.restore();
}

/** Step markers at a round interval giving roughly 12 along the run (so markers, not only colour, tell runs apart). */
export function markerInterval(count: number): number {
  if (count < 24) return 1;
  const raw = count / 12;
  const p = 10 ** Math.floor(Math.log10(raw));
  return [1, 2, 5, 10].map((m) => m * p).find((m) => m >= raw) ?? 10 * p;
}

export { LEGEND_WIDTH };
