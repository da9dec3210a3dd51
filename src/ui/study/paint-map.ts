import { OUTCOME_KINDS, type ToleranceTarget } from '../../engine';
import type { StudyCellsState } from '../../store/study-store';
import { cellColour } from './study-colours';

/**
 * The map as resolution x resolution RGBA pixels, cell (i, j) at column i and row resolution - 1 - j
 * (the second axis grows upwards, as on the surface view). While the map fills in coarse-to-fine
 * order (sweep/grid.ts coarseToFineOrder), a cell not yet run takes the colour of the coarsest-level
 * cell at the corner of the block it lies in, so a fraction of the work already gives a full, blocky
 * picture; cells with nothing yet stay clear. A basin's colour is shaded by steps to tolerance when the
 * study measured them (`byTolerance`: a run that never came within the tolerance shades as the step
 * limit), else by the steps the run took; mapShade says which in words.
 */
export function paintStartMap(cells: StudyCellsState, resolution: number, maxSteps: number, byTolerance: boolean): Uint8ClampedArray<ArrayBuffer> {
  const out = new Uint8ClampedArray(resolution * resolution * 4);
  const top = 2 ** Math.floor(Math.log2(resolution));
  for (let j = 0; j < resolution; j++)
    for (let i = 0; i < resolution; i++) {
      let index = i + j * resolution;
      for (let s = 2; !cells.filled[index] && s <= top; s *= 2) index = (i - (i % s)) + (j - (j % s)) * resolution;
      if (!cells.filled[index]) continue;
      const shade = byTolerance ? (cells.stepsToTolerance[index] >= 0 ? cells.stepsToTolerance[index] : maxSteps) : cells.steps[index];
      const [r, g, b] = cellColour(cells.kind[index], cells.basin[index], shade, maxSteps);
      const p = (i + (resolution - 1 - j) * resolution) * 4;
      out[p] = r;
      out[p + 1] = g;
      out[p + 2] = b;
      out[p + 3] = 255;
    }
  return out;
}

/** What the map's shade means, for its legend and figure key: steps to tolerance, or steps where there is no target. */
export function mapShade(target: ToleranceTarget | null, maxSteps: number | null): string {
  const limit = maxSteps === null ? '–' : String(maxSteps);
  if (!target) return `${limit} steps at most; lighter = more steps taken (no known minimum, so no steps to tolerance)`;
  return `${limit} steps at most; lighter = more steps to tolerance, to a loss within ${target.tolerance} of the known minimum's ${+target.value.toPrecision(6)}; lightest = never within it`;
}

/** Rows of the legend: each basin and each other outcome present, with its count and share. */
export interface LegendRow {
  key: string;
  label: string;
  basin: number;
  kindIndex: number;
  count: number;
  share: number;
}

export function mapLegend(cells: StudyCellsState, basinLabels: readonly string[]): LegendRow[] {
  const basinCounts = new Map<number, number>();
  const kindCounts = new Map<number, number>();
  let filled = 0;
  for (let c = 0; c < cells.filled.length; c++) {
    if (!cells.filled[c]) continue;
    filled++;
    if (cells.basin[c] >= 0) basinCounts.set(cells.basin[c], (basinCounts.get(cells.basin[c]) ?? 0) + 1);
    else kindCounts.set(cells.kind[c], (kindCounts.get(cells.kind[c]) ?? 0) + 1);
  }
  const rows: LegendRow[] = [];
  for (const [basin, count] of [...basinCounts].sort((a, b) => a[0] - b[0]))
    rows.push({ key: `b${basin}`, label: basinLabels[basin] ?? `basin ${basin + 1}`, basin, kindIndex: -1, count, share: count / filled });
  for (const [kindIndex, count] of [...kindCounts].sort((a, b) => a[0] - b[0]))
    rows.push({ key: `k${kindIndex}`, label: OUTCOME_KINDS[kindIndex], basin: -1, kindIndex, count, share: count / filled });
  return rows;
}

