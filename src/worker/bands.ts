import { finiteRange, sampleGridRows, validateGridRequest, type GridRequest, type Surface } from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromPoolMember, RowRange, ToPoolMember } from '../protocol';
import { errorText } from './runs';
import { SLICE_MS, type Timing } from './scheduler';

interface BandJob {
  requestId: string;
  surface: Surface;
  grid: GridRequest;
  rows: RowRange;
  /** nx (j1 - j0) values, row j0 first. */
  values: Float64Array;
  /** Next row to sample (j0 <= next <= j1). */
  next: number;
}

/**
 * A pool member's side of pooled grid sampling: queues bands of rows (in arrival order) and samples
 * them in time slices, posting progress between slices and each finished band's values. `cancel` drops
 * all of a request's bands, queued or half done; a cancel sent before a new band is always seen first,
 * because messages are handled in order between slices. The surface built from a spec is cached
 * (one entry), so the many bands of one request build it once.
 *
 * Band values are posted as copies, never transferred. In V8 (Node, Chrome) detaching any ArrayBuffer,
 * which a transfer does, permanently invalidates an isolate-wide assumption of optimised code, so every
 * later typed-array loop in that worker pays a detach check: measured here, a 128 x 128 data-fit slice
 * took 41 ms before the first detach and 58 ms after (bench/, Node 20). Copying one band (nx rows of
 * doubles) costs far less than slowing every band after it.
 */
export class BandSampler {
  private readonly queue: BandJob[] = [];
  private scheduled = false;
  private cache: { key: string; surface: Surface } | null = null;

  constructor(
    private readonly post: (msg: FromPoolMember) => void,
    private readonly timing: Timing,
  ) {}

  request(requestId: string, spec: SurfaceSpec, grid: GridRequest, rows: RowRange): void {
    let surface: Surface;
    try {
      surface = this.surfaceFor(spec);
      validateGridRequest(grid, surface.dimension);
      const [j0, j1] = rows;
      if (!(Number.isInteger(j0) && Number.isInteger(j1) && 0 <= j0 && j0 < j1 && j1 <= grid.ny))
        throw new Error(`grid band: rows must satisfy 0 <= j0 < j1 <= ${grid.ny}, got [${j0}, ${j1})`);
    } catch (e) {
      this.post({ type: 'band/error', requestId, rows, message: errorText(e) });
      return;
    }
    this.queue.push({ requestId, surface, grid, rows, values: new Float64Array(grid.nx * (rows[1] - rows[0])), next: rows[0] });
    this.schedule();
  }

  cancel(requestId: string): void {
    for (let k = this.queue.length - 1; k >= 0; k--) if (this.queue[k].requestId === requestId) this.queue.splice(k, 1);
  }

  /** Bands waiting or in progress. */
  get pending(): number {
    return this.queue.length;
  }

  private surfaceFor(spec: SurfaceSpec): Surface {
    const key = JSON.stringify(spec);
    if (this.cache?.key !== key) this.cache = { key, surface: buildSurface(spec) };
    return this.cache.surface;
  }

  private schedule(): void {
    if (this.scheduled || this.queue.length === 0) return;
    this.scheduled = true;
    this.timing.later(() => this.work(), 0);
  }

  private work(): void {
    this.scheduled = false;
    const deadline = this.timing.now() + SLICE_MS;
    while (this.queue.length > 0 && this.timing.now() < deadline) {
      const job = this.queue[0];
      const [j0, j1] = job.rows;
      try {
        // One row at a time, so a slice overruns its budget by at most one row.
        sampleGridRows(job.surface, job.grid, job.values, job.next, job.next + 1, j0);
      } catch (e) {
        this.queue.shift();
        this.post({ type: 'band/error', requestId: job.requestId, rows: job.rows, message: errorText(e) });
        continue;
      }
      job.next++;
      if (job.next === j1) {
        this.queue.shift();
        const { min, max } = finiteRange(job.values);
        // Copied, not transferred: see the class comment.
        this.post({ type: 'band/result', requestId: job.requestId, rows: job.rows, values: job.values, min, max });
      }
    }
    const head = this.queue[0];
    if (head && head.next > head.rows[0])
      this.post({ type: 'band/progress', requestId: head.requestId, rows: head.rows, rowsDone: head.next - head.rows[0] });
    this.schedule();
  }
}

/** A pool member's message switch ('band/sample', 'band/cancel'), free of worker globals like createHandler. */
export function createBandHandler(post: (msg: FromPoolMember) => void, timing: Timing) {
  const bands = new BandSampler(post, timing);
  return function handle(msg: ToPoolMember): void {
    switch (msg.type) {
      case 'band/sample':
        return bands.request(msg.requestId, msg.surface, msg.grid, msg.rows);
      case 'band/cancel':
        return bands.cancel(msg.requestId);
    }
  };
}

/** Whether a message to a worker belongs to pooled grid sampling. */
export function isPoolMessage(msg: { type: string }): msg is ToPoolMember {
  return msg.type === 'band/sample' || msg.type === 'band/cancel';
}
