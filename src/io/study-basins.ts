import type { KnownPoint as BasinPoint } from '../engine';
import type { KnownPoint } from '../problems';

/**
 * What a study's basins are measured against (engine/study/basins.ts), shared by the page's study
 * panels and the command line: the surface's listed minima labelled by place, and a distance of 1% of
 * the diagonal of the box the study looks at (README, Studies).
 */
export function knownMinima(points: readonly KnownPoint[]): BasinPoint[] {
  return points
    .filter((p) => p.kind === 'global-min' || p.kind === 'local-min')
    .map((p) => ({ point: p.point, label: `minimum (${p.point.map((v) => +v.toPrecision(6)).join(', ')})` }));
}

/** The basin distance rule: 1% of the box's diagonal (the page uses its view; a start-point map's box is the view it was made from). */
export function basinRadiusOf(view: { a: readonly [number, number]; b: readonly [number, number] }): number {
  return 0.01 * Math.hypot(view.a[1] - view.a[0], view.b[1] - view.b[0]);
}
