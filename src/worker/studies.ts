import { buildOptimizer, cellStart, coarseToFineOrder, RunCursor, validateStartMap, type Optimizer, type RunOutcome, type StartMapSpec, type Surface } from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromWorker, StudyCells } from '../protocol';
import { errorText } from './runs';
import { SLICE_MS, type Timing } from './scheduler';

interface StudyJob {
  requestId: string;
  spec: StartMapSpec;
  surface: Surface;
  optimizer: Optimizer;
  order: Int32Array;
  /** Position in `order` of the next cell to start. */
  next: number;
  /** The cell being worked on when a slice ran out in the middle of a long run. */
  current: { index: number; cursor: RunCursor } | null;
  startedAt: number;
  pending: { index: number; outcome: RunOutcome; steps: number; loss: number; end: Float64Array }[];
}

/** Steps per advance call inside a cell, so a long run still yields between slices. */
const CHUNK = 2000;

/**
 * Runs a start-point map: one ordinary RunCursor per cell (so every cell's end point and outcome are
 * exactly those of the same run done alone), cells in coarse-to-fine order, in time slices; after each
 * slice the finished cells go out in one message with the progress. One study at a time: a new one
 * supersedes the one in progress; cancel drops it between slices.
 */
export class StudyRunner {
  private job: StudyJob | null = null;

  constructor(
    private readonly post: (msg: FromWorker) => void,
    private readonly timing: Timing,
  ) {}

  start(requestId: string, surfaceSpec: SurfaceSpec, spec: StartMapSpec): void {
    try {
      const surface = buildSurface(surfaceSpec);
      validateStartMap(spec, surface.dimension);
      const optimizer = buildOptimizer(spec.optimizer);
      const started = !this.job;
      const order = coarseToFineOrder(spec.resolution);
      this.job = { requestId, spec, surface, optimizer, order, next: 0, current: null, startedAt: this.timing.now(), pending: [] };
      if (started) this.timing.later(() => this.work(), 0);
    } catch (e) {
      this.job = null;
      this.post({ type: 'study/error', requestId, message: errorText(e) });
    }
  }

  cancel(requestId: string): void {
    if (this.job?.requestId === requestId) this.job = null;
  }

  private work(): void {
    const job = this.job;
    if (!job) return;
    const deadline = this.timing.now() + SLICE_MS;
    const start = new Float64Array(job.surface.dimension);
    try {
      while (this.timing.now() < deadline && (job.current || job.next < job.order.length)) {
        if (!job.current) {
          const index = job.order[job.next++];
          const settings = { start: Array.from(cellStart(job.spec, index, start)), seed: job.spec.seed, stop: job.spec.stop };
          job.current = { index, cursor: new RunCursor(job.surface, job.optimizer, settings) };
        }
        const { index, cursor } = job.current;
        if (!cursor.outcome) cursor.advance(CHUNK);
        if (cursor.outcome) {
          job.pending.push({ index, outcome: cursor.outcome, steps: cursor.state.t, loss: cursor.state.loss, end: Float64Array.from(cursor.state.x) });
          job.current = null;
        }
      }
    } catch (e) {
      this.job = null;
      this.post({ type: 'study/error', requestId: job.requestId, message: errorText(e) });
      return;
    }
    this.flush(job);
    if (this.job !== job) return this.job ? this.timing.later(() => this.work(), 0) : undefined;
    if (job.next >= job.order.length && !job.current) {
      this.post({ type: 'study/done', requestId: job.requestId, elapsedMs: this.timing.now() - job.startedAt });
      this.job = null;
      return;
    }
    this.timing.later(() => this.work(), 0);
  }

  private flush(job: StudyJob): void {
    const n = job.surface.dimension;
    const cells: StudyCells = {
      indices: Int32Array.from(job.pending, (c) => c.index),
      steps: Int32Array.from(job.pending, (c) => c.steps),
      loss: Float64Array.from(job.pending, (c) => c.loss),
      endPoints: new Float64Array(job.pending.length * n),
      outcomes: job.pending.map((c) => c.outcome),
    };
    job.pending.forEach((c, k) => cells.endPoints.set(c.end, k * n));
    job.pending = [];
    const done = job.next - (job.current ? 1 : 0);
    this.post({ type: 'study/cells', requestId: job.requestId, cells, done, total: job.order.length, elapsedMs: this.timing.now() - job.startedAt });
  }
}
