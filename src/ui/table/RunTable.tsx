import { outcomeDetail, outcomeLabel } from '../../engine';
import { formatValue } from '../plot';
import { useActions, useApp } from '../app-context';
import { NumberField } from '../fields/NumberField';
import { RunGlyph } from '../runs/RunGlyph';

/** One row per run: how it ended, how far it got, and how close to a known minimum. */
export function RunTable() {
  const actions = useActions();
  const runs = useApp((s) => s.runs);
  const status = useApp((s) => s.status);
  const info = useApp((s) => s.surfaceInfo);
  const tolerance = useApp((s) => s.tolerance);
  const minima = info.knownPoints.filter((p) => p.kind === 'global-min' || p.kind === 'local-min');
  const hasGlobal = info.knownPoints.some((p) => p.kind === 'global-min');

  return (
    <section className="panel table-panel" aria-label="Results">
      <div className="panel-head">
        <h2>Results</h2>
        {hasGlobal && (
          <NumberField
            compact
            label="tolerance for 'steps to minimum'"
            value={tolerance}
            onCommit={(v) => {
              if (v === undefined || !(v >= 0)) return 'tolerance: must be a number >= 0';
              actions.setTolerance(v);
              return null;
            }}
          />
        )}
      </div>
      <div className="table-scroll">
        <table className="run-table" data-testid="run-table">
          <thead>
            <tr>
              <th scope="col">Run</th>
              <th scope="col">Outcome</th>
              <th scope="col">Steps</th>
              <th scope="col">Final loss</th>
              <th scope="col">Final point</th>
              <th scope="col">Nearest known min.</th>
              <th scope="col" title="First step whose loss came within the tolerance of the lowest known minimum">Steps to min. ± tol.</th>
              <th scope="col" title="Surface evaluations, line searches included">Evals</th>
            </tr>
          </thead>
          <tbody>
            {runs.map((r) => {
              const st = status[r.id];
              const s = st?.summary;
              const near = s?.nearestMinimum ? minima[s.nearestMinimum.index] : null;
              return (
                <tr key={r.id} data-run-id={r.id}>
                  <th scope="row">
                    <RunGlyph style={r.style} /> {r.label}
                  </th>
                  <td data-col="outcome" data-outcome={s?.outcome?.kind} title={s?.outcome ? outcomeDetail(s.outcome) : undefined}>{st?.phase === 'error' ? `error: ${st.error?.message}` : s?.outcome ? outcomeLabel(s.outcome) : st ? st.phase : '—'}</td>
                  <td data-col="steps">{s ? s.steps : '—'}</td>
                  <td data-col="final-loss" data-value={s ? String(s.finalLoss) : ''}>
                    {s && Number.isFinite(s.finalLoss) ? formatValue(s.finalLoss) : '—'}
                  </td>
                  <td data-col="final-point" className="mono">
                    {s?.finalPoint.length ? pointText(s.finalPoint) : '—'}
                  </td>
                  <td data-col="nearest">
                    {near && s?.nearestMinimum ? `${formatValue(s.nearestMinimum.distance)} from (${near.point.map(formatValue).join(', ')})` : '—'}
                  </td>
                  <td data-col="steps-to-tolerance">{!hasGlobal ? 'no known minimum' : s?.stepsToTolerance ?? 'not yet'}</td>
                  <td data-col="evaluations">{st?.evaluations ?? '—'}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/** A point as text; long parameter vectors are shortened (the CSV export has every coordinate). */
function pointText(x: number[]): string {
  return x.length <= 4 ? `(${x.map(formatValue).join(', ')})` : `(${x.slice(0, 3).map(formatValue).join(', ')}, … ${x.length} values)`;
}
