import { useMemo } from 'react';
import type { Surface } from '../../engine';
import type { SurfaceSpec } from '../../problems';
import { mainThreadSurface } from '../../store/surface-cache';

export { mainThreadSurface };

/**
 * The current surface for single-point work only (the hover readout, the arrow lattice, the data view);
 * grids and runs are computed in workers.
 */
export function useMainThreadSurface(spec: SurfaceSpec): Surface | null {
  return useMemo(() => mainThreadSurface(spec), [spec]);
}
