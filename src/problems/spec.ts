/**
 * Surface specs: plain JSON data naming a surface, shared by the page, the workers, the experiment file
 * and the command line. `buildSurface` turns a spec into an engine Surface; `describeSurface` gives what
 * a page needs to show it (label, variables, plotting box, known points) without the caller compiling.
 *
 * To add a kind: add a member to `SurfaceSpec` (types.ts), write a `SurfaceKind` handler in kinds/, and register it
 * in `KINDS` (the mapped type makes the compiler insist on it).
 */
import type { Surface } from '../engine';
import { catalogueKind } from './kinds/catalogue-kind';
import { dataFitKind } from './kinds/datafit-kind';
import { formulaKind } from './kinds/formula-kind';
import type { SurfaceDescription, SurfaceKind, SurfaceSpec, SurfaceSpecKind } from './types';

export type { CatalogueSpec, DataFitSpec, FormulaSpec, SurfaceDescription, SurfaceKind, SurfaceSpec, SurfaceSpecKind } from './types';

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
