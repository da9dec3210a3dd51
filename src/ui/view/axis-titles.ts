import { sliceTitles } from '../../store/slice-plane';
import { coordinateTitle, type ReportedUnits } from '../../store/units';
import type { SliceSettings } from '../../store/workspace';

/**
 * The map's axis titles. The map is drawn in the surface's own coordinates, so on a standardised
 * data-fit surface two chosen parameters are titled "(standardised)"; a method plane's directions are
 * titled by the plane.
 */
export function axisTitles(slice: SliceSettings, variables: readonly string[], units: ReportedUnits): { a: string; b: string } {
  const t = sliceTitles(slice, variables);
  if (slice.plane) return t;
  return { a: coordinateTitle(t.a, units), b: coordinateTitle(t.b, units) };
}
