import { Worker } from 'node:worker_threads';
import { bundleForNode } from './bundle';
import type { WorkerLike } from '../src/client/grid-pool';

/**
 * Bundles bench/pool-thread.ts and everything it imports (our TypeScript sources and any package) into
 * one ES module in bench/.cache/, with Vite's build API in SSR mode, so plain Node worker threads can
 * load it. Returns the bundle's path.
 */
export async function buildPoolThread(): Promise<string> {
  return bundleForNode('bench/pool-thread.ts', 'bench/.cache', 'pool-thread.mjs');
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
