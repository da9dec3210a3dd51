/**
 * Runs tasks (runs, cells of studies) on Node worker threads, at most one task per thread at a time,
 * and hands each result back as it arrives. `stop()` terminates the threads (Ctrl-C).
 */
import { Worker } from 'node:worker_threads';
import type { JobMessage, ResultMessage, Task, TaskResult, ThreadJob } from './thread-messages';

export interface ThreadPool {
  results: Promise<TaskResult[]>;
  stop(): Promise<void>;
}

export function runOnThreads(workerFile: URL, job: ThreadJob, tasks: readonly Task[], threads: number, onResult: (unit: number, result: TaskResult) => void): ThreadPool {
  const workers: Worker[] = [];
  const results: TaskResult[] = new Array(tasks.length);
  let next = 0;
  let done = 0;
  const promise = new Promise<TaskResult[]>((resolve, reject) => {
    if (tasks.length === 0) return resolve(results);
    const feed = (w: Worker) => {
      if (next >= tasks.length) return;
      const msg: JobMessage = { unit: next, task: tasks[next] };
      next++;
      w.postMessage(msg);
    };
    for (let k = 0; k < Math.min(threads, tasks.length); k++) {
      const w = new Worker(workerFile, { workerData: job });
      workers.push(w);
      w.on('message', (msg: ResultMessage) => {
        results[msg.unit] = msg.result;
        onResult(msg.unit, msg.result);
        done++;
        if (done === tasks.length) {
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
