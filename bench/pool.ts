import { sampleGrid, type GridRequest } from '../src/engine';
import { buildSurface, type SurfaceSpec } from '../src/problems';
import { createGridPool, type GridPool } from '../src/client/grid-pool';
import { buildPoolThread, nodeWorkerLike } from './node-worker';

/**
 * The grid pool with 2 worker threads against the same pool with 1, on one request: all run the page's
 * band handler in Node worker_threads (bundled by buildPoolThread); the main thread only hands out
 * bands and copies them into place.
 *
 * The limit: what two threads achieve with no pool at all. Two separate 1-worker pools sample the whole
 * grid at the same moment; 2 x (one grid alone) / (two grids at once) is the machine's parallel
 * throughput for exactly this work (2 on two free cores; less when the cores are shared or slow each
 * other down), so `ratio` / `limit` is the pool's own efficiency.
 *
 * The speed of the same loop differs by up to 1.6x from one fresh thread (or process) to the next on
 * this machine, so each trial starts fresh pools; each pool answers a warm-up request (threads start,
 * build and cache the surface, the JIT settles) whose values are checked against one sampleGrid call
 * on the main thread; then the timed requests alternate, so all see the same background load. The best
 * time of each kind over all trials counts.
 */
export async function poolSpeedup(spec: SurfaceSpec, grid: GridRequest, trials = 4, rounds = 8) {
  const file = await buildPoolThread();
  const expected = sampleGrid(buildSurface(spec), grid);
  let one = Infinity, two = Infinity, pair = Infinity;
  const time = async (f: () => Promise<unknown>) => {
    const t0 = performance.now();
    await f();
    return performance.now() - t0;
  };
  for (let t = 0; t < trials; t++) {
    const pools: GridPool[] = [1, 2, 1].map((size) => createGridPool(() => nodeWorkerLike(file), size));
    const [single, double, other] = pools;
    try {
      for (const [k, pool] of pools.entries()) {
        const warm = await pool.request(`warm-${k}`, spec, grid);
        for (let i = 0; i < expected.length; i++)
          if (!Object.is(warm.values[i], expected[i])) throw new Error(`bench: pool ${k} (${pool.size} workers) differs from sampleGrid at ${i}`);
      }
      for (let r = 0; r < rounds; r++) {
        const id = `${t}-${r}`;
        one = Math.min(one, await time(() => single.request(`one-${id}`, spec, grid)));
        two = Math.min(two, await time(() => double.request(`two-${id}`, spec, grid)));
        pair = Math.min(pair, await time(() => Promise.all([single.request(`a-${id}`, spec, grid), other.request(`b-${id}`, spec, grid)])));
      }
    } finally {
      for (const pool of pools) pool.dispose();
    }
  }
  return { oneWorkerMs: one, twoWorkersMs: two, twoGridsAtOnceMs: pair, ratio: one / two, limit: (2 * one) / pair, trials, rounds };
}
