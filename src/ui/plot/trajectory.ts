/**
 * A run's trajectory on the slice: the polyline in frame pixels, decimated and clipped, plus its
 * markers (start, every k-th step, end). `trajectoryPath` computes it; `drawTrajectory` paints it;
 * the SVG export uses the same path.
 *
 * Decimation: a point is emitted only when it is at least `minPixelStep` pixels (default 0.75) from the
 * last emitted one (the last point is always kept), so every skipped point lies within that distance of
 * the drawn line; 10^5 steps that crawl along a valley collapse to a few hundred vertices.
 * Clipping: segments are clipped (Liang-Barsky) to the frame grown by `clipMarginPx`, so a diverging
 * run with coordinates near 1e300 never hands the canvas huge numbers, and the visible part of every
 * segment is drawn exactly. Non-finite points break the line.
 * Markers: at steps divisible by `markerEvery` (not the start or the last row), skipped when closer than
 * one marker size to the previous marker, and only inside the grown frame.
 */
import type { DrawingContext } from './context';
import { drawMarker } from './markers';
import type { RunStyle } from './run-style';
import type { PixelPoint, ViewTransform } from './scales';

/** A polyline in frame pixels, interleaved px, py pairs. */
export interface PixelPolyline {
  readonly pxpy: Float64Array;
}

export type TrajectoryMarkerKind = 'start' | 'step' | 'end';

export interface TrajectoryMarker {
  kind: TrajectoryMarkerKind;
  step: number;
  at: PixelPoint;
}

export interface TrajectoryPath {
  polylines: PixelPolyline[];
  markers: TrajectoryMarker[];
}

/** Where the slice coordinates sit in each row of the points array. */
export interface PointLayout {
  /** Numbers per row (default 2). */
  stride: number;
  /** Column of a (default 0) and of b (default 1). */
  a: number;
  b: number;
}

export interface TrajectoryOptions {
  /** Step number of row 0 (default 0, meaning row 0 is the start point). */
  firstStep?: number;
  /** A marker at every step divisible by this; 0 for none (default). */
  markerEvery?: number;
  minPixelStep?: number;
  clipMarginPx?: number;
  /** Nominal marker diameter in pixels (default 8). */
  markerSize?: number;
  lineWidth?: number;
  layout?: Partial<PointLayout>;
  /** What drawTrajectory paints: the line, the markers, or both (default), so several runs' markers can go over all lines. */
  parts?: 'lines' | 'markers' | 'all';
}

export const TRAJECTORY_DEFAULTS = { minPixelStep: 0.75, clipMarginPx: 32, markerSize: 8, lineWidth: 1.75 } as const;

export function trajectoryPath(points: Float64Array, count: number, transform: ViewTransform, options: TrajectoryOptions = {}): TrajectoryPath {
  const builder = new PathBuilder(points, transform, options);
  const rows = builder.rowsOf(count);
  builder.extend(rows);
  return { polylines: builder.polylines(), markers: trajectoryMarkers(rows, builder.xOf, builder.yOf, builder.box, options) };
}

/** Builders kept per points array, a few per array (one per view that draws it: map, panels, figures). */
const BUILDERS = new WeakMap<Float64Array, { key: string; builder: PathBuilder }[]>();
const BUILDERS_PER_ARRAY = 4;

/**
 * trajectoryPath for a trajectory that only grows (the page's streamed runs): the same result, but
 * the polyline is extended from the rows already walked for the same points array, view and options,
 * so a frame costs the new steps, not all of them. A shorter count, another array (the buffer grew)
 * or another view walks from the start.
 */
export function growingTrajectoryPath(points: Float64Array, count: number, transform: ViewTransform, options: TrajectoryOptions = {}): TrajectoryPath {
  const key = pathKey(transform, options);
  let entries = BUILDERS.get(points);
  if (!entries) BUILDERS.set(points, (entries = []));
  let entry = entries.find((e) => e.key === key);
  if (entry) entries.splice(entries.indexOf(entry), 1);
  const fresh = new PathBuilder(points, transform, options);
  const rows = fresh.rowsOf(count);
  if (!entry || entry.builder.rows > rows) entry = { key, builder: fresh };
  entries.unshift(entry);
  entries.length = Math.min(entries.length, BUILDERS_PER_ARRAY);
  const builder = entry.builder;
  builder.extend(rows);
  return { polylines: builder.polylines(), markers: trajectoryMarkers(rows, builder.xOf, builder.yOf, builder.box, options) };
}

/** What a walked polyline depends on besides the points: the view's mapping and the walk's options. */
function pathKey(t: ViewTransform, o: TrajectoryOptions): string {
  const l = o.layout ?? {};
  return [t.size.width, t.size.height, t.pxOfA(0), t.pxOfA(1), t.pyOfB(0), t.pyOfB(1), l.stride ?? 2, l.a ?? 0, l.b ?? 1, o.minPixelStep ?? '', o.clipMarginPx ?? ''].join(' ');
}

/**
 * The decimating, clipping walk over the rows (see the header), resumable: `extend(rows)` walks the
 * rows not yet walked; `polylines()` is the finished lines plus the open one with its pending point,
 * without closing it, so the walk can go on.
 */
class PathBuilder {
  rows = 0;
  readonly box: Box;
  readonly xOf: (r: number) => number;
  readonly yOf: (r: number) => number;
  private readonly stride: number;
  private readonly tol2: number;
  private readonly done: PixelPolyline[] = [];
  private line: number[] | null = null;
  private lastX = 0;
  private lastY = 0;
  private pending = false;
  private pendX = 0;
  private pendY = 0;
  private prevOk = false;
  private prevX = 0;
  private prevY = 0;
  private readonly seg = new Float64Array(4);

  constructor(private readonly points: Float64Array, transform: ViewTransform, options: TrajectoryOptions) {
    const stride = options.layout?.stride ?? 2;
    const ca = options.layout?.a ?? 0;
    const cb = options.layout?.b ?? 1;
    if (!(Number.isInteger(stride) && stride >= 1 && ca >= 0 && cb >= 0 && ca < stride && cb < stride))
      throw new Error(`trajectory: layout columns ${ca}, ${cb} must lie inside rows of ${stride} numbers`);
    this.stride = stride;
    const tol = options.minPixelStep ?? TRAJECTORY_DEFAULTS.minPixelStep;
    this.tol2 = tol * tol;
    const margin = options.clipMarginPx ?? TRAJECTORY_DEFAULTS.clipMarginPx;
    this.box = { x0: -margin, y0: -margin, x1: transform.size.width + margin, y1: transform.size.height + margin };
    this.xOf = (r: number) => transform.pxOfA(points[r * stride + ca]);
    this.yOf = (r: number) => transform.pyOfB(points[r * stride + cb]);
  }

  /** The rows a count stands for in this array. */
  rowsOf(count: number): number {
    return Math.max(0, Math.min(Math.floor(count), Math.floor(this.points.length / this.stride)));
  }

  extend(rows: number): void {
    const { box, seg, tol2 } = this;
    for (let r = this.rows; r < rows; r++) {
      const x = this.xOf(r);
      const y = this.yOf(r);
      if (!(Number.isFinite(x) && Number.isFinite(y))) {
        this.flush();
        this.prevOk = false;
        continue;
      }
      if (!this.prevOk) {
        if (inside(box, x, y)) this.start(x, y);
      } else {
        const clip = inside(box, x, y) && inside(box, this.prevX, this.prevY) ? WHOLE : clipInto(box, this.prevX, this.prevY, x, y, seg);
        if (clip === HIDDEN) this.flush();
        else {
          if (clip === WHOLE) {
            seg[0] = this.prevX;
            seg[1] = this.prevY;
          }
          if (this.line === null || clip & START_CUT) {
            this.flush();
            this.start(seg[0], seg[1]);
          }
          if (clip & END_CUT) {
            if (this.pending) this.emit(this.pendX, this.pendY);
            this.emit(seg[2], seg[3]);
            this.flush();
          } else if ((x - this.lastX) * (x - this.lastX) + (y - this.lastY) * (y - this.lastY) >= tol2) this.emit(x, y);
          else {
            this.pending = true;
            this.pendX = x;
            this.pendY = y;
          }
        }
      }
      this.prevOk = true;
      this.prevX = x;
      this.prevY = y;
    }
    this.rows = Math.max(this.rows, rows);
  }

  polylines(): PixelPolyline[] {
    const open = this.line ? (this.pending ? [...this.line, this.pendX, this.pendY] : this.line) : null;
    return open && open.length >= 4 ? [...this.done, { pxpy: Float64Array.from(open) }] : this.done.slice();
  }

  private start(x: number, y: number): void {
    this.line = [x, y];
    this.lastX = x;
    this.lastY = y;
    this.pending = false;
  }

  private emit(x: number, y: number): void {
    this.line!.push(x, y);
    this.lastX = x;
    this.lastY = y;
    this.pending = false;
  }

  private flush(): void {
    if (this.line && this.pending) this.line.push(this.pendX, this.pendY);
    if (this.line && this.line.length >= 4) this.done.push({ pxpy: Float64Array.from(this.line) });
    this.line = null;
    this.pending = false;
  }
}

function trajectoryMarkers(
  rows: number,
  xOf: (r: number) => number,
  yOf: (r: number) => number,
  box: Box,
  options: TrajectoryOptions,
): TrajectoryMarker[] {
  const markers: TrajectoryMarker[] = [];
  if (rows === 0) return markers;
  const firstStep = options.firstStep ?? 0;
  const size = options.markerSize ?? TRAJECTORY_DEFAULTS.markerSize;
  const visible = (r: number) => inside(box, xOf(r), yOf(r));
  let lastX = Number.NaN, lastY = Number.NaN;
  const place = (kind: TrajectoryMarkerKind, r: number) => {
    const px = xOf(r), py = yOf(r);
    markers.push({ kind, step: firstStep + r, at: { px, py } });
    lastX = px;
    lastY = py;
  };
  if (firstStep === 0 && visible(0)) place('start', 0);
  const every = options.markerEvery ?? 0;
  if (Number.isInteger(every) && every > 0) {
    for (let r = (every - (firstStep % every)) % every; r < rows - 1; r += every) {
      if (firstStep + r === 0 || !visible(r)) continue;
      if (Math.hypot(xOf(r) - lastX, yOf(r) - lastY) < size) continue;
      place('step', r);
    }
  }
  const last = rows - 1;
  if (visible(last)) place('end', last);
  return markers;
}

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

function inside(b: Box, x: number, y: number): boolean {
  return x >= b.x0 && x <= b.x1 && y >= b.y0 && y <= b.y1;
}

const WHOLE = 0;
const START_CUT = 1;
const END_CUT = 2;
const HIDDEN = 4;

/**
 * Liang-Barsky clipping of the segment (x1, y1)-(x2, y2) to the box. Writes the visible part into out
 * and reports which ends were cut; null when nothing is visible.
 */
export function clipSegment(b: Box, x1: number, y1: number, x2: number, y2: number, out: Float64Array): { startClipped: boolean; endClipped: boolean } | null {
  const code = clipInto(b, x1, y1, x2, y2, out);
  return code === HIDDEN ? null : { startClipped: (code & START_CUT) !== 0, endClipped: (code & END_CUT) !== 0 };
}

/** The allocation-free core of clipSegment: HIDDEN, or WHOLE with START_CUT / END_CUT bits. */
function clipInto(b: Box, x1: number, y1: number, x2: number, y2: number, out: Float64Array): number {
  const dx = x2 - x1;
  const dy = y2 - y1;
  let t0 = 0;
  let t1 = 1;
  const edge = (p: number, q: number): boolean => {
    if (p === 0) return q >= 0;
    const t = q / p;
    if (p < 0) {
      if (t > t1) return false;
      if (t > t0) t0 = t;
    } else {
      if (t < t0) return false;
      if (t < t1) t1 = t;
    }
    return true;
  };
  if (!(edge(-dx, x1 - b.x0) && edge(dx, b.x1 - x1) && edge(-dy, y1 - b.y0) && edge(dy, b.y1 - y1))) return HIDDEN;
  out[0] = t0 > 0 ? x1 + t0 * dx : x1;
  out[1] = t0 > 0 ? y1 + t0 * dy : y1;
  out[2] = t1 < 1 ? x1 + t1 * dx : x2;
  out[3] = t1 < 1 ? y1 + t1 * dy : y2;
  return (t0 > 0 ? START_CUT : 0) | (t1 < 1 ? END_CUT : 0);
}

/** Sizes and outlines of the three marker kinds, shared with the SVG export. */
export function markerPaint(kind: TrajectoryMarkerKind, style: RunStyle, markerSize: number): { size: number; fill: string; outline: string; outlineWidth: number } {
  switch (kind) {
    case 'start':
      return { size: markerSize * 1.2, fill: '#ffffff', outline: style.colour, outlineWidth: 2 };
    case 'step':
      return { size: markerSize * 0.75, fill: style.colour, outline: style.halo, outlineWidth: 1 };
    case 'end':
      return { size: markerSize * 1.4, fill: style.colour, outline: style.halo, outlineWidth: 1.5 };
  }
}

/** Draws the trajectory over a contrasting halo, then its markers; returns the path it drew. */
export function drawTrajectory(
  ctx: DrawingContext,
  points: Float64Array,
  count: number,
  transform: ViewTransform,
  style: RunStyle,
  options: TrajectoryOptions = {},
): TrajectoryPath {
  const path = growingTrajectoryPath(points, count, transform, options);
  const width = options.lineWidth ?? TRAJECTORY_DEFAULTS.lineWidth;
  const markerSize = options.markerSize ?? TRAJECTORY_DEFAULTS.markerSize;
  ctx.save();
  ctx.lineJoin = 'round';
  ctx.lineCap = 'round';
  const parts = options.parts ?? 'all';
  if (parts !== 'markers' && path.polylines.length) {
    ctx.beginPath();
    for (const { pxpy } of path.polylines) {
      ctx.moveTo(pxpy[0], pxpy[1]);
      for (let k = 2; k < pxpy.length; k += 2) ctx.lineTo(pxpy[k], pxpy[k + 1]);
    }
    ctx.strokeStyle = style.halo;
    ctx.lineWidth = width + 2.5;
    ctx.stroke();
    ctx.strokeStyle = style.colour;
    ctx.lineWidth = width;
    ctx.stroke();
  }
  if (parts !== 'lines') for (const m of path.markers) {
    const paint = markerPaint(m.kind, style, markerSize);
    drawMarker(ctx, style.marker, m.at, paint.size, paint);
  }
  ctx.restore();
  return path;
}
