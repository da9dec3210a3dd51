import { gridRangeForProjection, hasParameterGroups, pcaPlane, randomPlane, type Surface } from '../../engine';
import type { TrajectoryBuffer } from '../../store/trajectory-buffer';
import type { PlaneSlice } from '../../store/workspace';
import type { ViewBox } from '../../engine';

/**
 * A filter-normalised random plane through `centre` (Li, Xu, Taylor, Studer & Goldstein, NeurIPS 2018),
 * drawn over [-1, 1]^2: a and b are multiples of the two directions, each scaled per filter to the
 * size of the centre's weights, so a = 1 moves every filter by its own norm.
 */
export function randomPlaneSlice(surface: Surface, centre: number[], seed: number, centreLabel: string): { plane: PlaneSlice; view: ViewBox } {
  const groups = hasParameterGroups(surface) ? surface.parameterGroups : undefined;
  const p = randomPlane(centre, groups, seed, { zeroBlocks: 'unit' });
  return {
    plane: {
      method: 'random',
      origin: [...p.origin],
      u: [...p.u],
      v: [...p.v],
      labels: ['direction 1 (filter-normalised)', 'direction 2 (filter-normalised)'],
      note: `Random plane through ${centreLabel}, seed ${seed}, directions normalised filter by filter (Li et al. 2018); biases held.`,
    },
    view: { a: [-1, 1], b: [-1, 1] },
  };
}

/**
 * The plane of a run's first two principal directions, through its last point (Li et al. 2018), with a
 * view that covers the run's projected path.
 */
export function pcaPlaneSlice(buffer: TrajectoryBuffer, runLabel: string): { plane: PlaneSlice; view: ViewBox } {
  const n = buffer.dimension;
  const p = pcaPlane(buffer.points.subarray(0, buffer.count * n), buffer.count, n);
  const pct = (r: number) => `${(100 * r).toFixed(1)}%`;
  const range = gridRangeForProjection(p.projected);
  return {
    plane: {
      method: 'pca',
      origin: [...p.plane.origin],
      u: [...p.plane.u],
      v: [...p.plane.v],
      labels: [`PC1 (${pct(p.explained[0])} of the path)`, `PC2 (${pct(p.explained[1])} of the path)`],
      note:
        `Plane of ${runLabel}'s first two principal directions through its last point; together they explain ${pct(p.explained[0] + p.explained[1])} of its squared distance from there.` +
        (p.rank < 2 ? ' The path is straight, so the second direction is arbitrary.' : ''),
    },
    view: range,
  };
}
