import { finiteRange, sampleGrid, validateGridRequest, type GridRequest, type Surface } from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import { previewSidesFor, type FromWorker } from '../protocol';
import { errorText } from './runs';
import { SLICE_MS, type Timing } from './scheduler';

interface GridJob {
  requestId: string;
  surface: Surface;
  grid: GridRequest;
  values: Float64Array;
  rowsDone: number;
}

/**
 * Samples surface grids in bands of rows, reporting progress, yielding between bands so a newer request
 * or a cancel is seen promptly. One grid at a time: a new request supersedes the one in progress.
 */
export class GridSampler {
  private job: GridJob | null = null;
  private cache: { key: string; surface: Surface } | null = null;

  constructor(
    private readonly post: (msg: FromWorker) => void,
    private readonly timing: Timing,
  ) {}

  request(requestId: string, spec: SurfaceSpec, grid: GridRequest, coarseFirst = false): void {
    let surface: Surface;
    try {
      surface = this.surfaceFor(spec);
      validateGridRequest(grid, surface.dimension);
    } catch (e) {
      this.job = null;
      this.post({ type: 'grid/error', requestId, message: errorText(e) });
      return;
    }
    // Previews (protocol/grid-previews.ts) are sampled at once: each is a small fraction of the grid.
    if (coarseFirst)
      for (const side of previewSidesFor(grid.nx, grid.ny)) {
        const coarse = { ...grid, nx: side, ny: side };
        this.finish(requestId, coarse, sampleGrid(surface, coarse), 'coarse');
      }
    const started = !this.job;
    this.job = { requestId, surface, grid, values: new Float64Array(grid.nx * grid.ny), rowsDone: 0 };
    if (started) this.timing.later(() => this.work(), 0);
  }

  cancel(requestId: string): void {
    if (this.job?.requestId === requestId) this.job = null;
  }

  private surfaceFor(spec: SurfaceSpec): Surface {
    const key = JSON.stringify(spec);
    if (this.cache?.key !== key) this.cache = { key, surface: buildSurface(spec) };
    return this.cache.surface;
  }

  private work(): void {
    const job = this.job;
    if (!job) return;
    const { grid } = job;
    const deadline = this.timing.now() + SLICE_MS;
    try {
      while (job.rowsDone < grid.ny && this.timing.now() < deadline) {
        const j1 = Math.min(grid.ny, job.rowsDone + 4);
        sampleGrid(job.surface, grid, job.values, job.rowsDone, j1);
        job.rowsDone = j1;
      }
    } catch (e) {
      this.job = null;
      this.post({ type: 'grid/error', requestId: job.requestId, message: errorText(e) });
      return;
    }
    if (job.rowsDone < grid.ny) {
      this.post({ type: 'grid/progress', requestId: job.requestId, rowsDone: job.rowsDone, rows: grid.ny });
      this.timing.later(() => this.work(), 0);
      return;
    }
    this.job = null;
    this.finish(job.requestId, grid, job.values, 'final');
  }

  private finish(requestId: string, grid: GridRequest, values: Float64Array, stage: 'coarse' | 'final'): void {
    const { min, max } = finiteRange(values);
    this.post({ type: 'grid/result', requestId, grid, values, min, max, stage }); // copied: see runs.ts
  }
}
