import type { EngineLink, FromWorker, LinkPing, LinkPong } from '../protocol';

export type { EngineLink } from '../protocol';

/** A worker that sends nothing for this long, pings included, is taken for dead and replaced. */
export const WORKER_SILENCE_LIMIT_MS = 15_000;
const PING_EVERY_MS = 2_000;
/** Restarts allowed within RESTART_WINDOW_MS; past that the link gives up (a worker that cannot start). */
export const MAX_RESTARTS = 3;
const RESTART_WINDOW_MS = 60_000;

export interface WorkerLinkOptions {
  /** The worker's name (its `self.name`; shown by the browser's tools). */
  name: string;
  /**
   * Ping the worker and replace it after WORKER_SILENCE_LIMIT_MS of silence (a worker the browser
   * killed sends no event). Only for workers that never compute silently for that long: the engine
   * worker's runs and grids are time-sliced, its CSV parsing reports progress per chunk.
   */
  watchSilence?: boolean;
}

/**
 * A module Web Worker running src/worker/engine.worker.ts, replaced by a fresh one when it throws an
 * uncaught error, sends a message that cannot be read, or (with `watchSilence`) stops answering.
 */
export function workerLink({ name, watchSilence = false }: WorkerLinkOptions): EngineLink {
  const listeners: ((msg: FromWorker) => void)[] = [];
  const restartListeners: ((reason: string) => void)[] = [];
  const restarts: number[] = [];
  let lastHeard = performance.now();
  let unansweredTicks = 0;
  let gaveUp = false;
  let worker = create();

  function create(): Worker {
    const w = new Worker(new URL('../worker/engine.worker.ts', import.meta.url), { type: 'module', name });
    w.addEventListener('message', (e: MessageEvent<FromWorker | LinkPong>) => {
      lastHeard = performance.now();
      unansweredTicks = 0;
      if (e.data.type === 'link/pong') return;
      for (const l of listeners) l(e.data);
    });
    w.addEventListener('error', (e: ErrorEvent) => {
      e.preventDefault();
      replace(e.message ? `threw an error: ${e.message}` : 'could not start');
    });
    w.addEventListener('messageerror', () => replace('sent a message that could not be read'));
    return w;
  }

  function replace(reason: string): void {
    if (gaveUp) return;
    worker.terminate();
    const now = performance.now();
    while (restarts.length && now - restarts[0] > RESTART_WINDOW_MS) restarts.shift();
    if (restarts.length >= MAX_RESTARTS) {
      gaveUp = true;
      for (const h of restartListeners) h(`${reason}, and failed ${MAX_RESTARTS} times within a minute; reload the page`);
      return;
    }
    restarts.push(now);
    worker = create();
    lastHeard = now;
    unansweredTicks = 0;
    for (const h of restartListeners) h(reason);
  }

  // Dead means silent for the limit in wall time and across that many ticks: a page that was itself
  // blocked or throttled in the background runs one late tick before the queued answers, not many.
  if (watchSilence)
    setInterval(() => {
      if (gaveUp) return;
      if (unansweredTicks * PING_EVERY_MS >= WORKER_SILENCE_LIMIT_MS && performance.now() - lastHeard >= WORKER_SILENCE_LIMIT_MS)
        return replace(`stopped answering (nothing for ${WORKER_SILENCE_LIMIT_MS / 1000} s)`);
      unansweredTicks += 1;
      worker.postMessage({ type: 'link/ping' } satisfies LinkPing);
    }, PING_EVERY_MS);

  return {
    send: (msg) => worker.postMessage(msg),
    listen: (handler) => listeners.push(handler),
    onRestart: (handler) => restartListeners.push(handler),
  };
}
