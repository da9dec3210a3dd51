import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { blockNorm, createRng, dot, nextGaussian, norm2, randomPlane, type ParameterGroup } from '../../../src/engine';

// Filter-wise normalisation as defined by Li, Xu, Taylor, Studer & Goldstein, "Visualizing the Loss
// Landscape of Neural Nets", NeurIPS 2018: each filter's direction block gets the Frobenius norm of the
// centre's block.

/** A model-shaped case: a random centre and a random partition of its positions into groups. */
const modelCase = fc
  .record({
    sizes: fc.array(fc.integer({ min: 1, max: 6 }), { minLength: 1, maxLength: 8 }),
    biasEvery: fc.integer({ min: 2, max: 4 }),
    seed: fc.integer(),
    scale: fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
  })
  .chain(({ sizes, biasEvery, seed, scale }) => {
    const n = sizes.reduce((s, k) => s + k, 0);
    return fc.record({
      centre: fc.array(fc.double({ min: -1, max: 1, noNaN: true }).map((x) => (Math.abs(x) < 1e-100 ? 0 : x * scale)), { minLength: n, maxLength: n }),
      order: fc.shuffledSubarray(Array.from({ length: n }, (_, i) => i), { minLength: n, maxLength: n }),
      sizes: fc.constant(sizes),
      biasEvery: fc.constant(biasEvery),
      seed: fc.constant(seed),
    });
  })
  .map(({ centre, order, sizes, biasEvery, seed }) => {
    let at = 0;
    const groups: ParameterGroup[] = sizes.map((k, g) => {
      const indices = order.slice(at, at + k);
      at += k;
      return { name: `g${g}`, indices, kind: g % biasEvery === biasEvery - 1 ? 'bias' : 'weights' };
    });
    return { centre, groups, seed };
  });

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(b));

describe('randomPlane: filter-wise normalisation (Li et al. 2018)', () => {
  it('gives every weights group the norm of the centre block and leaves bias groups at 0 (property)', () => {
    fc.assert(
      fc.property(modelCase, ({ centre, groups, seed }) => {
        if (groups.every((g) => g.kind === 'bias' || blockNorm(centre, g.indices) === 0)) return;
        const { origin, u, v } = randomPlane(centre, groups, seed);
        expect(origin).toEqual(centre);
        for (const g of groups) {
          const target = g.kind === 'weights' ? blockNorm(centre, g.indices) : 0;
          expect(close(blockNorm(u, g.indices), target)).toBe(true);
          expect(close(blockNorm(v, g.indices), target)).toBe(true);
        }
      }),
    );
  });

  it("with bias: 'filter' normalises bias groups too (property)", () => {
    fc.assert(
      fc.property(modelCase, ({ centre, groups, seed }) => {
        if (groups.every((g) => blockNorm(centre, g.indices) === 0)) return;
        const { u, v } = randomPlane(centre, groups, seed, { bias: 'filter' });
        for (const g of groups) {
          expect(close(blockNorm(u, g.indices), blockNorm(centre, g.indices))).toBe(true);
          expect(close(blockNorm(v, g.indices), blockNorm(centre, g.indices))).toBe(true);
        }
      }),
    );
  });

  it('orthogonalize makes v exactly orthogonal to u and keeps the filter norms of blocks with 2+ entries (property)', () => {
    fc.assert(
      fc.property(modelCase, ({ centre, groups, seed }) => {
        const multi = groups.filter((g) => g.indices.length >= 2 && blockNorm(centre, g.indices) > 0);
        if (multi.length === 0) return;
        const { u, v } = randomPlane(centre, groups, seed, { orthogonalize: true, bias: 'filter' });
        expect(Math.abs(dot(u, v))).toBeLessThanOrEqual(1e-12 * norm2(u) * norm2(v));
        for (const g of multi) expect(close(blockNorm(v, g.indices), blockNorm(centre, g.indices))).toBe(true);
        for (const g of groups) if (g.indices.length === 1) expect(blockNorm(v, g.indices)).toBe(0);
      }),
    );
  });

  it('within a block the direction is the seeded Gaussian draw rescaled (u from the first n deviates, v from the next n)', () => {
    const centre = [3, -4, 0.5, 2, 1];
    const groups: ParameterGroup[] = [
      { name: 'w0', indices: [0, 1], kind: 'weights' },
      { name: 'w1', indices: [2, 3, 4], kind: 'weights' },
    ];
    const { u, v } = randomPlane(centre, groups, 7);
    const rng = createRng(7);
    const raw = Array.from({ length: 10 }, () => nextGaussian(rng));
    for (const [dir, off] of [[u, 0], [v, 5]] as const)
      for (const g of groups) {
        const r = Math.hypot(...g.indices.map((i) => raw[off + i]));
        const c = Math.hypot(...g.indices.map((i) => centre[i]));
        for (const i of g.indices) expect(dir[i]).toBeCloseTo((raw[off + i] / r) * c, 12);
      }
  });
});

describe('randomPlane: seeds, defaults and edge cases', () => {
  const centre = Array.from({ length: 30 }, (_, k) => Math.sin(k + 1));

  it('the same seed gives the same plane; another seed another plane', () => {
    expect(randomPlane(centre, undefined, 42)).toEqual(randomPlane(centre, undefined, 42));
    expect(randomPlane(centre, undefined, 43).u).not.toEqual(randomPlane(centre, undefined, 42).u);
  });

  it('without groups the whole vector is one filter: |u| = |v| = |centre|', () => {
    const { u, v } = randomPlane(centre, undefined, 1);
    expect(norm2(u)).toBeCloseTo(norm2(centre), 12);
    expect(norm2(v)).toBeCloseTo(norm2(centre), 12);
    expect(randomPlane(centre, [], 1)).toEqual(randomPlane(centre, undefined, 1));
  });

  it('two independent directions in 2,000 dimensions are nearly orthogonal without orthogonalize', () => {
    const big = Array.from({ length: 2000 }, (_, k) => 1 + (k % 7));
    const { u, v } = randomPlane(big, undefined, 5);
    // |cos| of two independent Gaussian vectors has standard deviation 1/sqrt(n) ~ 0.022.
    expect(Math.abs(dot(u, v)) / (norm2(u) * norm2(v))).toBeLessThan(0.1);
  });

  it("a zero centre block gives a zero direction block by default, a unit-norm one with zeroBlocks: 'unit'", () => {
    const c = [0, 0, 0, 1, 2];
    const groups: ParameterGroup[] = [
      { name: 'dead', indices: [0, 1, 2], kind: 'weights' },
      { name: 'live', indices: [3, 4], kind: 'weights' },
    ];
    const held = randomPlane(c, groups, 3);
    expect(held.u.slice(0, 3)).toEqual([0, 0, 0]);
    expect(held.v.slice(0, 3)).toEqual([0, 0, 0]);
    const moved = randomPlane(c, groups, 3, { zeroBlocks: 'unit' });
    expect(blockNorm(moved.u, [0, 1, 2])).toBeCloseTo(1, 12);
    expect(blockNorm(moved.u, [3, 4])).toBeCloseTo(Math.sqrt(5), 12);
  });

  it('an all-zero centre is refused with a hint, and works with unit blocks', () => {
    expect(() => randomPlane([0, 0, 0], undefined, 1)).toThrow(/every perturbed block of the centre is zero.*zeroBlocks: 'unit'/);
    const { u, v } = randomPlane([0, 0, 0], undefined, 1, { zeroBlocks: 'unit' });
    expect(norm2(u)).toBeCloseTo(1, 12);
    expect(norm2(v)).toBeCloseTo(1, 12);
  });

  it('positions in no group stay unperturbed', () => {
    const { u, v } = randomPlane([1, 2, 3, 4], [{ name: 'w', indices: [1, 2], kind: 'weights' }], 9);
    expect([u[0], u[3], v[0], v[3]]).toEqual([0, 0, 0, 0]);
  });

  it('rejects bad groups and options with messages naming them', () => {
    expect(() => randomPlane([1, 2], [{ name: 'w', indices: [0, 2], kind: 'weights' }], 1)).toThrow("parameter group 'w': index 2 is outside the 2 parameters");
    expect(() =>
      randomPlane([1, 2], [
        { name: 'a', indices: [0, 1], kind: 'weights' },
        { name: 'b', indices: [1], kind: 'bias' },
      ], 1),
    ).toThrow("parameter group 'b': index 1 is already in group 'a'");
    expect(() => randomPlane([1, 2], undefined, 1, { bias: 'scaled' as 'zero' })).toThrow(/bias must be 'zero' or 'filter'/);
    expect(() => randomPlane([1, Number.NaN], undefined, 1)).toThrow('randomPlane: centre coordinate 2 is NaN');
  });
});
