/**
 * Catalogue surfaces against the published optima of the standard 2-D test functions.
 *
 * Numbers come from test/fixtures/test-functions.json, a copy of the project's reference notes
 * (../shared/reference/test-functions.json and .md); each point there names its source, e.g.
 * "[SciPy-GO citing Jamil & Yang 2013]" or "computed in reference file", and the test titles repeat it.
 */
import { describe, expect, it } from 'vitest';
import { buildSurface, catalogueEntry } from '../../src/problems';
import fixture from '../fixtures/test-functions.json';
import { classify, eigen2, exact, maxAbs } from '../problems/calculus';

interface FixturePoint {
  x: number;
  y: number;
  f: number;
  kind: string;
  source: string;
  hessianEigenvalues?: number[];
}
interface PublishedCheck {
  x: number;
  y: number;
  f: number;
  tolerance: number;
  source: string;
}
interface FixtureFunction {
  domain: number[][];
  points: FixturePoint[];
  constants?: Record<string, number>;
  valueTolerance?: number;
  note?: string;
  publishedChecks?: PublishedCheck[];
  misprints?: { x: number; y: number; fAbove: number; source: string }[];
}

const FUNCTIONS = fixture.functions as unknown as Record<string, FixtureFunction>;

const KIND_CLASS: Record<string, string> = { 'global-min': 'min', 'local-min': 'min', 'local-max': 'max', saddle: 'saddle' };

/** The reference prints Hessian eigenvalues rounded to 6 decimals. */
const EIGEN_TOLERANCE = 2e-6;

describe.each(Object.keys(FUNCTIONS))('%s against the reference', (id) => {
  const ref = FUNCTIONS[id];
  const entry = catalogueEntry(id);
  const surface = buildSurface({ kind: 'catalogue', id });
  const valueTolerance = (f: number) => ref.valueTolerance ?? 1e-12 * Math.max(1, Math.abs(f));

  it('uses the reference domain and default constants', () => {
    expect(entry.domain).toEqual(ref.domain);
    if (ref.constants) expect(entry.constants).toEqual(ref.constants);
  });

  it.each(ref.points.map((p) => [`(${p.x}, ${p.y}) ${p.kind} f = ${p.f} [${p.source}]`, p] as const))(
    'value, gradient and Hessian at %s',
    (_, p) => {
      const d = exact(surface, [p.x, p.y]);
      expect(Math.abs(d.value - p.f)).toBeLessThanOrEqual(valueTolerance(p.f));
      if (!p.hessianEigenvalues) {
        // Ackley's minimum is the tip of a cone: no gradient or Hessian exists there (reference
        // section 10), so only the value is checked.
        expect(id).toBe('ackley');
        return;
      }
      const lambda = eigen2(d.hessian);
      const scale = Math.max(1, ...lambda.map(Math.abs));
      expect(maxAbs(d.gradient)).toBeLessThanOrEqual(1e-9 * scale);
      expect(Math.abs(lambda[0] - p.hessianEigenvalues[0])).toBeLessThanOrEqual(EIGEN_TOLERANCE);
      expect(Math.abs(lambda[1] - p.hessianEigenvalues[1])).toBeLessThanOrEqual(EIGEN_TOLERANCE);
      expect(classify(lambda)).toBe(KIND_CLASS[p.kind]);
    },
  );

  it('lists every reference point among its known points with the same kind, value and eigenvalues', () => {
    for (const p of ref.points) {
      const match = entry.knownPoints.find(
        (k) => Math.abs(k.point[0] - p.x) <= 1e-12 * Math.max(1, Math.abs(p.x)) && Math.abs(k.point[1] - p.y) <= 1e-12 * Math.max(1, Math.abs(p.y)),
      );
      expect(match, `(${p.x}, ${p.y}) missing from ${id}`).toBeDefined();
      expect(match!.kind).toBe(p.kind);
      expect(Math.abs(match!.value - p.f)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(p.f)));
      if (p.hessianEigenvalues) {
        expect(match!.hessianEigenvalues).toHaveLength(2);
        match!.hessianEigenvalues!.forEach((v, i) => expect(Math.abs(v - p.hessianEigenvalues![i])).toBeLessThanOrEqual(EIGEN_TOLERANCE));
      } else {
        expect(match!.hessianEigenvalues).toBeUndefined();
      }
    }
  });

  const checks = ref.publishedChecks ?? [];
  if (checks.length > 0) {
    it.each(checks.map((c) => [`f(${c.x}, ${c.y}) = ${c.f} [${c.source}]`, c] as const))('published %s', (_, c) => {
      expect(Math.abs(surface.value([c.x, c.y]) - c.f)).toBeLessThanOrEqual(c.tolerance);
    });
  }

  const misprints = ref.misprints ?? [];
  if (misprints.length > 0) {
    it.each(misprints.map((m) => [`(${m.x}, ${m.y}) [${m.source}]`, m] as const))('misprinted minimum %s is not a minimum', (_, m) => {
      expect(surface.value([m.x, m.y])).toBeGreaterThan(m.fAbove);
    });
  }
});

describe('float64 residues named in the reference pitfalls', () => {
  it('Ackley f(0, 0) is a rounding residue of about 4.44e-16, within 1e-15 of 0 [reference pitfalls 7]', () => {
    const v = buildSurface({ kind: 'catalogue', id: 'ackley' }).value([0, 0]);
    expect(Math.abs(v)).toBeLessThanOrEqual(1e-15);
  });

  it('Levy N.13 f(1, 1) is about 1.35e-31, not 0, since sin(3 pi) != 0 in float64 [reference pitfalls 7]', () => {
    const v = buildSurface({ kind: 'catalogue', id: 'levy13' }).value([1, 1]);
    expect(v).toBeGreaterThanOrEqual(0);
    expect(v).toBeLessThanOrEqual(1e-30);
  });
});
