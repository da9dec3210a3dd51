import {
  buildOptimizer, cellPlans, coarseToFineOrder, drawStarts, hasParameterGroups, lossBands, RunCursor, splitBands, stepOfRow, Sweep, sweepThresholds, validateMultiStart,
  type LearningRateSweepSpec, type MultiStartSpec, type RunOutcome, type StartMapSpec, type StudySpec, type Surface, type SweepPlan, type ToleranceTarget,
} from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromWorker, StudyCells, StudyPart } from '../protocol';
import { errorText } from './runs';
import { SLICE_MS, type Timing } from './scheduler';

interface CellResult {
  index: number;
  outcome: RunOutcome;
  steps: number;
  loss: number;
  end: Float64Array;
  /** First step within the study's tolerance target, -1 if never or not measured. */
  toTolerance: number;
}

/** A study's work, taken in time slices: each call runs until `deadline` and returns the cells that ended. */
interface StudyWork {
  readonly total: number;
  readonly finished: boolean;
  run(deadline: number, now: () => number): CellResult[];
  /**
   * What goes out with the last message: for a whole study its bands or thresholds (finishStudy); for
   * a part, a multi-start's loss curves (the page merges the parts and asks for 'study/finish').
   */
  finish(): StudyEnd;
}

type StudyEnd = Pick<Extract<FromWorker, { type: 'study/done' }>, 'bands' | 'thresholds' | 'curveIndices' | 'curves'>;

/** The whole study, as one part. */
const WHOLE: StudyPart = { index: 0, count: 1 };

/** Part `part.index` of the `length` runs of one wave: its band of splitBands (empty past the last band). */
function bandOf(length: number, part: StudyPart): { lo: number; hi: number } {
  return splitBands(length, part.count)[part.index] ?? { lo: length, hi: length };
}

function validatePart(part: StudyPart): void {
  if (!(Number.isInteger(part.count) && part.count >= 1 && Number.isInteger(part.index) && part.index >= 0 && part.index < part.count))
    throw new Error(`study part: index must be a whole number in [0, count), got ${part.index} of ${part.count}`);
}

/**
 * Most cells in one message to the page. Reading a message (its outcomes are objects) is a task on the
 * page; with several pool workers sending at once, 1024-cell messages made tasks near 100 ms on a busy
 * machine and held a click on Cancel behind them (e2e/study-performance.spec.ts).
 */
const CELLS_PER_MESSAGE = 256;

interface StudyJob {
  requestId: string;
  work: StudyWork;
  done: number;
  startedAt: number;
}

/**
 * Runs studies in the worker, one at a time (a new one supersedes the one in progress; cancel drops it
 * between slices), whole or one part of one (StudyPart: the page's study pool gives each worker the
 * same share of every wave, and ends the study with 'study/finish' once every part is in). Start-point maps and learning-rate sweeps run on the lockstep sweep engine
 * (engine/sweep, each run bit-identical to the same RunCursor run); a map runs in waves, the coarse
 * grid of its coarse-to-fine order first, so a full blocky picture shows early. Multi-start studies
 * run one RunCursor per start, which also records each run's loss curve for the quantile bands.
 */
export class StudyRunner {
  private job: StudyJob | null = null;

  constructor(
    private readonly post: (msg: FromWorker) => void,
    private readonly timing: Timing,
  ) {}

  start(requestId: string, surfaceSpec: SurfaceSpec, spec: StudySpec, target: ToleranceTarget | null, part?: StudyPart): void {
    try {
      if (part) validatePart(part);
      const surface = buildSurface(surfaceSpec);
      const started = !this.job;
      this.job = { requestId, work: planWork(spec, surface, target, part), done: 0, startedAt: this.timing.now() };
      if (started) this.timing.later(() => this.slice(), 0);
    } catch (e) {
      this.job = null;
      this.post({ type: 'study/error', requestId, message: errorText(e) });
    }
  }

  cancel(requestId: string): void {
    if (this.job?.requestId === requestId) this.job = null;
  }

  private slice(): void {
    const job = this.job;
    if (!job) return;
    const now = () => this.timing.now();
    let cells: CellResult[];
    try {
      cells = job.work.run(now() + SLICE_MS, now);
    } catch (e) {
      this.job = null;
      this.post({ type: 'study/error', requestId: job.requestId, message: errorText(e) });
      return;
    }
    // In messages of at most CELLS_PER_MESSAGE cells: the page reads each message as a task of its own,
    // and a wave of a big map can end thousands of runs in one slice.
    for (let from = 0; from < cells.length || from === 0; from += CELLS_PER_MESSAGE) {
      const part = cells.slice(from, from + CELLS_PER_MESSAGE);
      job.done += part.length;
      this.post({ type: 'study/cells', requestId: job.requestId, cells: pack(part), done: job.done, total: job.work.total, elapsedMs: now() - job.startedAt });
      if (cells.length === 0) break;
    }
    if (this.job !== job) return this.job ? this.timing.later(() => this.slice(), 0) : undefined;
    if (job.work.finished) {
      let extra: ReturnType<StudyWork['finish']>;
      try {
        extra = job.work.finish();
      } catch (e) {
        this.job = null;
        this.post({ type: 'study/error', requestId: job.requestId, message: errorText(e) });
        return;
      }
      this.post({ type: 'study/done', requestId: job.requestId, elapsedMs: now() - job.startedAt, ...extra });
      this.job = null;
      return;
    }
    this.timing.later(() => this.slice(), 0);
  }
}

function pack(cells: CellResult[]): StudyCells {
  const n = cells.length ? cells[0].end.length : 0;
  const endPoints = new Float64Array(cells.length * n);
  cells.forEach((c, k) => endPoints.set(c.end, k * n));
  return {
    indices: Int32Array.from(cells, (c) => c.index),
    steps: Int32Array.from(cells, (c) => c.steps),
    loss: Float64Array.from(cells, (c) => c.loss),
    endPoints,
    stepsToTolerance: Int32Array.from(cells, (c) => c.toTolerance),
    outcomes: cells.map((c) => c.outcome),
  };
}

function planWork(spec: StudySpec, surface: Surface, target: ToleranceTarget | null, part?: StudyPart): StudyWork {
  switch (spec.kind) {
    case 'start-map':
      return startMapWork(spec, surface, target, part ?? WHOLE);
    case 'multi-start':
      return new CursorWork(spec, surface, target, part);
    case 'lr-sweep':
      return learningRateWork(spec, surface, target, part);
  }
}

/**
 * The end of a study from all its cells: a multi-start's quartile bands of the loss from every run's
 * curve (cell order), a learning-rate sweep's thresholds from every outcome (cell order); nothing for a
 * map. The same function ends a whole study and one merged from parts, so the two agree exactly.
 */
export function finishStudy(spec: StudySpec, surface: Surface, outcomes: readonly (RunOutcome | undefined)[], curves: Float64Array[]): StudyEnd {
  if (spec.kind === 'multi-start') return { bands: lossBands(curves, [0.25, 0.5, 0.75]).bands };
  if (spec.kind === 'lr-sweep') return { thresholds: sweepThresholds(spec, surface, outcomes) };
  return {};
}

/** 'study/finish': ends a study run in parts (the page's study pool) from the merged cells; the pool times the study. */
export function finishStudyParts(post: (msg: FromWorker) => void, requestId: string, surfaceSpec: SurfaceSpec, spec: StudySpec, outcomes: RunOutcome[], curves: Float64Array[]): void {
  try {
    post({ type: 'study/done', requestId, elapsedMs: 0, ...finishStudy(spec, buildSurface(surfaceSpec), outcomes, curves) });
  } catch (e) {
    post({ type: 'study/error', requestId, message: errorText(e) });
  }
}

/** One wave: a sweep of one optimizer over some cells. */
interface Wave {
  indices: Int32Array;
  plan: SweepPlan;
}

/** Waves run one after another on the sweep engine; a cell is reported when its run ends. */
class SweepWork implements StudyWork {
  private wave = -1;
  private sweep: Sweep | null = null;
  private reported: Uint8Array = new Uint8Array(0);
  readonly total: number;

  constructor(
    private readonly waves: Wave[],
    private readonly onFinish: () => StudyEnd = () => ({}),
  ) {
    this.total = waves.reduce((s, w) => s + w.indices.length, 0);
  }

  get finished(): boolean {
    return this.wave >= this.waves.length - 1 && (!this.sweep || this.sweep.finished);
  }

  run(deadline: number, now: () => number): CellResult[] {
    const out: CellResult[] = [];
    while (now() < deadline) {
      if (!this.sweep || this.sweep.finished) {
        if (this.wave >= this.waves.length - 1) break;
        const w = this.waves[++this.wave];
        this.sweep = new Sweep(w.plan);
        this.reported = new Uint8Array(w.indices.length);
      }
      this.sweep.advanceFor(Math.max(1, deadline - now()), now);
      const r = this.sweep.result();
      const w = this.waves[this.wave];
      const n = r.dimension;
      for (let k = 0; k < r.count; k++) {
        const outcome = r.outcomes[k];
        if (!outcome || this.reported[k]) continue;
        this.reported[k] = 1;
        out.push({ index: w.indices[k], outcome, steps: r.steps[k], loss: r.losses[k], end: r.endPoints.slice(k * n, (k + 1) * n), toTolerance: r.stepsToTolerance[k] });
      }
      if (now() >= deadline) break;
    }
    return out;
  }

  finish() {
    return this.onFinish();
  }
}

/** A map's cells in coarse-to-fine order, cut into waves at the full grids of stride 8, 4, 2 and 1 (of each, the part's band). */
function startMapWork(spec: StartMapSpec, surface: Surface, target: ToleranceTarget | null, part: StudyPart): StudyWork {
  const r = spec.resolution;
  const order = coarseToFineOrder(r, r);
  const cuts = [8, 4, 2, 1].map((s) => Math.ceil(r / s) ** 2);
  const waves: Wave[] = [];
  let from = 0;
  for (const to of cuts) {
    if (to <= from) continue;
    const band = bandOf(to - from, part);
    const indices = order.slice(from + band.lo, from + band.hi);
    from = to;
    if (indices.length === 0) continue;
    waves.push(...cellPlans(spec, surface, indices, target));
  }
  return new SweepWork(waves);
}

/**
 * Each optimizer at every rate (of a part: its band of the rates), one wave per optimizer. A whole
 * sweep ends with the thresholds (sweepThresholds); a part leaves them to 'study/finish'.
 */
function learningRateWork(spec: LearningRateSweepSpec, surface: Surface, target: ToleranceTarget | null, part?: StudyPart): StudyWork {
  const { lo, hi } = bandOf(spec.count, part ?? WHOLE);
  // Of every optimizer, the part's band of the rates (cell q count + k), one wave per optimizer (cellPlans).
  const cells = Int32Array.from({ length: spec.optimizers.length * (hi - lo) }, (_, j) => Math.floor(j / (hi - lo)) * spec.count + lo + (j % (hi - lo)));
  const waves: Wave[] = cells.length ? cellPlans(spec, surface, cells, target) : (cellPlans(spec, surface, [], target), []);
  const outcomes: (RunOutcome | undefined)[] = [];
  const work = new SweepWork(waves, () => (part ? {} : { thresholds: sweepThresholds(spec, surface, outcomes) }));
  const run = work.run.bind(work);
  work.run = (deadline, now) => {
    const cells = run(deadline, now);
    for (const c of cells) outcomes[c.index] = c.outcome;
    return cells;
  };
  return work;
}

/**
 * One RunCursor per start (multi-start; of a part, its band of the starts), keeping each run's loss
 * curve for the quantile bands, and its first step within the tolerance target as the run summary
 * finds it (io/run-summary.ts: loss - value <= tolerance, the row's step).
 */
class CursorWork implements StudyWork {
  readonly total: number;
  private next: number;
  private readonly end: number;
  private current: { index: number; cursor: RunCursor; loss: number[]; toTolerance: number } | null = null;
  private readonly curves: Float64Array[];
  private readonly starts: Float64Array;
  private readonly optimizer;

  constructor(
    private readonly spec: MultiStartSpec,
    private readonly surface: Surface,
    private readonly target: ToleranceTarget | null,
    private readonly part?: StudyPart,
  ) {
    validateMultiStart(spec);
    const { lo, hi } = bandOf(spec.count, part ?? WHOLE);
    [this.next, this.end] = [lo, hi];
    this.total = hi - lo;
    this.curves = new Array(spec.count);
    this.starts = drawStarts(spec.distribution, surface.dimension, spec.count, spec.startSeed, hasParameterGroups(surface) ? surface.parameterGroups : undefined);
    this.optimizer = buildOptimizer(spec.optimizer);
  }

  get finished(): boolean {
    return this.next >= this.end && !this.current;
  }

  run(deadline: number, now: () => number): CellResult[] {
    const n = this.surface.dimension;
    const out: CellResult[] = [];
    while (now() < deadline && !this.finished) {
      if (!this.current) {
        const index = this.next++;
        const settings = { start: Array.from(this.starts.subarray(index * n, (index + 1) * n)), seed: this.spec.seed, stop: this.spec.stop };
        this.current = { index, cursor: new RunCursor(this.surface, this.optimizer, settings), loss: [], toTolerance: -1 };
      }
      const current = this.current;
      const { index, cursor, loss } = current;
      const batch = cursor.advance(2000);
      const target = this.target;
      for (let k = 0; k < batch.count; k++) {
        loss.push(batch.loss[k]);
        if (target && current.toTolerance < 0 && batch.loss[k] - target.value <= target.tolerance) current.toTolerance = stepOfRow(batch, k);
      }
      if (cursor.outcome) {
        this.curves[index] = Float64Array.from(loss);
        out.push({ index, outcome: cursor.outcome, steps: cursor.state.t, loss: cursor.state.loss, end: Float64Array.from(cursor.state.x), toTolerance: current.toTolerance });
        this.current = null;
      }
      if (now() >= deadline) break;
    }
    return out;
  }

  finish(): StudyEnd {
    if (!this.part) return finishStudy(this.spec, this.surface, [], this.curves);
    const lo = this.end - this.total;
    return { curveIndices: Int32Array.from({ length: this.total }, (_, k) => lo + k), curves: this.curves.slice(lo, this.end) };
  }
}
