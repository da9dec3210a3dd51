import type { KnownPoint as BasinPoint } from '../../engine';
import type { KnownPoint } from '../../problems';

/** The surface's listed minima as the basins a study measures end points against, labelled by place. */
export function knownMinima(points: readonly KnownPoint[]): BasinPoint[] {
  return points
    .filter((p) => p.kind === 'global-min' || p.kind === 'local-min')
    .map((p) => ({ point: p.point, label: `minimum (${p.point.map((v) => +v.toPrecision(6)).join(', ')})` }));
}

/** The basin distance rule the page uses: 1% of the view's diagonal (README, Studies). */
export function basinRadiusOf(view: { a: readonly [number, number]; b: readonly [number, number] }): number {
  return 0.01 * Math.hypot(view.a[1] - view.a[0], view.b[1] - view.b[0]);
}
