import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { build } from 'vite';
import type { sweepBench } from './sweep';

const OUT = resolve(process.cwd(), 'bench/.cache/sweep');
const ENTRY = 'sweep-bench.mjs';

/**
 * Runs bench/sweep.ts bundled into one ES module (Vite's build API in SSR mode, as the pool's thread
 * bundle is made), so the engine runs as the app's build runs it: in the module runner every call
 * across our modules goes through an import object, which costs the per-run step loop several times
 * its own work. The hand-written loop is in the same bundle, so both sides are measured alike.
 */
export async function bundledSweepBench(): Promise<ReturnType<typeof sweepBench>> {
  await build({
    configFile: false,
    root: process.cwd(),
    logLevel: 'warn',
    ssr: { noExternal: true },
    build: {
      ssr: resolve(process.cwd(), 'bench/sweep.ts'),
      outDir: OUT,
      emptyOutDir: true,
      minify: false,
      target: 'node20',
      rolldownOptions: { output: { format: 'es', entryFileNames: ENTRY } },
    },
  });
  const mod = (await import(/* @vite-ignore */ pathToFileURL(resolve(OUT, ENTRY)).href)) as { sweepBench: typeof sweepBench };
  return mod.sweepBench();
}
