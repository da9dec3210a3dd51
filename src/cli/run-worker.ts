/** A worker thread of `fall run`: runs the units it is sent and posts each result back. */
import { parentPort, workerData } from 'node:worker_threads';
import { runOne } from './run-one';
import type { JobMessage, ThreadJob, ResultMessage } from './thread-messages';

const job = workerData as ThreadJob;

parentPort!.on('message', (msg: JobMessage) => {
  const run = job.runs[msg.runIndex];
  const result = runOne(job.surface, run, job.minima, job.tolerance);
  const t = result.trajectory;
  const reply: ResultMessage = { unit: msg.unit, result };
  parentPort!.postMessage(reply, [t.points.buffer, t.loss.buffer, t.gradNorm.buffer, t.learningRate.buffer] as ArrayBuffer[]);
});
