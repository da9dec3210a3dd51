import type { FromWorker, ToWorker } from '../protocol';

/** The page's line to the engine worker. Tests substitute an in-process link running the same handler. */
export interface EngineLink {
  send(msg: ToWorker): void;
  listen(handler: (msg: FromWorker) => void): void;
}

/** A module Web Worker running src/worker/engine.worker.ts. */
export function workerLink(): EngineLink {
  const worker = new Worker(new URL('../worker/engine.worker.ts', import.meta.url), { type: 'module' });
  return {
    send: (msg) => worker.postMessage(msg),
    listen: (handler) => worker.addEventListener('message', (e: MessageEvent<FromWorker>) => handler(e.data)),
  };
}
