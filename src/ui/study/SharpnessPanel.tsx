import { useEffect, useRef, useState } from 'react';
import { stepOfRow, type OptimizerKind } from '../../engine';
import { useApp, useLiveRuns } from '../app-context';
import { drawSharpnessChart } from './sharpness-chart';
import { useStudyStore } from './study-context';
import { useWorkerTask } from './use-worker-task';
import { FigureExport, sizeOf } from '../figure/FigureExport';
import { sharpnessFigure } from '../figure/views/study-figures';

/** Most trajectory points sampled for the sharpness curve. */
const MAX_SAMPLES = 300;
const GRADIENT_STEP_KINDS = new Set<OptimizerKind>(['gd', 'momentum', 'nesterov']);

interface Sample {
  runLabel: string;
  steps: Int32Array;
  values: Float64Array;
  limit: { steps: Int32Array; values: Float64Array } | null;
}

/**
 * Sharpness along the selected run: the largest eigenvalue of the exact Hessian (dense up to 200
 * parameters, Lanczos on exact Hessian-vector products above) at up to 300 evenly spaced steps of its
 * trajectory, computed in the study worker, against 2 / lr_t for methods whose learning rate is a
 * gradient step size.
 */
export function SharpnessPanel() {
  const study = useStudyStore();
  const live = useLiveRuns();
  const runs = useApp((s) => s.workspace.runs);
  const selected = useApp((s) => s.selectedRunId);
  const surface = useApp((s) => s.workspace.surface);
  const status = useApp((s) => s.status);
  const run = runs.find((r) => r.id === selected) ?? runs[0];
  const [sample, setSample] = useState<Sample | null>(null);
  const { busy, problem, setProblem, run: runTask } = useWorkerTask();
  const canvas = useRef<HTMLCanvasElement>(null);
  const body = useRef<HTMLElement>(null);
  const info = useApp((s) => s.surfaceInfo);
  const steps = run ? status[run.id]?.summary.steps ?? 0 : 0;

  const measure = async () => {
    if (!run) return;
    const batch = live.trajectory(run.id)?.asBatch();
    if (!batch || batch.count === 0) return setProblem('The run has no trajectory yet: play it first.');
    const n = batch.dimension;
    const count = Math.min(MAX_SAMPLES, batch.count);
    const rows = Int32Array.from({ length: count }, (_, k) => (count === 1 ? 0 : Math.round((k * (batch.count - 1)) / (count - 1))));
    const points = new Float64Array(count * n);
    rows.forEach((row, k) => points.set(batch.points.subarray(row * n, (row + 1) * n), k * n));
    await runTask(async () => {
      const values = await study.sharpness(surface, points, count);
      // 2/lr is the stability line for plain gradient steps (GD and its momentum forms); an adaptive
      // method's learning rate is scaled per coordinate, so the raw Hessian's 2/lr does not apply.
      const stepSize = GRADIENT_STEP_KINDS.has(run.optimizer.kind);
      const stepsOf = Int32Array.from(rows, (row) => stepOfRow(batch, row));
      const limitRows = Array.from(rows).filter((row) => row > 0);
      const limit = stepSize ? { steps: Int32Array.from(limitRows, (row) => stepOfRow(batch, row)), values: Float64Array.from(limitRows, (row) => 2 / batch.learningRate[row]) } : null;
      setSample({ runLabel: run.label, steps: stepsOf, values, limit });
    });
  };

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx || !sample) return;
    drawSharpnessChart(ctx, { width: c.width, height: c.height }, sample.steps, sample.values, sample.limit);
  }, [sample]);

  const last = sample ? sample.values[sample.values.length - 1] : Number.NaN;
  return (
    <section className="study-panel" aria-label="Sharpness along a run" data-testid="sharpness">
      <h2>Sharpness along a run</h2>
      <p className="study-help">
        The largest eigenvalue of the exact Hessian along {run ? `“${run.label}”` : 'the selected run'} ({steps} steps so far), against 2/learning rate: gradient steps are unstable on the local quadratic model where the curve rises above the dashed line (Cohen et al., ICLR 2021, "edge of stability").
      </p>
      <div className="study-controls">
        <button type="button" onClick={measure} disabled={!run || busy}>{busy ? 'Measuring…' : 'Measure sharpness'}</button>
        <FigureExport name="Sharpness" fileName="fall-line-sharpness" disabled={!sample} screenSize={() => sizeOf(body.current)} figure={() => (sample ? sharpnessFigure({ ...sample, surfaceLabel: info.label }) : null)} />
        {sample && (
          <span data-testid="sharpness-last" data-value={last}>
            at step {sample.steps[sample.steps.length - 1]}: λmax = {String(+last.toPrecision(5))}
            {sample.limit ? `, 2/lr = ${String(+sample.limit.values[sample.limit.values.length - 1].toPrecision(5))}` : ' (no 2/lr line: this method\'s learning rate is not a gradient step size)'}
          </span>
        )}
      </div>
      {problem && <p className="field-error" role="alert">{problem}</p>}
      {sample && (
        <figure className="start-map-figure" style={{ width: 480 }} ref={body}>
          <canvas ref={canvas} width={480} height={240} data-testid="sharpness-chart" aria-label={`Largest Hessian eigenvalue along ${sample.runLabel}`} />
          <figcaption className="start-map-axes">solid: λmax at {sample.steps.length} sampled steps; dashed: 2 / (learning rate at that step)</figcaption>
        </figure>
      )}
    </section>
  );
}
