/**
 * The page's two CSV exports built from plain data (run configs, their trajectories and summaries), so
 * the page and the command line write the same bytes for the same runs. Columns are in the README.
 * Points are written in the reported units (units.ts: the data's original units for a standardised
 * data-fit surface), so the files say what the page's tables say.
 */
import { optimizerLabel } from '../engine';
import type { KnownPoint } from '../problems';
import { CSV_LINE_END, runTableCsv, trajectoryCsv, type RunSummaryRow, type TrajectoryExportRun } from './csv';
import type { RunConfig } from './experiment/types';
import { formatValue } from './number-text';
import type { ReferenceMinimum, RunSummary } from './run-summary';
import { IDENTITY_UNITS, type ReportedUnits } from './units';

type Batch = TrajectoryExportRun['batch'];

/** What the summaries measure distance to: the known minima, when the surface has a global one. */
export function referenceMinima(knownPoints: readonly KnownPoint[]): ReferenceMinimum[] {
  const minima = listedMinima(knownPoints);
  return minima.some((p) => p.kind === 'global-min') ? minima : [];
}

/** Trajectories of every run that has one, in the order of `runs`. */
export function trajectoriesCsvOf(runs: readonly Pick<RunConfig, 'id' | 'label' | 'optimizer'>[], trajectoryOf: (id: string) => Batch | undefined, variables: readonly string[], units: ReportedUnits = IDENTITY_UNITS): string {
  const rows: TrajectoryExportRun[] = [];
  for (const r of runs) {
    const batch = trajectoryOf(r.id);
    if (batch) rows.push({ id: r.id, label: r.label, optimizer: optimizerLabel(r.optimizer), learningRate: r.optimizer.learningRate, variables, batch: { ...batch, points: reportedPoints(batch.points, batch.count, batch.dimension, units) } });
  }
  return trajectoryCsv(rows);
}

/** count x n points in the reported units (the same array when they are the surface's own). */
export function reportedPoints(points: Float64Array, count: number, n: number, units: ReportedUnits): Float64Array {
  if (!units.standardised) return points;
  const out = new Float64Array(count * n);
  for (let k = 0; k < count; k++) out.set(units.toReported(points.subarray(k * n, (k + 1) * n)), k * n);
  return out;
}

/**
 * The same text as `trajectoriesCsvOf`, in pieces of one run each (the header with the first), so a
 * long sweep is never held as one string. All runs share `variables`, so every run's header is the same.
 */
export function* trajectoriesCsvPieces(runs: readonly Pick<RunConfig, 'id' | 'label' | 'optimizer'>[], trajectoryOf: (id: string) => Batch | undefined, variables: readonly string[], units: ReportedUnits = IDENTITY_UNITS): Generator<string> {
  const recorded = runs.filter((r) => trajectoryOf(r.id) !== undefined);
  if (!recorded.length) return yield trajectoriesCsvOf([], trajectoryOf, variables, units);
  for (const [k, run] of recorded.entries()) {
    const text = trajectoriesCsvOf([run], trajectoryOf, variables, units);
    yield k === 0 ? text : text.slice(text.indexOf(CSV_LINE_END) + CSV_LINE_END.length);
  }
}

/** The run table, one row per run (a run without a summary is written as still running). */
export function resultsCsvOf(
  runs: readonly Pick<RunConfig, 'id' | 'label' | 'optimizer'>[],
  summaryOf: (id: string) => RunSummary | undefined,
  surface: { variables: readonly string[]; knownPoints: readonly KnownPoint[] },
  units: ReportedUnits = IDENTITY_UNITS,
): string {
  const minima = listedMinima(surface.knownPoints);
  const rows: RunSummaryRow[] = runs.map((r) => {
    const sum = summaryOf(r.id);
    const near = sum?.nearestMinimum ?? null;
    const finalPoint = sum?.finalPoint.length ? units.toReported(sum.finalPoint) : [];
    const minimum = near ? units.toReported(minima[near.index].point) : null;
    return {
      id: r.id,
      label: r.label,
      optimizer: optimizerLabel(r.optimizer),
      learningRate: r.optimizer.learningRate,
      outcome: sum?.outcome ?? null,
      steps: sum?.steps ?? 0,
      finalLoss: sum?.finalLoss ?? Number.NaN,
      variables: surface.variables,
      finalPoint,
      // In reported units the distance is measured again there (a standardised surface's own distance differs).
      distanceToNearestMinimum: !near || !minimum ? null : units.standardised && finalPoint.length ? Math.hypot(...finalPoint.map((v, k) => v - minimum[k])) : near.distance,
      nearestMinimum: minimum ? `(${minimum.map(formatValue).join(', ')})` : null,
      // A bound (see RunSummary) is not the first step, so the column is left empty.
      stepsToTolerance: sum?.stepsToToleranceIsBound ? null : sum?.stepsToTolerance ?? null,
    };
  });
  return runTableCsv(rows);
}

function listedMinima(knownPoints: readonly KnownPoint[]): KnownPoint[] {
  return knownPoints.filter((p) => p.kind === 'global-min' || p.kind === 'local-min');
}
