import type { Surface } from '../engine';

/**
 * The one unit system everything a user reads or exports is in: the data's original units. A data-fit
 * surface with standardised inputs optimises in standardised coordinates; its `toOriginalUnits`
 * converts a point back. Every other surface's coordinates are already the reported ones.
 */
export interface ReportedUnits {
  /** Whether the surface's own coordinates (the map's axes, run starts) are standardised. */
  standardised: boolean;
  /** A point in the surface's coordinates, in the reported (original) units. */
  toReported(x: ArrayLike<number>): number[];
}

interface Convertible {
  standardised: boolean;
  toOriginalUnits(params: ArrayLike<number>): number[];
}

function convertible(s: Surface | null): s is Surface & Convertible {
  return !!s && (s as Partial<Convertible>).standardised === true && typeof (s as Partial<Convertible>).toOriginalUnits === 'function';
}

export const IDENTITY_UNITS: ReportedUnits = { standardised: false, toReported: (x) => Array.from(x) };

export function reportedUnits(surface: Surface | null): ReportedUnits {
  if (!convertible(surface)) return IDENTITY_UNITS;
  return { standardised: true, toReported: (x) => (x.length === surface.dimension ? surface.toOriginalUnits(x) : Array.from(x)) };
}

/** The suffix that marks a name or title given in the surface's standardised coordinates. */
export const STANDARDISED_MARK = ' (standardised)';

/** Axis or field titles for coordinates that stay in the surface's own units, marked where standardised. */
export function coordinateTitle(name: string, units: ReportedUnits): string {
  return units.standardised ? `${name}${STANDARDISED_MARK}` : name;
}
