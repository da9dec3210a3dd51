import type { TrajectoryBatch } from '../engine';
import type { FromWorker, RunControl, RunSpec } from '../protocol';
import type { EngineLink } from './engine-link';
import { freshId } from './ids';
import { emptySummary, resummarise, updateSummary, type ReferenceMinimum, type RunSummary } from './run-summary';
import { TrajectoryBuffer, upfrontCapacity } from './trajectory-buffer';

export type RunPhase = 'running' | 'paused' | 'ended' | 'error';

/** What React shows about a run: small, replaced at most once per animation frame. */
export interface RunStatus {
  phase: RunPhase;
  summary: RunSummary;
  evaluations: number;
  error: { message: string; field?: string } | null;
}

interface Live {
  runId: string;
  buffer: TrajectoryBuffer;
  status: RunStatus;
}

/**
 * Page-side bookkeeping of launched runs: which launch is current for each run config, the streamed
 * trajectories, and their summaries. Batches of a superseded launch are dropped. Canvas layers read the
 * buffers directly; `onFrame` hands the changed statuses to the store once per animation frame.
 */
export class LiveRuns {
  private readonly byConfig = new Map<string, Live>();
  private readonly configOfRun = new Map<string, string>();
  private dirty = new Set<string>();
  private frameQueued = false;
  /** Bumped on every change of any trajectory; canvas layers compare it to skip idle frames. */
  version = 0;
  minima: readonly ReferenceMinimum[] = [];
  tolerance = 1e-6;

  constructor(
    private readonly link: EngineLink,
    private readonly requestFrame: (fn: () => void) => void,
    /** Changed statuses by run config id; null for a run that is gone. */
    private readonly onFrame: (changed: Map<string, RunStatus | null>) => void,
  ) {}

  launch(configId: string, spec: RunSpec, paused = false): void {
    this.forget(configId, true);
    const runId = freshId('r');
    const live: Live = {
      runId,
      buffer: new TrajectoryBuffer(spec.settings.start.length, upfrontCapacity(spec.settings.start.length, spec.settings.stop.maxSteps)),
      status: { phase: paused ? 'paused' : 'running', summary: emptySummary(), evaluations: 0, error: null },
    };
    this.byConfig.set(configId, live);
    this.configOfRun.set(runId, configId);
    this.touch(configId);
    this.link.send({ type: 'run/start', runId, spec, paused });
  }

  /** Records that a run could not be launched (its settings did not validate). */
  reject(configId: string, message: string, field?: string): void {
    this.forget(configId, true);
    const status: RunStatus = { phase: 'error', summary: emptySummary(), evaluations: 0, error: { message, field } };
    this.byConfig.set(configId, { runId: '', buffer: new TrajectoryBuffer(1, 1), status });
    this.touch(configId);
  }

  control(configId: string, action: RunControl): void {
    const live = this.byConfig.get(configId);
    if (!live || live.status.phase === 'ended' || live.status.phase === 'error') return;
    this.link.send({ type: 'run/control', runId: live.runId, action });
    if (action === 'pause' || action === 'step') live.status = { ...live.status, phase: 'paused' };
    if (action === 'resume') live.status = { ...live.status, phase: 'running' };
    this.touch(configId);
  }

  /** Stops a run and drops its trajectory (the config was removed or is being relaunched). */
  forget(configId: string, silently = false): void {
    const live = this.byConfig.get(configId);
    if (!live) return;
    if (live.status.phase === 'running' || live.status.phase === 'paused')
      this.link.send({ type: 'run/control', runId: live.runId, action: 'cancel' });
    this.configOfRun.delete(live.runId);
    this.byConfig.delete(configId);
    if (!silently) this.touch(configId);
  }

  trajectory(configId: string): TrajectoryBuffer | undefined {
    return this.byConfig.get(configId)?.buffer;
  }

  status(configId: string): RunStatus | undefined {
    return this.byConfig.get(configId)?.status;
  }

  /** New reference minima or tolerance: summaries are recomputed from the stored trajectories. */
  setReference(minima: readonly ReferenceMinimum[], tolerance: number): void {
    this.minima = minima;
    this.tolerance = tolerance;
    for (const [configId, live] of this.byConfig) {
      live.status = { ...live.status, summary: resummarise(live.status.summary, live.buffer.asBatch(), minima, tolerance) };
      this.touch(configId);
    }
  }

  /** The worker was replaced: every run it was stepping ends with `message` (their trajectories stay). */
  workerLost(message: string): void {
    for (const [configId, live] of this.byConfig) {
      if (live.status.phase !== 'running' && live.status.phase !== 'paused') continue;
      live.status = { ...live.status, phase: 'error', error: { message } };
      this.configOfRun.delete(live.runId);
      this.touch(configId);
    }
  }

  handle(msg: FromWorker): void {
    if (msg.type !== 'run/batch' && msg.type !== 'run/error') return;
    const configId = this.configOfRun.get(msg.runId);
    if (configId === undefined) return; // a superseded launch
    const live = this.byConfig.get(configId)!;
    if (msg.type === 'run/error') {
      live.status = { ...live.status, phase: 'error', error: { message: msg.message, field: msg.field } };
      this.configOfRun.delete(msg.runId);
    } else {
      this.absorb(live, msg.batch, msg.evaluations, msg.paused);
      if (msg.batch.outcome) this.configOfRun.delete(msg.runId);
    }
    this.touch(configId);
  }

  private absorb(live: Live, batch: TrajectoryBatch, evaluations: number, paused: boolean): void {
    live.buffer.append(batch);
    const summary = updateSummary(live.status.summary, batch, this.minima, this.tolerance);
    const phase: RunPhase = batch.outcome ? 'ended' : paused ? 'paused' : 'running';
    live.status = { ...live.status, summary, evaluations, phase };
  }

  private touch(configId: string): void {
    this.version += 1;
    this.dirty.add(configId);
    if (this.frameQueued) return;
    this.frameQueued = true;
    this.requestFrame(() => {
      this.frameQueued = false;
      const changed = new Map<string, RunStatus | null>();
      for (const id of this.dirty) changed.set(id, this.byConfig.get(id)?.status ?? null);
      this.dirty = new Set();
      this.onFrame(changed);
    });
  }
}
