/** What the store derives from a surface: whether the map can draw it, its default views and starts. */
import type { ViewBox } from '../engine';
import { describeSurface, type SurfaceSpec } from '../problems';
import { buildCheckedSurface } from './surface-cache';
import type { SurfaceInfo } from './app-state';
import type { SliceSettings } from './workspace';

/**
 * Builds the surface (throwing its specific error) and describes it; refuses a surface the map cannot
 * show, one of fewer than two variables.
 */
export function drawableSurface(spec: SurfaceSpec): SurfaceInfo {
  buildCheckedSurface(spec); // and kept for the views (surface-cache.ts), so it is built once
  const info = describeSurface(spec);
  const n = info.variables.length;
  if (n < 2) {
    const which = n ? `1 (${info.variables[0]})` : 'none';
    const hint = spec.kind === 'formula' ? '; list them under Variable order, for example "x, y"' : '';
    throw new Error(`the map needs two or more variables, this surface has ${which}${hint}`);
  }
  return info;
}

/** Default view of a slice: the surface's box on the two axes, or [-1, 1]^2 in a method plane's units. */
export function defaultView(info: SurfaceInfo, slice: SliceSettings, requested?: ViewBox): ViewBox {
  if (requested) return requested;
  if (slice.plane) return { a: [-1, 1], b: [-1, 1] };
  return viewFor(info.view, slice.axes);
}

export function viewFor(view: [number, number][], [i, j]: [number, number]): ViewBox {
  return { a: [...view[i]] as [number, number], b: [...view[j]] as [number, number] };
}

export function sameView(p: ViewBox, q: ViewBox): boolean {
  return p.a[0] === q.a[0] && p.a[1] === q.a[1] && p.b[0] === q.b[0] && p.b[1] === q.b[1];
}

export function insideBox(point: number[], box: [number, number][]): boolean {
  return point.length === box.length && point.every((x, i) => x >= box[i][0] && x <= box[i][1]);
}

export function suggestedStart(info: SurfaceInfo): number[] {
  return info.suggestedStart ?? info.view.map(([lo, hi]) => lo + 0.25 * (hi - lo));
}
