import { useShownView } from '../view/use-shown-view';
import { useEffect, useRef, useState } from 'react';
import { cellStart, OUTCOME_KINDS, START_MAP_RESOLUTIONS, type StartMapSpec } from '../../engine';
import { STUDY_CSV, studyCsv, studyRows } from '../../io/study-csv';
import { studyOfKind } from '../../store/app-store';
import { useActions, useApp } from '../app-context';
import { download } from '../export/download';
import { useMainThreadSurface } from '../view/use-surface';
import { mapLegend, mapShade, paintStartMap } from './paint-map';
import { drawMapCells, drawMapMinima } from './start-map-drawing';
import { basinColour, cssColour, OUTCOME_COLOURS } from './study-colours';
import { basinRadiusOf, knownMinima, studyTarget } from './basin-inputs';
import { useStudy, useStudyStore } from './study-context';
import { FigureExport, sizeOf } from '../figure/FigureExport';
import { startMapFigure } from '../figure/views/study-figures';

const SIDE = 320;
const fmt = (v: number) => String(+v.toPrecision(4));

/**
 * Start-point map: the selected run's configuration (or the first run's) started from every cell of
 * the current view, each cell coloured by where its run ended. Clicking a cell opens that run as an
 * ordinary run. The map last started here, or opened from a file, is the workspace's set-up map
 * (saved in the experiment file, with this panel's current number of cells); "Run as set up" runs it
 * exactly as written.
 */
export function StartMapPanel() {
  const study = useStudyStore();
  const all = useStudy((s) => s);
  // The study store holds one study at a time; this panel shows it only when it is a start-point map.
  const mine = all.spec?.kind === 'start-map';
  const state = mine
    ? { ...all, spec: all.spec as StartMapSpec }
    : { ...all, spec: null, cells: null, status: 'idle' as const, total: 0, done: 0, message: null, known: [], target: null };
  const runs = useApp((s) => s.workspace.runs);
  const selected = useApp((s) => s.selectedRunId);
  const view = useShownView();
  const slice = useApp((s) => s.workspace.slice);
  const surface = useApp((s) => s.workspace.surface);
  const info = useApp((s) => s.surfaceInfo);
  const tolerance = useApp((s) => s.workspace.tolerance);
  const actions = useActions();
  const builtSurface = useMainThreadSurface(state.surface ?? surface);
  const setUp = useApp((s) => studyOfKind(s.workspace.studies, 'start-map'));
  const [resolution, setResolution] = useState(setUp?.resolution ?? 64);
  useEffect(() => {
    if (setUp) setResolution(setUp.resolution);
  }, [setUp]);
  const changeResolution = (r: number) => {
    setResolution(r);
    if (setUp) actions.setStudy({ ...setUp, resolution: r });
  };
  const resolutions = START_MAP_RESOLUTIONS.includes(resolution as never) ? START_MAP_RESOLUTIONS : [...START_MAP_RESOLUTIONS, resolution].sort((x, y) => x - y);
  const canvas = useRef<HTMLCanvasElement>(null);
  const body = useRef<HTMLDivElement>(null);
  const config = runs.find((r) => r.id === selected) ?? runs[0];

  const problem = !config ? 'Add a run first: the map uses its optimizer and stop rules.' : slice.plane ? 'Start-point maps need a slice through two parameters (not a random or principal-direction plane).' : null;

  const start = () => {
    if (!config || problem) return;
    const spec: StartMapSpec = {
      kind: 'start-map', optimizer: config.optimizer, stop: config.settings.stop, seed: config.settings.seed,
      box: { a: [view.a[0], view.a[1]], b: [view.b[0], view.b[1]] }, axes: slice.axes, base: slice.at.slice(), resolution,
    };
    actions.setStudy(spec);
    study.start({ surface, variables: info.variables, spec, configLabel: config.label, known: knownMinima(info.knownPoints), basinRadius: basinRadiusOf(view), target: studyTarget(info.knownPoints, tolerance) });
  };
  const runSetUp = () => {
    if (!setUp) return;
    study.start({ surface, variables: info.variables, spec: setUp, configLabel: 'the set-up map', known: knownMinima(info.knownPoints), basinRadius: basinRadiusOf(setUp.box), target: studyTarget(info.knownPoints, tolerance) });
  };

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    ctx.clearRect(0, 0, c.width, c.height);
    if (!state.cells || !state.spec) return;
    const r = state.spec.resolution;
    const size = { width: c.width, height: c.height };
    drawMapCells(ctx, paintStartMap(state.cells, r, state.spec.stop.maxSteps, state.target !== null), r, size);
    drawMapMinima(ctx, state.known, state.spec.box, state.spec.axes, size);
  }, [state.version, state.cells, state.spec, state.known, state.target]);

  const openCell = (e: React.MouseEvent<HTMLCanvasElement>) => {
    const spec = state.spec;
    if (!spec || !config) return;
    const rect = e.currentTarget.getBoundingClientRect();
    const i = Math.min(spec.resolution - 1, Math.floor(((e.clientX - rect.left) / rect.width) * spec.resolution));
    const j = Math.min(spec.resolution - 1, Math.floor(((rect.bottom - e.clientY) / rect.height) * spec.resolution));
    const startPoint = Array.from(cellStart(spec, i + j * spec.resolution, new Float64Array(spec.base.length)));
    const id = actions.duplicateRun(config.id);
    if (!id) return;
    actions.updateRun(id, { label: `${config.label} from map cell (${i + 1}, ${j + 1})`, settings: { ...config.settings, start: startPoint } });
    actions.selectRun(id);
  };

  const exportCsv = () => {
    const { cells, spec, variables } = state;
    if (!cells || !spec || !builtSurface) return;
    const rows = studyRows(spec, builtSurface, cells, (c) => (cells.basin[c] >= 0 ? state.basinLabels[cells.basin[c]] : null));
    download(`${STUDY_CSV['start-map'].file}.csv`, studyCsv(STUDY_CSV['start-map'].name, variables, rows), 'text/csv');
  };

  const legend = state.cells ? mapLegend(state.cells, state.basinLabels) : [];
  const eta = state.status === 'running' && state.done > 0 ? ((state.total - state.done) * state.elapsedMs) / state.done / 1000 : null;
  const [xName, yName] = [info.variables[slice.axes[0]], info.variables[slice.axes[1]]];
  return (
    <section className="study-panel" aria-label="Start-point map" data-testid="start-map">
      <h2>Start-point map</h2>
      <p className="study-help">
        {config ? `Runs “${config.label}” from the centre of every cell of the current view (${xName} across, ${yName} up)` : 'Runs one configuration from every cell of the current view'}
        {info.variables.length > 2 ? `, other parameters as the slice holds them (a slice of a ${info.variables.length}-parameter surface)` : ''}; each cell is coloured by where its run ended. Click a cell to open its run.
      </p>
      <div className="study-controls">
        <label>
          cells per side{' '}
          <select value={resolution} onChange={(e) => changeResolution(Number(e.target.value))}>
            {resolutions.map((r) => <option key={r} value={r}>{r}</option>)}
          </select>
        </label>
        {state.status === 'running' ? (
          <button type="button" onClick={() => study.cancel()}>Cancel map</button>
        ) : (
          <button type="button" onClick={start} disabled={!!problem}>Map start points</button>
        )}
        {setUp && state.status !== 'running' && (
          <button type="button" onClick={runSetUp} title={setUpText(setUp, info.variables)} data-testid="start-map-run-set-up">Run as set up</button>
        )}
        <button type="button" onClick={exportCsv} disabled={!state.cells || state.done === 0}>Map CSV</button>
        <FigureExport
          name="Start-point map" fileName="fall-line-start-map" disabled={!state.cells || state.done === 0} screenSize={() => sizeOf(body.current)}
          figure={() => state.cells && state.spec ? startMapFigure({ spec: state.spec, cells: state.cells, known: state.known, target: state.target, legend, labels: { a: xName, b: yName }, configLabel: state.configLabel, surfaceLabel: info.label }) : null}
        />
        {state.total > 0 && (
          <span className="study-progress" data-status={state.status}>
            <progress max={state.total} value={state.done} aria-label="Runs done" /> {state.done} / {state.total} runs
            {eta !== null ? `, about ${eta.toFixed(eta < 10 ? 1 : 0)} s left` : ''}
            {state.status === 'done' ? ` in ${(state.elapsedMs / 1000).toFixed(1)} s` : state.status === 'cancelled' ? ' (cancelled)' : ''}
          </span>
        )}
      </div>
      {setUp && <p className="study-help" data-testid="start-map-set-up">Set up (saved with the experiment): {setUpText(setUp, info.variables)}</p>}
      {problem && <p className="field-error">{problem}</p>}
      {state.message && <p className="field-error" role="alert">{state.message}</p>}
      <div className="study-body" ref={body}>
        <figure className="start-map-figure">
        <canvas ref={canvas} width={SIDE} height={SIDE} className="start-map-canvas" data-testid="start-map-canvas" data-version={state.version}
          aria-label={`Start-point map picture, ${state.spec?.resolution ?? 0} by ${state.spec?.resolution ?? 0} cells`} onClick={openCell} />
          {state.spec && (
            <figcaption className="start-map-axes" data-testid="start-map-axes">
              {xName} from {fmt(state.spec.box.a[0])} (left) to {fmt(state.spec.box.a[1])} (right); {yName} from {fmt(state.spec.box.b[0])} (bottom) to {fmt(state.spec.box.b[1])} (top); rings: known minima
            </figcaption>
          )}
        </figure>
        <table className="study-legend" data-testid="start-map-legend">
          <caption data-testid="start-map-shade">Where the runs ended ({mapShade(state.target, state.spec?.stop.maxSteps ?? null)})</caption>
          <thead><tr><th scope="col">colour</th><th scope="col">end</th><th scope="col">starts</th><th scope="col">share</th></tr></thead>
          <tbody>
            {legend.map((row) => (
              <tr key={row.key} data-basin={row.basin} data-outcome={row.kindIndex >= 0 ? OUTCOME_KINDS[row.kindIndex] : undefined}>
                <td><span className="swatch" style={{ background: cssColour(row.basin >= 0 ? basinColour(row.basin) : (OUTCOME_COLOURS[OUTCOME_KINDS[row.kindIndex]] ?? [255, 255, 255])) }} /></td>
                <td>{row.label}</td>
                <td>{row.count}</td>
                <td data-share={row.share}>{(100 * row.share).toFixed(1)}%</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/** The set-up map in one line: cells, box, optimizer. */
function setUpText(spec: StartMapSpec, variables: readonly string[]): string {
  const [p, q] = spec.axes;
  return `${spec.resolution} × ${spec.resolution} cells, ${variables[p] ?? `#${p}`} from ${fmt(spec.box.a[0])} to ${fmt(spec.box.a[1])}, ${variables[q] ?? `#${q}`} from ${fmt(spec.box.b[0])} to ${fmt(spec.box.b[1])}; ${spec.optimizer.kind} at learning rate ${fmt(spec.optimizer.learningRate)}, at most ${spec.stop.maxSteps} steps`;
}
