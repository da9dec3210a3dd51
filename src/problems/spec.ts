/**
 * Surface specs: plain JSON data naming a surface, shared by the page, the workers, the experiment file
 * and the command line. `buildSurface` turns a spec into an engine Surface; `describeSurface` gives what
 * a page needs to show it (label, variables, plotting box, known points) without the caller compiling.
 *
 * To add a kind: add a member to `SurfaceSpec`, write a `SurfaceKind` handler in kinds/, and register it
 * in `KINDS` (the mapped type makes the compiler insist on it).
 */
import type { Surface } from '../engine';
import type { KnownPoint } from './catalogue';
import type { DataFitSpec } from './datafit';
import { catalogueKind } from './kinds/catalogue-kind';
import { dataFitKind } from './kinds/datafit-kind';
import { formulaKind } from './kinds/formula-kind';

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
export type { DataFitSpec } from './datafit';

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

const KINDS: { [K in SurfaceSpecKind]: SurfaceKind<Extract<SurfaceSpec, { kind: K }>> } = {
  catalogue: catalogueKind,
  formula: formulaKind,
  datafit: dataFitKind,
};

/** Every surface kind, from the handler registry (the experiment file's schema is built from this). */
export const SURFACE_KINDS = Object.keys(KINDS) as SurfaceSpecKind[];

function kindOf(spec: unknown): SurfaceKind<SurfaceSpec> {
  if (typeof spec !== 'object' || spec === null || Array.isArray(spec)) {
    throw new Error(`surface spec: expected an object with a 'kind', got ${spec === null ? 'null' : Array.isArray(spec) ? 'an array' : typeof spec}`);
  }
  const kind = (spec as { kind?: unknown }).kind;
  const handler = typeof kind === 'string' && Object.hasOwn(KINDS, kind) ? KINDS[kind as SurfaceSpecKind] : undefined;
  if (!handler) {
    throw new Error(`surface spec: unknown kind ${JSON.stringify(kind)}; known kinds: ${Object.keys(KINDS).join(', ')}`);
  }
  return handler as SurfaceKind<SurfaceSpec>;
}

/** The Surface a spec names. Throws FormulaSyntaxError for bad formula text, a clear Error otherwise. */
export function buildSurface(spec: SurfaceSpec): Surface {
  const kind = kindOf(spec);
  return kind.build(kind.validate(spec as unknown as Record<string, unknown>));
}

/** Label, variables, plotting box and known points of the surface a spec names. */
export function describeSurface(spec: SurfaceSpec): SurfaceDescription {
  const kind = kindOf(spec);
  return kind.describe(kind.validate(spec as unknown as Record<string, unknown>));
}
