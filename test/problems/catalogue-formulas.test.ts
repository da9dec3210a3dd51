/**
 * Each catalogue formula against an independent hand-written JavaScript version of the published
 * formula (catches copying typos such as Goldstein-Price's 48y printed as 4y). The versions
 * below are written from the formulas in the reference notes (../shared/reference/test-functions.md,
 * copied here by hand), not from the catalogue text.
 */
import { describe, expect, it } from 'vitest';
import { createRng, nextUniform } from '../../src/engine';
import { CATALOGUE, buildSurface } from '../../src/problems';

type Fn = (x: number, y: number, c: Record<string, number>) => number;
const { sin, cos, exp, sqrt, tanh, PI } = Math;
const sq = (v: number) => v * v;

const HANDWRITTEN: Record<string, Fn> = {
  // (a - x)^2 + b (y - x^2)^2 [Rosenbrock 1960]
  rosenbrock: (x, y, c) => sq(c.a - x) + c.b * sq(y - x * x),
  himmelblau: (x, y) => sq(x * x + y - 11) + sq(x + y * y - 7),
  beale: (x, y) => sq(1.5 - x + x * y) + sq(2.25 - x + x * y * y) + sq(2.625 - x + x * y * y * y),
  booth: (x, y) => sq(x + 2 * y - 7) + sq(2 * x + y - 5),
  matyas: (x, y) => 0.26 * (x * x + y * y) - 0.48 * x * y,
  'three-hump-camel': (x, y) => 2 * x ** 2 - 1.05 * x ** 4 + x ** 6 / 6 + x * y + y ** 2,
  'six-hump-camel': (x, y) => (4 - 2.1 * x ** 2 + x ** 4 / 3) * x ** 2 + x * y + (-4 + 4 * y ** 2) * y ** 2,
  'goldstein-price': (x, y) =>
    (1 + sq(x + y + 1) * (19 - 14 * x + 3 * x * x - 14 * y + 6 * x * y + 3 * y * y)) *
    (30 + sq(2 * x - 3 * y) * (18 - 32 * x + 12 * x * x + 48 * y - 36 * x * y + 27 * y * y)),
  rastrigin: (x, y, c) => 2 * c.A + (x * x - c.A * cos(2 * PI * x)) + (y * y - c.A * cos(2 * PI * y)),
  ackley: (x, y, c) => -c.a * exp(-c.b * sqrt((x * x + y * y) / 2)) - exp((cos(c.c * x) + cos(c.c * y)) / 2) + c.a + Math.E,
  levy13: (x, y) => sq(sin(3 * PI * x)) + sq(x - 1) * (1 + sq(sin(3 * PI * y))) + sq(y - 1) * (1 + sq(sin(2 * PI * y))),
  'styblinski-tang': (x, y) => 0.5 * (x ** 4 - 16 * x ** 2 + 5 * x + (y ** 4 - 16 * y ** 2 + 5 * y)),
  mccormick: (x, y) => sin(x + y) + sq(x - y) - 1.5 * x + 2.5 * y + 1,
  easom: (x, y) => -cos(x) * cos(y) * exp(-(sq(x - PI) + sq(y - PI))),
  // Our own surfaces, written from their doc comments in a different form.
  quadratic: (x, y, c) => quadraticByMatrix(x, y, c),
  'rotated-quadratic': (x, y, c) => quadraticByMatrix(x, y, c),
  saddle: (x, y) => x * x - y * y,
  plateau: (x, y, c) => tanh((sq(x - 1) + 4 * sq(y - 0.5)) / (c.w * c.w)),
};

/** p^T A p with A = R^T diag(1, kappa) R, R the rotation by `angle` degrees. */
function quadraticByMatrix(x: number, y: number, c: Record<string, number>): number {
  const t = (c.angle * PI) / 180;
  const [co, si] = [cos(t), sin(t)];
  const a11 = co * co + c.kappa * si * si;
  const a22 = si * si + c.kappa * co * co;
  const a12 = (1 - c.kappa) * co * si;
  return a11 * x * x + 2 * a12 * x * y + a22 * y * y;
}

describe('catalogue formulas against hand-written versions', () => {
  it('covers every entry', () => {
    expect(Object.keys(HANDWRITTEN).sort()).toEqual(CATALOGUE.map((e) => e.id).sort());
  });

  const rng = createRng(7);
  const cases = CATALOGUE.flatMap((entry) => {
    const defaults = entry.constants ?? {};
    const variants: Record<string, number>[] = [defaults];
    if (entry.constantInfo) {
      variants.push(Object.fromEntries(entry.constantInfo.map((c) => [c.name, c.min + (c.max - c.min) * nextUniform(rng)])));
    }
    return variants.map((constants) => [`${entry.id} ${JSON.stringify(constants)}`, entry.id, constants] as const);
  });

  it.each(cases)('%s', (_, id, constants) => {
    const entry = CATALOGUE.find((e) => e.id === id)!;
    const surface = buildSurface({ kind: 'catalogue', id, constants });
    const ref = HANDWRITTEN[id];
    for (const box of [entry.domain, entry.view]) {
      for (let k = 0; k < 6; k++) {
        const [x, y] = box.map(([lo, hi]) => lo + (hi - lo) * nextUniform(rng));
        const expected = ref(x, y, constants);
        expect(Math.abs(surface.value([x, y]) - expected), `f(${x}, ${y})`).toBeLessThanOrEqual(1e-12 * (1 + Math.abs(expected)));
      }
    }
  });

  it('tells Goldstein-Price 48y from the misprinted 4y (reference pitfalls 5)', () => {
    const surface = buildSurface({ kind: 'catalogue', id: 'goldstein-price' });
    const misprint = (x: number, y: number) =>
      (1 + sq(x + y + 1) * (19 - 14 * x + 3 * x * x - 14 * y + 6 * x * y + 3 * y * y)) *
      (30 + sq(2 * x - 3 * y) * (18 - 32 * x + 12 * x * x + 4 * y - 36 * x * y + 27 * y * y));
    expect(Math.abs(surface.value([0.5, 0.5]) - misprint(0.5, 0.5))).toBeGreaterThan(1);
  });
});
