import { AXES_MARGIN, viewTransform, type PixelPoint, type PixelSize, type ViewTransform } from '../plot';
import type { ViewBox } from '../../engine';

/** Room to the right of the plot frame for the colour legend. */
export const LEGEND_WIDTH = 92;

/** Where the plot frame sits on a canvas of the given CSS size. */
export interface FrameLayout {
  canvas: PixelSize;
  /** Offset of the frame's top-left corner on the canvas. */
  left: number;
  top: number;
  frame: PixelSize;
  withLegend: boolean;
}

export function frameLayout(canvas: PixelSize, withLegend: boolean): FrameLayout {
  const right = AXES_MARGIN.right + (withLegend ? LEGEND_WIDTH : 0);
  return {
    canvas,
    left: AXES_MARGIN.left,
    top: AXES_MARGIN.top,
    frame: {
      width: Math.max(20, canvas.width - AXES_MARGIN.left - right),
      height: Math.max(20, canvas.height - AXES_MARGIN.top - AXES_MARGIN.bottom),
    },
    withLegend,
  };
}

export function frameTransform(view: ViewBox, layout: FrameLayout): ViewTransform {
  return viewTransform(view, layout.frame);
}

/** Canvas CSS pixel (e.g. from a pointer event) to frame pixel. */
export function canvasToFrame(layout: FrameLayout, p: PixelPoint): PixelPoint {
  return { px: p.px - layout.left, py: p.py - layout.top };
}

export function insideFrame(layout: FrameLayout, p: PixelPoint): boolean {
  return p.px >= 0 && p.py >= 0 && p.px <= layout.frame.width && p.py <= layout.frame.height;
}

/** A clicked coordinate rounded to a thousandth of the visible span (what a pixel can mean), e.g. 0.675 not 0.6750878049616227. */
export function roundToView(v: number, range: readonly [number, number]): number {
  const step = 10 ** Math.floor(Math.log10((range[1] - range[0]) / 1000));
  return Number((Math.round(v / step) * step).toPrecision(12));
}
