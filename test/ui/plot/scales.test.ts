import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitAspect, gridToParam, panBy, paramToGrid, viewTransform, zoomAt } from '../../../src/ui/plot';
import type { ViewBox } from '../../../src/engine';

const view: ViewBox = { a: [-2, 2], b: [-1, 3] };
const size = { width: 400, height: 200 };

const finiteIn = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });
const arbView = fc
  .tuple(finiteIn(-1e3, 1e3), finiteIn(1e-3, 1e3), finiteIn(-1e3, 1e3), finiteIn(1e-3, 1e3))
  .map(([a0, wa, b0, wb]): ViewBox => ({ a: [a0, a0 + wa], b: [b0, b0 + wb] }));
const arbSize = fc.tuple(fc.integer({ min: 10, max: 3000 }), fc.integer({ min: 10, max: 3000 })).map(([width, height]) => ({ width, height }));

describe('viewTransform', () => {
  it('maps the corners of the view to the corners of the frame, b upward and py downward', () => {
    const t = viewTransform(view, size);
    expect(t.toPixel({ a: -2, b: 3 })).toEqual({ px: 0, py: 0 });
    expect(t.toPixel({ a: 2, b: 3 })).toEqual({ px: 400, py: 0 });
    expect(t.toPixel({ a: -2, b: -1 })).toEqual({ px: 0, py: 200 });
    expect(t.toPixel({ a: 2, b: -1 })).toEqual({ px: 400, py: 200 });
    expect(t.toPixel({ a: 0, b: 1 })).toEqual({ px: 200, py: 100 });
  });

  it('flips b: a larger b is higher on screen (smaller py)', () => {
    const t = viewTransform(view, size);
    expect(t.toPixel({ a: 0, b: 2 }).py).toBeLessThan(t.toPixel({ a: 0, b: 1 }).py);
    expect(t.pxPerA).toBe(100);
    expect(t.pxPerB).toBe(50);
  });

  it('toParam(toPixel(p)) == p and toPixel(toParam(q)) == q (property)', () => {
    fc.assert(
      fc.property(arbView, arbSize, finiteIn(0, 1), finiteIn(0, 1), (v, s, u, w) => {
        const t = viewTransform(v, s);
        const p = { a: v.a[0] + u * (v.a[1] - v.a[0]), b: v.b[0] + w * (v.b[1] - v.b[0]) };
        const back = t.toParam(t.toPixel(p));
        const scale = Math.max(1, Math.abs(p.a), Math.abs(p.b));
        expect(Math.abs(back.a - p.a)).toBeLessThan(1e-12 * scale * 1e3);
        expect(Math.abs(back.b - p.b)).toBeLessThan(1e-12 * scale * 1e3);
        const q = { px: u * s.width, py: w * s.height };
        const again = t.toPixel(t.toParam(q));
        expect(again.px).toBeCloseTo(q.px, 6);
        expect(again.py).toBeCloseTo(q.py, 6);
      }),
    );
  });

  it('rejects empty or reversed ranges and non-positive sizes with precise messages', () => {
    expect(() => viewTransform({ a: [1, 1], b: [0, 1] }, size)).toThrow('view: the a range must be two finite numbers, low < high, got [1, 1]');
    expect(() => viewTransform({ a: [0, 1], b: [2, Number.NaN] }, size)).toThrow('the b range');
    expect(() => viewTransform(view, { width: 0, height: 10 })).toThrow('view: the frame size must be positive, got 0 x 10');
  });
});

describe('grid space', () => {
  const grid = { a: [-2, 2] as [number, number], b: [-1, 3] as [number, number], nx: 5, ny: 9 };

  it('puts samples on cell corners: i = 0 at a0, i = nx - 1 at a1, j = 0 at b0 (bottom)', () => {
    expect(gridToParam(grid, { i: 0, j: 0 })).toEqual({ a: -2, b: -1 });
    expect(gridToParam(grid, { i: 4, j: 8 })).toEqual({ a: 2, b: 3 });
    expect(gridToParam(grid, { i: 1, j: 2 })).toEqual({ a: -1, b: 0 });
    expect(paramToGrid(grid, { a: -1, b: 0 })).toEqual({ i: 1, j: 2 });
  });

  it('gridToPixel agrees with gridToParam followed by toPixel, and j = 0 is the bottom of the frame', () => {
    const t = viewTransform(view, size);
    for (const [i, j] of [[0, 0], [4, 8], [2.5, 3.25]]) {
      const direct = t.gridToPixel(grid, i, j);
      const via = t.toPixel(gridToParam(grid, { i, j }));
      expect(direct.px).toBeCloseTo(via.px, 12);
      expect(direct.py).toBeCloseTo(via.py, 12);
    }
    expect(t.gridToPixel(grid, 0, 0)).toEqual({ px: 0, py: 200 });
    expect(t.gridToPixel(grid, 4, 8)).toEqual({ px: 400, py: 0 });
  });
});

describe('zoomAt', () => {
  it('keeps the parameter point under the anchor pixel fixed (property)', () => {
    fc.assert(
      fc.property(arbView, arbSize, finiteIn(0, 1), finiteIn(0, 1), finiteIn(0.1, 10), (v, s, u, w, factor) => {
        const at = { px: u * s.width, py: w * s.height };
        const before = viewTransform(v, s).toParam(at);
        const zoomed = zoomAt(v, s, at, factor);
        const after = viewTransform(zoomed, s).toParam(at);
        const tol = 1e-9 * Math.max(1, Math.abs(before.a), Math.abs(before.b), v.a[1] - v.a[0], v.b[1] - v.b[0]);
        expect(Math.abs(after.a - before.a)).toBeLessThan(tol);
        expect(Math.abs(after.b - before.b)).toBeLessThan(tol);
        expect(zoomed.a[1] - zoomed.a[0]).toBeCloseTo((v.a[1] - v.a[0]) / factor, 6);
      }),
    );
  });

  it('zooms in by 2 about the centre to the middle half of each range', () => {
    expect(zoomAt(view, size, { px: 200, py: 100 }, 2)).toEqual({ a: [-1, 1], b: [0, 2] });
  });

  it('stops at the precision floor instead of collapsing the range', () => {
    const tiny = { a: [1, 1 + 2e-9] as [number, number], b: [0, 1] as [number, number] };
    const z = zoomAt(tiny, size, { px: 0, py: 0 }, 10);
    expect(z.a).toEqual(tiny.a);
    expect(z.b[1] - z.b[0]).toBeCloseTo(0.1, 12);
    expect(() => zoomAt(view, size, { px: 0, py: 0 }, 0)).toThrow('zoom: factor must be a positive number, got 0');
  });
});

describe('panBy', () => {
  it('shifts by the pixel distance over pixels per unit, content following the pointer', () => {
    // 100 px per unit of a, 50 px per unit of b: dragging right 50 px moves the view 0.5 left;
    // dragging down 25 px moves it 0.5 up.
    const p = panBy(view, size, 50, 25);
    expect(p).toEqual({ a: [-2.5, 1.5], b: [-0.5, 3.5] });
    const t0 = viewTransform(view, size);
    const t1 = viewTransform(p, size);
    const grabbed = t0.toParam({ px: 120, py: 80 });
    const moved = t1.toPixel(grabbed);
    expect(moved.px).toBeCloseTo(170, 9);
    expect(moved.py).toBeCloseTo(105, 9);
  });
});

describe('fitAspect', () => {
  it('widens the narrower axis so both have the same units per pixel, keeping the centre', () => {
    const f = fitAspect(view, size); // a: 4 / 400 = 0.01, b: 4 / 200 = 0.02 per px -> a widens to 8
    expect(f.a).toEqual([-4, 4]);
    expect(f.b).toEqual([-1, 3]);
    const t = viewTransform(f, size);
    expect(t.pxPerA).toBeCloseTo(t.pxPerB, 12);
  });
});
