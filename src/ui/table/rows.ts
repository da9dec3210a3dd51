import { optimizerLabel, outcomeDetail, outcomeLabel } from '../../engine';
import type { AppState } from '../../store/app-store';
import type { ReportedUnits } from '../../store/units';
import type { ResultRow } from './columns';
import { runErrorMessage } from '../messages';

/** One row per run from the store, every coordinate in the reported units. */
export function resultRows(s: Pick<AppState, 'status' | 'surfaceInfo'> & { workspace: Pick<AppState['workspace'], 'runs'> }, units: ReportedUnits): ResultRow[] {
  const minima = s.surfaceInfo.knownPoints.filter((p) => p.kind === 'global-min' || p.kind === 'local-min');
  const hasGlobal = s.surfaceInfo.knownPoints.some((p) => p.kind === 'global-min');
  return s.workspace.runs.map((r) => {
    const st = s.status[r.id];
    const sum = st?.summary;
    const near = sum?.nearestMinimum ? minima[sum.nearestMinimum.index] : null;
    const outcome = st?.phase === 'error' ? `error: ${st.error ? runErrorMessage(st.error.message, r.optimizer.kind) : 'unknown'}` : sum?.outcome ? outcomeLabel(sum.outcome) : st ? st.phase : '—';
    const point = sum?.finalPoint.length ? units.toReported(sum.finalPoint) : [];
    const nearestPoint = near ? units.toReported(near.point) : null;
    // The distance in the reported units (the summary's is in the surface's own coordinates).
    const nearestDistance = !near || !sum?.nearestMinimum ? null : units.standardised ? Math.hypot(...point.map((v, k) => v - nearestPoint![k])) : sum.nearestMinimum.distance;
    return {
      id: r.id,
      label: r.label,
      style: r.style,
      optimizer: optimizerLabel(r.optimizer),
      learningRate: r.optimizer.learningRate,
      outcome,
      outcomeKind: sum?.outcome?.kind,
      outcomeTitle: sum?.outcome ? outcomeDetail(sum.outcome) : undefined,
      steps: sum ? sum.steps : null,
      maxSteps: r.settings.stop.maxSteps,
      finalLoss: sum?.finalLoss ?? Number.NaN,
      bestLoss: sum?.bestLoss ?? Number.NaN,
      point,
      nearestDistance,
      nearestPoint,
      stepsToTolerance: !hasGlobal ? 'none' : sum?.stepsToTolerance ?? null,
      stepsToToleranceIsBound: sum?.stepsToToleranceIsBound ?? false,
      evaluations: st?.evaluations ?? null,
    };
  });
}
