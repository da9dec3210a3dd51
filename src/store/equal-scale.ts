/**
 * Equal scale on the map: one unit of a and one unit of b cover the same number of pixels, so a path
 * crosses contours at the angles it has in parameter space (at right angles for plain descent). The
 * saved view box is what the user asked for; the box shown on a frame keeps its centre and widens one
 * axis until the units per pixel agree, so the whole frame is used. The grid request, the axes, the
 * pointer and zoom all use the shown box.
 */
import type { SurfaceSpec } from '../problems';
import type { ViewBox } from '../engine';
import type { DisplaySettings } from './workspace';

/** A plot frame's size in CSS pixels (the shape of the ui's PixelSize, kept here so the store does not import the ui). */
export interface FrameSize {
  width: number;
  height: number;
}

/** Whether equal scale is on: the saved choice, else on for the two-variable test functions. */
export function equalScaleOn(display: Pick<DisplaySettings, 'equalScale'>, surface: SurfaceSpec, variableCount: number): boolean {
  return display.equalScale ?? (surface.kind === 'catalogue' && variableCount === 2);
}

/**
 * The box drawn on a frame of `frame` pixels: `view` itself without equal scale (or before the frame is
 * measured); with it, `view` widened about its centre on the axis with more pixels per unit, so that
 * width / span(a) = height / span(b). A box that already has equal scale is returned as it is.
 */
export function shownView(view: ViewBox, frame: FrameSize | null, equal: boolean): ViewBox {
  if (!equal || !frame || !(frame.width > 0 && frame.height > 0)) return view;
  const spanA = view.a[1] - view.a[0];
  const spanB = view.b[1] - view.b[0];
  const perA = frame.width / spanA;
  const perB = frame.height / spanB;
  if (Math.abs(perA - perB) <= 1e-9 * Math.max(perA, perB)) return view;
  if (perA > perB) return { a: widened(view.a, frame.width / perB), b: view.b };
  return { a: view.a, b: widened(view.b, frame.height / perA) };
}

function widened([lo, hi]: readonly [number, number], span: number): [number, number] {
  const centre = lo + (hi - lo) / 2;
  return [centre - span / 2, centre + span / 2];
}
