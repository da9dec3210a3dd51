import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromWorker } from '../protocol';
import type { Surface } from '../engine';
import { errorText } from './runs';

/**
 * The loss and exact gradient at a few points, for the page's hover readout and gradient arrows. A
 * model fitted to a large table takes milliseconds per evaluation, so none runs on the page. The
 * surface of the last spec is kept (one entry): the pointer asks again at every move.
 */
export class SurfaceProbe {
  private cache: { key: string; surface: Surface } | null = null;

  constructor(private readonly post: (msg: FromWorker) => void) {}

  /** `points`: count x n, row-major. */
  probe(requestId: string, spec: SurfaceSpec, points: Float64Array, count: number): void {
    try {
      const surface = this.surfaceFor(spec);
      const n = surface.dimension;
      if (!(Number.isInteger(count) && count >= 0 && points.length === count * n)) throw new Error(`probe: expected ${count} points of ${n} coordinates, got ${points.length} numbers`);
      const values = new Float64Array(count);
      const gradients = new Float64Array(count * n);
      for (let k = 0; k < count; k++) values[k] = surface.valueGradient(points.subarray(k * n, (k + 1) * n), gradients.subarray(k * n, (k + 1) * n));
      this.post({ type: 'probe/result', requestId, values, gradients }); // copied: see runs.ts
    } catch (e) {
      this.post({ type: 'probe/error', requestId, message: errorText(e) });
    }
  }

  private surfaceFor(spec: SurfaceSpec): Surface {
    const key = JSON.stringify(spec);
    if (this.cache?.key !== key) this.cache = { key, surface: buildSurface(spec) };
    return this.cache.surface;
  }
}
