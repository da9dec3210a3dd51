import {
  buildOptimizer, cellStart, coarseToFineOrder, drawStarts, hasParameterGroups, lossBands, RunCursor, validateMultiStart, validateStartMap,
  type Optimizer, type RunOutcome, type RunSettings, type StudySpec, type Surface,
} from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromWorker, StudyCells } from '../protocol';
import { errorText } from './runs';
import { SLICE_MS, type Timing } from './scheduler';

interface StudyJob {
  requestId: string;
  surface: Surface;
  optimizer: Optimizer;
  /** The cells in the order they are run. */
  order: Int32Array;
  settingsOf: (index: number) => RunSettings;
  /** Loss curves of every run (multi-start studies), for the quantile bands. */
  curves: Float64Array[] | null;
  next: number;
  current: { index: number; cursor: RunCursor; loss: number[] | null } | null;
  startedAt: number;
  pending: { index: number; outcome: RunOutcome; steps: number; loss: number; end: Float64Array }[];
}

/** Steps per advance call inside a cell, so a long run still yields between slices. */
const CHUNK = 2000;

/**
 * Runs a study: one ordinary RunCursor per cell (a start of a start-point map or of a multi-start
 * study), so every cell's end point and outcome are exactly those of the same run done alone; cells
 * of a map in coarse-to-fine order; in time slices, posting the cells finished in each slice with
 * the progress. One study at a time: a new one supersedes the one in progress; cancel drops it
 * between slices.
 */
export class StudyRunner {
  private job: StudyJob | null = null;

  constructor(
    private readonly post: (msg: FromWorker) => void,
    private readonly timing: Timing,
  ) {}

  start(requestId: string, surfaceSpec: SurfaceSpec, spec: StudySpec): void {
    try {
      const surface = buildSurface(surfaceSpec);
      const started = !this.job;
      this.job = { requestId, surface, optimizer: buildOptimizer(spec.optimizer), ...plan(spec, surface), next: 0, current: null, startedAt: this.timing.now(), pending: [] };
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
    try {
      while (this.timing.now() < deadline && (job.current || job.next < job.order.length)) {
        if (!job.current) {
          const index = job.order[job.next++];
          job.current = { index, cursor: new RunCursor(job.surface, job.optimizer, job.settingsOf(index)), loss: job.curves ? [] : null };
        }
        const { index, cursor, loss } = job.current;
        if (!cursor.outcome) {
          const batch = cursor.advance(CHUNK);
          if (loss) for (let k = 0; k < batch.count; k++) loss.push(batch.loss[k]);
        }
        if (cursor.outcome) {
          if (job.curves && loss) job.curves[index] = Float64Array.from(loss);
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
      const bands = job.curves ? lossBands(job.curves, [0.25, 0.5, 0.75]).bands : undefined;
      this.post({ type: 'study/done', requestId: job.requestId, elapsedMs: this.timing.now() - job.startedAt, bands });
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

/** The cells of a study: their order, each cell's run settings, whether loss curves are kept. */
function plan(spec: StudySpec, surface: Surface): Pick<StudyJob, 'order' | 'settingsOf' | 'curves'> {
  const n = surface.dimension;
  if (spec.kind === 'start-map') {
    validateStartMap(spec, n);
    const start = new Float64Array(n);
    return { order: coarseToFineOrder(spec.resolution, spec.resolution), settingsOf: (index) => ({ start: Array.from(cellStart(spec, index, start)), seed: spec.seed, stop: spec.stop }), curves: null };
  }
  validateMultiStart(spec);
  const starts = drawStarts(spec.distribution, n, spec.count, spec.startSeed, hasParameterGroups(surface) ? surface.parameterGroups : undefined);
  return {
    order: Int32Array.from({ length: spec.count }, (_, k) => k),
    settingsOf: (index) => ({ start: Array.from(starts.subarray(index * n, (index + 1) * n)), seed: spec.seed, stop: spec.stop }),
    curves: new Array(spec.count),
  };
}
