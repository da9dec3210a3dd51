import { describe, expect, it } from 'vitest';
import { axisPlane, randomPlane, sampleGrid, type GridRequest } from '../../src/engine';
import { buildSurface, type SurfaceSpec } from '../../src/problems';
import { createGridPool, defaultPoolSize, GridRequestCancelled, type GridPoolResult } from '../../src/client/grid-pool';
import { fakeWorld, flush } from './fake-workers';

/** A 12-parameter surface sliced on a random plane: every band does real, distinct work. */
const SPEC: SurfaceSpec = { kind: 'formula', text: 'a^2 + 2*b^2 + 3*c^2 + d*m + sin(f) + g^2*h + exp(-i^2) + j^2 + k*l' };
const CENTRE = [0.5, -1, 0.25, 1, 2, -0.5, 0.3, 1.5, -2, 0.1, 0.7, -0.3];
const plane = randomPlane(CENTRE, undefined, 17);
const grid = (nx: number, ny: number): GridRequest => ({ plane, a: [-1, 1], b: [-0.75, 1.25], nx, ny });

/** What one sampleGrid call gives on the page: the oracle for the reassembled pool result. */
const direct = (spec: SurfaceSpec, g: GridRequest) => sampleGrid(buildSurface(spec), g);

/** Settles a promise into a plain record without throwing. */
function track<T>(p: Promise<T>) {
  const out: { value?: T; error?: unknown; settled: boolean } = { settled: false };
  p.then(
    (v) => Object.assign(out, { value: v, settled: true }),
    (e) => Object.assign(out, { error: e, settled: true }),
  );
  return out;
}

/** Rows of a request that members finished and sent back. */
function rowsFinished(world: ReturnType<typeof fakeWorld>, requestId: string): number {
  return world.log.reduce((n, e) => (e.msg.type === 'band/result' && e.msg.requestId === requestId ? n + e.msg.rows[1] - e.msg.rows[0] : n), 0);
}

describe('GridPool: reassembly', () => {
  it.each([
    [1, 40, 33],
    [2, 40, 33],
    [3, 17, 50],
    [5, 9, 2],
    [8, 64, 7],
  ])('%i members give exactly the values of one sampleGrid call (%i x %i)', async (size, nx, ny) => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, size);
    const g = grid(nx, ny);
    const r = track(pool.request('g1', SPEC, g));
    world.run();
    await flush();
    const result = r.value as GridPoolResult;
    expect(Array.from(result.values)).toEqual(Array.from(direct(SPEC, g)));
    const finite = Array.from(result.values).filter(Number.isFinite);
    expect([result.min, result.max]).toEqual([Math.min(...finite), Math.max(...finite)]);
    expect(result.grid).toEqual(g);
    // Every member took part when there were enough rows.
    const served = new Set(world.log.filter((e) => e.msg.type === 'band/sample').map((e) => e.member));
    expect(served.size).toBe(Math.min(size, ny));
  });

  it('hands out every row exactly once, in bands that shrink towards the end (guided self-scheduling)', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    track(pool.request('g', SPEC, grid(8, 100)));
    world.run();
    const bands = world.log.filter((e) => e.msg.type === 'band/sample').map((e) => (e.msg as { rows: [number, number] }).rows);
    // ceil(0.5 x rows left / 2 members): 25, 19, 14, 11, 8, 6, 5, 3, 3, 2, 1, 1, 1, 1
    expect(bands.map(([j0, j1]) => j1 - j0)).toEqual([25, 19, 14, 11, 8, 6, 5, 3, 3, 2, 1, 1, 1, 1]);
    expect(bands.map(([j0]) => j0)).toEqual(bands.map((_, k) => bands.slice(0, k).reduce((s, [a, b]) => s + b - a, 0)));
  });

  it('samples a 2-D catalogue surface on an axis plane the same way', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 3);
    const spec: SurfaceSpec = { kind: 'catalogue', id: 'rosenbrock' };
    const g: GridRequest = { plane: axisPlane([0, 0], 0, 1), a: [-2, 2], b: [-1, 3], nx: 31, ny: 29 };
    const r = track(pool.request('r', spec, g));
    world.run();
    await flush();
    expect(Array.from((r.value as GridPoolResult).values)).toEqual(Array.from(direct(spec, g)));
  });

  it('reports progress that never decreases, has steps inside bands, and ends at exactly 1', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    const seen: number[] = [];
    const r = track(pool.request('p', SPEC, grid(60, 40), (f) => seen.push(f)));
    world.run();
    await flush();
    expect(r.value).toBeDefined();
    expect(seen.at(-1)).toBe(1);
    for (let k = 1; k < seen.length; k++) expect(seen[k]).toBeGreaterThan(seen[k - 1]);
    expect(world.log.some((e) => e.msg.type === 'band/progress')).toBe(true);
    expect(seen.length).toBeGreaterThan(8);
  });

  it('sends the previews first when asked, coarse to fine, each equal to sampling its grid', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    const g = grid(120, 120);
    const order: string[] = [];
    const previews: GridPoolResult[] = [];
    const r = track(
      pool.request('c', SPEC, g, undefined, {
        onCoarse: (p) => {
          previews.push(p);
          order.push(`preview ${p.grid.nx}`);
        },
      }).then((v) => (order.push('final'), v)),
    );
    world.run();
    await flush();
    expect(order).toEqual(['preview 16', 'preview 48', 'final']);
    for (const p of previews) expect(Array.from(p.values)).toEqual(Array.from(direct(SPEC, { ...g, nx: p.grid.nx, ny: p.grid.nx })));
    expect(previews[1].grid).toEqual({ ...g, nx: 48, ny: 48 });
    expect(Array.from((r.value as GridPoolResult).values)).toEqual(Array.from(direct(SPEC, g)));
    // A 40 x 40 grid gets only the 16 x 16 preview (48 x 48 would not be a quarter of it), a small grid none.
    const sides: number[] = [];
    track(pool.request('m', SPEC, grid(40, 40), undefined, { onCoarse: (p) => sides.push(p.grid.nx) }));
    world.run();
    await flush();
    expect(sides).toEqual([16]);
    let small = 0;
    track(pool.request('s', SPEC, grid(20, 20), undefined, { onCoarse: () => small++ }));
    world.run();
    expect(small).toBe(0);
  });

  it('drops a coarse preview that arrives after a finer one', async () => {
    // Member 0 crashes on its first band, the 16 x 16 preview: it is handed to member 1 again, which has
    // the 48 x 48 one queued first, so the coarse preview comes back second and must not replace it.
    const world = fakeWorld();
    world.failing.add(0);
    const pool = createGridPool(world.factory, 2);
    const sides: number[] = [];
    const g = grid(120, 120);
    const r = track(pool.request('late', SPEC, g, undefined, { onCoarse: (p) => sides.push(p.grid.nx) }));
    world.run();
    await flush();
    expect(world.log.filter((e) => e.msg.type === 'band/result' && e.msg.requestId === 'late#preview16')).toHaveLength(1);
    expect(sides).toEqual([48]);
    expect(Array.from((r.value as GridPoolResult).values)).toEqual(Array.from(direct(SPEC, g)));
  });
});

describe('GridPool: stale requests, cancellation, errors, failures', () => {
  it('a new request supersedes the one in progress: the old rejects as superseded, its late messages are dropped', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    const oldProgress: number[] = [];
    const first = track(pool.request('old', SPEC, grid(80, 60), (f) => oldProgress.push(f)));
    world.run(12); // part way: some bands handed out, some rows sampled
    const progressAtSupersede = oldProgress.length;
    const g2 = grid(30, 25);
    const second = track(pool.request('new', { kind: 'catalogue', id: 'himmelblau' }, { ...g2, plane: axisPlane([0, 0], 0, 1) }));
    world.run();
    await flush();
    expect(first.error).toBeInstanceOf(GridRequestCancelled);
    expect((first.error as GridRequestCancelled).reason).toBe('superseded');
    expect(oldProgress.length).toBe(progressAtSupersede);
    const expected = direct({ kind: 'catalogue', id: 'himmelblau' }, { ...g2, plane: axisPlane([0, 0], 0, 1) });
    expect(Array.from((second.value as GridPoolResult).values)).toEqual(Array.from(expected));
    // Each member was told to drop the old request's bands before it got a new band.
    for (const m of [0, 1]) {
      const inbox = world.log.filter((e) => e.member === m && e.direction === 'in').map((e) => `${e.msg.type} ${(e.msg as { requestId: string }).requestId}`);
      const cancel = inbox.indexOf('band/cancel old');
      const firstNew = inbox.indexOf('band/sample new');
      expect(cancel).toBeGreaterThanOrEqual(0);
      expect(cancel).toBeLessThan(firstNew);
    }
    // The old request's bands stopped: fewer old rows were finished than it had.
    expect(rowsFinished(world, 'old')).toBeLessThan(60);
  });

  it('cancel rejects as cancelled and stops the members; other ids are ignored', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    const r = track(pool.request('x', SPEC, grid(80, 60)));
    world.run(6);
    pool.cancel('not-this-one');
    pool.cancel('x');
    world.run();
    await flush();
    expect((r.error as GridRequestCancelled).reason).toBe('cancelled');
    // The members dropped what they had not finished.
    expect(rowsFinished(world, 'x')).toBeLessThan(60);
    expect(world.idle).toBe(true);
  });

  it('an error in the bands rejects the request once, with the worker message, and the pool carries on', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 3);
    const rejections: unknown[] = [];
    const bad = pool.request('bad', { kind: 'catalogue', id: 'rosenbrock' }, grid(10, 12));
    bad.catch((e) => rejections.push(e));
    const progress: number[] = [];
    world.run();
    await flush();
    expect(rejections).toHaveLength(1);
    expect((rejections[0] as Error).message).toBe('grid: the slice plane has 12 coordinates but the surface has 2');
    expect(world.log.filter((e) => e.msg.type === 'band/error').length).toBeGreaterThan(1); // several bands failed...
    const good = track(pool.request('good', SPEC, grid(10, 12), (f) => progress.push(f)));
    world.run();
    await flush();
    expect(Array.from((good.value as GridPoolResult).values)).toEqual(Array.from(direct(SPEC, grid(10, 12))));
    expect(progress.at(-1)).toBe(1);
  });

  it('an unknown surface is reported with the problems layer message', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    const r = track(pool.request('u', { kind: 'catalogue', id: 'no-such-surface' }, grid(10, 10)));
    world.run();
    await flush();
    expect(String((r.error as Error).message)).toMatch(/no-such-surface/);
  });

  it('a grid of the wrong shape is refused before any worker is asked', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    await expect(pool.request('w', SPEC, { ...grid(10, 10), nx: 1 })).rejects.toThrow(/nx must be a whole number from 2/);
    expect(world.log).toHaveLength(0);
  });

  it("a member whose worker fails is retired and its band redone by another; with none left the request fails", async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 3);
    world.failing.add(1);
    const r = track(pool.request('f', SPEC, grid(20, 30)));
    world.run();
    await flush();
    expect(Array.from((r.value as GridPoolResult).values)).toEqual(Array.from(direct(SPEC, grid(20, 30))));
    expect(pool.aliveCount).toBe(2);
    world.failing.add(0);
    world.failing.add(2);
    const r2 = track(pool.request('f2', SPEC, grid(20, 30)));
    world.run();
    await flush();
    expect((r2.error as Error).message).toBe('grid pool: every worker has failed (last: simulated crash)');
    await expect(pool.request('f3', SPEC, grid(20, 30))).rejects.toThrow('grid pool: every worker has failed');
  });

  it('dispose rejects the request in progress and any later one as disposed', async () => {
    const world = fakeWorld();
    const pool = createGridPool(world.factory, 2);
    const r = track(pool.request('d', SPEC, grid(30, 30)));
    world.run(3);
    pool.dispose();
    world.run();
    await flush();
    expect((r.error as GridRequestCancelled).reason).toBe('disposed');
    await expect(pool.request('d2', SPEC, grid(30, 30))).rejects.toBeInstanceOf(GridRequestCancelled);
  });
});

describe('pool size', () => {
  it('defaults to hardwareConcurrency clamped to [1, 8], 1 when unknown', () => {
    expect([defaultPoolSize(undefined), defaultPoolSize(0), defaultPoolSize(2), defaultPoolSize(6), defaultPoolSize(64)]).toEqual([1, 1, 2, 6, 8]);
  });

  it('refuses a size below 1', () => {
    expect(() => createGridPool(fakeWorld().factory, 0)).toThrow('grid pool: size must be a whole number of at least 1, got 0');
  });
});
