import { useEffect, useMemo, useRef } from 'react';
import { RunGlyph } from '../runs/RunGlyph';
import { useApp, useLiveRuns, useStoreApi } from '../app-context';
import { FigureExport } from '../figure/FigureExport';
import { lossFigure, multiStartBand } from '../figure/views/loss-figure';
import { useStudy, useStudyStore } from '../study/study-context';
import { prepareCanvas, useElementSize } from '../view/use-canvas-size';
import { BAND_STYLE, chooseLossAxis, drawLossChart, knownMinimumOf, lossSeriesOf } from './loss-chart';

/**
 * Loss against step for every visible run, redrawn at most once per animation frame while streaming,
 * with a legend of the runs' colours and markers; a finished multi-start study adds its median and
 * quartile band across starts.
 */
export function LossChart() {
  const live = useLiveRuns();
  const storeApi = useStoreApi();
  const boxRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(boxRef);
  const runs = useApp((s) => s.workspace.runs);
  const knownPoints = useApp((s) => s.surfaceInfo.knownPoints);
  const study = useStudyStore();
  // Only the fields the band needs, so study progress does not redraw the chart.
  const studySpec = useStudy((s) => s.spec);
  const studyBands = useStudy((s) => s.bands);
  const studyLabel = useStudy((s) => s.configLabel);
  const band = useMemo(() => multiStartBand({ spec: studySpec, bands: studyBands, configLabel: studyLabel }), [studySpec, studyBands, studyLabel]);
  const minimum = knownMinimumOf(knownPoints);
  const input = useRef({ runs, size, minimum, band });
  input.current = { runs, size, minimum, band };

  useEffect(() => {
    let frame = 0;
    let drawn: [number, unknown] = [-1, null];
    const tick = () => {
      frame = requestAnimationFrame(tick);
      const { runs, size, minimum, band } = input.current;
      const canvas = canvasRef.current;
      if (!canvas || !size || (drawn[0] === live.version && drawn[1] === input.current)) return;
      drawn = [live.version, input.current];
      const ctx = prepareCanvas(canvas, size);
      if (!ctx) return;
      const series = lossSeriesOf(runs, live);
      drawLossChart(ctx, size, series, chooseLossAxis(series, minimum), band);
      canvas.dataset.series = String(series.length);
      canvas.dataset.band = band ? 'multi-start' : 'none';
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
        {band && (
          <>
            <li data-band="median">
              <svg className="run-glyph" width={22} height={14} viewBox="0 0 22 14" aria-hidden="true">
                <line x1={1} y1={7} x2={21} y2={7} stroke={BAND_STYLE.median} strokeWidth={2} strokeDasharray={BAND_STYLE.medianDash.join(' ')} />
              </svg>{' '}
              {band.medianLabel}
            </li>
            <li data-band="quartiles">
              <svg className="run-glyph" width={22} height={14} viewBox="0 0 22 14" aria-hidden="true">
                <rect x={1} y={2} width={20} height={10} fill={BAND_STYLE.fill} stroke="#444" strokeWidth={0.75} />
              </svg>{' '}
              {band.bandLabel}
            </li>
          </>
        )}
      </ul>
      <FigureExport name="Loss chart" fileName="fall-line-loss" screenSize={() => size} figure={() => lossFigure(storeApi.getState(), live, study.store.getState())} />
    </section>
  );
}
