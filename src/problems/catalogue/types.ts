/**
 * The data that describes one catalogue surface. Entries are plain data (no functions), so they can be
 * listed on the page, sent to a worker or written into an experiment file unchanged; the surface itself
 * is built from `formula` by the engine's formula compiler, which also supplies exact derivatives.
 */

/** What kind of stationary point a known point is. */
export type PointKind = 'global-min' | 'local-min' | 'local-max' | 'saddle';

export interface KnownPoint {
  /** Location, one coordinate per variable. */
  point: number[];
  /** f at `point`. */
  value: number;
  kind: PointKind;
  /** Where the numbers come from: a published source, "computed in reference file", or "closed form". */
  source: string;
  /** Hessian eigenvalues at the point, ascending (absent where f is not twice differentiable there). */
  hessianEigenvalues?: number[];
}

/** A slider range for one named constant of a formula. */
export interface ConstantInfo {
  name: string;
  label: string;
  min: number;
  max: number;
  step?: number;
}

export interface CatalogueEntry {
  /** Stable identifier used in surface specs and experiment files (kebab-case). */
  id: string;
  /** Display name. */
  label: string;
  /** The formula in the engine's formula language: the one source of truth for value and derivatives. */
  formula: string;
  /** Variable names in order (all entries are 2-D: x then y). */
  variables: string[];
  /** Default values of the named constants in `formula`; these match the published function. */
  constants?: Record<string, number>;
  /** Slider ranges for the constants. */
  constantInfo?: ConstantInfo[];
  /** The usual search domain, one [low, high] per variable. */
  domain: [number, number][];
  /** Where `domain` comes from. */
  domainSource: string;
  /** A good default plotting box, one [low, high] per variable. */
  view: [number, number][];
  /** A start point that shows the surface's character. */
  suggestedStart: number[];
  /** Every published global minimum plus the other stationary points the reference lists (default constants). */
  knownPoints: KnownPoint[];
  /** Where the formula and the minima come from. */
  source: string;
  /** Pitfalls: non-differentiable points, unboundedness, misprints seen in published copies. */
  notes: string;
  /** Value to subtract before a log colour scale (the global minimum value where it is not 0). */
  logScaleOffset?: number;
}

/** Known points of an entry whose location or curvature depends on its constants. */
export type KnownPointsRule = (constants: Readonly<Record<string, number>>) => KnownPoint[];
