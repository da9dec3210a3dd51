import type { FromWorker, ToWorker } from './messages';

/**
 * The page's line to a worker that speaks ToWorker / FromWorker: the engine worker (store/engine-link.ts
 * workerLink), the study pool over the pool workers (client/study-pool.ts), or in tests an in-process
 * link running the same handler.
 */
export interface EngineLink {
  send(msg: ToWorker): void;
  listen(handler: (msg: FromWorker) => void): void;
  /**
   * Optional: `handler(reason)` is called after the worker failed and a fresh one replaced it (work in
   * flight is gone); the reason completes "The engine worker ..." ("threw an error: ...").
   */
  onRestart?(handler: (reason: string) => void): void;
}
