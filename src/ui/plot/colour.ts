/**
 * Surface colours: a value scale (log by default, linear as the alternative), contour level thresholds,
 * and a perceptually uniform colour map.
 *
 * Log scale. Losses can be zero or negative (the six-hump camel minimum is about -1.0316), so values are
 * shifted before the logarithm:
 *   T(v) = log10(max(v - min, 0) + offset),   offset = floor * (max - min),   floor = 1e-4 by default,
 * so the minimum maps to log10(offset) and the maximum to log10(max - min + offset): the colour range
 * always spans log10(1 + 1/floor) decades (4 with the default), and values within about `offset` of the
 * minimum share the lowest colour. Values below `min` (possible when the caller fixes the range) clamp to
 * the lowest colour instead of becoming missing. When max == min the span is taken as 1.
 * Linear scale: T(v) = v.
 * Colour of v: map((T(v) - T(min)) / (T(max) - T(min))) clamped to [0, 1]; NaN and +-Infinity are
 * missing (no colour).
 *
 * Maps: viridis (default) and cividis from d3-scale-chromatic. Viridis: van der Walt & Smith (2015),
 * matplotlib's default map; cividis: Nunez, Anderton & Renslow (2018), "Optimizing colormaps with
 * consideration for color vision deficiency", PLOS ONE 13(7). Both are perceptually uniform.
 */
import { color, interpolateCividis, interpolateViridis } from 'd3';

export type ValueScaleKind = 'log' | 'linear';
export type SurfaceColourMap = 'viridis' | 'cividis';

/** Fraction of the value range used as the log offset (see the module comment). */
export const DEFAULT_LOG_FLOOR = 1e-4;
export const MAX_LEVELS = 256;

export interface ValueScale {
  readonly kind: ValueScaleKind;
  /** Actual loss values at the ends of the colour range. */
  readonly min: number;
  readonly max: number;
  /** The log shift in loss units (0 for linear). */
  readonly offset: number;
  /** T(v): the value in the space where levels are spaced evenly. NaN for missing values. */
  transform(v: number): number;
  /** The inverse of T on [T(min), T(max)]. */
  inverse(t: number): number;
  /** Position in [0, 1] along the colour range; NaN for missing values. */
  normalise(v: number): number;
  /** The loss value at position u in [0, 1]. */
  valueAt(u: number): number;
}

/**
 * The value scale for a grid whose finite values span [min, max]. `offset` overrides the log shift
 * (must be positive). With no finite values (min or max NaN) every value is missing.
 */
export function valueScale(min: number, max: number, kind: ValueScaleKind = 'log', offset?: number): ValueScale {
  const known = Number.isFinite(min) && Number.isFinite(max);
  const lo = known ? Math.min(min, max) : Number.NaN;
  const hi = known ? (max > min ? max : lo + 1) : Number.NaN;
  let shift = 0;
  if (kind === 'log') {
    if (offset !== undefined && !(Number.isFinite(offset) && offset > 0))
      throw new Error(`colour scale: the log offset must be a positive number, got ${offset}`);
    shift = offset ?? DEFAULT_LOG_FLOOR * (hi - lo);
  }
  const transform =
    kind === 'log'
      ? (v: number) => (Number.isFinite(v) ? Math.log10(Math.max(v - lo, 0) + shift) : Number.NaN)
      : (v: number) => (Number.isFinite(v) ? v : Number.NaN);
  const inverse = kind === 'log' ? (t: number) => lo + Math.pow(10, t) - shift : (t: number) => t;
  const t0 = transform(lo);
  const t1 = transform(hi);
  const normalise = (v: number) => {
    const t = transform(v);
    return Number.isNaN(t) ? Number.NaN : Math.min(1, Math.max(0, (t - t0) / (t1 - t0)));
  };
  const valueAt = (u: number) => {
    if (u <= 0) return lo;
    if (u >= 1) return hi;
    return inverse(t0 + u * (t1 - t0));
  };
  return { kind, min: lo, max: hi, offset: shift, transform, inverse, normalise, valueAt };
}

/**
 * `count` contour levels t_0 < ... < t_{count-1} in loss units. t_0 = min exactly, and the levels are
 * evenly spaced in T: t_k = T^-1(T(min) + k (T(max) - T(min)) / count). So for log the shifted levels
 * t_k - min + offset form a geometric sequence with ratio ((max - min + offset) / offset)^(1 / count),
 * and for linear t_k = min + k (max - min) / count. Band k holds values in [t_k, t_{k+1}); the top band
 * [t_{count-1}, max] has the same width in T as the others. Returns [] when min or max is not finite.
 */
export function levelThresholds(min: number, max: number, count: number, kind: ValueScaleKind = 'log', offset?: number): number[] {
  if (!(Number.isInteger(count) && count >= 1 && count <= MAX_LEVELS))
    throw new Error(`levels: count must be a whole number from 1 to ${MAX_LEVELS}, got ${count}`);
  const scale = valueScale(min, max, kind, offset);
  return thresholdsFor(scale, count);
}

/** The same levels for an existing scale. */
export function thresholdsFor(scale: ValueScale, count: number): number[] {
  if (!Number.isFinite(scale.min)) return [];
  const t0 = scale.transform(scale.min);
  const t1 = scale.transform(scale.max);
  const out = [scale.min];
  for (let k = 1; k < count; k++) out.push(scale.inverse(t0 + (k * (t1 - t0)) / count));
  return out;
}

/** The colour map as a function of u in [0, 1], returning "#rrggbb". */
export function colourMap(map: SurfaceColourMap = 'viridis'): (u: number) => string {
  const interpolate = map === 'cividis' ? interpolateCividis : interpolateViridis;
  return (u: number) => toHex(interpolate(Math.min(1, Math.max(0, u))));
}

/** Colour of one loss value, or null when it is missing (NaN, +-Infinity). */
export function colourForValue(v: number, scale: ValueScale, map: SurfaceColourMap = 'viridis'): string | null {
  const u = scale.normalise(v);
  return Number.isNaN(u) ? null : colourMap(map)(u);
}

/**
 * Fill colour of each band: band k is painted with the map at the middle of its T-interval, i.e. at
 * u = (k + 0.5) / count for evenly spaced levels, so the bands use the whole map without its very ends.
 */
export function bandColours(thresholds: readonly number[], scale: ValueScale, map: SurfaceColourMap = 'viridis'): string[] {
  const at = colourMap(map);
  return thresholds.map((t, k) => {
    const u0 = scale.normalise(t);
    const u1 = k + 1 < thresholds.length ? scale.normalise(thresholds[k + 1]) : 1;
    return at((u0 + u1) / 2);
  });
}

function toHex(css: string): string {
  const c = color(css);
  return c ? c.formatHex() : '#000000';
}
