/**
 * Filled contours of a sampled slice, computed with d3-contour and kept in parameter space (so a pan
 * or zoom redraws them without recomputing).
 *
 * d3-contour's convention: it reads the nx x ny values as a raster of unit pixels, value (i, j) at the
 * pixel centre (i + 0.5, j + 0.5), output coordinates in [0, nx] x [0, ny]; the region of a threshold t
 * is where value >= t, and anything outside the raster counts as below every threshold, which closes
 * the rings half a pixel beyond the outer samples. Our samples sit on cell corners (see grid-space.ts),
 * so a contour point (x, y) maps to fractional sample indices
 *   i = clamp(x - 0.5, 0, nx - 1),   j = clamp(y - 0.5, 0, ny - 1),
 * then to parameter space with gridToParam. The clamp moves the half-pixel overhang onto the outermost
 * sample row or column, which is exactly the boundary of the sampled region (points at x = 0 or x = nx
 * are only ever joined to points on the outer sample column), so a band covering every sample fills
 * the grid rectangle exactly. d3's row y = 0 is our j = 0, the bottom of the view; the flip to screen
 * rows happens later, in the view transform.
 *
 * Values are contoured after the scale's transform T (log10 of the shifted value by default, see
 * colour.ts), so the linear interpolation along cell edges happens in the space where the levels are
 * evenly spaced. NaN and +-Infinity are missing: they are set to NaN, which d3 treats as below every
 * threshold, so missing cells belong to no band and show whatever was painted underneath (the
 * `missing` colour). Nothing here throws on bad values.
 */
import { contours } from 'd3';
import { PLOT_STYLE, type DrawingContext } from './context';
import { validateGridBox, type GridBox } from '../../engine';
import type { ViewTransform } from './scales';

/** A closed ring in parameter space, interleaved a, b pairs (the first point is not repeated). */
export interface ParamRing {
  readonly ab: Float64Array;
}

/** The region where the value is at or above `threshold`; polygon = [outer ring, ...holes]. */
export interface ContourBand {
  level: number;
  threshold: number;
  polygons: ParamRing[][];
}

export function contourBands(
  values: Float64Array,
  grid: GridBox,
  thresholds: readonly number[],
  transform: (v: number) => number = (v) => v,
): ContourBand[] {
  validateGridBox(grid);
  const { nx, ny } = grid;
  if (values.length !== nx * ny) throw new Error(`contours: expected ${nx} x ${ny} = ${nx * ny} values, got ${values.length}`);
  const t = new Float64Array(values.length);
  for (let k = 0; k < values.length; k++) {
    const v = transform(values[k]);
    t[k] = Number.isFinite(v) ? v : Number.NaN;
  }
  const generator = contours().size([nx, ny]);
  const da = (grid.a[1] - grid.a[0]) / (nx - 1);
  const db = (grid.b[1] - grid.b[0]) / (ny - 1);
  const a0 = grid.a[0];
  const b0 = grid.b[0];
  const raster = t as unknown as number[]; // d3 only indexes it
  return thresholds.map((threshold, level) => {
    const tt = transform(threshold);
    if (!Number.isFinite(tt)) return { level, threshold, polygons: [] };
    const shape = generator.contour(raster, tt);
    const polygons = shape.coordinates.map((polygon) =>
      polygon.map((ring) => {
        const n = ring.length > 1 && ring[0][0] === ring[ring.length - 1][0] && ring[0][1] === ring[ring.length - 1][1] ? ring.length - 1 : ring.length;
        const ab = new Float64Array(2 * n);
        for (let k = 0; k < n; k++) {
          const i = Math.min(nx - 1, Math.max(0, ring[k][0] - 0.5));
          const j = Math.min(ny - 1, Math.max(0, ring[k][1] - 0.5));
          ab[2 * k] = a0 + i * da;
          ab[2 * k + 1] = b0 + j * db;
        }
        return { ab };
      }),
    );
    return { level, threshold, polygons };
  });
}

export interface FilledContourOptions {
  /**
   * Painted over the grid rectangle first, so missing cells (NaN, infinite) show it. Needs `grid`.
   * Defaults to PLOT_STYLE.missingColour when a grid is given; pass null to paint nothing.
   */
  missing?: string | null;
  grid?: GridBox;
}

/**
 * Paints bands in ascending level order, each over the ones below (band k's region contains band k+1's),
 * so there are no seams between neighbours. Rings are traced in one path per band and filled with the
 * even-odd rule, which makes holes regardless of ring orientation.
 */
export function drawFilledContours(
  ctx: DrawingContext,
  bands: readonly ContourBand[],
  transform: ViewTransform,
  colours: readonly string[],
  options: FilledContourOptions = {},
): void {
  if (colours.length < bands.length) throw new Error(`contours: ${bands.length} bands need ${bands.length} colours, got ${colours.length}`);
  ctx.save();
  const missing = options.missing === undefined ? PLOT_STYLE.missingColour : options.missing;
  if (options.grid && missing) {
    const g = options.grid;
    const x0 = transform.pxOfA(g.a[0]);
    const x1 = transform.pxOfA(g.a[1]);
    const y0 = transform.pyOfB(g.b[1]);
    const y1 = transform.pyOfB(g.b[0]);
    ctx.fillStyle = missing;
    ctx.fillRect(x0, y0, x1 - x0, y1 - y0);
  }
  for (const band of bands) {
    if (band.polygons.length === 0) continue;
    ctx.beginPath();
    for (const polygon of band.polygons) for (const ring of polygon) traceRing(ctx, ring, transform);
    ctx.fillStyle = colours[band.level] ?? colours[colours.length - 1];
    ctx.fill('evenodd');
  }
  ctx.restore();
}

function traceRing(ctx: DrawingContext, ring: ParamRing, transform: ViewTransform): void {
  const ab = ring.ab;
  const n = ab.length / 2;
  if (n < 3) return;
  ctx.moveTo(transform.pxOfA(ab[0]), transform.pyOfB(ab[1]));
  for (let k = 1; k < n; k++) ctx.lineTo(transform.pxOfA(ab[2 * k]), transform.pyOfB(ab[2 * k + 1]));
  ctx.closePath();
}

export interface IsolineStyle {
  colour?: string;
  width?: number;
}

/**
 * Strokes the level curves (band boundaries), leaving out the stretches that run along the edge of the
 * grid rectangle, which are where a band was cut by the sampled range rather than a level curve.
 */
export function drawIsolines(ctx: DrawingContext, bands: readonly ContourBand[], grid: GridBox, transform: ViewTransform, style: IsolineStyle = {}): void {
  const onEdge = edgeTest(grid);
  ctx.save();
  ctx.strokeStyle = style.colour ?? 'rgba(255,255,255,0.35)';
  ctx.lineWidth = style.width ?? 0.75;
  ctx.lineJoin = 'round';
  ctx.beginPath();
  for (const band of bands)
    for (const polygon of band.polygons)
      for (const ring of polygon) {
        const ab = ring.ab;
        const n = ab.length / 2;
        let penDown = false;
        for (let k = 0; k < n; k++) {
          const k2 = (k + 1) % n;
          const a1 = ab[2 * k], b1 = ab[2 * k + 1], a2 = ab[2 * k2], b2 = ab[2 * k2 + 1];
          if (onEdge(a1, b1, a2, b2)) {
            penDown = false;
            continue;
          }
          if (!penDown) ctx.moveTo(transform.pxOfA(a1), transform.pyOfB(b1));
          ctx.lineTo(transform.pxOfA(a2), transform.pyOfB(b2));
          penDown = true;
        }
      }
  ctx.stroke();
  ctx.restore();
}

/** Whether the segment lies along one side of the grid rectangle. */
export function edgeTest(grid: GridBox): (a1: number, b1: number, a2: number, b2: number) => boolean {
  const ea = 1e-9 * (grid.a[1] - grid.a[0]);
  const eb = 1e-9 * (grid.b[1] - grid.b[0]);
  const near = (x: number, y: number, e: number) => Math.abs(x - y) <= e;
  return (a1, b1, a2, b2) =>
    (near(a1, grid.a[0], ea) && near(a2, grid.a[0], ea)) ||
    (near(a1, grid.a[1], ea) && near(a2, grid.a[1], ea)) ||
    (near(b1, grid.b[0], eb) && near(b2, grid.b[0], eb)) ||
    (near(b1, grid.b[1], eb) && near(b2, grid.b[1], eb));
}
