import { compileFormula, type Surface } from '../../engine';
import { catalogueEntry, knownPointsFor, resolveConstants } from '../catalogue';
import type { CatalogueSpec, SurfaceDescription, SurfaceKind } from '../spec';
import { checkConstants, checkString } from './check';

/** Catalogue specs: an entry id plus optional constant overrides, compiled from the entry's formula. */
export const catalogueKind: SurfaceKind<CatalogueSpec> = {
  validate(spec) {
    const id = checkString('surface spec (catalogue)', 'id', spec.id);
    const constants = checkConstants(`surface spec (catalogue ${id})`, spec.constants);
    return constants ? { kind: 'catalogue', id, constants } : { kind: 'catalogue', id };
  },

  build(spec): Surface {
    const entry = catalogueEntry(spec.id);
    return compileFormula(entry.formula, { variables: entry.variables, constants: resolveConstants(entry, spec.constants) });
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
    const lowest = Math.min(...knownPoints.filter((p) => p.kind === 'global-min').map((p) => p.value));
    if (changed.length === 0 && entry.logScaleOffset !== undefined) description.logScaleOffset = entry.logScaleOffset;
    else if (changed.length > 0 && Number.isFinite(lowest) && lowest !== 0) description.logScaleOffset = lowest;
    return description;
  },
};
