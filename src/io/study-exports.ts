/**
 * A study's CSV from all its ended cells, as the command line writes it (one process or merged
 * shards: the same bytes). Rows come from study-csv.ts `studyRows`, the page's builder. Basins are
 * assigned by the page's rule (engine/study BasinTracker over the known minima, 1% of the box's
 * diagonal, study-basins.ts) one cell at a time in the study's run order (engine/study `studyOrder`:
 * coarse to fine for a map), so the labels do not depend on how the cells were split or when they
 * ended. Learning-rate sweeps have no basins, as on the page.
 */
import { BasinTracker, studyOrder, studySize, type StudyCellResults, type StudySpec, type Surface } from '../engine';
import type { KnownPoint } from '../problems';
import { basinRadiusOf, knownMinima } from './study-basins';
import { STUDY_CSV, studyCsv, studyRows, type StudyCellTable } from './study-csv';
import type { ViewBox } from '../engine';

/** Cells from any number of pieces (shards, threads) into one table by cell index; every cell exactly once. */
export function cellTable(spec: StudySpec, n: number, pieces: readonly StudyCellResults[]): StudyCellTable {
  const size = studySize(spec);
  const table: StudyCellTable = { filled: new Uint8Array(size), steps: new Int32Array(size), loss: new Float64Array(size), endPoints: new Float64Array(size * n), stepsToTolerance: new Int32Array(size).fill(-1), outcomes: new Array(size) };
  for (const p of pieces)
    p.indices.forEach((cell, k) => {
      if (!(cell >= 0 && cell < size)) throw new Error(`study cells: cell ${cell} is outside 0..${size - 1}`);
      if (table.filled[cell]) throw new Error(`study cells: cell ${cell} was computed twice`);
      table.filled[cell] = 1;
      table.steps[cell] = p.steps[k];
      table.loss[cell] = p.loss[k];
      table.stepsToTolerance[cell] = p.stepsToTolerance[k];
      table.endPoints.set(p.endPoints.subarray(k * n, (k + 1) * n), cell * n);
      table.outcomes[cell] = p.outcomes[k];
    });
  const missing = table.filled.indexOf(0);
  if (missing >= 0) throw new Error(`study cells: cell ${missing} of ${size} is missing`);
  return table;
}

/** Basin label per cell (null: none), assigned in run order. */
export function studyBasins(spec: StudySpec, table: StudyCellTable, n: number, knownPoints: readonly KnownPoint[], view: ViewBox): (string | null)[] {
  const labels: (string | null)[] = new Array(table.filled.length).fill(null);
  if (spec.kind === 'lr-sweep') return labels;
  const tracker = new BasinTracker(knownMinima(knownPoints), basinRadiusOf(spec.kind === 'start-map' ? spec.box : view));
  for (const cell of studyOrder(spec)) {
    const basin = tracker.assign(table.endPoints.subarray(cell * n, (cell + 1) * n), table.outcomes[cell]!.kind);
    if (basin >= 0) labels[cell] = tracker.labels[basin];
  }
  return labels;
}

export function studyCsvOf(spec: StudySpec, surface: Surface, info: { variables: readonly string[]; knownPoints: readonly KnownPoint[] }, view: ViewBox, table: StudyCellTable): string {
  const basins = studyBasins(spec, table, surface.dimension, info.knownPoints, view);
  return studyCsv(STUDY_CSV[spec.kind].name, info.variables, studyRows(spec, surface, table, (c) => basins[c]));
}
