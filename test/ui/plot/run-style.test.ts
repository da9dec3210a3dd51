import { describe, expect, it } from 'vitest';
import {
  drawKnownPoints,
  drawMarker,
  knownPointGlyph,
  MARKER_SHAPES,
  markerGeometry,
  relativeLuminance,
  runStyle,
  viewTransform,
} from '../../../src/ui/plot';
import { RecordingContext } from './recording-context';

/** Okabe & Ito (2008), Color Universal Design, https://jfly.uni-koeln.de/color/ (RGB values of the set). */
const OKABE_ITO_REFERENCE = ['#000000', '#E69F00', '#56B4E9', '#009E73', '#F0E442', '#0072B2', '#D55E00', '#CC79A7'];

describe('runStyle', () => {
  it('the first eight runs use the eight Okabe-Ito colours and eight different markers', () => {
    const styles = Array.from({ length: 8 }, (_, k) => runStyle(k));
    expect(new Set(styles.map((s) => s.colour))).toEqual(new Set(OKABE_ITO_REFERENCE));
    expect(new Set(styles.map((s) => s.marker)).size).toBe(8);
  });

  it('the first 64 runs have distinct (colour, marker) pairs, so colour is never the only cue', () => {
    const pairs = new Set(Array.from({ length: 64 }, (_, k) => `${runStyle(k).colour}/${runStyle(k).marker}`));
    expect(pairs.size).toBe(64);
    expect(runStyle(8).colour).toBe(runStyle(0).colour);
    expect(runStyle(8).marker).not.toBe(runStyle(0).marker);
  });

  it('light colours get a dark halo, dark colours a light one', () => {
    expect(runStyle(3).colour).toBe('#F0E442');
    expect(runStyle(3).halo).toMatch(/^rgba\(0,0,0/);
    expect(runStyle(7).colour).toBe('#000000');
    expect(runStyle(7).halo).toMatch(/^rgba\(255,255,255/);
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 12); // WCAG 2 definition: white 1, black 0
    expect(relativeLuminance('#000000')).toBe(0);
  });

  it('rejects a negative index', () => {
    expect(() => runStyle(-1)).toThrow('run style: index must be a whole number >= 0, got -1');
  });
});

describe('markers', () => {
  it('includes circle, square, triangle, diamond, cross, plus, star and inverted triangle, each a different outline', () => {
    expect([...MARKER_SHAPES].sort()).toEqual(['circle', 'cross', 'diamond', 'inverted-triangle', 'plus', 'square', 'star', 'triangle']);
    const outlines = MARKER_SHAPES.map((s) => JSON.stringify(markerGeometry(s, 10)));
    expect(new Set(outlines).size).toBe(8);
  });

  it('every marker stays within about its nominal size around the centre', () => {
    for (const shape of MARKER_SHAPES) {
      const g = markerGeometry(shape, 10);
      const reach = g.kind === 'circle' ? g.r : Math.max(...g.points.map((p) => Math.hypot(p.px, p.py)));
      expect(reach).toBeGreaterThan(4);
      expect(reach).toBeLessThan(8);
    }
  });

  it('the triangle points up on screen and the inverted triangle down', () => {
    const up = markerGeometry('triangle', 10);
    const down = markerGeometry('inverted-triangle', 10);
    if (up.kind !== 'polygon' || down.kind !== 'polygon') throw new Error('expected polygons');
    expect(up.points[0].py).toBeLessThan(0);
    expect(down.points[0].py).toBeGreaterThan(0);
  });

  it('drawMarker fills the shape at the given pixel with the given colour and outline', () => {
    const ctx = new RecordingContext();
    drawMarker(ctx, 'square', { px: 50, py: 20 }, 10, { fill: '#E69F00', outline: '#000000' });
    expect(ctx.paints.map((p) => [p.op, p.colour])).toEqual([['fill', '#E69F00'], ['stroke', '#000000']]);
    for (const [x, y] of ctx.paints[0].subpaths.flat()) expect(Math.hypot(x - 50, y - 20)).toBeLessThan(7);
    expect(ctx.depth).toBe(0);
  });
});

describe('known points', () => {
  it('minimum, saddle and maximum have different glyphs, none of them filled like a run marker', () => {
    const glyphs = (['minimum', 'saddle', 'maximum'] as const).map((k) => JSON.stringify(knownPointGlyph(k, 12)));
    expect(new Set(glyphs).size).toBe(3);
    const t = viewTransform({ a: [-1, 1], b: [-1, 1] }, { width: 100, height: 100 });
    const ctx = new RecordingContext();
    drawKnownPoints(ctx, [{ at: { a: 0.5, b: 0.5 }, kind: 'minimum', label: 'global minimum' }, { at: { a: 0, b: Number.NaN }, kind: 'saddle' }], t, { labels: true });
    expect(ctx.texts.map((x) => x.text)).toEqual(['global minimum']);
    const strokes = ctx.paints.filter((p) => p.op === 'stroke');
    expect(new Set(strokes.map((s) => s.colour))).toEqual(new Set(['#ffffff', '#000000']));
    for (const [x, y] of strokes.flatMap((s) => s.subpaths.flat())) expect(Math.hypot(x - 75, y - 25)).toBeLessThan(10);
  });
});
