import { describe, expect, it } from 'vitest';
import { drawArrows, gradientArrows, sampledGradient, viewTransform, type SliceGradient } from '../../../src/ui/plot';
import type { GridBox } from '../../../src/engine';
import { RecordingContext } from './recording-context';

// f(a, b) = a^2 + 4 b^2, gradient (2a, 8b)
const f = (a: number, b: number) => a * a + 4 * b * b;
const grad: SliceGradient = (p) => ({ da: 2 * p.a, db: 8 * p.b });

describe('gradientArrows', () => {
  // unequal scales on purpose: 100 px per unit of a, 25 px per unit of b
  const t = viewTransform({ a: [-1.9, 2.1], b: [-3.9, 4.1] }, { width: 400, height: 200 });
  const arrows = gradientArrows(grad, t, 40);

  it('places one arrow per lattice point, each of the same pixel length', () => {
    expect(arrows.length).toBe(10 * 5);
    for (const arrow of arrows) {
      const p = t.toPixel(arrow.tail);
      const q = t.toPixel(arrow.head);
      expect(Math.hypot(q.px - p.px, q.py - p.py)).toBeCloseTo(0.7 * 40, 9);
    }
  });

  it('points along -grad f in parameter space (downhill), whatever the axis scales', () => {
    for (const arrow of arrows) {
      const mid = { a: (arrow.tail.a + arrow.head.a) / 2, b: (arrow.tail.b + arrow.head.b) / 2 };
      const g = grad(mid)!;
      const d = { a: arrow.head.a - arrow.tail.a, b: arrow.head.b - arrow.tail.b };
      const cross = d.a * -g.db - d.b * -g.da;
      const dot = d.a * -g.da + d.b * -g.db;
      expect(Math.abs(cross)).toBeLessThan(1e-9 * Math.hypot(d.a, d.b) * Math.hypot(g.da, g.db));
      expect(dot).toBeGreaterThan(0);
      expect(arrow.magnitude).toBeCloseTo(Math.hypot(g.da, g.db), 9);
      // a short step along the arrow lowers f
      expect(f(mid.a + 1e-3 * d.a, mid.b + 1e-3 * d.b)).toBeLessThan(f(mid.a, mid.b));
    }
  });

  it('skips points with a zero or non-finite gradient', () => {
    const centred = viewTransform({ a: [-1, 1], b: [-1, 1] }, { width: 120, height: 120 }); // lattice 3 x 3, middle at (0, 0)
    expect(gradientArrows(grad, centred, 40)).toHaveLength(8);
    expect(gradientArrows(() => ({ da: Number.NaN, db: 1 }), centred, 40)).toHaveLength(0);
    expect(gradientArrows(() => null, centred, 40)).toHaveLength(0);
    expect(() => gradientArrows(grad, centred, 2)).toThrow('arrows: spacing must be at least 4 pixels, got 2');
  });
});

describe('sampledGradient', () => {
  it('bilinear interpolation of sampled gradients is exact for a quadratic surface (linear gradient)', () => {
    const g: GridBox = { a: [-2, 2], b: [-1, 1], nx: 9, ny: 5 };
    const ga = new Float64Array(g.nx * g.ny);
    const gb = new Float64Array(g.nx * g.ny);
    for (let j = 0; j < g.ny; j++)
      for (let i = 0; i < g.nx; i++) {
        const a = -2 + i * 0.5, b = -1 + j * 0.5;
        ga[i + j * g.nx] = 2 * a;
        gb[i + j * g.nx] = 8 * b;
      }
    const s = sampledGradient(g, ga, gb);
    for (const p of [{ a: 0.3, b: -0.7 }, { a: 2, b: 1 }, { a: -2, b: -1 }, { a: 1.234, b: 0.111 }]) {
      const v = s(p)!;
      expect(v.da).toBeCloseTo(2 * p.a, 12);
      expect(v.db).toBeCloseTo(8 * p.b, 12);
    }
    expect(s({ a: 2.01, b: 0 })).toBeNull();
    ga[4 + 2 * 9] = Number.NaN;
    expect(s({ a: 0.1, b: 0.1 })).toBeNull();
  });
});

describe('drawArrows', () => {
  it('strokes shaft and two head sides per arrow, over a halo', () => {
    const t = viewTransform({ a: [-1, 1], b: [-1, 1] }, { width: 120, height: 120 });
    const arrows = gradientArrows(grad, t, 40);
    const ctx = new RecordingContext();
    drawArrows(ctx, arrows, t);
    expect(ctx.paints).toHaveLength(2);
    expect(ctx.paints[0].lineWidth).toBeGreaterThan(ctx.paints[1].lineWidth);
    expect(ctx.paints[1].subpaths).toHaveLength(3 * arrows.length);
  });
});
