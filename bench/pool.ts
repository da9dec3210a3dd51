import { sampleGrid, type GridRequest } from '../src/engine';
import { buildSurface, type SurfaceSpec } from '../src/problems';
import { createGridPool, type GridPool } from '../src/worker/pool';
import { buildPoolThread, nodeWorkerLike } from './node-worker';

/**
 * The grid pool with 2 worker threads against the same pool with 1, on one request: both run the page's
 * band handler in Node worker_threads (bundled by buildPoolThread), and the main thread only hands out
 * bands and copies them into place. Both pools answer one warm-up request first (threads start, build
 * and cache the surface, the JIT settles) whose values are checked against one sampleGrid call on the
 * main thread. Then the timed rounds alternate between the two pools, so both see the same background
 * load from other processes, and the best round of each counts.
 */
export async function poolSpeedup(spec: SurfaceSpec, grid: GridRequest, rounds = 15) {
  const file = await buildPoolThread();
  const expected = sampleGrid(buildSurface(spec), grid);
  const pools: [number, GridPool][] = [1, 2].map((size) => [size, createGridPool(() => nodeWorkerLike(file), size)]);
  const best: Record<number, number> = { 1: Infinity, 2: Infinity };
  try {
    for (const [size, pool] of pools) {
      const warm = await pool.request(`warm-${size}`, spec, grid);
      for (let k = 0; k < expected.length; k++)
        if (!Object.is(warm.values[k], expected[k])) throw new Error(`bench: the ${size}-worker pool differs from sampleGrid at ${k}`);
    }
    for (let r = 0; r < rounds; r++)
      for (const [size, pool] of pools) {
        const t0 = performance.now();
        await pool.request(`round-${size}-${r}`, spec, grid);
        best[size] = Math.min(best[size], performance.now() - t0);
      }
  } finally {
    for (const [, pool] of pools) pool.dispose();
  }
  return { oneWorkerMs: best[1], twoWorkersMs: best[2], ratio: best[1] / best[2] };
}
