/**
 * Time-slicing for the worker: runs and grid bands advance in short slices so that control messages
 * (pause, cancel, a new request) are handled between slices instead of waiting behind long work.
 * The clock and the way to schedule the next slice are injected, so tests drive it deterministically.
 */
export interface Timing {
  now(): number;
  /** Calls fn after at least `delayMs` (0: as soon as pending messages have been handled). */
  later(fn: () => void, delayMs: number): void;
}

/** Default timing inside a worker: MessageChannel for zero delay (setTimeout(0) is clamped to 4 ms when nested). */
export function workerTiming(): Timing {
  const channel = new MessageChannel();
  const queue: (() => void)[] = [];
  channel.port1.onmessage = () => queue.shift()?.();
  return {
    now: () => performance.now(),
    later(fn, delayMs) {
      if (delayMs > 0) setTimeout(fn, delayMs);
      else {
        queue.push(fn);
        channel.port2.postMessage(null);
      }
    },
  };
}

/** Milliseconds of work per slice before yielding. Keeps message latency low without starving work. */
export const SLICE_MS = 12;
/** Interval between slices when runs are paced rather than running flat out. */
export const PACED_INTERVAL_MS = 16;
