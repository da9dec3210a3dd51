import { useShownView } from '../view/use-shown-view';
import { useEffect, useRef, useState } from 'react';
import { drawStarts, hasParameterGroups, summariseStarts, type MultiStartSpec, type MultiStartSummary, type StartDistribution, type StartResult, type ToleranceTarget } from '../../engine';
import { STUDY_CSV, studyCsv, studyRows } from '../../io/study-csv';
import { studyOfKind } from '../../store/app-store';
import { useActions, useApp } from '../app-context';
import { chooseLossAxis } from '../chart/loss-chart';
import { download } from '../export/download';
import { useMainThreadSurface } from '../view/use-surface';
import { drawBandChart } from './band-chart';
import { basinRadiusOf, knownMinima, studyTarget } from './basin-inputs';
import { useStudy, useStudyStore } from './study-context';
import { FigureExport, sizeOf } from '../figure/FigureExport';
import { multiStartFigure } from '../figure/views/study-figures';

type DistributionChoice = 'uniform' | 'gaussian' | 'glorot' | 'he';

/**
 * Multi-start: N seeded starts of the selected run's configuration; success rate, final-loss spread,
 * steps to tolerance, outcomes, and the median and quartile band of the loss across starts. The study
 * last started here, or opened from a file, is the workspace's set-up multi-start (saved in the
 * experiment file, with this panel's current settings); "Run as set up" runs it exactly as written.
 */
export function MultiStartPanel() {
  const study = useStudyStore();
  const all = useStudy((s) => s);
  const runs = useApp((s) => s.workspace.runs);
  const selected = useApp((s) => s.selectedRunId);
  const surfaceSpec = useApp((s) => s.workspace.surface);
  const info = useApp((s) => s.surfaceInfo);
  const view = useShownView();
  const tolerance = useApp((s) => s.workspace.tolerance);
  const surface = useMainThreadSurface(surfaceSpec);
  // The surface the shown study ran on (the page's may have changed since).
  const studySurface = useMainThreadSurface(all.surface ?? surfaceSpec);
  const actions = useActions();
  const setUp = useApp((s) => studyOfKind(s.workspace.studies, 'multi-start'));
  const [choice, setChoice] = useState<DistributionChoice>(setUp?.distribution.kind ?? 'uniform');
  const [count, setCount] = useState(setUp?.count ?? 100);
  const [sd, setSd] = useState(setUp?.distribution.kind === 'gaussian' && typeof setUp.distribution.sd === 'number' ? setUp.distribution.sd : 0.5);
  const [startSeed, setStartSeed] = useState(setUp?.startSeed ?? 1);
  useEffect(() => {
    if (!setUp) return;
    setChoice(setUp.distribution.kind);
    setCount(setUp.count);
    setStartSeed(setUp.startSeed);
    if (setUp.distribution.kind === 'gaussian' && typeof setUp.distribution.sd === 'number') setSd(setUp.distribution.sd);
  }, [setUp]);
  const canvas = useRef<HTMLCanvasElement>(null);
  const body = useRef<HTMLDivElement>(null);
  const config = runs.find((r) => r.id === selected) ?? runs[0];
  const network = !!surface && hasParameterGroups(surface);
  const mine = all.spec?.kind === 'multi-start';
  const spec = mine ? (all.spec as MultiStartSpec) : null;
  const knownMinimum = info.knownPoints.filter((p) => p.kind === 'global-min').reduce<number | null>((m, p) => (m === null ? p.value : Math.min(m, p.value)), null);

  const distribution = (kind = choice, spread = sd): StartDistribution => {
    if (kind === 'uniform') return { kind: 'uniform', box: info.view.map(([lo, hi]) => [lo, hi] as [number, number]) };
    if (kind === 'gaussian') return { kind: 'gaussian', centre: setUp?.distribution.kind === 'gaussian' && !config ? setUp.distribution.centre : config!.settings.start.slice(), sd: spread };
    return { kind };
  };
  /** A changed setting also changes the set-up study, so the saved experiment has the panel's settings. */
  const patch = (p: Partial<MultiStartSpec>) => {
    if (setUp) actions.setStudy({ ...setUp, ...p });
  };
  let problem: string | null = !config ? 'Add a run first: the starts use its optimizer and stop rules.' : null;
  if (!problem && surface) {
    try {
      drawStarts(distribution(), surface.dimension, 1, startSeed, hasParameterGroups(surface) ? surface.parameterGroups : undefined);
      if (!(Number.isInteger(count) && count >= 1 && count <= 10_000)) problem = `number of starts must be a whole number from 1 to 10000, got ${count}`;
    } catch (e) {
      problem = (e as Error).message;
    }
  }

  const start = () => {
    if (!config || problem) return;
    const s: MultiStartSpec = { kind: 'multi-start', optimizer: config.optimizer, stop: config.settings.stop, seed: config.settings.seed, distribution: distribution(), count, startSeed };
    actions.setStudy(s);
    study.start({ surface: surfaceSpec, variables: info.variables, spec: s, configLabel: config.label, known: knownMinima(info.knownPoints), basinRadius: basinRadiusOf(view), target: studyTarget(info.knownPoints, tolerance) });
  };
  const runSetUp = () => {
    if (setUp) study.start({ surface: surfaceSpec, variables: info.variables, spec: setUp, configLabel: 'the set-up starts', known: knownMinima(info.knownPoints), basinRadius: basinRadiusOf(view), target: studyTarget(info.knownPoints, tolerance) });
  };

  const results: StartResult[] = [];
  if (mine && all.cells) {
    const n = all.variables.length;
    for (let c = 0; c < all.cells.filled.length; c++) {
      const outcome = all.cells.outcomes[c];
      if (all.cells.filled[c] && outcome) results.push({ outcome, finalLoss: all.cells.loss[c], endPoint: all.cells.endPoints.subarray(c * n, (c + 1) * n), stepsToTolerance: all.cells.stepsToTolerance[c] >= 0 ? all.cells.stepsToTolerance[c] : null });
    }
  }
  const summary = results.length ? summariseStarts(results, tolerance, knownMinimum) : null;

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    ctx.clearRect(0, 0, c.width, c.height);
    if (!mine || !all.bands) return;
    drawBandChart(ctx, { width: c.width, height: c.height }, all.bands, chooseLossAxis([], knownMinimum));
  }, [mine, all.bands, knownMinimum]);

  const exportCsv = () => {
    const cells = all.cells;
    if (!spec || !cells || !studySurface) return;
    const rows = studyRows(spec, studySurface, cells, (c) => (cells.basin[c] >= 0 ? all.basinLabels[cells.basin[c]] : null));
    download(`${STUDY_CSV['multi-start'].file}.csv`, studyCsv(STUDY_CSV['multi-start'].name, all.variables, rows), 'text/csv');
  };

  const pct = (v: number) => `${(100 * v).toFixed(1)}%`;
  const formatValue = (v: number) => (Number.isFinite(v) ? String(+v.toPrecision(3)) : String(v));
  return (
    <section className="study-panel" aria-label="Multi-start" data-testid="multi-start">
      <h2>Multi-start</h2>
      <p className="study-help">
        {config ? `Runs “${config.label}” from many seeded starts` : 'Runs one configuration from many seeded starts'}: how often it reaches the best minimum, how the final loss spreads, and the median and quartile band of the loss across starts.
      </p>
      <div className="study-controls">
        <label>
          starts from{' '}
          <select
            value={choice}
            onChange={(e) => {
              const kind = e.target.value as DistributionChoice;
              setChoice(kind);
              if (config || kind !== 'gaussian') patch({ distribution: distribution(kind) });
            }}
          >
            <option value="uniform">uniform over the surface's box</option>
            <option value="gaussian">Gaussian around the run's start</option>
            {network && <option value="glorot">Glorot uniform (network weights)</option>}
            {network && <option value="he">He normal (network weights)</option>}
          </select>
        </label>
        {choice === 'gaussian' && (
          <label>
            standard deviation <input type="number" value={sd} step="any" min={0} onChange={(e) => {
              setSd(Number(e.target.value));
              const v = Number(e.target.value);
              if (setUp?.distribution.kind === 'gaussian' && v >= 0 && Number.isFinite(v)) patch({ distribution: { ...setUp.distribution, sd: v } });
            }} style={{ width: '5rem' }} />
          </label>
        )}
        <label>
          number of starts <input type="number" value={count} min={1} max={10000} onChange={(e) => {
              setCount(Number(e.target.value));
              const v = Number(e.target.value);
              if (Number.isInteger(v) && v >= 1 && v <= 10_000) patch({ count: v });
            }} style={{ width: '5rem' }} />
        </label>
        <label>
          seed of the starts <input type="number" value={startSeed} onChange={(e) => {
              setStartSeed(Number(e.target.value));
              if (Number.isFinite(Number(e.target.value))) patch({ startSeed: Number(e.target.value) });
            }} style={{ width: '4rem' }} />
        </label>
        {mine && all.status === 'running' ? (
          <button type="button" onClick={() => study.cancel()}>Cancel starts</button>
        ) : (
          <button type="button" onClick={start} disabled={!!problem}>Run starts</button>
        )}
        {setUp && !(mine && all.status === 'running') && <button type="button" onClick={runSetUp} data-testid="multi-start-run-set-up">Run as set up</button>}
        <button type="button" onClick={exportCsv} disabled={!mine || !all.cells || all.done === 0}>Starts CSV</button>
        <FigureExport
          name="Multi-start" fileName="fall-line-multi-start" disabled={!mine || !all.bands || !summary} screenSize={() => sizeOf(body.current)}
          figure={() => mine && spec && all.bands && summary ? multiStartFigure({ bands: all.bands, axis: chooseLossAxis([], knownMinimum), summary: summaryLines(summary, tolerance, all.target, all.cells!.basin, all.basinLabels), count: spec.count, configLabel: all.configLabel, surfaceLabel: info.label }) : null}
        />
        {mine && all.total > 0 && (
          <span className="study-progress" data-status={all.status}>
            <progress max={all.total} value={all.done} aria-label="Starts done" /> {all.done} / {all.total} runs
            {all.status === 'done' ? ` in ${(all.elapsedMs / 1000).toFixed(1)} s` : all.status === 'cancelled' ? ' (cancelled)' : ''}
          </span>
        )}
      </div>
      {setUp && (
        <p className="study-help" data-testid="multi-start-set-up">
          Set up (saved with the experiment): {setUp.count} starts, {setUp.distribution.kind} (seed {setUp.startSeed}); {setUp.optimizer.kind} at learning rate {String(+setUp.optimizer.learningRate.toPrecision(4))}, at most {setUp.stop.maxSteps} steps
        </p>
      )}
      {problem && <p className="field-error">{problem}</p>}
      {mine && all.message && <p className="field-error" role="alert">{all.message}</p>}
      {summary && (
        <div className="study-body" ref={body}>
          <table className="study-legend" data-testid="multi-start-summary">
            <caption>Over {summary.runs} starts (tolerance {tolerance} above the {summary.target.source})</caption>
            <tbody>
              <tr data-key="success"><th scope="row">success rate</th><td data-value={summary.successRate}>{pct(summary.successRate)} ({summary.successes} converged within the tolerance of {formatValue(summary.target.loss)})</td></tr>
              <tr><th scope="row">converged</th><td>{summary.converged}</td></tr>
              <tr><th scope="row">final loss</th><td>min {formatValue(summary.finalLoss.min)}, quartiles {formatValue(summary.finalLoss.q1)} / {formatValue(summary.finalLoss.median)} / {formatValue(summary.finalLoss.q3)}, max {formatValue(summary.finalLoss.max)}</td></tr>
              <tr data-key="steps-to-tolerance"><th scope="row">steps to tolerance</th><td data-reached={summary.stepsToTolerance.reached} data-median={summary.stepsToTolerance.median}>{toleranceText(summary, all.target)}</td></tr>
              <tr><th scope="row">outcomes</th><td data-testid="multi-start-outcomes">{Object.entries(summary.outcomes).map(([k, v]) => `${k} ${v}`).join(', ')}</td></tr>
              <tr><th scope="row">ended in</th><td>{countBasins(all.cells!.basin, all.basinLabels)}</td></tr>
            </tbody>
          </table>
          <figure className="start-map-figure" style={{ width: 420 }}>
            <canvas ref={canvas} width={420} height={220} data-testid="multi-start-bands" aria-label="Median and quartile band of the loss across starts" />
            <figcaption className="start-map-axes">median (line) and 25–75% band of the loss across starts; a run that ended keeps its last loss</figcaption>
          </figure>
        </div>
      )}
    </section>
  );
}

/** The summary table's rows as lines of text, for the figure's key. */
function summaryLines(summary: MultiStartSummary, tolerance: number, target: ToleranceTarget | null, basin: Int32Array, labels: readonly string[]): string[] {
  const v = (x: number) => (Number.isFinite(x) ? String(+x.toPrecision(3)) : String(x));
  return [
    `success rate ${(100 * summary.successRate).toFixed(1)}% (${summary.successes} of ${summary.runs} within ${tolerance} of ${v(summary.target.loss)}, the ${summary.target.source})`,
    `final loss: min ${v(summary.finalLoss.min)}, quartiles ${v(summary.finalLoss.q1)} / ${v(summary.finalLoss.median)} / ${v(summary.finalLoss.q3)}, max ${v(summary.finalLoss.max)}`,
    `steps to tolerance: ${toleranceText(summary, target)}`,
    `outcomes: ${Object.entries(summary.outcomes).map(([k, c]) => `${k} ${c}`).join(', ')}`,
    `ended in: ${countBasins(basin, labels)}`,
  ];
}

/**
 * The steps-to-tolerance line: median and quartiles over the starts that reached the tolerance, how
 * many did, and what it was measured against (the study's target, fixed when it started).
 */
function toleranceText(summary: MultiStartSummary, target: ToleranceTarget | null): string {
  if (!target) return 'not measured: the surface has no known minimum to measure the tolerance from';
  const s = summary.stepsToTolerance;
  const against = `loss within ${target.tolerance} of the known minimum's ${+target.value.toPrecision(6)}`;
  if (s.reached === 0) return `no start reached it (${against})`;
  return `median ${+s.median.toPrecision(4)}, quartiles ${+s.q1.toPrecision(4)} / ${+s.q3.toPrecision(4)}, over the ${s.reached} of ${summary.runs} starts that reached it (${against})`;
}

function countBasins(basin: Int32Array, labels: readonly string[]): string {
  const counts = new Map<number, number>();
  for (const b of basin) if (b >= 0) counts.set(b, (counts.get(b) ?? 0) + 1);
  return [...counts].sort((a, b) => a[0] - b[0]).map(([b, c]) => `${labels[b]}: ${c}`).join('; ') || 'no basin';
}
