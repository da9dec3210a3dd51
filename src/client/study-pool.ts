import type { StudySpec, ToleranceTarget } from '../engine';
import type { SurfaceSpec } from '../problems';
import type { EngineLink, FromPoolMember, FromWorker, RunOutcome, ToWorker } from '../protocol';
import type { WorkerLike } from './grid-pool';

// The page's side of studies on several workers: runs on the page, the members run src/worker/studies.ts.

interface StudyJob {
  requestId: string;
  surface: SurfaceSpec;
  spec: StudySpec;
  /** Cells in the whole study. */
  total: number;
  /** Cells reported so far, over every part. */
  done: number;
  parts: number;
  partsDone: number;
  /** By cell: outcomes (the learning-rate sweep's thresholds need them all) and multi-start loss curves. */
  outcomes: RunOutcome[];
  curves: Float64Array[];
  /** Sent 'study/finish' to a member: its 'study/done' ends the study. */
  finishing: boolean;
  startedAt: number;
}

/** Cells in a study: a map's resolution^2, a sweep's rates per optimizer, a multi-start's starts. */
export function studyCellCount(spec: StudySpec): number {
  return spec.kind === 'start-map' ? spec.resolution * spec.resolution : spec.kind === 'lr-sweep' ? spec.count * spec.optimizers.length : spec.count;
}

/**
 * Studies split across the page's pool workers, behind the same link the study store would give one
 * worker. A 'study/start' goes to every member as part k of P (StudyPart: of every wave of runs the
 * band splitBands(length, P)[k], so each starts on its share of a map's coarse grid); cells stream back
 * from every member and are passed on as they come, with the progress summed over the parts and the
 * time measured here. When every part is done, a map is done; a multi-start or a learning-rate sweep
 * sends the merged curves or outcomes (by cell index, the plan's order) to one member as
 * 'study/finish', whose answer carries the bands or thresholds. Each run is the run one worker would
 * make (the sweep engine's runs do not depend on which others share a sweep), so the cells, bands and
 * thresholds equal a single worker's exactly (test/client/study-pool.test.ts). 'study/cancel' goes to
 * every member; late messages of a superseded or cancelled study are dropped by request id. One-off
 * analysis requests (sharpness, critical points) go to the members in turn.
 */
export class StudyPool implements EngineLink {
  private job: StudyJob | null = null;
  private readonly listeners: ((msg: FromWorker) => void)[] = [];
  /** Request ids of one-off analysis requests whose answers are passed on. */
  private readonly asked = new Set<string>();
  private nextMember = 0;
  private readonly alive: boolean[];

  constructor(
    private readonly members: readonly WorkerLike[],
    private readonly clock: () => number = () => performance.now(),
  ) {
    if (members.length === 0) throw new Error('study pool: needs at least one worker');
    this.alive = members.map(() => true);
    members.forEach((m, k) =>
      m.listen(
        (msg) => this.onMessage(k, msg),
        (message) => this.onFailure(k, message),
      ),
    );
  }

  listen(handler: (msg: FromWorker) => void): void {
    this.listeners.push(handler);
  }

  send(msg: ToWorker): void {
    switch (msg.type) {
      case 'study/start':
        return this.start(msg.requestId, msg.surface, msg.study, msg.target);
      case 'study/cancel':
        if (this.job?.requestId === msg.requestId) this.drop(this.job);
        return;
      default:
        if ('requestId' in msg) this.asked.add(msg.requestId);
        this.liveMember(this.nextMember++)?.postMessage(msg);
    }
  }

  private start(requestId: string, surface: SurfaceSpec, spec: StudySpec, target: ToleranceTarget | null): void {
    if (this.job) this.drop(this.job);
    const live = this.members.filter((_, k) => this.alive[k]);
    if (live.length === 0) return this.emit({ type: 'study/error', requestId, message: 'study pool: every worker has failed' });
    const total = studyCellCount(spec);
    this.job = { requestId, surface, spec, total, done: 0, parts: live.length, partsDone: 0, outcomes: new Array(total), curves: new Array(total), finishing: false, startedAt: this.clock() };
    live.forEach((m, index) => m.postMessage({ type: 'study/start', requestId, surface, study: spec, target, part: { index, count: live.length } }));
  }

  private drop(job: StudyJob): void {
    this.job = null;
    this.members.forEach((m, k) => this.alive[k] && m.postMessage({ type: 'study/cancel', requestId: job.requestId }));
  }

  private onMessage(member: number, msg: FromPoolMember | FromWorker): void {
    if (msg.type === 'sharpness/result' || msg.type === 'critical/result' || msg.type === 'analysis/error') {
      if (this.asked.delete(msg.requestId)) this.emit(msg);
      return;
    }
    const job = this.job;
    if (!job || !(msg.type === 'study/cells' || msg.type === 'study/done' || msg.type === 'study/error') || msg.requestId !== job.requestId) return;
    const elapsedMs = this.clock() - job.startedAt;
    switch (msg.type) {
      case 'study/cells': {
        const { cells } = msg;
        cells.indices.forEach((index, k) => (job.outcomes[index] = cells.outcomes[k]));
        job.done += cells.indices.length;
        // Every part's last slice reports, often with no cells; the store needs only the real ones.
        if (cells.indices.length > 0) this.emit({ type: 'study/cells', requestId: job.requestId, cells, done: job.done, total: job.total, elapsedMs });
        return;
      }
      case 'study/error':
        this.drop(job);
        return this.emit(msg);
      case 'study/done':
        if (job.finishing) {
          this.job = null;
          return this.emit({ ...msg, elapsedMs });
        }
        msg.curveIndices?.forEach((index, k) => (job.curves[index] = msg.curves![k]));
        if (++job.partsDone < job.parts) return;
        if (job.spec.kind === 'start-map') {
          this.job = null;
          return this.emit({ type: 'study/done', requestId: job.requestId, elapsedMs });
        }
        job.finishing = true;
        this.liveMember(member)?.postMessage({ type: 'study/finish', requestId: job.requestId, surface: job.surface, study: job.spec, outcomes: job.outcomes, curves: job.spec.kind === 'multi-start' ? job.curves : [] });
    }
  }

  private onFailure(member: number, message: string): void {
    if (!this.alive[member]) return;
    this.alive[member] = false;
    const job = this.job;
    if (!job) return;
    this.drop(job);
    this.emit({ type: 'study/error', requestId: job.requestId, message: `a study worker stopped (${message}); start the study again` });
  }

  /** The first live member from position k on (round robin), or null when none is left. */
  private liveMember(k: number): WorkerLike | null {
    for (let d = 0; d < this.members.length; d++) {
      const q = (k + d) % this.members.length;
      if (this.alive[q]) return this.members[q];
    }
    return null;
  }

  private emit(msg: FromWorker): void {
    for (const l of this.listeners) l(msg);
  }
}
