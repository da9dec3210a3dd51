import { useEffect, useRef, useState } from 'react';
import { logSpaced, OUTCOME_KINDS, type LearningRateSweepSpec } from '../../engine';
import { STUDY_CSV, studyCsv, studyRows } from '../../io/study-csv';
import { studyOfKind } from '../../store/app-store';
import { useActions, useApp } from '../app-context';
import { download } from '../export/download';
import { useMainThreadSurface } from '../view/use-surface';
import { runStyle } from '../plot';
import { drawRateChart, type RateCurve } from './rate-chart';
import { studyTarget } from './basin-inputs';
import { useStudy, useStudyStore } from './study-context';
import { FigureExport, sizeOf } from '../figure/FigureExport';
import { rateSweepFigure } from '../figure/views/study-figures';

const COUNTS = [16, 32, 64, 128, 256] as const;
const fmt = (v: number) => String(+v.toPrecision(4));

/**
 * Learning-rate sweep: chosen runs' optimizers at log-spaced learning rates from one start; final loss
 * against learning rate, the observed divergence threshold (refined by bisection) and, for gradient
 * descent and heavy-ball momentum, the threshold predicted from the Hessian at the start. The sweep
 * last started here, or opened from a file, is the workspace's set-up sweep (saved in the experiment
 * file, with this panel's current range and count); "Run as set up" runs it exactly as written.
 */
export function RateSweepPanel() {
  const study = useStudyStore();
  const all = useStudy((s) => s);
  const runs = useApp((s) => s.workspace.runs);
  const selected = useApp((s) => s.selectedRunId);
  const surface = useApp((s) => s.workspace.surface);
  const info = useApp((s) => s.surfaceInfo);
  const tolerance = useApp((s) => s.workspace.tolerance);
  const studySurface = useMainThreadSurface(all.surface ?? surface);
  const [chosen, setChosen] = useState<string[]>(() => runs.slice(0, 3).map((r) => r.id));
  const actions = useActions();
  const setUp = useApp((s) => studyOfKind(s.workspace.studies, 'lr-sweep'));
  const [range, setRangeState] = useState<[number, number]>(setUp?.range ?? [1e-4, 1]);
  const [count, setCountState] = useState(setUp?.count ?? 64);
  useEffect(() => {
    if (!setUp) return;
    setRangeState(setUp.range);
    setCountState(setUp.count);
  }, [setUp]);
  /** A changed range or count also changes the set-up sweep, so the saved experiment has the panel's settings. */
  const setRange = (r: [number, number]) => {
    setRangeState(r);
    if (setUp && r[0] > 0 && r[1] > r[0] && Number.isFinite(r[1])) actions.setStudy({ ...setUp, range: r });
  };
  const setCount = (c: number) => {
    setCountState(c);
    if (setUp) actions.setStudy({ ...setUp, count: c });
  };
  const counts = COUNTS.includes(count as never) ? COUNTS : [...COUNTS, count].sort((x, y) => x - y);
  const canvas = useRef<HTMLCanvasElement>(null);
  const body = useRef<HTMLDivElement>(null);
  const startRun = runs.find((r) => r.id === selected) ?? runs[0];
  const picked = runs.filter((r) => chosen.includes(r.id));
  const mine = all.spec?.kind === 'lr-sweep';
  const spec = mine ? (all.spec as LearningRateSweepSpec) : null;
  const problem = !startRun ? 'Add a run first.' : picked.length === 0 ? 'Choose at least one run whose optimizer to sweep.' : !(range[0] > 0 && range[1] > range[0]) ? `the range must satisfy 0 < low < high, got ${range[0]} to ${range[1]}` : null;

  const start = () => {
    if (problem || !startRun) return;
    const s: LearningRateSweepSpec = {
      kind: 'lr-sweep', optimizers: picked.map((r) => ({ label: r.label, spec: r.optimizer })), stop: startRun.settings.stop, seed: startRun.settings.seed,
      start: startRun.settings.start.slice(), range, count,
    };
    actions.setStudy(s);
    study.start({ surface, variables: info.variables, spec: s, configLabel: startRun.label, known: [], basinRadius: 1, target: studyTarget(info.knownPoints, tolerance) });
  };
  const runSetUp = () => {
    if (setUp) study.start({ surface, variables: info.variables, spec: setUp, configLabel: 'the set-up sweep', known: [], basinRadius: 1, target: studyTarget(info.knownPoints, tolerance) });
  };

  const rates = spec ? logSpaced(spec.range[0], spec.range[1], spec.count) : null;
  const curves: RateCurve[] = [];
  if (spec && all.cells && rates) {
    spec.optimizers.forEach((o, q) => {
      const finalLoss = new Float64Array(spec.count).fill(Number.NaN);
      const kinds = new Int8Array(spec.count).fill(-1);
      for (let k = 0; k < spec.count; k++) {
        const c = q * spec.count + k;
        if (!all.cells!.filled[c]) continue;
        kinds[k] = all.cells!.kind[c];
        finalLoss[k] = all.cells!.loss[c];
      }
      const run = runs.find((r) => r.label === o.label);
      curves.push({ label: o.label, style: runStyle(run?.style ?? q), finalLoss, kinds, threshold: all.thresholds?.[q] ?? null });
    });
  }

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    ctx.clearRect(0, 0, c.width, c.height);
    if (rates && curves.length) drawRateChart(ctx, { width: c.width, height: c.height }, rates, curves);
  });

  const exportCsv = () => {
    const cells = all.cells;
    if (!spec || !cells || !studySurface) return;
    const rows = studyRows(spec, studySurface, cells, () => null);
    download(`${STUDY_CSV['lr-sweep'].file}.csv`, studyCsv(STUDY_CSV['lr-sweep'].name, all.variables, rows), 'text/csv');
  };

  return (
    <section className="study-panel" aria-label="Learning-rate sweep" data-testid="rate-sweep">
      <h2>Learning-rate sweep</h2>
      <p className="study-help">
        Runs each chosen run's optimizer at log-spaced learning rates from {startRun ? `the start of “${startRun.label}”` : 'one start'}, with its stop rules; marks where the runs begin to diverge (solid line, refined by bisection) and, for gradient descent and heavy-ball momentum, where the Hessian at the start predicts it (dashed: 2/λmax and 2(1+μ)/λmax).
      </p>
      <div className="study-controls">
        <fieldset className="study-choice">
          <legend>optimizers (runs)</legend>
          {runs.map((r) => (
            <label key={r.id}>
              <input type="checkbox" checked={chosen.includes(r.id)} onChange={(e) => setChosen(e.target.checked ? [...chosen, r.id] : chosen.filter((id) => id !== r.id))} /> {r.label}
            </label>
          ))}
        </fieldset>
        <label>
          lowest rate <input type="number" step="any" value={range[0]} onChange={(e) => setRange([Number(e.target.value), range[1]])} style={{ width: '6rem' }} />
        </label>
        <label>
          highest rate <input type="number" step="any" value={range[1]} onChange={(e) => setRange([range[0], Number(e.target.value)])} style={{ width: '6rem' }} />
        </label>
        <label>
          rates{' '}
          <select value={count} onChange={(e) => setCount(Number(e.target.value))}>
            {counts.map((c) => <option key={c} value={c}>{c}</option>)}
          </select>
        </label>
        {mine && all.status === 'running' ? (
          <button type="button" onClick={() => study.cancel()}>Cancel sweep</button>
        ) : (
          <button type="button" onClick={start} disabled={!!problem}>Sweep learning rates</button>
        )}
        {setUp && !(mine && all.status === 'running') && <button type="button" onClick={runSetUp} data-testid="rate-sweep-run-set-up">Run as set up</button>}
        <button type="button" onClick={exportCsv} disabled={!mine || !all.cells || all.done === 0}>Sweep CSV</button>
        <FigureExport
          name="Learning-rate sweep" fileName="fall-line-learning-rates" disabled={!mine || !curves.length || all.done === 0} screenSize={() => sizeOf(body.current)}
          figure={() => rates && curves.length ? rateSweepFigure({ rates, curves, surfaceLabel: info.label, startLabel: all.configLabel }) : null}
        />
        {mine && all.total > 0 && (
          <span className="study-progress" data-status={all.status}>
            <progress max={all.total} value={all.done} aria-label="Rates done" /> {all.done} / {all.total} runs
            {all.status === 'done' ? ` in ${(all.elapsedMs / 1000).toFixed(1)} s` : all.status === 'cancelled' ? ' (cancelled)' : ''}
          </span>
        )}
      </div>
      {setUp && (
        <p className="study-help" data-testid="rate-sweep-set-up">
          Set up (saved with the experiment): {setUp.optimizers.map((o) => o.label).join(', ')} at {setUp.count} rates from {fmt(setUp.range[0])} to {fmt(setUp.range[1])}, from ({setUp.start.map(fmt).join(', ')}), at most {setUp.stop.maxSteps} steps
        </p>
      )}
      {problem && <p className="field-error">{problem}</p>}
      {mine && all.message && <p className="field-error" role="alert">{all.message}</p>}
      {mine && (
        <div className="study-body" ref={body}>
          <canvas ref={canvas} width={520} height={280} data-testid="rate-chart" aria-label="Final loss against learning rate" />
          <table className="study-legend" data-testid="rate-thresholds">
            <caption>Divergence thresholds (λmax of the Hessian at the start: {all.thresholds ? fmt(all.thresholds[0].lambdaMax) : '…'})</caption>
            <thead><tr><th scope="col">run</th><th scope="col">observed</th><th scope="col">predicted</th><th scope="col">outcomes</th></tr></thead>
            <tbody>
              {curves.map((c, q) => (
                <tr key={c.label} data-optimizer={c.label}>
                  <td><span className="swatch" style={{ background: c.style.colour }} /> {c.label}</td>
                  <td data-observed={c.threshold?.observed ? Math.sqrt(c.threshold.observed.lo * c.threshold.observed.hi) : ''}>
                    {c.threshold?.observed ? `${fmt(Math.sqrt(c.threshold.observed.lo * c.threshold.observed.hi))}${c.threshold.observed.refined ? ' (bisected)' : ` (between ${fmt(c.threshold.observed.lo)} and ${fmt(c.threshold.observed.hi)})`}` : all.status === 'done' ? 'none in range' : '…'}
                  </td>
                  <td data-predicted={c.threshold?.predicted ?? ''}>{c.threshold?.predicted ? fmt(c.threshold.predicted) : all.status === 'done' ? 'no prediction' : '…'}</td>
                  <td>{countKinds(c.kinds)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}

function countKinds(kinds: Int8Array): string {
  const counts = new Map<number, number>();
  for (const k of kinds) if (k >= 0) counts.set(k, (counts.get(k) ?? 0) + 1);
  return [...counts].sort((a, b) => a[0] - b[0]).map(([k, c]) => `${OUTCOME_KINDS[k]} ${c}`).join(', ');
}
