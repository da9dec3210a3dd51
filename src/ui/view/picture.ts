import { useEffect, useState } from 'react';
import type { GridState } from '../../store/app-store';
import type { DisplaySettings } from '../../store/workspace';
import { bandColours, contourBands, legendModel, thresholdsFor, valueScale, type ContourBand, type LegendModel } from '../plot';
import type { GridBox } from '../../engine';

/** The contoured surface: computed once per grid and display setting, drawn by every panel. */
export interface SurfacePicture {
  /** The grid request the values came from (a preview shares its request's id). */
  requestId: string | null;
  grid: GridBox;
  bands: ContourBand[];
  colours: string[];
  legend: LegendModel;
}

/** Longest stretch of contouring before yielding to the page (keeps every task well under 50 ms). */
const SLICE_MS = 8;

const done = new WeakMap<Float64Array, Map<string, SurfacePicture>>();
const pending = new WeakMap<Float64Array, Map<string, Promise<SurfacePicture>>>();

function keyOf(display: DisplaySettings, knownMinimum: number | undefined): string {
  return `${display.scale}|${display.levels}|${display.colourMap}|${knownMinimum ?? ''}`;
}

/** The picture if it has been computed already. */
export function cachedPicture(grid: GridState, display: DisplaySettings, knownMinimum?: number): SurfacePicture | null {
  return (grid.values && done.get(grid.values)?.get(keyOf(display, knownMinimum))) ?? null;
}

/**
 * Contours and legend for a grid, computed one level at a time in short slices (d3-contour on a 256 x 256
 * grid with two dozen levels takes tens of milliseconds, which would freeze a frame if done at once).
 */
export function buildPicture(grid: GridState, display: DisplaySettings, knownMinimum?: number): Promise<SurfacePicture> | null {
  const values = grid.values;
  const req = grid.request;
  if (!values || !req) return null;
  const key = keyOf(display, knownMinimum);
  const ready = done.get(values)?.get(key);
  if (ready) return Promise.resolve(ready);
  const inFlight = pending.get(values)?.get(key);
  if (inFlight) return inFlight;
  const spec: GridBox = { a: req.a, b: req.b, nx: req.nx, ny: req.ny };
  // A log scale measures the loss above the surface's known minimum where there is one (the value may
  // be negative, as for the six-hump camel), else above the grid's lowest value.
  const low = display.scale === 'log' && knownMinimum !== undefined ? Math.min(grid.min, knownMinimum) : grid.min;
  const scale = valueScale(low, grid.max, display.scale);
  const thresholds = thresholdsFor(scale, display.levels);
  const transformed = values.map(scale.transform);
  const identity = (v: number) => v;
  const promise = new Promise<SurfacePicture>((resolve) => {
    const bands: ContourBand[] = [];
    const step = () => {
      const t0 = performance.now();
      while (bands.length < thresholds.length && performance.now() - t0 < SLICE_MS) {
        const k = bands.length;
        const [band] = contourBands(transformed, spec, [scale.transform(thresholds[k])], identity);
        bands.push({ ...band, level: k, threshold: thresholds[k] });
      }
      if (bands.length < thresholds.length) {
        setTimeout(step, 0);
        return;
      }
      const colours = bandColours(thresholds, scale, display.colourMap);
      const picture = { requestId: grid.requestId, grid: spec, bands, colours, legend: legendModel(scale, thresholds, colours) };
      if (!done.has(values)) done.set(values, new Map());
      done.get(values)!.set(key, picture);
      pending.get(values)?.delete(key);
      resolve(picture);
    };
    step();
  });
  if (!pending.has(values)) pending.set(values, new Map());
  pending.get(values)!.set(key, promise);
  return promise;
}

/**
 * The newest finished picture for the current grid and display; the previous one while a new one is
 * built for the same surface, none while a new surface has no grid yet.
 */
export function useSurfacePicture(grid: GridState, display: DisplaySettings, knownMinimum?: number): SurfacePicture | null {
  const [picture, setPicture] = useState<SurfacePicture | null>(() => cachedPicture(grid, display, knownMinimum));
  useEffect(() => {
    let live = true;
    const ready = cachedPicture(grid, display, knownMinimum);
    if (!grid.values) setPicture(null); // the surface changed: its old picture is not this surface's
    else if (ready) setPicture(ready);
    else buildPicture(grid, display, knownMinimum)?.then((p) => live && setPicture(p));
    return () => {
      live = false;
    };
  }, [grid, display, knownMinimum]);
  return picture;
}
