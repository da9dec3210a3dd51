import { resultsCsvOf, trajectoriesCsvOf } from '../../io/run-exports';
import type { AppState } from '../../store/app-store';
import type { LiveRuns } from '../../store/live-runs';
import { surfaceToSvg, type PixelSize } from '../plot';
import { frameLayout, frameTransform } from '../view/frame';
import { cachedPicture } from '../view/picture';
import { drawBase, drawOverlay, markerInterval } from '../view/scene';
import { knownPointsOnSlice, trajectoryItems } from '../view/scene-input';
import { mainThreadSurface } from '../view/use-surface';
import { reportedUnits } from '../../store/units';
import { axisTitles } from '../view/axis-titles';

/** Trajectories of every run, one row per run per step (columns in the README). */
export function trajectoriesCsv(s: AppState, live: LiveRuns): string {
  return trajectoriesCsvOf(s.runs, (id) => live.trajectory(id)?.asBatch(), s.surfaceInfo.variables, reportedUnits(mainThreadSurface(s.surface)));
}

/** The run table as shown on the page. */
export function resultsCsv(s: AppState): string {
  return resultsCsvOf(s.runs, (id) => s.status[id]?.summary, s.surfaceInfo, reportedUnits(mainThreadSurface(s.surface)));
}

/** The overlaid surface view drawn onto a fresh canvas at `scale` times the CSS size, as PNG. */
export function viewPng(s: AppState, live: LiveRuns, size: PixelSize, scale = 2): Promise<Blob> {
  const canvas = document.createElement('canvas');
  canvas.width = size.width * scale;
  canvas.height = size.height * scale;
  const ctx = canvas.getContext('2d')!;
  ctx.scale(scale, scale);
  const layout = frameLayout(size, true);
  drawBase(ctx, {
    layout,
    view: s.view,
    picture: cachedPicture(s.grid, s.display, s.surfaceInfo.logScaleOffset),
    axisLabels: axisTitles(s.slice, s.surfaceInfo.variables, reportedUnits(mainThreadSurface(s.surface))),
    knownPoints: knownPointsOnSlice(s),
    arrows: [],
    title: s.surfaceInfo.label,
  });
  drawOverlay(ctx, { layout, view: s.view, hover: null, trajectories: trajectoryItems({ ...s, selectedRunId: null }, live) });
  return new Promise((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the browser could not encode the PNG'))), 'image/png'));
}

/** The same view as a standalone SVG document. */
export function viewSvg(s: AppState, live: LiveRuns, size: PixelSize): string {
  const layout = frameLayout(size, true);
  const picture = cachedPicture(s.grid, s.display, s.surfaceInfo.logScaleOffset);
  return surfaceToSvg({
    transform: frameTransform(s.view, layout),
    title: s.surfaceInfo.label,
    bands: picture?.bands,
    colours: picture?.colours,
    grid: picture?.grid,
    axes: axisTitles(s.slice, s.surfaceInfo.variables, reportedUnits(mainThreadSurface(s.surface))),
    legend: picture ? { model: picture.legend, title: 'loss' } : undefined,
    knownPoints: knownPointsOnSlice(s),
    trajectories: trajectoryItems(s, live).map((t) => ({
      points: t.points,
      count: t.count,
      style: t.style,
      label: t.label,
      options: { layout: t.layout, markerEvery: markerInterval(t.count) },
    })),
  });
}
