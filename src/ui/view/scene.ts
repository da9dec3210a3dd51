import {
  drawAxes,
  drawFilledContours,
  drawKnownPoints,
  drawLegend,
  drawTrajectory,
  drawArrows,
  ellipsize,
  type Arrow,
  type AxesModel,
  type DrawingContext,
  type KnownPoint,
  type RunStyle,
} from '../plot';
import type { ViewBox } from '../../engine';
import { frameTransform, type FrameLayout } from './frame';
import type { SurfacePicture } from './picture';

export interface BaseLayer {
  layout: FrameLayout;
  view: ViewBox;
  picture: SurfacePicture | null;
  axisLabels: { a: string; b: string };
  knownPoints: KnownPoint[];
  arrows: Arrow[];
  title?: string;
}

/** Room the title plate leaves inside the frame: 2 px margin, 4 px padding each side. */
export const TITLE_PLATE_INSET = 12;

/** Contours, arrows, known points, axes and legend: everything that does not move while runs stream. Returns the axes drawn. */
export function drawBase(ctx: DrawingContext & { measureText(text: string): { width: number } }, base: BaseLayer): AxesModel {
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
  const axes = drawAxes(ctx, t, base.axisLabels);
  if (layout.withLegend && picture) {
    drawLegend(ctx, picture.legend, { px: layout.frame.width + 24, py: 18, width: 14, height: Math.max(40, layout.frame.height - 24) }, 'loss');
  }
  if (base.title) {
    // On a light plate in the frame's top-left corner so it reads over any contour colour; shortened
    // with an ellipsis to the frame's width (the origin is the frame's corner here).
    ctx.font = '600 12px system-ui, sans-serif';
    ctx.textAlign = 'left';
    ctx.textBaseline = 'top';
    const title = ellipsize(base.title, Math.max(0, layout.frame.width - TITLE_PLATE_INSET), (t) => ctx.measureText(t).width);
    const width = ctx.measureText(title).width;
    ctx.fillStyle = 'rgba(255,255,255,0.88)';
    ctx.fillRect(2, 2, width + 8, 17);
    ctx.fillStyle = '#222222';
    ctx.fillText(title, 6, 4);
  }
  ctx.restore();
  return axes;
}

export interface TrajectoryLayerItem {
  points: Float64Array;
  count: number;
  /** Where a and b sit in each row of `points`. */
  layout: { stride: number; a: number; b: number };
  style: RunStyle;
  selected: boolean;
  label: string;
}

export interface OverlayLayer {
  layout: FrameLayout;
  view: ViewBox;
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
  // Every line first, then every run's markers, so no run's start, steps or end hide under another's line.
  for (const parts of ['lines', 'markers'] as const)
    for (const tr of overlay.trajectories) {
      drawTrajectory(ctx, tr.points, tr.count, t, tr.style, {
        layout: tr.layout,
        markerEvery: markerInterval(tr.count),
        lineWidth: tr.selected ? 2.75 : 1.75,
        parts,
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

