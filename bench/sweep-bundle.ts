import { pathToFileURL } from 'node:url';
import { bundleForNode } from './bundle';
import type { sweepBench } from './sweep';

/**
 * Runs bench/sweep.ts bundled into one ES module (Vite's build API in SSR mode, as the pool's thread
 * bundle is made), so the engine runs as the app's build runs it: in the module runner every call
 * across our modules goes through an import object, which costs the per-run step loop several times
 * its own work. The hand-written loop is in the same bundle, so both sides are measured alike.
 */
export async function bundledSweepBench(): Promise<ReturnType<typeof sweepBench>> {
  const path = await bundleForNode('bench/sweep.ts', 'bench/.cache/sweep', 'sweep-bench.mjs');
  const mod = (await import(/* @vite-ignore */ pathToFileURL(path).href)) as { sweepBench: typeof sweepBench };
  return mod.sweepBench();
}
