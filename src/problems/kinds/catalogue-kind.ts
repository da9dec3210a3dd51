import { compileFormula, type FormulaSurface, type Surface } from '../../engine';
import { catalogueEntry, knownPointsFor, resolveConstants, type CatalogueEntry } from '../catalogue';
import type { CatalogueSpec, SurfaceDescription, SurfaceKind } from '../types';
import { checkConstants, checkString } from './check';

/** Each entry's formula compiled once (with its default constants); builds rebind constants only. */
const COMPILED = new Map<string, FormulaSurface>();

function compiled(entry: CatalogueEntry): FormulaSurface {
  let surface = COMPILED.get(entry.id);
  if (!surface) {
    surface = compileFormula(entry.formula, { variables: [...entry.variables], constants: { ...(entry.constants ?? {}) } });
    COMPILED.set(entry.id, surface);
  }
  return surface;
}

/** Catalogue specs: an entry id plus optional constant overrides, compiled from the entry's formula. */
export const catalogueKind: SurfaceKind<CatalogueSpec> = {
  validate(spec) {
    const id = checkString('surface spec (catalogue)', 'id', spec.id);
    const constants = checkConstants(`surface spec (catalogue ${id})`, spec.constants);
    return constants ? { kind: 'catalogue', id, constants } : { kind: 'catalogue', id };
  },

  /** A fresh FormulaSurface with the entry's constants, overridden by the spec's. */
  build(spec): Surface {
    const entry = catalogueEntry(spec.id);
    return compiled(entry).withConstants(resolveConstants(entry, spec.constants));
  },

  describe(spec): SurfaceDescription {
    const entry = catalogueEntry(spec.id);
    const constants = resolveConstants(entry, spec.constants);
    const changed = Object.keys(constants).filter((name) => constants[name] !== entry.constants?.[name]);
    const label = changed.length ? `${entry.label} (${changed.map((n) => `${n} = ${constants[n]}`).join(', ')})` : entry.label;
    const knownPoints = knownPointsFor(entry, spec.constants);
    const description: SurfaceDescription = {
      label,
      variables: [...entry.variables],
      view: entry.view.map(([lo, hi]) => [lo, hi]),
      knownPoints,
      suggestedStart: [...entry.suggestedStart],
    };
    // With the published constants the entry says; otherwise the lowest known global minimum, if not 0.
    const lowest = Math.min(...knownPoints.filter((p) => p.kind === 'global-min').map((p) => p.value));
    if (changed.length === 0 && entry.logScaleOffset !== undefined) description.logScaleOffset = entry.logScaleOffset;
    else if (changed.length > 0 && Number.isFinite(lowest) && lowest !== 0) description.logScaleOffset = lowest;
    return description;
  },
};
