import { useEffect, useRef } from 'react';
import { runStyle } from '../plot';
import { RunGlyph } from '../runs/RunGlyph';
import { useApp, useLiveRuns } from '../app-context';
import { prepareCanvas, useElementSize } from '../view/use-canvas-size';
import { chooseLossAxis, drawLossChart, type LossSeries } from './loss-chart';

/** Loss against step for every visible run, redrawn at most once per animation frame while streaming, with a legend of the runs' colours and markers. */
export function LossChart() {
  const live = useLiveRuns();
  const boxRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(boxRef);
  const runs = useApp((s) => s.runs);
  const knownPoints = useApp((s) => s.surfaceInfo.knownPoints);
  const minimum = knownPoints.some((p) => p.kind === 'global-min') ? Math.min(...knownPoints.filter((p) => p.kind === 'global-min').map((p) => p.value)) : null;
  const input = useRef({ runs, size, minimum });
  input.current = { runs, size, minimum };

  useEffect(() => {
    let frame = 0;
    let drawn: [number, unknown] = [-1, null];
    const tick = () => {
      frame = requestAnimationFrame(tick);
      const { runs, size, minimum } = input.current;
      const canvas = canvasRef.current;
      if (!canvas || !size || (drawn[0] === live.version && drawn[1] === input.current)) return;
      drawn = [live.version, input.current];
      const ctx = prepareCanvas(canvas, size);
      if (!ctx) return;
      const series: LossSeries[] = [];
      for (const r of runs) {
        const b = live.trajectory(r.id);
        if (!r.hidden && b && b.count) series.push({ loss: b.loss, count: b.count, style: runStyle(r.style), label: r.label });
      }
      drawLossChart(ctx, size, series, chooseLossAxis(series, minimum));
      canvas.dataset.series = String(series.length);
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [live]);

  return (
    <section className="panel chart-panel" aria-label="Loss by step">
      <h2>Loss by step</h2>
      <div ref={boxRef} className="chart-box">
        <canvas ref={canvasRef} data-testid="loss-chart" role="img" aria-label={minimum !== null ? 'Loss above the known minimum against step, log scale' : 'Loss against step'} />
      </div>
      <ul className="chart-legend" data-testid="loss-legend" aria-label="Runs on the loss chart">
        {runs.filter((r) => !r.hidden).map((r) => (
          <li key={r.id} data-run-id={r.id}>
            <RunGlyph style={r.style} /> {r.label}
          </li>
        ))}
      </ul>
    </section>
  );
}
