/// <reference lib="dom" />
// Page side of the grid pool: Web Workers running the normal engine worker entry.
import type { FromPoolMember, FromWorker } from '../protocol';
import { createGridPool, defaultPoolSize, type GridPool, type WorkerLike } from './grid-pool';

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
 * A grid pool of module Web Workers running src/worker/engine.worker.ts (the same entry as the page's
 * engine worker; it answers 'band/sample'). Size: navigator.hardwareConcurrency clamped to [1, 8].
 */
export function createPageGridPool(size = defaultPoolSize()): GridPool {
  return createGridPool(() => webWorkerLike(new Worker(new URL('../worker/engine.worker.ts', import.meta.url), { type: 'module' })), size);
}
