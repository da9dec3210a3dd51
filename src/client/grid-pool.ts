import { validateGridRequest, type GridRequest } from '../engine';
import type { SurfaceSpec } from '../problems';
import { GridRequestCancelled, previewSidesFor, type FromPoolMember, type FromWorker, type RowRange, type ToPoolMember, type ToWorker } from '../protocol';

// The page's side of pooled grid sampling: cuts one grid into bands for several workers and puts the
// answers back together. Runs on the page (src/client); the members run src/worker/bands.ts.
export { GridRequestCancelled };

/**
 * The least a pool needs of a worker, so the same pool code drives Web Workers in the page
 * (`webWorkerLike`) and Node worker_threads in the benchmark. Members run the normal worker handler
 * (src/worker/bands.ts answers 'band/sample' and 'band/cancel'; src/worker/handler.ts the rest, such as
 * the parts of a study sent by src/client/study-pool.ts).
 */
export interface WorkerLike {
  postMessage(msg: ToPoolMember | ToWorker): void;
  /**
   * Registers the two listeners: messages from the worker (the pool reads only band replies, so a
   * member may also be running trajectories), and failures of the worker itself.
   */
  listen(onMessage: (msg: FromPoolMember | FromWorker) => void, onFailure: (message: string) => void): void;
  terminate(): void;
}

export interface GridPoolResult {
  requestId: string;
  grid: GridRequest;
  /** nx ny values, row-major, as `sampleGrid` lays them out. */
  values: Float64Array;
  /** Finite min and max (NaN when no value is finite). */
  min: number;
  max: number;
}

export interface GridPoolRequestOptions {
  /**
   * Receives quick previews of a large grid before the full result (the sides of previewSidesFor,
   * each a band of its own; a coarser one arriving after a finer one is dropped), as the
   * single-worker 'grid/sample' with coarseFirst does.
   */
  onCoarse?: (preview: GridPoolResult) => void;
}

/** Default size cap: beyond this, message and start-up costs outweigh more parallel rows for our grids. */
export const MAX_DEFAULT_POOL_SIZE = 8;
/**
 * Band sizes by guided self-scheduling (C. D. Polychronopoulos & D. J. Kuck, "Guided self-scheduling:
 * a practical scheduling scheme for parallel supercomputers", IEEE Trans. Computers C-36, 1987): an
 * idle member gets ceil(R / p) of the R rows not yet handed out, p the live members; we give it this
 * share of that (half), so bands start large (few messages), shrink to single rows at the end (a member
 * finishing early waits for at most about one small band), and a slow first member cannot hold half
 * the grid.
 */
export const GUIDED_SHARE = 0.5;

/**
 * Bands a member holds at once: the one it is sampling and the next, already in its queue, so it never
 * idles while its finished band travels to the page and the next one comes back (a busy or collecting
 * page thread can take milliseconds to answer). With guided sizes the bands near the end are small, so
 * holding one in advance costs little balance.
 */
export const BANDS_AHEAD = 2;

/** navigator.hardwareConcurrency clamped to [1, MAX_DEFAULT_POOL_SIZE] (1 where it is unknown). */
export function defaultPoolSize(hardwareConcurrency = typeof navigator !== 'undefined' ? navigator.hardwareConcurrency : undefined): number {
  const n = Math.floor(Number(hardwareConcurrency));
  return Number.isFinite(n) ? Math.min(MAX_DEFAULT_POOL_SIZE, Math.max(1, n)) : 1;
}

interface Band {
  rows: RowRange;
  /** The side of the preview grid this band samples whole, or 0 for rows of the requested grid. */
  preview: number;
}

interface Member {
  worker: WorkerLike;
  alive: boolean;
  /** The current request's bands this member holds, in the order it works through them. */
  bands: Band[];
  /** Rows of the first of them finished, as last reported. */
  rowsDone: number;
}

interface Job {
  requestId: string;
  spec: SurfaceSpec;
  grid: GridRequest;
  values: Float64Array;
  /** The first row not yet handed out; rows below it are done, in flight or in `returned`. */
  nextRow: number;
  /** Bands handed back by failed members, handed out again first. */
  returned: Band[];
  /** Preview sides not yet handed out, coarsest first. */
  previewsPending: number[];
  /** The finest preview delivered so far (0: none). */
  previewShown: number;
  rowsDone: number;
  min: number;
  max: number;
  reported: number;
  onProgress?: (fraction: number) => void;
  onCoarse?: (preview: GridPoolResult) => void;
  resolve: (r: GridPoolResult) => void;
  reject: (e: Error) => void;
}

/**
 * Samples one grid at a time across several workers. A request is cut into bands of whole rows as
 * members ask for work (each holds up to BANDS_AHEAD), sized by guided self-scheduling (GUIDED_SHARE),
 * so faster or less loaded members take more; each band's values are copied into place, so the result is
 * exactly what one `sampleGrid` call gives. A new request supersedes the one in progress: its bands are
 * cancelled in the workers and any of its late messages are dropped by request id (ids must be fresh
 * per request). The first band error rejects the request (once) and cancels the rest. A member whose
 * worker fails is retired and its band handed to another; when none is left, the request fails.
 */
export class GridPool {
  private readonly members: Member[];
  private job: Job | null = null;
  private disposed = false;

  constructor(factory: (index: number) => WorkerLike, size = defaultPoolSize()) {
    if (!Number.isInteger(size) || size < 1) throw new Error(`grid pool: size must be a whole number of at least 1, got ${size}`);
    this.members = Array.from({ length: size }, (_, index) => {
      const member: Member = { worker: factory(index), alive: true, bands: [], rowsDone: 0 };
      member.worker.listen(
        (msg) => this.onMessage(member, msg),
        (message) => this.onFailure(member, message),
      );
      return member;
    });
  }

  get size(): number {
    return this.members.length;
  }

  /** Members whose worker has not failed. */
  get aliveCount(): number {
    return this.members.filter((m) => m.alive).length;
  }

  /**
   * Samples `grid` of the surface `spec` names. Resolves with the whole grid; rejects with the first
   * error a band reports, or with GridRequestCancelled when superseded, cancelled or disposed.
   * `onProgress` gets the finished share of rows, non-decreasing, ending at exactly 1.
   */
  request(
    requestId: string,
    spec: SurfaceSpec,
    grid: GridRequest,
    onProgress?: (fraction: number) => void,
    options: GridPoolRequestOptions = {},
  ): Promise<GridPoolResult> {
    if (this.job) this.abort(this.job, 'superseded');
    if (this.disposed) return Promise.reject(new GridRequestCancelled(requestId, 'disposed'));
    try {
      // Shape only: the dimension check against the surface happens in the workers, which build it.
      validateGridRequest(grid, grid.plane.origin.length);
    } catch (e) {
      return Promise.reject(e);
    }
    if (this.aliveCount === 0) return Promise.reject(new Error('grid pool: every worker has failed'));
    return new Promise<GridPoolResult>((resolve, reject) => {
      this.job = {
        requestId,
        spec,
        grid,
        values: new Float64Array(grid.nx * grid.ny),
        nextRow: 0,
        returned: [],
        previewsPending: options.onCoarse ? previewSidesFor(grid.nx, grid.ny) : [],
        previewShown: 0,
        rowsDone: 0,
        min: Infinity,
        max: -Infinity,
        reported: 0,
        onProgress,
        onCoarse: options.onCoarse,
        resolve,
        reject,
      };
      this.dispatch(this.job);
    });
  }

  cancel(requestId: string): void {
    if (this.job?.requestId === requestId) this.abort(this.job, 'cancelled');
  }

  /** Cancels the request in progress and terminates every worker. */
  dispose(): void {
    if (this.job) this.abort(this.job, 'disposed');
    this.disposed = true;
    for (const m of this.members) {
      m.alive = false;
      m.worker.terminate();
    }
  }

  /** Tops every live member up to BANDS_AHEAD bands, one band per member per pass (spreads the big first bands). */
  private dispatch(job: Job): void {
    for (let depth = 1; depth <= BANDS_AHEAD; depth++)
      for (const m of this.members) {
        if (!m.alive || m.bands.length >= depth) continue;
        const band = this.nextBand(job);
        if (!band) return;
        if (m.bands.length === 0) m.rowsDone = 0;
        m.bands.push(band);
        m.worker.postMessage({
          type: 'band/sample',
          requestId: this.idOf(job, band),
          surface: job.spec,
          grid: band.preview ? previewGrid(job.grid, band.preview) : job.grid,
          rows: band.rows,
        });
      }
  }

  private idOf(job: Job, band: Band): string {
    return band.preview ? `${job.requestId}#preview${band.preview}` : job.requestId;
  }

  /** The next band to hand out: the previews first (coarsest first), then returned bands, then a guided share of the rest. */
  private nextBand(job: Job): Band | null {
    const side = job.previewsPending.shift();
    if (side) return { rows: [0, side], preview: side };
    const back = job.returned.shift();
    if (back) return back;
    const left = job.grid.ny - job.nextRow;
    if (left <= 0) return null;
    const rows = Math.max(1, Math.ceil((GUIDED_SHARE * left) / this.aliveCount));
    const band: Band = { rows: [job.nextRow, job.nextRow + rows], preview: 0 };
    job.nextRow += rows;
    return band;
  }

  private onMessage(member: Member, msg: FromPoolMember | FromWorker): void {
    const job = this.job;
    if (!job || !(msg.type === 'band/progress' || msg.type === 'band/result' || msg.type === 'band/error')) return;
    // A member answers its bands in order; anything else is a late message of a superseded request.
    const k = member.bands.findIndex((b) => this.idOf(job, b) === msg.requestId && b.rows[0] === msg.rows[0] && b.rows[1] === msg.rows[1]);
    if (k < 0) return;
    const band = member.bands[k];
    switch (msg.type) {
      case 'band/progress':
        if (k === 0 && !band.preview) {
          member.rowsDone = msg.rowsDone;
          this.report(job);
        }
        return;
      case 'band/error':
        return this.fail(job, msg.message);
      case 'band/result':
        member.bands.splice(k, 1);
        member.rowsDone = 0;
        if (!band.preview) this.store(job, msg.rows, msg.values, msg.min, msg.max);
        else if (band.preview > job.previewShown) {
          job.previewShown = band.preview;
          job.onCoarse?.({ requestId: job.requestId, grid: previewGrid(job.grid, band.preview), values: msg.values, min: msg.min, max: msg.max });
        }
        if (this.job !== job) return; // the preview callback may have started a new request
        if (job.rowsDone === job.grid.ny) this.finish(job);
        else {
          this.report(job);
          this.dispatch(job);
        }
    }
  }

  private store(job: Job, rows: RowRange, values: Float64Array, min: number, max: number): void {
    job.values.set(values, rows[0] * job.grid.nx);
    job.rowsDone += rows[1] - rows[0];
    if (min < job.min) job.min = min;
    if (max > job.max) job.max = max;
  }

  private report(job: Job): void {
    let rows = job.rowsDone;
    for (const m of this.members) if (m.bands.length > 0 && !m.bands[0].preview) rows += m.rowsDone;
    const fraction = Math.min(1, rows / job.grid.ny);
    if (fraction > job.reported) {
      job.reported = fraction;
      job.onProgress?.(fraction);
    }
  }

  private finish(job: Job): void {
    this.release(job); // a preview still in flight is no longer wanted
    this.job = null;
    if (job.reported < 1) job.onProgress?.(1);
    const finite = job.min <= job.max;
    job.resolve({ requestId: job.requestId, grid: job.grid, values: job.values, min: finite ? job.min : Number.NaN, max: finite ? job.max : Number.NaN });
  }

  private fail(job: Job, message: string): void {
    this.release(job);
    this.job = null;
    job.reject(new Error(message));
  }

  private abort(job: Job, reason: GridRequestCancelled['reason']): void {
    this.release(job);
    this.job = null;
    job.reject(new GridRequestCancelled(job.requestId, reason));
  }

  /** Tells members still holding this job's bands to drop them, and marks them idle. */
  private release(job: Job): void {
    for (const m of this.members) {
      if (m.alive) for (const id of new Set(m.bands.map((b) => this.idOf(job, b)))) m.worker.postMessage({ type: 'band/cancel', requestId: id });
      m.bands = [];
      m.rowsDone = 0;
    }
  }

  private onFailure(member: Member, message: string): void {
    if (!member.alive) return;
    member.alive = false;
    const job = this.job;
    if (!job) return;
    for (const band of member.bands) {
      if (!band.preview) job.returned.push(band);
      else if (band.preview > job.previewShown) job.previewsPending.push(band.preview);
    }
    job.previewsPending.sort((a, b) => a - b);
    member.bands = [];
    member.rowsDone = 0;
    if (this.aliveCount === 0) this.fail(job, `grid pool: every worker has failed (last: ${message})`);
    else this.dispatch(job);
  }
}

function previewGrid(grid: GridRequest, side: number): GridRequest {
  return { ...grid, nx: side, ny: side };
}

/** A pool of `size` workers made by `factory` (default size: defaultPoolSize()). */
export function createGridPool(factory: (index: number) => WorkerLike, size = defaultPoolSize()): GridPool {
  return new GridPool(factory, size);
}
