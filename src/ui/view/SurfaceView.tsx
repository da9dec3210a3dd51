import { useEffect, useMemo, useRef, type KeyboardEvent, type PointerEvent } from 'react';
import { equalScaleOn, shownView } from '../../store/equal-scale';
import { slicePlane, slicePoint } from '../../store/slice-plane';
import { reportedUnits } from '../../store/units';
import { axisTitles } from './axis-titles';
import { gradientArrows, panBy, zoomAt, type Arrow } from '../plot';
import { ARROW_SPACING, COMPACT_ARROW_SPACING, gradientInPlane } from './plane-arrows';
import { useActions, useApp, useHoverApi, useLiveRuns, useStoreApi } from '../app-context';
import { canvasToFrame, frameLayout, frameTransform, insideFrame, roundToView } from './frame';
import { useSurfacePicture } from './picture';
import { drawBase, drawOverlay } from './scene';
import { knownPointsOnSlice, trajectoryItems } from './scene-input';
import { prepareCanvas, useElementSize } from './use-canvas-size';
import { useMainThreadSurface } from './use-surface';
import { HoverReadout } from './HoverReadout';
import { specKey, useProbe } from './use-probe';

export interface SurfaceViewProps {
  /** Which runs to draw: all visible ones, or only these ids (one panel of the panel grid). */
  runIds?: string[];
  title?: string;
  compact?: boolean;
}

/** Performance mark set when contours are first on screen (read by the browser performance check). */
export const FIRST_CONTOUR_MARK = 'fall-line:first-contour';

/** Zoom factors (> 1 zooms in, see `zoomAt`) per wheel notch and per key press. */
const WHEEL_ZOOM = 1.15;
const KEY_ZOOM = 1.25;

/**
 * The surface slice with the runs over it. Two stacked canvases: the base (contours, arrows, known
 * points, axes, legend) redraws when the grid or the view changes; the overlay (trajectories, crosshair)
 * redraws at most once per animation frame while runs stream, reading trajectories straight from the
 * live buffers. Mouse: wheel zooms, drag pans, click sets the start point. Keyboard: arrows pan,
 * + and - zoom, 0 resets the view.
 */
export function SurfaceView({ runIds, title, compact }: SurfaceViewProps) {
  const actions = useActions();
  const live = useLiveRuns();
  const storeApi = useStoreApi();
  const hoverApi = useHoverApi();
  const boxRef = useRef<HTMLDivElement>(null);
  const baseRef = useRef<HTMLCanvasElement>(null);
  // Renders of this view, on the base canvas for the browser tests (a pointer move must add none).
  const renders = useRef(0);
  useEffect(() => {
    renders.current += 1;
    if (baseRef.current) baseRef.current.dataset.renders = String(renders.current);
  });
  const overlayRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(boxRef);
  const askedView = useApp((s) => s.workspace.view);
  const grid = useApp((s) => s.grid);
  const display = useApp((s) => s.workspace.display);
  const info = useApp((s) => s.surfaceInfo);
  const slice = useApp((s) => s.workspace.slice);
  const runs = useApp((s) => s.workspace.runs);
  const selected = useApp((s) => s.selectedRunId);
  const surfaceSpec = useApp((s) => s.workspace.surface);
  const surface = useMainThreadSurface(surfaceSpec);
  const layout = useMemo(() => (size ? frameLayout(size, !compact) : null), [size, compact]);
  // The box drawn: the saved view, widened on one axis when equal scale is on (store/equal-scale.ts).
  const equal = equalScaleOn(display, surfaceSpec, info.variables.length);
  const view = useMemo(() => shownView(askedView, layout?.frame ?? null, equal), [askedView, layout, equal]);
  useEffect(() => {
    if (layout) actions.setFrame(layout.frame);
  }, [layout, actions]);
  const picture = useSurfacePicture(grid, display, info.logScaleOffset);
  const n = info.variables.length;
  const titles = axisTitles(slice, info.variables, reportedUnits(surface));
  const knownPoints = useMemo(() => knownPointsOnSlice({ workspace: { slice, display, runs }, surfaceInfo: info, selectedRunId: selected }), [slice, info, display, runs, selected]);

  // Gradient arrows: the lattice centres are laid out here, their gradients computed in the worker.
  const arrowLattice = useMemo(() => {
    if (!display.showArrows || !layout || info.variables.length !== n) return null;
    const t = frameTransform(view, layout);
    const spacing = compact ? COMPACT_ARROW_SPACING : ARROW_SPACING;
    const centres: { a: number; b: number }[] = [];
    gradientArrows((p) => (centres.push(p), null), t, spacing);
    const points = new Float64Array(centres.length * n);
    centres.forEach((p, k) => points.set(slicePoint(slice, n, p.a, p.b), k * n));
    return { t, spacing, points, count: centres.length, key: `${specKey(surfaceSpec)}|${view.a}|${view.b}|${layout.frame.width}x${layout.frame.height}|${JSON.stringify(slice)}|${spacing}` };
  }, [display.showArrows, layout, view, slice, n, compact, info.variables.length, surfaceSpec]);
  const probed = useProbe(arrowLattice?.key ?? null, () => arrowLattice!.points, arrowLattice?.count ?? 0);
  const arrows: Arrow[] = useMemo(() => {
    if (!arrowLattice || probed?.key !== arrowLattice.key) return [];
    const plane = slicePlane(slice, n);
    let k = 0;
    // The same lattice in the same order: the k-th centre's gradient restricted to the plane, (u . grad, v . grad).
    return gradientArrows(() => {
      const g = probed.gradients.subarray(k * n, (k + 1) * n);
      k++;
      return gradientInPlane(plane, g);
    }, arrowLattice.t, arrowLattice.spacing);
  }, [arrowLattice, probed, slice, n]);

  // Base layer, drawn in the next animation frame: a commit that mounts a new page (the data-fit
  // layout) runs its effects in the click's own task, and the canvas's font setter would force the new
  // page's style and layout there too; in the frame the browser lays the page out once anyway.
  useEffect(() => {
    const frame = requestAnimationFrame(paintBase);
    return () => cancelAnimationFrame(frame);
  }, [layout, picture, view, titles.a, titles.b, knownPoints, arrows, title]);
  function paintBase() {
    const canvas = baseRef.current;
    if (!canvas || !layout) return;
    const ctx = prepareCanvas(canvas, layout.canvas);
    if (!ctx) return;
    const axes = drawBase(ctx, { layout, view, picture, axisLabels: titles, knownPoints, arrows, title });
    canvas.dataset.drawn = picture ? 'contours' : 'empty';
    // The plot frame and the drawn ticks (value, position) in canvas CSS pixels, read by the browser tests.
    canvas.dataset.axes = JSON.stringify({
      frame: { left: layout.left, top: layout.top, ...layout.frame },
      a: axes.aTicks.map((t) => [t.value, layout.left + t.px]),
      b: axes.bTicks.map((t) => [t.value, layout.top + t.py]),
    });
    // Which grid is on screen (read by the browser tests: time to the first picture of a new surface).
    canvas.dataset.gridRequest = picture?.requestId ?? '';
    canvas.dataset.gridSide = picture ? String(picture.grid.nx) : '';
    if (picture && performance.getEntriesByName(FIRST_CONTOUR_MARK).length === 0) performance.mark(FIRST_CONTOUR_MARK);
  }

  // Overlay layer: once per animation frame, only when something changed.
  // The pointer's point comes from the hover store, read here in the loop: a pointer move redraws this
  // canvas on the next frame without re-rendering the component.
  const overlayInput = useRef({ view, runs, selected, slice, runIds, layout });
  overlayInput.current = { view, runs, selected, slice, runIds, layout };
  useEffect(() => {
    let frame = 0;
    let drawnVersion = -1;
    let drawnInput: unknown = null;
    let drawnHover: unknown = null;
    const tick = () => {
      frame = requestAnimationFrame(tick);
      const input = overlayInput.current;
      const hover = hoverApi.getState().hover;
      const canvas = overlayRef.current;
      if (!canvas || !input.layout) return;
      if (drawnVersion === live.version && drawnInput === input && drawnHover === hover) return;
      drawnVersion = live.version;
      drawnInput = input;
      drawnHover = hover;
      const ctx = prepareCanvas(canvas, input.layout.canvas);
      if (!ctx) return;
      ctx.clearRect(0, 0, input.layout.canvas.width, input.layout.canvas.height);
      const trajectories = trajectoryItems(storeApi.getState(), live, input.runIds);
      drawOverlay(ctx, { layout: input.layout, view: input.view, trajectories, hover });
      canvas.dataset.trajectories = String(trajectories.length);
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [live, storeApi, hoverApi]);

  // Interaction.
  const drag = useRef<{ x: number; y: number; moved: boolean } | null>(null);
  function framePoint(e: { clientX: number; clientY: number }) {
    const rect = overlayRef.current!.getBoundingClientRect();
    return canvasToFrame(layout!, { px: e.clientX - rect.left, py: e.clientY - rect.top });
  }
  /** Wheel up (away from the user) zooms in at the pointer; the page does not scroll meanwhile. */
  function onWheel(e: WheelEvent) {
    if (!layout) return;
    const p = framePoint(e);
    if (!insideFrame(layout, p)) return;
    e.preventDefault();
    actions.setView(zoomAt(view, layout.frame, p, e.deltaY < 0 ? WHEEL_ZOOM : 1 / WHEEL_ZOOM));
  }
  // React's onWheel listener is passive (it cannot prevent scrolling), so the wheel is listened to directly.
  const wheelHandler = useRef(onWheel);
  wheelHandler.current = onWheel;
  useEffect(() => {
    const box = boxRef.current;
    if (!box) return;
    const listener = (e: WheelEvent) => wheelHandler.current(e);
    box.addEventListener('wheel', listener, { passive: false });
    return () => box.removeEventListener('wheel', listener);
  }, []);
  function onPointerDown(e: PointerEvent) {
    if (e.button !== 0) return;
    drag.current = { x: e.clientX, y: e.clientY, moved: false };
    (e.target as Element).setPointerCapture?.(e.pointerId);
  }
  function onPointerMove(e: PointerEvent) {
    if (!layout) return;
    const p = framePoint(e);
    const d = drag.current;
    if (d) {
      const dx = e.clientX - d.x;
      const dy = e.clientY - d.y;
      if (d.moved || Math.hypot(dx, dy) > 4) {
        d.moved = true;
        d.x = e.clientX;
        d.y = e.clientY;
        actions.setView(panBy(view, layout.frame, dx, dy));
        return;
      }
    }
    actions.setHover(insideFrame(layout, p) ? frameTransform(view, layout).toParam(p) : null);
  }
  function onPointerUp(e: PointerEvent) {
    const d = drag.current;
    drag.current = null;
    if (!d || d.moved || !layout) return;
    const p = framePoint(e);
    if (!insideFrame(layout, p)) return;
    const q = frameTransform(view, layout).toParam(p);
    actions.setStart(slicePoint(slice, n, roundToView(q.a, view.a), roundToView(q.b, view.b)));
  }
  function onKeyDown(e: KeyboardEvent) {
    if (!layout) return;
    const { width, height } = layout.frame;
    const centre = { px: width / 2, py: height / 2 };
    const moves: Record<string, () => void> = {
      ArrowLeft: () => actions.setView(panBy(view, layout.frame, width * 0.1, 0)),
      ArrowRight: () => actions.setView(panBy(view, layout.frame, -width * 0.1, 0)),
      ArrowUp: () => actions.setView(panBy(view, layout.frame, 0, height * 0.1)),
      ArrowDown: () => actions.setView(panBy(view, layout.frame, 0, -height * 0.1)),
      '+': () => actions.setView(zoomAt(view, layout.frame, centre, KEY_ZOOM)),
      '=': () => actions.setView(zoomAt(view, layout.frame, centre, KEY_ZOOM)),
      '-': () => actions.setView(zoomAt(view, layout.frame, centre, 1 / KEY_ZOOM)),
      '0': () => actions.resetView(),
    };
    const move = moves[e.key];
    if (move) {
      e.preventDefault();
      move();
    }
  }

  return (
    <div className={compact ? 'surface-view compact' : 'surface-view'}>
      <div
        ref={boxRef}
        className="surface-canvas-box"
        tabIndex={0}
        role="img"
        aria-label={`${title ?? info.label}: contour map of the loss over ${titles.a} and ${titles.b}. Arrow keys pan, plus and minus zoom, 0 resets; click sets the start point.`}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerLeave={() => actions.setHover(null)}
        onKeyDown={onKeyDown}
      >
        <canvas ref={baseRef} className="surface-base" data-testid="surface-base" />
        <canvas ref={overlayRef} className="surface-overlay" data-testid="surface-overlay" />
        {grid.phase === 'error' && <div className="grid-error" role="alert">{grid.error}</div>}
      </div>
      {/* Below the canvas, in a line of its own that is always there: drawn over the map, the badge
          covered the plot, the colour bar or a neighbouring panel. */}
      <div className="grid-status">
        {grid.phase === 'computing' && (
          <span className="grid-progress" role="progressbar" aria-label="Sampling the surface" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(grid.progress * 100)}>
            sampling {Math.round(grid.progress * 100)}%{grid.stage === 'coarse' && grid.request ? ` (showing a ${grid.request.nx} x ${grid.request.ny} preview)` : ''}
          </span>
        )}
      </div>
      {!compact && <HoverReadout surface={surface} />}
    </div>
  );
}

