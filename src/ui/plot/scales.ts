/**
 * The view: which part of the slice plane is visible, and the one conversion between parameter space
 * and screen pixels.
 *
 * Spaces are distinct types (habit 5): a `ParamPoint` {a, b} is a point of the slice plane, a
 * `PixelPoint` {px, py} is a position in the plot frame in CSS pixels, with py growing downward. The
 * only ways across are the methods of a `ViewTransform` built from the current view and frame size.
 *
 * Frame-local pixels: (0, 0) is the top-left corner of the plot area and (width, height) its bottom-right
 * corner. Axes and the legend are drawn outside that rectangle, so the caller translates the canvas
 * context (or wraps SVG in a `<g transform>`) by its margins, and subtracts the same margins from pointer
 * positions before calling `toParam`, `zoomAt` or `panBy`. Device pixel ratio is the caller's business
 * too (`ctx.setTransform(dpr, 0, 0, dpr, 0, 0)` before drawing).
 */
import { validateViewBox, type GridBox, type ViewBox } from '../../engine';
import { gridToParam, type ParamPoint } from './grid-space';


/** Size of the plot frame in CSS pixels. */
export interface PixelSize {
  width: number;
  height: number;
}

/** A frame-local position in CSS pixels; py grows downward. */
export interface PixelPoint {
  px: number;
  py: number;
}

export interface ViewTransform {
  readonly view: ViewBox;
  readonly size: PixelSize;
  /** Pixels per unit of a, and per unit of b (both positive; the flip of b lives in the conversions). */
  readonly pxPerA: number;
  readonly pxPerB: number;
  toPixel(p: ParamPoint): PixelPoint;
  toParam(p: PixelPoint): ParamPoint;
  /** Scalar forms of the same maps, for hot loops that keep coordinates in typed arrays. */
  pxOfA(a: number): number;
  pyOfB(b: number): number;
  aOfPx(px: number): number;
  bOfPy(py: number): number;
  /**
   * Pixel position of grid sample (i, j), fractional indices allowed. The grid carries its own ranges
   * (it may lag the view while a new grid is being sampled after a zoom), hence the `grid` argument.
   */
  gridToPixel(grid: GridBox, i: number, j: number): PixelPoint;
}

/** Smallest span a zoom may reach, relative to the magnitude of the coordinates (double precision guard). */
export const MIN_RELATIVE_SPAN = 1e-9;
/** Largest span a zoom-out may reach. */
export const MAX_SPAN = 1e12;

export function validateView(view: ViewBox): void {
  validateViewBox(view, 'view');
}

export function validateSize(size: PixelSize): void {
  if (!(Number.isFinite(size.width) && size.width > 0 && Number.isFinite(size.height) && size.height > 0))
    throw new Error(`view: the frame size must be positive, got ${size.width} x ${size.height}`);
}

/**
 * px = (a - a0) / (a1 - a0) * width,  py = (b1 - b) / (b1 - b0) * height
 * so a0 is the left edge, a1 the right edge, b1 the top edge and b0 the bottom edge.
 */
export function viewTransform(view: ViewBox, size: PixelSize): ViewTransform {
  validateView(view);
  validateSize(size);
  const [a0, a1] = view.a;
  const [b0, b1] = view.b;
  const pxPerA = size.width / (a1 - a0);
  const pxPerB = size.height / (b1 - b0);
  const pxOfA = (a: number) => (a - a0) * pxPerA;
  const pyOfB = (b: number) => (b1 - b) * pxPerB;
  const aOfPx = (px: number) => a0 + px / pxPerA;
  const bOfPy = (py: number) => b1 - py / pxPerB;
  return {
    view: { a: [a0, a1], b: [b0, b1] },
    size: { width: size.width, height: size.height },
    pxPerA,
    pxPerB,
    pxOfA,
    pyOfB,
    aOfPx,
    bOfPy,
    toPixel: (p) => ({ px: pxOfA(p.a), py: pyOfB(p.b) }),
    toParam: (p) => ({ a: aOfPx(p.px), b: bOfPy(p.py) }),
    gridToPixel: (grid, i, j) => {
      const p = gridToParam(grid, { i, j });
      return { px: pxOfA(p.a), py: pyOfB(p.b) };
    },
  };
}

/**
 * Zooms by `factor` (> 1 zooms in: each span becomes span / factor) keeping the parameter point under
 * the pixel `at` at that same pixel. Spans are kept within [MIN_RELATIVE_SPAN * max(1, |coordinate|),
 * MAX_SPAN] so repeated wheel events cannot break double precision; at a limit the axis stops changing.
 */
export function zoomAt(view: ViewBox, size: PixelSize, at: PixelPoint, factor: number): ViewBox {
  if (!(Number.isFinite(factor) && factor > 0)) throw new Error(`zoom: factor must be a positive number, got ${factor}`);
  const t = viewTransform(view, size);
  const anchor = t.toParam(at);
  const fa = at.px / size.width; // fraction of the span left of the anchor
  const fb = (size.height - at.py) / size.height; // fraction of the span below the anchor
  return {
    a: zoomAxis(view.a, anchor.a, fa, factor),
    b: zoomAxis(view.b, anchor.b, fb, factor),
  };
}

function zoomAxis(range: [number, number], anchor: number, fractionBelow: number, factor: number): [number, number] {
  const span = (range[1] - range[0]) / factor;
  const floor = MIN_RELATIVE_SPAN * Math.max(1, Math.abs(range[0]), Math.abs(range[1]));
  if (!(span >= floor && span <= MAX_SPAN)) return [range[0], range[1]];
  const low = anchor - fractionBelow * span;
  return [low, low + span];
}

/**
 * Drag semantics: the content follows the pointer. Moving the pointer right by dxPx pixels shifts the
 * view left by dxPx / pxPerA in a; moving it down by dyPx shifts the view up by dyPx / pxPerB in b.
 */
export function panBy(view: ViewBox, size: PixelSize, dxPx: number, dyPx: number): ViewBox {
  const t = viewTransform(view, size);
  const da = Number.isFinite(dxPx) ? dxPx / t.pxPerA : 0;
  const db = Number.isFinite(dyPx) ? dyPx / t.pxPerB : 0;
  return { a: [view.a[0] - da, view.a[1] - da], b: [view.b[0] + db, view.b[1] + db] };
}

/**
 * Equal aspect: widens the narrower axis (about its centre) so one parameter unit has the same length
 * in pixels on both axes. Never shrinks a range, so everything visible before stays visible.
 */
export function fitAspect(view: ViewBox, size: PixelSize): ViewBox {
  validateView(view);
  validateSize(size);
  const unitsPerPx = Math.max((view.a[1] - view.a[0]) / size.width, (view.b[1] - view.b[0]) / size.height);
  const widen = (r: [number, number], px: number): [number, number] => {
    const mid = (r[0] + r[1]) / 2;
    const half = Math.max((unitsPerPx * px) / 2, (r[1] - r[0]) / 2);
    return [mid - half, mid + half];
  };
  return { a: widen(view.a, size.width), b: widen(view.b, size.height) };
}
