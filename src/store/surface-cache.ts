import type { Surface } from '../engine';
import { buildSurface, type SurfaceSpec } from '../problems';

const built = new WeakMap<SurfaceSpec, Surface | null>();

/**
 * The surface of a spec built on the page, once per spec object (the store replaces a spec, never
 * changes it in place, so identity is enough; comparing text would stringify a data-fit spec's whole
 * table on every render). Null when it does not build. For single-point work only (a readout, the
 * curvature at a start, unit conversions); grids and runs are computed in workers.
 */
export function mainThreadSurface(spec: SurfaceSpec): Surface | null {
  if (!built.has(spec)) {
    let surface: Surface | null = null;
    try {
      surface = buildSurface(spec);
    } catch {
      // The store only holds specs that build; a spec that does not simply has no surface here.
    }
    built.set(spec, surface);
  }
  return built.get(spec)!;
}

/**
 * Builds a spec's surface, throwing its specific error when it does not build, and keeps it for
 * mainThreadSurface: the store checks a new spec this way, and the views then reuse the surface instead
 * of building it a second time (a data-fit network took 10-20 ms each time, in the click's task).
 */
export function buildCheckedSurface(spec: SurfaceSpec): Surface {
  const surface = buildSurface(spec);
  built.set(spec, surface);
  return surface;
}
