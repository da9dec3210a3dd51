import { axisPlane, distanceToPlane, planePoint, type SlicePlane } from '../engine';
import type { SliceSettings } from './workspace';

const planes = new WeakMap<SliceSettings, SlicePlane>();

/**
 * The plane the view shows: the stored method plane, or the one spanned by the two chosen variables.
 * The same settings object always gives the same plane object, so drawing caches can key on it.
 */
export function slicePlane(slice: SliceSettings, dimension: number): SlicePlane {
  const known = planes.get(slice);
  if (known && known.origin.length === dimension) return known;
  let plane: SlicePlane;
  if (slice.plane) plane = { origin: slice.plane.origin, u: slice.plane.u, v: slice.plane.v };
  else plane = axisPlane(Array.from({ length: dimension }, (_, k) => slice.at[k] ?? 0), slice.axes[0], slice.axes[1]);
  planes.set(slice, plane);
  return plane;
}

/** Whether x lies on the plane (to rounding), e.g. a known minimum worth marking on the slice. */
export function onPlane(plane: SlicePlane, x: readonly number[]): boolean {
  const scale = 1 + Math.hypot(...x);
  return distanceToPlane(plane, x) <= 1e-9 * scale;
}

/** Full coordinates of the slice point (a, b). */
export function slicePoint(slice: SliceSettings, dimension: number, a: number, b: number): number[] {
  return Array.from(planePoint(slicePlane(slice, dimension), a, b, new Float64Array(dimension)));
}

/** For an axis slice, the two coordinates that are a and b (so points need no projection); else null. */
export function sliceAxes(slice: SliceSettings): [number, number] | null {
  return slice.plane ? null : slice.axes;
}

export function sliceTitles(slice: SliceSettings, variables: readonly string[]): { a: string; b: string } {
  if (slice.plane) return { a: slice.plane.labels[0], b: slice.plane.labels[1] };
  return { a: variables[slice.axes[0]] ?? 'a', b: variables[slice.axes[1]] ?? 'b' };
}
