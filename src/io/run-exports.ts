/**
 * The page's two CSV exports built from plain data (run configs, their trajectories and summaries), so
 * the page and the command line write the same bytes for the same runs. Columns are in the README.
 */
import { optimizerInfo, type TrajectoryBatch } from '../engine';
import type { KnownPoint } from '../problems';
import { CSV_LINE_END, runTableCsv, trajectoryCsv, type RunSummaryRow, type TrajectoryExportRun } from './csv';
import type { RunConfig } from './experiment/types';
import { formatValue } from './number-text';
import type { ReferenceMinimum, RunSummary } from './run-summary';

type Batch = TrajectoryExportRun['batch'];

/** What the summaries measure distance to: the known minima, when the surface has a global one. */
export function referenceMinima(knownPoints: readonly KnownPoint[]): ReferenceMinimum[] {
  const minima = listedMinima(knownPoints);
  return minima.some((p) => p.kind === 'global-min') ? minima : [];
}

/** Trajectories of every run that has one, in the order of `runs`. */
export function trajectoriesCsvOf(runs: readonly Pick<RunConfig, 'id' | 'label' | 'optimizer'>[], trajectoryOf: (id: string) => Batch | undefined, variables: readonly string[]): string {
  const rows: TrajectoryExportRun[] = [];
  for (const r of runs) {
    const batch = trajectoryOf(r.id);
    if (batch) rows.push({ id: r.id, label: r.label, optimizer: optimizerInfo(r.optimizer.kind).label, learningRate: r.optimizer.learningRate, variables, batch });
  }
  return trajectoryCsv(rows);
}

/**
 * The same text as `trajectoriesCsvOf`, in pieces of one run each (the header with the first), so a
 * long sweep is never held as one string. All runs share `variables`, so every run's header is the same.
 */
export function* trajectoriesCsvPieces(runs: readonly Pick<RunConfig, 'id' | 'label' | 'optimizer'>[], trajectoryOf: (id: string) => Batch | undefined, variables: readonly string[]): Generator<string> {
  const recorded = runs.filter((r) => trajectoryOf(r.id) !== undefined);
  if (!recorded.length) return yield trajectoriesCsvOf([], trajectoryOf, variables);
  for (const [k, run] of recorded.entries()) {
    const text = trajectoriesCsvOf([run], trajectoryOf, variables);
    yield k === 0 ? text : text.slice(text.indexOf(CSV_LINE_END) + CSV_LINE_END.length);
  }
}

/** The run table, one row per run (a run without a summary is written as still running). */
export function resultsCsvOf(
  runs: readonly Pick<RunConfig, 'id' | 'label' | 'optimizer'>[],
  summaryOf: (id: string) => RunSummary | undefined,
  surface: { variables: readonly string[]; knownPoints: readonly KnownPoint[] },
): string {
  const minima = listedMinima(surface.knownPoints);
  const rows: RunSummaryRow[] = runs.map((r) => {
    const sum = summaryOf(r.id);
    const near = sum?.nearestMinimum ?? null;
    return {
      id: r.id,
      label: r.label,
      optimizer: optimizerInfo(r.optimizer.kind).label,
      learningRate: r.optimizer.learningRate,
      outcome: sum?.outcome ?? null,
      steps: sum?.steps ?? 0,
      finalLoss: sum?.finalLoss ?? Number.NaN,
      variables: surface.variables,
      finalPoint: sum?.finalPoint ?? [],
      distanceToNearestMinimum: near?.distance ?? null,
      nearestMinimum: near ? `(${minima[near.index].point.map(formatValue).join(', ')})` : null,
      stepsToTolerance: sum?.stepsToTolerance ?? null,
    };
  });
  return runTableCsv(rows);
}

function listedMinima(knownPoints: readonly KnownPoint[]): KnownPoint[] {
  return knownPoints.filter((p) => p.kind === 'global-min' || p.kind === 'local-min');
}
