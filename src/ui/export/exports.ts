import { optimizerLabel } from '../../engine';
import { runTableCsv, trajectoryCsv, type RunSummaryRow, type TrajectoryExportRun } from '../../io/csv';
import type { AppState } from '../../store/app-store';
import type { LiveRuns } from '../../store/live-runs';
import { formatValue, surfaceToSvg, type PixelSize } from '../plot';
import { frameLayout, frameTransform } from '../view/frame';
import { cachedPicture } from '../view/picture';
import { drawBase, drawOverlay, markerInterval } from '../view/scene';
import { knownPointsOnSlice, trajectoryItems } from '../view/scene-input';
import { mainThreadSurface } from '../view/use-surface';
import { reportedUnits, type ReportedUnits } from '../../store/units';
import { axisTitles } from '../view/axis-titles';

/** The points of a batch (count x n, row-major) in the reported units (a copy when they differ). */
export function reportedPoints(points: Float64Array, count: number, n: number, units: ReportedUnits): Float64Array {
  if (!units.standardised) return points;
  const out = new Float64Array(count * n);
  for (let k = 0; k < count; k++) out.set(units.toReported(points.subarray(k * n, (k + 1) * n)), k * n);
  return out;
}

/** Trajectories of every run, one row per run per step (columns in the README). */
export function trajectoriesCsv(s: AppState, live: LiveRuns): string {
  const runs: TrajectoryExportRun[] = [];
  const units = reportedUnits(mainThreadSurface(s.surface));
  for (const r of s.runs) {
    const b = live.trajectory(r.id);
    if (!b) continue;
    const batch = b.asBatch();
    const points = reportedPoints(batch.points, batch.count, batch.dimension, units);
    runs.push({ id: r.id, label: r.label, optimizer: optimizerLabel(r.optimizer), learningRate: r.optimizer.learningRate, variables: s.surfaceInfo.variables, batch: { ...batch, points } });
  }
  return trajectoryCsv(runs);
}

/** The run table as shown on the page. */
export function resultsCsv(s: AppState): string {
  const minima = s.surfaceInfo.knownPoints.filter((p) => p.kind === 'global-min' || p.kind === 'local-min');
  const units = reportedUnits(mainThreadSurface(s.surface));
  const rows: RunSummaryRow[] = s.runs.map((r) => {
    const sum = s.status[r.id]?.summary;
    const near = sum?.nearestMinimum ?? null;
    return {
      id: r.id,
      label: r.label,
      optimizer: optimizerLabel(r.optimizer),
      learningRate: r.optimizer.learningRate,
      outcome: sum?.outcome ?? null,
      steps: sum?.steps ?? 0,
      finalLoss: sum?.finalLoss ?? Number.NaN,
      variables: s.surfaceInfo.variables,
      finalPoint: sum?.finalPoint.length ? units.toReported(sum.finalPoint) : [],
      distanceToNearestMinimum: !near ? null : units.standardised && sum?.finalPoint.length ? Math.hypot(...units.toReported(sum.finalPoint).map((v, k) => v - units.toReported(minima[near.index].point)[k])) : near.distance,
      nearestMinimum: near ? `(${units.toReported(minima[near.index].point).map(formatValue).join(', ')})` : null,
      stepsToTolerance: sum?.stepsToTolerance ?? null,
    };
  });
  return runTableCsv(rows);
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
