import { useEffect, useRef, useState } from 'react';
import { focusRun } from '../../store/app-store';
import { datasetTable, type DataFitSpec, type DataFitSurface } from '../../problems';
import { formatValue } from '../plot';
import { useActions, useApp, useLiveRuns } from '../app-context';
import { prepareCanvas, useElementSize } from '../view/use-canvas-size';
import { useMainThreadSurface } from '../view/use-surface';
import { drawDataScene, predictionRows, taskOf } from './data-plot';
import { ParamTable } from './ParamTable';

/** Least time between two prediction requests while a run streams (the worker is also stepping runs). */
const PREDICT_INTERVAL_MS = 100;

/**
 * The data beside the landscape, redrawn as the selected run streams: the fit at the run's current
 * parameters, and those parameters (in the data's original units) next to the known answer. The
 * model's predictions are computed in the worker (actions.predictFit), one request in flight at a
 * time, at most every PREDICT_INTERVAL_MS; the page only draws them.
 */
export function DataView({ spec }: { spec: DataFitSpec }) {
  const live = useLiveRuns();
  const actions = useActions();
  const surface = useMainThreadSurface(spec) as DataFitSurface | null;
  const info = useApp((s) => s.surfaceInfo);
  const boxRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(boxRef);
  const run = useApp(focusRun);
  const [caption, setCaption] = useState('');
  const [shown, setShown] = useState<{ params: number[]; step: number; label: string } | null>(null);
  const input = useRef({ size, run, surface });
  input.current = { size, run, surface };

  useEffect(() => {
    let frame = 0;
    let stopped = false;
    let asked: [number, unknown] = [-1, null];
    let inFlight = false;
    let lastAsk = -Infinity;
    const table = datasetTable(spec.dataset);
    const task = taskOf(spec.model);
    const { rows, count } = predictionRows(table, spec.model.inputs, task);
    const scene = { table, inputs: spec.model.inputs, target: spec.model.target, task };
    const draw = (predictions: { outputs: Float64Array; width: number } | null, runId: string) => {
      const { size } = input.current;
      const canvas = canvasRef.current;
      if (stopped || !canvas || !size) return;
      const ctx = prepareCanvas(canvas, size);
      if (!ctx) return;
      setCaption(drawDataScene(ctx, size, { ...scene, predictions }));
      canvas.dataset.drawnFor = runId;
    };
    let shownFor: [number, unknown] = [-1, null];
    const tick = () => {
      frame = requestAnimationFrame(tick);
      const { size, run, surface } = input.current;
      if (!canvasRef.current || !size || !surface) return;
      const changed = shownFor[0] !== live.version || shownFor[1] !== input.current;
      if (!changed && asked[0] === live.version && asked[1] === input.current) return;
      const buffer = run ? live.trajectory(run.id) : undefined;
      const x = buffer && buffer.count > 0 && buffer.dimension === surface.dimension ? Float64Array.from(buffer.point(buffer.count - 1)) : null;
      // The parameter table follows every update at once (it renders only the rows in view); the
      // picture waits for the worker's predictions.
      if (changed) {
        shownFor = [live.version, input.current];
        setShown(x && run && buffer ? { params: Array.from(x), step: buffer.stepOf(buffer.count - 1), label: run.label } : null);
      }
      if (inFlight || performance.now() - lastAsk < PREDICT_INTERVAL_MS) return;
      asked = [live.version, input.current];
      if (!x || !x.every(Number.isFinite) || count === 0) return draw(null, run?.id ?? '');
      inFlight = true;
      lastAsk = performance.now();
      actions
        .predictFit(x, rows, count)
        .then((predictions) => draw(predictions, run?.id ?? ''))
        .catch(() => draw(null, run?.id ?? '')) // the worker's message: the parameters do not fit this model (a run of another surface)
        .finally(() => (inFlight = false));
    };
    frame = requestAnimationFrame(tick);
    return () => {
      stopped = true;
      cancelAnimationFrame(frame);
    };
  }, [live, spec, actions]);

  const known = info.knownPoints.find((p) => p.kind === 'global-min');
  const original = surface && shown ? surface.toOriginalUnits(shown.params) : null;
  const knownOriginal = surface && known ? surface.toOriginalUnits(known.point) : null;
  return (
    <section className="panel data-panel" aria-label="Data and fit">
      <h2>Data and fit</h2>
      <div ref={boxRef} className="data-box">
        <canvas ref={canvasRef} data-testid="data-view" role="img" aria-label={`The data (${spec.model.target} against ${spec.model.inputs.join(', ')}) with the fit of ${run?.label ?? 'no run'}`} />
      </div>
      <p className="field-help">{caption}</p>
      {surface && (
        <ParamTable
          caption={`Parameters${surface.standardised ? ' (converted back to the original units of the data)' : ''}: ${shown ? `${shown.label} at step ${shown.step}` : 'no run yet'}`}
          names={surface.variables}
          values={original}
          known={knownOriginal ? { title: known!.source.startsWith('normal equations') ? 'least-squares answer' : 'known minimum', values: knownOriginal } : null}
        />
      )}
      {known && <p className="field-help">Known minimum: {known.source}; loss there {formatValue(known.value)}.</p>}
    </section>
  );
}
