import { projectToPlane } from '../../engine';
import type { AppState } from '../../store/app-store';
import type { Workspace } from '../../store/workspace';
import type { LiveRuns } from '../../store/live-runs';
import { onPlane, sliceAxes, slicePlane } from '../../store/slice-plane';
import { runStyle, type KnownPoint as PlotKnownPoint } from '../plot';
import { projectedTrajectory } from './projection';
import type { TrajectoryLayerItem } from './scene';

export const KIND_OF_POINT = { 'global-min': 'minimum', 'local-min': 'minimum', 'local-max': 'maximum', saddle: 'saddle' } as const;

type SceneState = Pick<AppState, 'surfaceInfo' | 'selectedRunId'> & { workspace: Pick<Workspace, 'slice' | 'display' | 'runs'> };

/** Known stationary points that lie on the current slice, in slice coordinates. */
export function knownPointsOnSlice(s: SceneState): PlotKnownPoint[] {
  if (!s.workspace.display.showKnownPoints) return [];
  const n = s.surfaceInfo.variables.length;
  const plane = slicePlane(s.workspace.slice, n);
  return s.surfaceInfo.knownPoints
    .filter((p) => p.point.length === n && onPlane(plane, p.point))
    .map((p) => ({ at: projectToPlane(plane, p.point), kind: KIND_OF_POINT[p.kind] }));
}

/** The trajectories to draw: visible runs (or only `runIds`), on axis slices read in place, else projected. */
export function trajectoryItems(s: SceneState, live: LiveRuns, runIds?: readonly string[]): TrajectoryLayerItem[] {
  const n = s.surfaceInfo.variables.length;
  const axes = sliceAxes(s.workspace.slice);
  const plane = slicePlane(s.workspace.slice, n);
  const items: TrajectoryLayerItem[] = [];
  for (const r of s.workspace.runs) {
    if (r.hidden || (runIds && !runIds.includes(r.id))) continue;
    const buffer = live.trajectory(r.id);
    if (!buffer || buffer.count === 0 || buffer.dimension !== n) continue;
    const style = runStyle(r.style);
    const selected = r.id === s.selectedRunId;
    if (axes) items.push({ points: buffer.points, count: buffer.count, layout: { stride: n, a: axes[0], b: axes[1] }, style, selected, label: r.label });
    else {
      const p = projectedTrajectory(buffer, plane);
      items.push({ points: p.points, count: p.count, layout: { stride: 2, a: 0, b: 1 }, style, selected, label: r.label });
    }
  }
  return items;
}
