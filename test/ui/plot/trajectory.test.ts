import { describe, expect, it } from 'vitest';
import { clipSegment, drawTrajectory, runStyle, trajectoryPath, viewTransform, type PixelPolyline } from '../../../src/ui/plot';
import { RecordingContext } from './recording-context';

const t = viewTransform({ a: [-1, 1], b: [-1, 1] }, { width: 500, height: 500 });

function distanceToPolylines(x: number, y: number, lines: PixelPolyline[]): number {
  let best = Infinity;
  for (const { pxpy } of lines)
    for (let k = 0; k + 3 < pxpy.length; k += 2) {
      const [x1, y1, x2, y2] = [pxpy[k], pxpy[k + 1], pxpy[k + 2], pxpy[k + 3]];
      const dx = x2 - x1, dy = y2 - y1;
      const len2 = dx * dx + dy * dy;
      const u = len2 > 0 ? Math.max(0, Math.min(1, ((x - x1) * dx + (y - y1) * dy) / len2)) : 0;
      best = Math.min(best, Math.hypot(x - x1 - u * dx, y - y1 - u * dy));
    }
  return best;
}

/** A slowly converging spiral: 10^5 steps, most of them packed near the centre. */
function spiral(n: number): Float64Array {
  const p = new Float64Array(2 * n);
  for (let k = 0; k < n; k++) {
    const r = 0.9 * Math.exp(-k / 30000);
    p[2 * k] = r * Math.cos(k / 500);
    p[2 * k + 1] = r * Math.sin(k / 500);
  }
  return p;
}

describe('trajectoryPath', () => {
  it('decimates 10^5 points to far fewer vertices, every point within minPixelStep of the drawn line', () => {
    const n = 100_000;
    const pts = spiral(n);
    const path = trajectoryPath(pts, n, t, { minPixelStep: 0.75 });
    const vertices = path.polylines.reduce((s, l) => s + l.pxpy.length / 2, 0);
    expect(path.polylines).toHaveLength(1);
    expect(vertices).toBeLessThan(n / 4);
    for (let k = 0; k < n; k += 97) expect(distanceToPolylines(t.pxOfA(pts[2 * k]), t.pyOfB(pts[2 * k + 1]), path.polylines)).toBeLessThan(0.75 + 1e-9);
    const line = path.polylines[0].pxpy;
    expect(line[line.length - 2]).toBe(t.pxOfA(pts[2 * n - 2])); // the last point is kept exactly
    expect(line[line.length - 1]).toBe(t.pyOfB(pts[2 * n - 1]));
  });

  it('clips a diverging run to the frame plus margin: no huge coordinates, the visible part exact', () => {
    const pts = Float64Array.from([0, 0, 0.5, 0.25, 1e150, 0.5e150, 1e300, 1e300]);
    const path = trajectoryPath(pts, 4, t, { clipMarginPx: 32 });
    expect(path.polylines).toHaveLength(1);
    const line = path.polylines[0].pxpy;
    for (const v of line) expect(Math.abs(v)).toBeLessThan(600);
    // the exit point lies on the ray through the first two points (slope 1/2 in parameter space)
    const exit = t.toParam({ px: line[line.length - 2], py: line[line.length - 1] });
    expect(exit.b / exit.a).toBeCloseTo(0.5, 9);
    expect(t.pxOfA(exit.a)).toBeCloseTo(532, 9);
  });

  it('a non-finite point breaks the line', () => {
    const pts = Float64Array.from([0, 0, 0.1, 0, Number.NaN, 0, 0.3, 0, 0.4, 0]);
    const path = trajectoryPath(pts, 5, t);
    expect(path.polylines).toHaveLength(2);
  });

  it('re-enters: a run that leaves the frame and comes back gives two polylines starting on the margin', () => {
    const pts = Float64Array.from([0, 0, 5, 0, 0.2, 0.1]);
    const path = trajectoryPath(pts, 3, t, { clipMarginPx: 10 });
    expect(path.polylines).toHaveLength(2);
    expect(path.polylines[1].pxpy[0]).toBeCloseTo(510, 9);
  });

  it('markers: start, every k-th step (not the start or the last), end', () => {
    const n = 35;
    const pts = new Float64Array(2 * n);
    for (let k = 0; k < n; k++) pts[2 * k] = -0.9 + k * 0.05;
    const path = trajectoryPath(pts, n, t, { markerEvery: 10 });
    expect(path.markers.map((m) => `${m.kind}:${m.step}`)).toEqual(['start:0', 'step:10', 'step:20', 'step:30', 'end:34']);
    const later = trajectoryPath(pts, n, t, { markerEvery: 10, firstStep: 95 });
    expect(later.markers.map((m) => `${m.kind}:${m.step}`)).toEqual(['step:100', 'step:110', 'step:120', 'end:129']);
  });

  it('skips step markers closer than a marker size to the previous one', () => {
    const n = 101;
    const pts = new Float64Array(2 * n);
    for (let k = 0; k < n; k++) pts[2 * k] = k * 0.0041; // 1.025 px per step
    const path = trajectoryPath(pts, n, t, { markerEvery: 2, markerSize: 8 });
    const steps = path.markers.filter((m) => m.kind === 'step').map((m) => m.step);
    expect(steps[0]).toBe(8);
    for (let k = 1; k < steps.length; k++) expect(steps[k] - steps[k - 1]).toBe(8);
  });

  it('reads a and b from any two columns of wider rows', () => {
    const rows = Float64Array.from([0.25, 7, 0.5, 0, 7, 0, -0.5, 7, 0.1]); // stride 3, a in column 2, b in column 0
    const path = trajectoryPath(rows, 3, t, { layout: { stride: 3, a: 2, b: 0 } });
    expect(path.markers[0].at).toEqual(t.toPixel({ a: 0.5, b: 0.25 }));
    expect(path.markers[1].at).toEqual(t.toPixel({ a: 0.1, b: -0.5 }));
    expect(() => trajectoryPath(rows, 3, t, { layout: { stride: 2, a: 2 } })).toThrow('trajectory: layout columns 2, 1 must lie inside rows of 2 numbers');
  });
});

describe('clipSegment', () => {
  it('keeps inside segments whole and rejects outside ones', () => {
    const box = { x0: 0, y0: 0, x1: 10, y1: 10 };
    const out = new Float64Array(4);
    expect(clipSegment(box, 1, 1, 2, 2, out)).toEqual({ startClipped: false, endClipped: false });
    expect(Array.from(out)).toEqual([1, 1, 2, 2]);
    expect(clipSegment(box, -5, 5, 15, 5, out)).toEqual({ startClipped: true, endClipped: true });
    expect(Array.from(out)).toEqual([0, 5, 10, 5]);
    expect(clipSegment(box, 11, 0, 20, 5, out)).toBeNull();
  });
});

describe('drawTrajectory', () => {
  it('strokes a halo then the run colour, and draws the markers in the run style', () => {
    const style = runStyle(1);
    const pts = Float64Array.from([-0.5, -0.5, 0, 0, 0.5, 0.2]);
    const ctx = new RecordingContext();
    const path = drawTrajectory(ctx, pts, 3, t, style);
    const strokes = ctx.paints.filter((p) => p.op === 'stroke');
    expect(strokes[0].colour).toBe(style.halo);
    expect(strokes[1].colour).toBe(style.colour);
    expect(strokes[0].lineWidth).toBeGreaterThan(strokes[1].lineWidth);
    expect(path.markers.map((m) => m.kind)).toEqual(['start', 'end']);
    const fills = ctx.paints.filter((p) => p.op === 'fill').map((p) => p.colour);
    expect(fills).toEqual(['#ffffff', style.colour]); // hollow start, filled end
    expect(ctx.depth).toBe(0);
  });
  it('paints only the line or only the markers when asked', () => {
    const style = runStyle(0);
    const pts = Float64Array.from([-0.5, -0.5, 0, 0, 0.5, 0.2]);
    const lines = new RecordingContext();
    drawTrajectory(lines, pts, 3, t, style, { parts: 'lines' });
    expect(lines.paints.map((p) => p.op)).toEqual(['stroke', 'stroke']);
    const markers = new RecordingContext();
    drawTrajectory(markers, pts, 3, t, style, { parts: 'markers' });
    expect(markers.paints.filter((p) => p.op === 'fill').map((p) => p.colour)).toEqual(['#ffffff', style.colour]);
    expect(markers.paints.filter((p) => p.op === 'stroke' && p.lineWidth > 3)).toEqual([]);
  });
});
