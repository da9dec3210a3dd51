import { describe, expect, it } from 'vitest';
import {
  bandColours,
  contourBands,
  drawFilledContours,
  drawIsolines,
  levelThresholds,
  valueScale,
  viewTransform,
  type ContourBand,
  type ParamRing,
} from '../../../src/ui/plot';
import type { GridBox } from '../../../src/engine';
import { RecordingContext } from './recording-context';

const grid: GridBox = { a: [-2, 2], b: [-2, 2], nx: 101, ny: 101 };

function sample(g: GridBox, f: (a: number, b: number) => number): Float64Array {
  const out = new Float64Array(g.nx * g.ny);
  for (let j = 0; j < g.ny; j++)
    for (let i = 0; i < g.nx; i++) out[i + j * g.nx] = f(g.a[0] + (i * (g.a[1] - g.a[0])) / (g.nx - 1), g.b[0] + (j * (g.b[1] - g.b[0])) / (g.ny - 1));
  return out;
}

function points(ring: ParamRing): { a: number; b: number }[] {
  const out = [];
  for (let k = 0; k < ring.ab.length; k += 2) out.push({ a: ring.ab[k], b: ring.ab[k + 1] });
  return out;
}

const touchesEdge = (ring: ParamRing, g: GridBox) => points(ring).some((p) => p.a === g.a[0] || p.a === g.a[1] || p.b === g.b[0] || p.b === g.b[1]);

/** Even-odd point-in-band test over all rings of the band. */
function inBand(band: ContourBand, a: number, b: number): boolean {
  let inside = false;
  for (const polygon of band.polygons)
    for (const ring of polygon) {
      const p = points(ring);
      for (let k = 0, m = p.length - 1; k < p.length; m = k++)
        if (p[k].b > b !== p[m].b > b && a < ((p[m].a - p[k].a) * (b - p[k].b)) / (p[m].b - p[k].b) + p[k].a) inside = !inside;
    }
  return inside;
}

describe('contourBands', () => {
  const bowl = sample(grid, (a, b) => a * a + b * b);

  it.each([
    ['raw values', (v: number) => v],
    ['log-scaled values', valueScale(0, 8).transform],
  ])('on f = a^2 + b^2 the level curve of threshold t is a circle of radius sqrt(t) (%s)', (_, transform) => {
    const thresholds = [0.25, 1, 2.25];
    const bands = contourBands(bowl, grid, thresholds, transform);
    bands.forEach((band, k) => {
      expect(band.threshold).toBe(thresholds[k]);
      const inner = band.polygons.flat().filter((r) => !touchesEdge(r, grid));
      expect(inner).toHaveLength(1); // the hole where f < t
      const radii = points(inner[0]).map((p) => Math.hypot(p.a, p.b));
      expect(radii.length).toBeGreaterThan(20);
      for (const r of radii) expect(Math.abs(r - Math.sqrt(thresholds[k]))).toBeLessThan(0.01);
      expect(inBand(band, 0, 0)).toBe(false);
      expect(inBand(band, 1.9, 1.9)).toBe(true);
    });
  });

  it('a peak gives a disk (the region at or above the threshold)', () => {
    const peak = sample(grid, (a, b) => -(a * a + b * b));
    const [band] = contourBands(peak, grid, [-1]);
    expect(band.polygons).toHaveLength(1);
    expect(band.polygons[0]).toHaveLength(1);
    for (const p of points(band.polygons[0][0])) expect(Math.hypot(p.a, p.b)).toBeCloseTo(1, 2);
  });

  it('a threshold below every value covers the grid rectangle exactly (d3 half-cell overhang removed)', () => {
    const g: GridBox = { a: [1, 3], b: [-5, -4], nx: 7, ny: 4 };
    const [band] = contourBands(sample(g, (a, b) => a + b), g, [-100]);
    const p = band.polygons.flat().flatMap(points);
    expect(Math.min(...p.map((q) => q.a))).toBe(1);
    expect(Math.max(...p.map((q) => q.a))).toBeCloseTo(3, 12);
    expect(Math.min(...p.map((q) => q.b))).toBe(-5);
    expect(Math.max(...p.map((q) => q.b))).toBeCloseTo(-4, 12);
  });

  it('row j = 0 is b0: the band of f = b above 0.5 is the top part, drawn in the upper part of the frame', () => {
    const g: GridBox = { a: [0, 1], b: [0, 1], nx: 11, ny: 11 };
    const [band] = contourBands(sample(g, (_, b) => b), g, [0.5]);
    const p = band.polygons.flat().flatMap(points);
    expect(Math.min(...p.map((q) => q.b))).toBeCloseTo(0.5, 12);
    expect(Math.max(...p.map((q) => q.b))).toBeCloseTo(1, 12);
    const t = viewTransform(g, { width: 100, height: 100 });
    const ctx = new RecordingContext();
    drawFilledContours(ctx, [band], t, ['#123456'], { missing: null });
    const ys = ctx.paints[0].subpaths.flat().map(([, y]) => y);
    expect(Math.max(...ys)).toBeCloseTo(50, 9);
    expect(Math.min(...ys)).toBeCloseTo(0, 9);
  });

  it('NaN and infinite cells are missing: no crash, and no band covers them', () => {
    const values = bowl.slice();
    for (let j = 40; j <= 60; j++) for (let i = 70; i <= 90; i++) values[i + j * grid.nx] = (i + j) % 3 === 0 ? Number.NaN : (i + j) % 3 === 1 ? Infinity : -Infinity;
    values[0] = Number.NaN;
    const bands = contourBands(values, grid, levelThresholds(0, 8, 10));
    // centre of the block: i = 80, j = 50 -> a = 1.2, b = 0
    for (const band of bands) expect(inBand(band, 1.2, 0)).toBe(false);
    expect(inBand(bands[0], -1, 1)).toBe(true);
  });

  it('an all-missing grid and non-finite thresholds give empty bands', () => {
    const bands = contourBands(new Float64Array(grid.nx * grid.ny).fill(Number.NaN), grid, [0, 1, Number.NaN]);
    expect(bands.map((b) => b.polygons.length)).toEqual([0, 0, 0]);
  });

  it('checks the value count', () => {
    expect(() => contourBands(new Float64Array(3), grid, [0])).toThrow('contours: expected 101 x 101 = 10201 values, got 3');
  });
});

describe('drawFilledContours and drawIsolines', () => {
  const bowl = sample(grid, (a, b) => a * a + b * b);
  const scale = valueScale(0, 8);
  const thresholds = levelThresholds(0, 8, 12);
  const colours = bandColours(thresholds, scale);
  const bands = contourBands(bowl, grid, thresholds, scale.transform);
  const t = viewTransform(grid, { width: 300, height: 200 });

  it('paints the missing colour under the grid, then one even-odd fill per band in ascending order with map colours', () => {
    const ctx = new RecordingContext();
    drawFilledContours(ctx, bands, t, colours, { grid });
    const [missing, ...fills] = ctx.paints;
    expect(missing.colour).toBe('#d9d9d9');
    expect(fills.map((f) => f.colour)).toEqual(colours.slice(0, fills.length));
    expect(fills.every((f) => f.rule === 'evenodd')).toBe(true);
    expect(fills.length).toBe(12);
    for (const f of fills)
      for (const [x, y] of f.subpaths.flat()) {
        expect(x).toBeGreaterThanOrEqual(-1e-9);
        expect(x).toBeLessThanOrEqual(300 + 1e-9);
        expect(y).toBeGreaterThanOrEqual(-1e-9);
        expect(y).toBeLessThanOrEqual(200 + 1e-9);
      }
    expect(ctx.depth).toBe(0);
  });

  it('refuses fewer colours than bands', () => {
    expect(() => drawFilledContours(new RecordingContext(), bands, t, colours.slice(1))).toThrow('contours: 12 bands need 12 colours, got 11');
  });

  it('isolines leave out the grid edge: every stroked point is on a circle', () => {
    const few = contourBands(bowl, grid, [1, 2.25]);
    const ctx = new RecordingContext();
    drawIsolines(ctx, few, grid, t);
    const pts = ctx.paints[0].subpaths.flat().map(([x, y]) => t.toParam({ px: x, py: y }));
    expect(pts.length).toBeGreaterThan(40);
    for (const p of pts) {
      const r = Math.hypot(p.a, p.b);
      expect(Math.min(Math.abs(r - 1), Math.abs(r - 1.5))).toBeLessThan(0.01);
    }
  });
});
