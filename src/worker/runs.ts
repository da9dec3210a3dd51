import { buildOptimizer, RunCursor, SettingError } from '../engine';
import { buildSurface } from '../problems';
import type { FromWorker, Pace, RunControl, RunSpec } from '../protocol';
import { PACED_INTERVAL_MS, SLICE_MS, type Timing } from './scheduler';

interface ActiveRun {
  cursor: RunCursor;
  paused: boolean;
  /** Steps owed to this run by the pace but not yet taken (fractional). */
  credit: number;
  /** Measured throughput, used to size flat-out batches. */
  stepsPerMs: number;
}

/** Upper bound on the steps in one flat-out batch. */
const MAX_CHUNK = 200_000;

/**
 * The runs one worker is advancing. Each slice gives every unpaused run its share of steps (set by the
 * pace) and posts one batch per run that moved; finished runs are dropped after their last batch.
 */
export class RunPool {
  private readonly runs = new Map<string, ActiveRun>();
  private pace: Pace = 1000;
  private lastSlice = 0;
  private sliceQueued = false;

  constructor(
    private readonly post: (msg: FromWorker) => void,
    private readonly timing: Timing,
  ) {}

  start(runId: string, spec: RunSpec, paused = false): void {
    let cursor: RunCursor;
    try {
      const surface = buildSurface(spec.surface);
      cursor = new RunCursor(surface, buildOptimizer(spec.optimizer), spec.settings);
    } catch (e) {
      this.post({ type: 'run/error', runId, message: errorText(e), field: e instanceof SettingError ? e.field : undefined });
      return;
    }
    this.runs.set(runId, { cursor, paused, credit: 0, stepsPerMs: 10 });
    // Step 0 (the start point) goes out at once so the page can draw the start marker.
    this.emit(runId, this.runs.get(runId)!, 0);
    this.wake();
  }

  control(runId: string, action: RunControl): void {
    const run = this.runs.get(runId);
    if (!run) return;
    switch (action) {
      case 'pause':
        run.paused = true;
        this.emit(runId, run, 0);
        break;
      case 'resume':
        run.paused = false;
        run.credit = 0;
        this.wake();
        break;
      case 'step':
        run.paused = true;
        this.emit(runId, run, 1);
        break;
      case 'cancel': {
        run.cursor.cancel();
        this.emit(runId, run, 0);
        break;
      }
    }
  }

  setPace(pace: Pace): void {
    this.pace = pace;
    for (const run of this.runs.values()) run.credit = 0;
  }

  get activeCount(): number {
    return this.runs.size;
  }

  private wake(): void {
    if (this.sliceQueued) return;
    this.sliceQueued = true;
    this.lastSlice = this.timing.now();
    this.timing.later(() => this.slice(), 0);
  }

  private slice(): void {
    this.sliceQueued = false;
    const moving = [...this.runs.entries()].filter(([, r]) => !r.paused);
    if (moving.length === 0) return;
    const now = this.timing.now();
    if (this.pace === 'max') {
      // Flat out: split the slice's time between the moving runs, sized by each run's measured speed,
      // so each posts one batch per slice however cheap or costly its steps are.
      const share = SLICE_MS / moving.length;
      for (const [id, run] of moving) {
        const steps = Math.max(1, Math.min(MAX_CHUNK, Math.floor(run.stepsPerMs * share)));
        const t0 = this.timing.now();
        this.emit(id, run, steps);
        const took = this.timing.now() - t0;
        if (took > 0) run.stepsPerMs = 0.5 * run.stepsPerMs + 0.5 * (steps / took);
        else run.stepsPerMs *= 2;
      }
    } else {
      const dt = Math.min(now - this.lastSlice, 250);
      for (const [id, run] of moving) {
        run.credit += (this.pace * dt) / 1000;
        const n = Math.floor(run.credit);
        if (n > 0) {
          run.credit -= n;
          this.emit(id, run, n);
        }
      }
    }
    this.lastSlice = now;
    if ([...this.runs.values()].some((r) => !r.paused)) {
      this.sliceQueued = true;
      this.timing.later(() => this.slice(), this.pace === 'max' ? 0 : PACED_INTERVAL_MS);
    }
  }

  /** Advances a run by up to `steps` and posts what it recorded; drops the run once it has ended. */
  private emit(runId: string, run: ActiveRun, steps: number): void {
    let batch;
    try {
      batch = run.cursor.advance(steps);
    } catch (e) {
      this.runs.delete(runId);
      this.post({ type: 'run/error', runId, message: `step ${run.cursor.state.t}: ${errorText(e)}` });
      return;
    }
    if (batch.count === 0 && !batch.outcome && steps > 0) return;
    if (batch.outcome) this.runs.delete(runId);
    // Copied, not transferred: once any ArrayBuffer has been detached in a V8 isolate, every typed-array
    // access in it pays for a detach check, which slows the stepping loops (measured with the grid pool).
    this.post({ type: 'run/batch', runId, batch, evaluations: run.cursor.state.evaluations, paused: run.paused });
  }
}

export function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
