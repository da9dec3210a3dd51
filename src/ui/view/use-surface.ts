import { useMemo } from 'react';
import type { Surface } from '../../engine';
import { buildSurface, type SurfaceSpec } from '../../problems';

/**
 * The current surface built on the page, for single-point work only (the hover readout and the arrow
 * lattice); grids and runs are computed in the worker.
 */
export function useMainThreadSurface(spec: SurfaceSpec): Surface | null {
  const key = JSON.stringify(spec);
  return useMemo(() => {
    try {
      return buildSurface(JSON.parse(key) as SurfaceSpec);
    } catch {
      return null;
    }
  }, [key]);
}
