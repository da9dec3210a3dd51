import { resolve } from 'node:path';
import { Worker } from 'node:worker_threads';
import { build } from 'vite';
import type { WorkerLike } from '../src/client/grid-pool';

const CACHE = resolve(process.cwd(), 'bench/.cache');
const ENTRY = 'pool-thread.mjs';

/**
 * Bundles bench/pool-thread.ts and everything it imports (our TypeScript sources and any package) into
 * one ES module in bench/.cache/, with Vite's build API in SSR mode, so plain Node worker threads can
 * load it. Returns the bundle's path.
 */
export async function buildPoolThread(): Promise<string> {
  await build({
    configFile: false,
    root: process.cwd(),
    logLevel: 'warn',
    ssr: { noExternal: true },
    build: {
      ssr: resolve(process.cwd(), 'bench/pool-thread.ts'),
      outDir: CACHE,
      emptyOutDir: true,
      minify: false,
      target: 'node20',
      rolldownOptions: { output: { format: 'es', entryFileNames: ENTRY } },
    },
  });
  return resolve(CACHE, ENTRY);
}

/** A Node worker thread as the pool's WorkerLike. */
export function nodeWorkerLike(file: string): WorkerLike {
  const worker = new Worker(file);
  return {
    postMessage: (msg) => worker.postMessage(msg),
    listen(onMessage, onFailure) {
      worker.on('message', onMessage);
      worker.on('error', (e) => onFailure(e.message));
      worker.on('exit', (code) => code !== 0 && onFailure(`the worker thread exited with code ${code}`));
    },
    terminate: () => void worker.terminate(),
  };
}
