/**
 * Figures of the surface view in each layout, drawn by the on-screen drawing functions (drawBase,
 * drawOverlay, drawLegend) so the export is what the page shows: the single map with its colour bar;
 * one panel per visible run; the optimizer x learning-rate table with its column and row heads. Each
 * has a key of the runs drawn and of the known-point glyphs on the slice.
 */
import { optimizerInfo, optimizerLabel } from '../../../engine';
import { viewShownBy, type AppState } from '../../../store/app-store';
import type { LiveRuns } from '../../../store/live-runs';
import { reportedUnits } from '../../../store/units';
import { canvasFont, drawLegend, ellipsize, PLOT_STYLE, type KnownPointKind, type PixelSize } from '../../plot';
import { axisTitles } from '../../view/axis-titles';
import { frameLayout, frameTransform } from '../../view/frame';
import { buildPicture, cachedPicture } from '../../view/picture';
import { ARROW_SPACING, COMPACT_ARROW_SPACING, planeArrows } from '../../view/plane-arrows';
import { drawBase, drawOverlay } from '../../view/scene';
import { knownPointsOnSlice, trajectoryItems } from '../../view/scene-input';
import { mainThreadSurface } from '../../view/use-surface';
import type { Figure, FigureContext } from '../compose';
import type { KeyEntry } from '../key';

/** Width of the colour-bar column beside a panel grid (as ColourBar.tsx draws it). */
export const BAR_COLUMN = 96;
const BAR_MAX_HEIGHT = 220;
const HEAD_ROW = 22;
const ROW_HEAD_COLUMN = 120;
const PANEL_GAP = 8;

const KNOWN_NAMES: Record<KnownPointKind, string> = { minimum: 'minimum', saddle: 'saddle point', maximum: 'maximum' };

/**
 * mapFigure once the contours of the grid the view has now are built: the page keeps showing the
 * previous picture while a new one is contoured, so an export made in that moment would otherwise
 * lose its contours and colour bar.
 */
export async function mapFigureWhenDrawn(state: () => AppState, live: LiveRuns): Promise<Figure> {
  const s = state();
  await buildPicture(s.grid, s.workspace.display, s.surfaceInfo.logScaleOffset);
  return mapFigure(state(), live);
}

export function mapFigure(s: AppState, live: LiveRuns): Figure {
  if (s.workspace.panels.mode === 'per-run') return perRunFigure(s, live);
  if (s.workspace.panels.mode === 'table') return tableFigure(s, live);
  const items = trajectoryItems(s, live);
  return {
    title: s.surfaceInfo.label,
    key: [...items.map((t) => ({ kind: 'run' as const, style: t.style, label: t.label })), ...knownKey(s)],
    drawBody: (ctx, size) => drawMap(ctx, s, live, size, { withLegend: true }),
  };
}

function perRunFigure(s: AppState, live: LiveRuns): Figure {
  const visible = s.workspace.runs.filter((r) => !r.hidden);
  const columns = Math.min(3, Math.max(1, visible.length));
  return {
    title: s.surfaceInfo.label,
    key: [...runKey(s, live, visible.map((r) => r.id)), ...knownKey(s)],
    keyPlacement: 'below',
    drawBody: (ctx, size) => {
      const grid = { width: size.width - BAR_COLUMN, height: size.height };
      const rows = Math.max(1, Math.ceil(visible.length / columns));
      const cell = { width: (grid.width - (columns - 1) * PANEL_GAP) / columns, height: (grid.height - (rows - 1) * PANEL_GAP) / rows };
      visible.forEach((r, k) => inBox(ctx, (k % columns) * (cell.width + PANEL_GAP), Math.floor(k / columns) * (cell.height + PANEL_GAP), () =>
        drawMap(ctx, s, live, cell, { runIds: [r.id], title: r.label }),
      ));
      drawColourBar(ctx, s, grid.width, size.height);
    },
  };
}

function tableFigure(s: AppState, live: LiveRuns): Figure {
  const cells = s.workspace.runs.filter((r) => r.cell);
  const { tableLearningRates: rates, tableOptimizers: kinds } = s.workspace.panels;
  return {
    title: s.surfaceInfo.label,
    key: [...runKey(s, live, cells.map((r) => r.id)), ...knownKey(s)],
    keyPlacement: 'below',
    drawBody: (ctx, size) => {
      const grid = { width: size.width - BAR_COLUMN - ROW_HEAD_COLUMN, height: size.height - HEAD_ROW };
      const columns = Math.max(1, rates.length);
      const rows = Math.max(1, kinds.length);
      const cell = { width: (grid.width - (columns - 1) * PANEL_GAP) / columns, height: (grid.height - (rows - 1) * PANEL_GAP) / rows };
      const widthOf = (t: string) => ctx.measureText(t).width;
      ctx.save();
      ctx.font = canvasFont(PLOT_STYLE.tickFontSize + 1);
      ctx.fillStyle = PLOT_STYLE.textColour;
      ctx.textAlign = 'center';
      ctx.textBaseline = 'middle';
      rates.forEach((lr, c) => ctx.fillText(ellipsize(`learning rate ${lr}`, cell.width - 4, widthOf), ROW_HEAD_COLUMN + c * (cell.width + PANEL_GAP) + cell.width / 2, HEAD_ROW / 2));
      ctx.textAlign = 'right';
      kinds.forEach((kind, row) => {
        const first = cells.find((r) => r.cell!.row === row);
        const label = first ? optimizerLabel(first.optimizer) : optimizerInfo(kind).label;
        ctx.fillText(ellipsize(label, ROW_HEAD_COLUMN - 8, widthOf), ROW_HEAD_COLUMN - 6, HEAD_ROW + row * (cell.height + PANEL_GAP) + cell.height / 2);
      });
      ctx.restore();
      for (const r of cells)
        inBox(ctx, ROW_HEAD_COLUMN + r.cell!.column * (cell.width + PANEL_GAP), HEAD_ROW + r.cell!.row * (cell.height + PANEL_GAP), () =>
          drawMap(ctx, s, live, cell, { runIds: [r.id], title: r.label }),
        );
      drawColourBar(ctx, s, size.width - BAR_COLUMN, size.height);
    },
  };
}

/** One map (contours, arrows, known points, axes, optional colour bar and title plate, trajectories) in a `size` box at the origin. */
function drawMap(ctx: FigureContext, s: AppState, live: LiveRuns, size: PixelSize, options: { withLegend?: boolean; runIds?: string[]; title?: string }): void {
  const layout = frameLayout(size, options.withLegend ?? false);
  const view = viewShownBy(s); // the box the screen shows (widened under equal scale), which the grid covers
  const surface = mainThreadSurface(s.workspace.surface);
  const n = s.surfaceInfo.variables.length;
  const arrows = s.workspace.display.showArrows && surface && surface.dimension === n
    ? planeArrows(surface, s.workspace.slice, frameTransform(view, layout), options.withLegend ? ARROW_SPACING : COMPACT_ARROW_SPACING)
    : [];
  drawBase(ctx, {
    layout,
    view,
    picture: cachedPicture(s.grid, s.workspace.display, s.surfaceInfo.logScaleOffset),
    axisLabels: axisTitles(s.workspace.slice, s.surfaceInfo.variables, reportedUnits(surface)),
    knownPoints: knownPointsOnSlice(s),
    arrows,
    title: options.title,
  });
  drawOverlay(ctx, { layout, view, hover: null, trajectories: trajectoryItems(s, live, options.runIds) });
}

function drawColourBar(ctx: FigureContext, s: AppState, x: number, height: number): void {
  const picture = cachedPicture(s.grid, s.workspace.display, s.surfaceInfo.logScaleOffset);
  if (!picture) return;
  const barHeight = Math.min(BAR_MAX_HEIGHT, height);
  inBox(ctx, x, 0, () => drawLegend(ctx, picture.legend, { px: 14, py: 18, width: 14, height: barHeight - 30 }, 'loss'));
}

function inBox(ctx: FigureContext, x: number, y: number, draw: () => void): void {
  ctx.save();
  ctx.translate(x, y);
  draw();
  ctx.restore();
}

function runKey(s: AppState, live: LiveRuns, ids: readonly string[]): KeyEntry[] {
  return trajectoryItems(s, live, ids).map((t) => ({ kind: 'run', style: t.style, label: t.label }));
}

/** One entry per known-point kind drawn on the slice. */
function knownKey(s: AppState): KeyEntry[] {
  const kinds = new Set(knownPointsOnSlice(s).map((p) => p.kind));
  return (['minimum', 'saddle', 'maximum'] as const).filter((k) => kinds.has(k)).map((k) => ({ kind: 'known', point: k, label: `known ${KNOWN_NAMES[k]}` }));
}
