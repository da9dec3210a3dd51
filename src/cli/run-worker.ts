/** A worker thread of `fall run`: runs the tasks it is sent (a run, or cells of a study) and posts each result back. */
import { parentPort, workerData } from 'node:worker_threads';
import { runStudyCells, type Surface } from '../engine';
import { buildSurface } from '../problems';
import { runOne } from './run-one';
import type { JobMessage, ResultMessage, ThreadJob } from './thread-messages';

const job = workerData as ThreadJob;
let surface: Surface | null = null;

parentPort!.on('message', (msg: JobMessage) => {
  const task = msg.task;
  if (task.kind === 'run') {
    const result = runOne(job.surface, job.runs[task.runIndex], job.minima, job.tolerance);
    const t = result.trajectory;
    const reply: ResultMessage = { unit: msg.unit, result: { kind: 'run', result } };
    parentPort!.postMessage(reply, [t.points.buffer, t.loss.buffer, t.gradNorm.buffer, t.learningRate.buffer] as ArrayBuffer[]);
    return;
  }
  surface ??= buildSurface(job.surface);
  const cells = runStudyCells(job.studies[task.study], surface, task.cells, job.target);
  const reply: ResultMessage = { unit: msg.unit, result: { kind: 'cells', cells } };
  parentPort!.postMessage(reply, [cells.indices.buffer, cells.steps.buffer, cells.loss.buffer, cells.endPoints.buffer, cells.stepsToTolerance.buffer] as ArrayBuffer[]);
});
