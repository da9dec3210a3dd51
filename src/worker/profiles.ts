import { lineProfile } from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';
import type { FromWorker } from '../protocol';
import { errorText } from './runs';

/** The loss along a segment of parameter space, for the 1-D profile chart. */
export function sampleProfile(
  post: (msg: FromWorker) => void,
  requestId: string,
  spec: SurfaceSpec,
  from: number[],
  to: number[],
  alphas: { from: number; to: number; count: number },
): void {
  try {
    const p = lineProfile(buildSurface(spec), from, to, alphas);
    post({ type: 'profile/result', requestId, alphas: p.alphas, values: p.values }); // copied: see runs.ts
  } catch (e) {
    post({ type: 'profile/error', requestId, message: errorText(e) });
  }
}
