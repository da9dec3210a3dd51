/**
 * The analysis tools on Himmelblau's function against the stationary points in
 * test/fixtures/test-functions.json (a copy of the project's reference notes: minima published in
 * [Wikipedia, Himmelblau's function], 6 decimals, refined to 17 digits in the reference file; the
 * local maximum likewise; the four saddles "computed in reference file", not a published value).
 */
import { describe, expect, it } from 'vitest';
import { classifyPoint, type PointKind } from '../../src/engine';
import { buildSurface } from '../../src/problems';
import fixture from '../fixtures/test-functions.json';

interface FixturePoint {
  x: number;
  y: number;
  f: number;
  kind: string;
  source: string;
  hessianEigenvalues: number[];
}

const POINTS = (fixture.functions as unknown as Record<string, { points: FixturePoint[] }>).himmelblau.points;
const KIND: Record<string, PointKind> = { 'global-min': 'minimum', 'local-max': 'maximum', saddle: 'saddle' };
const surface = buildSurface({ kind: 'catalogue', id: 'himmelblau' });

describe("classifyPoint at Himmelblau's nine stationary points", () => {
  it('the fixture lists 4 minima, 4 saddles and 1 maximum', () => {
    const counts = POINTS.reduce<Record<string, number>>((acc, p) => ({ ...acc, [p.kind]: (acc[p.kind] ?? 0) + 1 }), {});
    expect(counts).toEqual({ 'global-min': 4, saddle: 4, 'local-max': 1 });
  });

  it.each(POINTS.map((p) => [`${p.kind} (${p.x}, ${p.y}) [${p.source}]`, p] as const))('%s', (_, p) => {
    const c = classifyPoint(surface, [p.x, p.y]);
    expect(c?.method).toBe('exact');
    expect(c?.kind).toBe(KIND[p.kind]);
    expect(c?.negative).toBe(p.kind === 'saddle' ? 1 : p.kind === 'local-max' ? 2 : 0);
    expect(c?.zero).toBe(0);
    // The fixture's eigenvalues are rounded to 6 decimals.
    expect(Math.abs(c!.smallest - p.hessianEigenvalues[0])).toBeLessThanOrEqual(1e-6);
    expect(Math.abs(c!.largest - p.hessianEigenvalues[1])).toBeLessThanOrEqual(1e-6);
  });
});
