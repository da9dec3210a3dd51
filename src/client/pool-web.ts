/// <reference lib="dom" />
// Page side of the worker pool: Web Workers running the normal engine worker entry, shared by the grid
// pool and the study pool (src/client/study-pool.ts).
import type { FromPoolMember, FromWorker } from '../protocol';
import { createGridPool, defaultPoolSize, type GridPool, type WorkerLike } from './grid-pool';
import { sharedWorkers } from './shared-workers';

/** Adapts a Web Worker to the pool's WorkerLike. */
export function webWorkerLike(worker: Worker): WorkerLike {
  return {
    postMessage: (msg) => worker.postMessage(msg),
    listen(onMessage, onFailure) {
      worker.addEventListener('message', (e: MessageEvent<FromPoolMember | FromWorker>) => onMessage(e.data));
      worker.addEventListener('error', (e: ErrorEvent) => {
        e.preventDefault();
        onFailure(e.message || 'the worker could not start');
      });
      worker.addEventListener('messageerror', () => onFailure('a message from the worker could not be read'));
    },
    terminate: () => worker.terminate(),
  };
}

/**
 * The page's pool workers: module Web Workers running src/worker/engine.worker.ts (the same entry as the
 * page's engine worker; it answers bands and study parts). Size: navigator.hardwareConcurrency clamped
 * to [1, 8].
 */
export function createPageWorkers(size = defaultPoolSize()): WorkerLike[] {
  return sharedWorkers(() => webWorkerLike(new Worker(new URL('../worker/engine.worker.ts', import.meta.url), { type: 'module' })), size);
}

/** A grid pool on the given workers (default: a fresh set of createPageWorkers). */
export function createPageGridPool(workers: readonly WorkerLike[] = createPageWorkers()): GridPool {
  return createGridPool((index) => workers[index], workers.length);
}
