import { describe, expect, it } from 'vitest';
import { createRng, nextUniform } from '../../src/engine';
import {
  CATALOGUE,
  buildSurface,
  catalogueEntry,
  catalogueIds,
  knownPointsFor,
  type CatalogueEntry,
  type KnownPoint,
} from '../../src/problems';
import { classify, eigen2, exact, finiteGradient, finiteHessian, maxAbs, maxAbsDiff } from './calculus';

const KIND_CLASS = { 'global-min': 'min', 'local-min': 'min', 'local-max': 'max', saddle: 'saddle' } as const;

function surfaceFor(entry: CatalogueEntry, constants?: Record<string, number>) {
  return buildSurface({ kind: 'catalogue', id: entry.id, constants });
}

/** Value, zero gradient and Hessian classification of a known point on the compiled surface. */
function expectStationary(entry: CatalogueEntry, p: KnownPoint, constants?: Record<string, number>) {
  const d = exact(surfaceFor(entry, constants), p.point);
  expect(Math.abs(d.value - p.value), `value at ${p.point}`).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(p.value)));
  if (!p.hessianEigenvalues) return; // not twice differentiable there (Ackley's cone tip)
  const lambda = eigen2(d.hessian);
  const scale = Math.max(1, ...lambda.map(Math.abs));
  expect(maxAbs(d.gradient), `gradient at ${p.point}`).toBeLessThanOrEqual(1e-9 * scale);
  expect(maxAbsDiff(lambda, p.hessianEigenvalues), `eigenvalues at ${p.point}`).toBeLessThanOrEqual(2e-6 * scale);
  expect(classify(lambda)).toBe(KIND_CLASS[p.kind]);
}

describe('CATALOGUE', () => {
  it('has the standard test functions and our own bowls, saddle and plateau, with unique ids', () => {
    const ids = catalogueIds();
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of [
      'rosenbrock', 'himmelblau', 'beale', 'booth', 'matyas', 'three-hump-camel', 'six-hump-camel', 'goldstein-price',
      'rastrigin', 'ackley', 'levy13', 'styblinski-tang', 'mccormick', 'easom', 'quadratic', 'rotated-quadratic', 'saddle', 'plateau',
    ]) {
      expect(ids).toContain(id);
    }
  });

  it.each(CATALOGUE.map((e) => [e.id, e] as const))('%s is well-formed', (_, entry) => {
    expect(entry.id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
    expect(entry.variables).toEqual(['x', 'y']);
    for (const box of [entry.domain, entry.view]) {
      expect(box).toHaveLength(2);
      for (const [lo, hi] of box) expect(lo).toBeLessThan(hi);
    }
    expect(entry.suggestedStart).toHaveLength(2);
    entry.suggestedStart.forEach((v, i) => {
      expect(v).toBeGreaterThanOrEqual(entry.view[i][0]);
      expect(v).toBeLessThanOrEqual(entry.view[i][1]);
    });
    expect(entry.source.length).toBeGreaterThan(5);
    expect(entry.domainSource.length).toBeGreaterThan(3);
    expect(entry.notes.length).toBeGreaterThan(10);
    expect(entry.knownPoints.length).toBeGreaterThan(0);
    for (const p of entry.knownPoints) expect(p.source.length).toBeGreaterThan(3);
    const names = Object.keys(entry.constants ?? {}).sort();
    expect((entry.constantInfo ?? []).map((c) => c.name).sort()).toEqual(names);
    for (const info of entry.constantInfo ?? []) {
      expect(info.min).toBeLessThan(info.max);
      expect(entry.constants![info.name]).toBeGreaterThanOrEqual(info.min);
      expect(entry.constants![info.name]).toBeLessThanOrEqual(info.max);
    }
    expect(() => surfaceFor(entry)).not.toThrow();
  });

  it.each(CATALOGUE.map((e) => [e.id, e] as const))('%s: logScaleOffset is its global minimum value when that is not 0', (_, entry) => {
    const globals = entry.knownPoints.filter((p) => p.kind === 'global-min').map((p) => p.value);
    const lowest = globals.length ? Math.min(...globals) : undefined;
    if (lowest === undefined || lowest === 0) expect(entry.logScaleOffset).toBeUndefined();
    else expect(entry.logScaleOffset).toBeCloseTo(lowest, 14);
  });
});

describe('known points of every entry (including those computed for this catalogue)', () => {
  const cases = CATALOGUE.flatMap((e) => e.knownPoints.map((p) => [`${e.id} ${p.kind} (${p.point.join(', ')})`, e, p] as const));
  it.each(cases)('%s: value, zero gradient and Hessian eigenvalues agree with the compiled surface', (_, entry, p) => {
    expectStationary(entry, p);
  });

  it.each(CATALOGUE.map((e) => [e.id, e] as const))('%s: no point of a 201 x 201 grid over the domain lies below its global minimum', (_, entry) => {
    const globals = entry.knownPoints.filter((p) => p.kind === 'global-min');
    if (globals.length === 0) return expect(entry.id).toBe('saddle'); // unbounded below: no minimum
    const best = Math.min(...globals.map((p) => p.value));
    for (const p of entry.knownPoints) expect(p.value).toBeGreaterThanOrEqual(best);
    const s = surfaceFor(entry);
    const [[x0, x1], [y0, y1]] = entry.domain;
    let lowest = Infinity;
    for (let i = 0; i <= 200; i++) {
      for (let j = 0; j <= 200; j++) lowest = Math.min(lowest, s.value([x0 + ((x1 - x0) * i) / 200, y0 + ((y1 - y0) * j) / 200]));
    }
    expect(lowest).toBeGreaterThanOrEqual(best - 1e-12 * Math.max(1, Math.abs(best)));
  });
});

describe('knownPointsFor', () => {
  it('returns the listed points for the default constants and for none', () => {
    for (const entry of CATALOGUE) {
      expect(knownPointsFor(entry)).toEqual(entry.knownPoints);
      if (entry.constants) expect(knownPointsFor(entry, entry.constants)).toEqual(entry.knownPoints);
    }
  });

  const sliderCases = CATALOGUE.filter((e) => e.constantInfo).flatMap((entry) =>
    [0, 0.37, 1].map((t) => {
      const constants = Object.fromEntries(entry.constantInfo!.map((c) => [c.name, c.min + t * (c.max - c.min)]));
      return [`${entry.id} ${JSON.stringify(constants)}`, entry, constants] as const;
    }),
  );
  it.each(sliderCases)('%s: points follow the constants', (_, entry, constants) => {
    const points = knownPointsFor(entry, constants);
    expect(points.length).toBeGreaterThan(0);
    for (const p of points) expectStationary(entry, p, constants);
  });

  it('moves the Rosenbrock minimum to (a, a^2) and the plateau curvature to diag(2, 8)/w^2', () => {
    const [r] = knownPointsFor(catalogueEntry('rosenbrock'), { a: -1.5 });
    expect(r.point).toEqual([-1.5, 2.25]);
    const [p] = knownPointsFor(catalogueEntry('plateau'), { w: 0.5 });
    expect(p.hessianEigenvalues).toEqual([8, 32]);
  });

  it('gives no point where the constants leave none isolated', () => {
    expect(knownPointsFor(catalogueEntry('rosenbrock'), { b: 0 })).toEqual([]);
    expect(knownPointsFor(catalogueEntry('quadratic'), { kappa: 0 })).toEqual([]);
  });

  it('rejects constants the entry does not have', () => {
    expect(() => knownPointsFor(catalogueEntry('rosenbrock'), { c: 1 })).toThrow("catalogue rosenbrock: unknown constant 'c'; constants: a, b");
    expect(() => knownPointsFor(catalogueEntry('himmelblau'), { a: 1 })).toThrow("catalogue himmelblau: unknown constant 'a'; it has no constants");
    expect(() => knownPointsFor(catalogueEntry('rastrigin'), { A: Number.NaN })).toThrow('catalogue rastrigin: constant A must be a finite number, got NaN');
  });
});

describe('catalogueEntry', () => {
  it('finds an entry by id', () => {
    expect(catalogueEntry('beale').label).toBe('Beale');
  });

  it('throws with the list of known ids', () => {
    expect(() => catalogueEntry('rosenbrok')).toThrow(`catalogue: no surface with id 'rosenbrok'; known ids: ${catalogueIds().join(', ')}`);
  });
});

describe('exact derivatives against central finite differences', () => {
  const rng = createRng(20240611);
  const sample = (box: [number, number][]) => box.map(([lo, hi]) => lo + (hi - lo) * nextUniform(rng));
  const cases = CATALOGUE.flatMap((entry) =>
    [...Array.from({ length: 4 }, () => ['domain', sample(entry.domain)]), ...Array.from({ length: 4 }, () => ['view', sample(entry.view)])].map(
      ([where, point]) => [`${entry.id} at ${where} point (${(point as number[]).map((v) => v.toFixed(4)).join(', ')})`, entry, point as number[]] as const,
    ),
  );

  it.each(cases)('%s', (_, entry, point) => {
    const s = surfaceFor(entry);
    const d = exact(s, point);
    expect(d.value).toBe(s.value(point));
    const gradientScale = 1 + maxAbs(d.gradient) + Math.abs(d.value);
    expect(maxAbsDiff(d.gradient, finiteGradient(s, point))).toBeLessThanOrEqual(1e-6 * gradientScale);
    const fdH = finiteHessian(s, point);
    expect(maxAbsDiff(d.hessian, fdH)).toBeLessThanOrEqual(1e-6 * (1 + maxAbs(d.hessian) + maxAbs(d.gradient)));
    expect(Math.abs(d.hessian[1] - d.hessian[2])).toBeLessThanOrEqual(1e-12 * (1 + maxAbs(d.hessian)));
  });
});

describe('catalogue data is shared and read-only', () => {
  it('is deeply frozen', () => {
    const entry = catalogueEntry('himmelblau');
    expect(Object.isFrozen(entry)).toBe(true);
    expect(Object.isFrozen(entry.knownPoints[0].point)).toBe(true);
    expect(() => {
      (entry.view[0] as number[])[0] = 1;
    }).toThrow(TypeError);
  });

  it('is plain data that survives JSON unchanged', () => {
    expect(JSON.parse(JSON.stringify(CATALOGUE))).toEqual(CATALOGUE);
  });
});
