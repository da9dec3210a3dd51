import { findCriticalPoints, sharpnessAlong } from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromWorker } from '../protocol';
import { errorText } from './runs';

/** The largest Hessian eigenvalue at each of `count` points (exact or Lanczos, engine/analysis). */
export function sampleSharpness(post: (msg: FromWorker) => void, requestId: string, spec: SurfaceSpec, points: Float64Array, count: number): void {
  try {
    post({ type: 'sharpness/result', requestId, values: sharpnessAlong(buildSurface(spec), points, count) });
  } catch (e) {
    post({ type: 'analysis/error', requestId, message: errorText(e) });
  }
}

/** Critical points found from the given starts (Newton on grad f = 0), de-duplicated and classified. */
export function searchCriticalPoints(post: (msg: FromWorker) => void, requestId: string, spec: SurfaceSpec, starts: Float64Array, count: number): void {
  try {
    const surface = buildSurface(spec);
    const n = surface.dimension;
    const list = Array.from({ length: count }, (_, k) => starts.subarray(k * n, (k + 1) * n));
    const r = findCriticalPoints(surface, list);
    post({ type: 'critical/result', requestId, points: r.points, converged: r.converged, failed: r.failed });
  } catch (e) {
    post({ type: 'analysis/error', requestId, message: errorText(e) });
  }
}
