import type { FromWorker, ToWorker } from '../../src/protocol';
import type { EngineLink } from '../../src/store/engine-link';
import { createHandler } from '../../src/worker/handler';
import type { Timing } from '../../src/worker/scheduler';

/**
 * The real worker message handler running in the test process, with a manual clock: `drain()` runs the
 * scheduled slices until none is left (or a limit), advancing the clock by 16 ms per slice.
 */
export function inProcessLink() {
  let now = 0;
  const queue: { at: number; fn: () => void }[] = [];
  const timing: Timing = { now: () => now, later: (fn, delay) => queue.push({ at: now + delay, fn }) };
  const listeners: ((m: FromWorker) => void)[] = [];
  const sent: ToWorker[] = [];
  const received: FromWorker[] = [];
  const handle = createHandler((m) => {
    received.push(m);
    for (const l of listeners) l(structuredClone(m));
  }, timing);
  const frames: (() => void)[] = [];
  const link: EngineLink = {
    send: (m) => {
      sent.push(m);
      handle(structuredClone(m));
    },
    listen: (h) => listeners.push(h),
  };
  return {
    link,
    sent,
    received,
    requestFrame: (fn: () => void) => frames.push(fn),
    /** Runs worker slices and page frames until both are idle. */
    drain(maxSlices = 100_000) {
      for (let k = 0; k < maxSlices && (queue.length || frames.length); k++) {
        queue.sort((a, b) => a.at - b.at);
        const next = queue.shift();
        if (next) {
          now = Math.max(now + 16, next.at);
          next.fn();
        }
        while (frames.length) frames.shift()!();
      }
    },
  };
}
