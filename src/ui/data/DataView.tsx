import { useEffect, useRef, useState } from 'react';
import { focusRun } from '../../store/app-store';
import { datasetTable, type DataFitSpec, type DataFitSurface } from '../../problems';
import { formatValue } from '../plot';
import { useApp, useLiveRuns } from '../app-context';
import { prepareCanvas, useElementSize } from '../view/use-canvas-size';
import { useMainThreadSurface } from '../view/use-surface';
import { drawDataScene, taskOf } from './data-plot';

/**
 * The data beside the landscape, redrawn as the selected run streams: the fit at the run's current
 * parameters, and those parameters (in the data's original units) next to the known answer.
 */
export function DataView({ spec }: { spec: DataFitSpec }) {
  const live = useLiveRuns();
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
    let drawn: [number, unknown] = [-1, null];
    const table = datasetTable(spec.dataset);
    const tick = () => {
      frame = requestAnimationFrame(tick);
      const { size, run, surface } = input.current;
      const canvas = canvasRef.current;
      if (!canvas || !size || !surface || (drawn[0] === live.version && drawn[1] === input.current)) return;
      drawn = [live.version, input.current];
      const buffer = run ? live.trajectory(run.id) : undefined;
      const x = buffer && buffer.count > 0 && buffer.dimension === surface.dimension ? Array.from(buffer.point(buffer.count - 1)) : null;
      const ctx = prepareCanvas(canvas, size);
      if (!ctx) return;
      const predict = x && x.every(Number.isFinite) ? (row: ArrayLike<number>) => surface.predict(x, row) : null;
      setCaption(drawDataScene(ctx, size, { table, inputs: spec.model.inputs, target: spec.model.target, task: taskOf(spec.model), predict }));
      setShown(x && run && buffer ? { params: x, step: buffer.count - 1, label: run.label } : null);
      canvas.dataset.drawnFor = run?.id ?? '';
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [live, spec]);

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
        <table className="param-table" data-testid="param-table">
          <caption>
            Parameters{surface.standardised ? ' (converted back to the original units of the data)' : ''}: {shown ? `${shown.label} at step ${shown.step}` : 'no run yet'}
          </caption>
          <thead>
            <tr>
              <th scope="col">parameter</th>
              <th scope="col">this run</th>
              {knownOriginal && <th scope="col">{known!.source.startsWith('normal equations') ? 'least-squares answer' : 'known minimum'}</th>}
            </tr>
          </thead>
          <tbody>
            {surface.variables.map((name, k) => (
              <tr key={name}>
                <th scope="row" className="mono">
                  {name}
                </th>
                <td className="mono" data-col="run">
                  {original ? formatValue(original[k]) : '—'}
                </td>
                {knownOriginal && (
                  <td className="mono" data-col="known">
                    {formatValue(knownOriginal[k])}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {known && <p className="field-help">Known minimum: {known.source}; loss there {formatValue(known.value)}.</p>}
    </section>
  );
}
