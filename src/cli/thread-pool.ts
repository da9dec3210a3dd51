/**
 * Runs units on Node worker threads, at most one unit per thread at a time, and hands each result back
 * as it arrives. `stop()` terminates the threads (Ctrl-C).
 */
import { Worker } from 'node:worker_threads';
import type { RunResult } from './run-one';
import type { JobMessage, ResultMessage, ThreadJob } from './thread-messages';
import type { WorkUnit } from './work-units';

export interface ThreadPool {
  results: Promise<RunResult[]>;
  stop(): Promise<void>;
}

export function runOnThreads(workerFile: URL, job: ThreadJob, units: readonly WorkUnit[], threads: number, onResult: (unit: number, result: RunResult) => void): ThreadPool {
  const workers: Worker[] = [];
  const results: RunResult[] = new Array(units.length);
  let next = 0;
  let done = 0;
  const promise = new Promise<RunResult[]>((resolve, reject) => {
    if (units.length === 0) return resolve(results);
    const feed = (w: Worker) => {
      if (next >= units.length) return;
      const msg: JobMessage = { unit: next, runIndex: units[next].runIndex };
      next++;
      w.postMessage(msg);
    };
    for (let k = 0; k < Math.min(threads, units.length); k++) {
      const w = new Worker(workerFile, { workerData: job });
      workers.push(w);
      w.on('message', (msg: ResultMessage) => {
        results[msg.unit] = msg.result;
        onResult(msg.unit, msg.result);
        done++;
        if (done === units.length) {
          void Promise.all(workers.map((x) => x.terminate())).then(() => resolve(results));
        } else feed(w);
      });
      w.on('error', (e) => reject(e));
      feed(w);
    }
  });
  return {
    results: promise,
    async stop() {
      await Promise.all(workers.map((w) => w.terminate()));
    },
  };
}
