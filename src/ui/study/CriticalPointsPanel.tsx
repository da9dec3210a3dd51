import { useShownView } from '../view/use-shown-view';
import { useEffect, useRef, useState } from 'react';
import { startGrid, type CriticalPoint } from '../../engine';
import { useApp } from '../app-context';
import { CRITICAL_GLYPHS, drawCriticalPoints } from './critical-chart';
import { useStudyStore } from './study-context';
import { useWorkerTask } from './use-worker-task';
import { FigureExport, sizeOf } from '../figure/FigureExport';
import { criticalPointsFigure } from '../figure/views/study-figures';

const SIDE = 280;
const fmt = (v: number) => String(+v.toPrecision(6));

/**
 * Critical points: Newton's method on grad f = 0 (engine/analysis/critical.ts) from a grid of starts
 * over the current view (in the slice plane), de-duplicated and classified by the Hessian's
 * eigenvalues; listed in a table and plotted in the view's box with a key.
 */
export function CriticalPointsPanel() {
  const study = useStudyStore();
  const surface = useApp((s) => s.workspace.surface);
  const info = useApp((s) => s.surfaceInfo);
  const view = useShownView();
  const slice = useApp((s) => s.workspace.slice);
  const [side, setSide] = useState(12);
  const [found, setFound] = useState<{ points: CriticalPoint[]; converged: number; failed: number; box: typeof view; axes: [number, number] } | null>(null);
  const { busy, problem, run } = useWorkerTask(slice.plane ? 'Critical points are searched in a slice through two parameters, not a random or principal-direction plane.' : null);
  const canvas = useRef<HTMLCanvasElement>(null);
  const body = useRef<HTMLDivElement>(null);

  const search = async () => {
    const { starts } = startGrid(view, side, { base: slice.at, axes: slice.axes });
    await run(async () => {
      const r = await study.criticalPoints(surface, starts, side * side);
      setFound({ ...r, box: view, axes: slice.axes });
    });
  };

  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx || !found) return;
    ctx.fillStyle = '#fff';
    ctx.fillRect(0, 0, c.width, c.height);
    ctx.strokeStyle = '#999';
    ctx.strokeRect(0.5, 0.5, c.width - 1, c.height - 1);
    drawCriticalPoints(ctx, found.points, found.box, found.axes, { width: c.width, height: c.height });
  }, [found]);

  const [xName, yName] = [info.variables[slice.axes[0]], info.variables[slice.axes[1]]];
  return (
    <section className="study-panel" aria-label="Critical points" data-testid="critical-points">
      <h2>Critical points</h2>
      <p className="study-help">
        Newton's method on ∇f = 0 with the exact Hessian from a grid of starts over the current view; points closer than 1e-6 (relative) are one; each is classified by the Hessian's eigenvalues (a saddle's index is the number of negative ones).
      </p>
      <div className="study-controls">
        <label>
          starts per side{' '}
          <select value={side} onChange={(e) => setSide(Number(e.target.value))}>
            {[6, 12, 24].map((s) => <option key={s} value={s}>{s}</option>)}
          </select>
        </label>
        <button type="button" onClick={search} disabled={busy || !!slice.plane}>{busy ? 'Searching…' : 'Find critical points'}</button>
        <FigureExport
          name="Critical points" fileName="fall-line-critical-points" disabled={!found} screenSize={() => sizeOf(body.current)}
          figure={() => (found ? criticalPointsFigure({ ...found, labels: { a: info.variables[found.axes[0]], b: info.variables[found.axes[1]] }, surfaceLabel: info.label }) : null)}
        />
        {found && <span data-testid="critical-summary">{found.points.length} points from {found.converged} converged starts ({found.failed} did not converge)</span>}
      </div>
      {problem && <p className="field-error" role="alert">{problem}</p>}
      {found && (
        <div className="study-body" ref={body}>
          <figure className="start-map-figure" style={{ width: SIDE + 2 }}>
            <canvas ref={canvas} width={SIDE} height={SIDE} data-testid="critical-canvas" aria-label="Critical points in the view" />
            <figcaption className="start-map-axes">
              {xName} across, {yName} up, over the current view. Key:{' '}
              {Object.values(CRITICAL_GLYPHS).map((g) => <span key={g.key} className="critical-key"><span className="swatch" style={{ background: g.colour }} /> {g.key} </span>)}
            </figcaption>
          </figure>
          <table className="study-legend" data-testid="critical-table">
            <thead><tr><th scope="col">point</th><th scope="col">loss</th><th scope="col">kind</th><th scope="col">eigenvalues</th><th scope="col">|∇f|</th><th scope="col">starts</th></tr></thead>
            <tbody>
              {found.points.map((p, k) => (
                <tr key={k} data-kind={p.classification?.kind ?? 'not classified'}>
                  <td>({p.point.map(fmt).join(', ')})</td>
                  <td>{fmt(p.value)}</td>
                  <td>{p.classification ? (p.classification.kind === 'saddle' ? `saddle (index ${p.classification.negative ?? '≥ 1'})` : p.classification.kind) : 'not classified'}</td>
                  <td>{p.classification ? `${fmt(p.classification.smallest)} … ${fmt(p.classification.largest)}` : '—'}</td>
                  <td>{p.gradientNorm.toExponential(1)}</td>
                  <td>{p.hits}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
