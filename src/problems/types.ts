/**
 * The surface spec types: the plain JSON data naming a surface (one member per kind), what a page
 * needs to show one, and the handler each kind registers in spec.ts. Types only, so the kind handlers
 * (kinds/, datafit/) and the registry can all import them without importing one another.
 */
import type { Surface } from '../engine';
import type { KnownPoint } from './catalogue';
import type { DataFitSpec } from './datafit/spec';

export interface CatalogueSpec {
  kind: 'catalogue';
  /** A catalogue id such as 'rosenbrock'. */
  id: string;
  /** Overrides of the entry's named constants; the rest keep their published defaults. */
  constants?: Record<string, number>;
}

export interface FormulaSpec {
  kind: 'formula';
  /** Formula text in the engine's formula language, e.g. 'x^2 + 10*y^2'. */
  text: string;
  /** Variable order; by default the free names that are not constants, alphabetically. */
  variables?: string[];
  /** Values of named constants in `text`. */
  constants?: Record<string, number>;
}

/** The loss of a model fitted to a dataset (see datafit/spec.ts); re-exported here with the other kinds. */
export type { DataFitSpec };

export type SurfaceSpec = CatalogueSpec | FormulaSpec | DataFitSpec;

export type SurfaceSpecKind = SurfaceSpec['kind'];

export interface SurfaceDescription {
  label: string;
  variables: string[];
  /** Default plotting box, one [low, high] per variable ([-3, 3] per variable for a typed formula). */
  view: [number, number][];
  knownPoints: KnownPoint[];
  /** A start point that shows the surface's character, where the surface suggests one. */
  suggestedStart?: number[];
  /** Value to subtract before a log colour scale, where the surface's minimum is known and not 0. */
  logScaleOffset?: number;
}

/** How one kind of spec is checked, built and described. */
export interface SurfaceKind<S extends SurfaceSpec> {
  /** Throws a clear Error when the JSON does not have this kind's shape; returns the spec typed. */
  validate(spec: Record<string, unknown>): S;
  build(spec: S): Surface;
  describe(spec: S): SurfaceDescription;
}
