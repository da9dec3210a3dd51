/**
 * The analysis tools on Himmelblau's function against the stationary points in
 * test/fixtures/test-functions.json (a copy of the project's reference notes: minima published in
 * [Wikipedia, Himmelblau's function], 6 decimals, refined to 17 digits in the reference file; the
 * local maximum likewise; the four saddles "computed in reference file", not a published value).
 */
import { describe, expect, it } from 'vitest';
import { classifyPoint, findCriticalPoints, type PointKind } from '../../src/engine';
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

describe("findCriticalPoints on Himmelblau's function", () => {
  // A 9 x 9 grid of starts over the domain [-5, 5]^2 (corners included).
  const starts: number[][] = [];
  for (let i = 0; i < 9; i++) for (let j = 0; j < 9; j++) starts.push([-5 + 1.25 * i, -5 + 1.25 * j]);
  const search = findCriticalPoints(surface, starts);

  it('finds exactly nine critical points: 4 minima, 4 saddles, 1 maximum', () => {
    expect(search.points.length).toBe(9);
    const kinds = search.points.map((p) => p.classification?.kind).sort();
    expect(kinds).toEqual(['maximum', 'minimum', 'minimum', 'minimum', 'minimum', 'saddle', 'saddle', 'saddle', 'saddle']);
    expect(search.points.reduce((s, p) => s + p.hits, 0)).toBe(search.converged);
    expect(search.converged + search.failed).toBe(starts.length);
  });

  it.each(POINTS.map((p) => [`${p.kind} (${p.x}, ${p.y}) [${p.source}]`, p] as const))('finds %s to 1e-8, classified', (_, p) => {
    const match = search.points.filter((c) => Math.max(Math.abs(c.point[0] - p.x), Math.abs(c.point[1] - p.y)) <= 1e-8);
    expect(match.length).toBe(1);
    const [c] = match;
    expect(c.classification?.kind).toBe(KIND[p.kind]);
    expect(c.gradientNorm).toBeLessThanOrEqual(1e-10);
    expect(Math.abs(c.value - p.f)).toBeLessThanOrEqual(1e-9 * Math.max(1, p.f));
  });

  it('returns the points by value, ascending', () => {
    for (let k = 1; k < search.points.length; k++) expect(search.points[k].value).toBeGreaterThanOrEqual(search.points[k - 1].value);
  });
});
