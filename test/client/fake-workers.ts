import type { FromPoolMember, FromWorker, ToPoolMember, ToWorker } from '../../src/protocol';
import { createBandHandler, isPoolMessage } from '../../src/worker/bands';
import { createHandler } from '../../src/worker/handler';
import type { WorkerLike } from '../../src/client/grid-pool';
import type { Timing } from '../../src/worker/scheduler';

/**
 * In-process stand-ins for pool members: each runs the real band handler (src/worker/bands.ts) and
 * engine handler (src/worker/handler.ts) as the worker entry does, and
 * every message and every scheduled slice is a task in one FIFO queue, so deliveries are asynchronous
 * and interleave as they would between real threads. Each member's clock ticks `msPerRead` on every
 * read, so a slice (SLICE_MS of work) ends after a few rows and progress messages appear.
 */
export function fakeWorld(msPerRead = 4) {
  const tasks: (() => void)[] = [];
  const log: { member: number; direction: 'in' | 'out'; msg: ToPoolMember | FromPoolMember | ToWorker | FromWorker }[] = [];
  const failing = new Set<number>();
  const failures: ((message: string) => void)[] = [];

  function factory(index: number): WorkerLike {
    let clock = 0;
    const timing: Timing = { now: () => (clock += msPerRead), later: (fn) => tasks.push(fn) };
    let toPage: (msg: FromPoolMember | FromWorker) => void = () => {};
    let terminated = false;
    const post = (msg: FromPoolMember | FromWorker) => {
      if (terminated) return;
      const copy = structuredClone(msg);
      log.push({ member: index, direction: 'out', msg: copy });
      tasks.push(() => toPage(copy));
    };
    const handleBand = createBandHandler(post, timing);
    const handleOther = createHandler(post, timing);
    const handle = (msg: ToPoolMember | ToWorker) => (isPoolMessage(msg) ? handleBand(msg) : handleOther(msg));
    return {
      postMessage(msg) {
        const copy = structuredClone(msg);
        log.push({ member: index, direction: 'in', msg: copy });
        tasks.push(() => {
          if (terminated) return;
          if (failing.has(index) && (copy.type === 'band/sample' || copy.type === 'study/start')) {
            terminated = true;
            failures[index]?.('simulated crash');
            return;
          }
          handle(copy);
        });
      },
      listen(onMessage, onFailure) {
        toPage = onMessage;
        failures[index] = onFailure;
      },
      terminate() {
        terminated = true;
      },
    };
  }

  return {
    factory,
    log,
    /** Members that crash on their next band or study part. */
    failing,
    /** Runs queued tasks (messages and slices) until none is left or `limit` have run; returns how many ran. */
    run(limit = 1_000_000): number {
      let k = 0;
      for (; k < limit && tasks.length; k++) tasks.shift()!();
      return k;
    },
    get idle(): boolean {
      return tasks.length === 0;
    },
  };
}

/** Lets settled promises run their callbacks. */
export const flush = () => new Promise<void>((r) => setTimeout(r, 0));
