import { compileFormula, type Surface } from '../../engine';
import type { FormulaSpec, SurfaceDescription, SurfaceKind } from '../types';
import { checkConstants, checkString } from './check';

/** The plotting box of a typed formula: [-3, 3] per variable (nothing is known about its scale). */
export const FORMULA_VIEW_HALF_WIDTH = 3;

/** Formula specs: text in the engine's formula language, compiled with exact derivatives. */
export const formulaKind: SurfaceKind<FormulaSpec> = {
  validate(spec) {
    const text = checkString('surface spec (formula)', 'text', spec.text);
    const variables = spec.variables;
    if (variables !== undefined && !(Array.isArray(variables) && variables.every((v) => typeof v === 'string'))) {
      throw new Error('surface spec (formula): variables must be an array of names');
    }
    const constants = checkConstants('surface spec (formula)', spec.constants);
    const out: FormulaSpec = { kind: 'formula', text };
    if (variables) out.variables = variables as string[];
    if (constants) out.constants = constants;
    return out;
  },

  build(spec): Surface {
    return compileFormula(spec.text, { variables: spec.variables, constants: spec.constants });
  },

  describe(spec): SurfaceDescription {
    const surface = formulaKind.build(spec);
    const h = FORMULA_VIEW_HALF_WIDTH;
    return {
      label: spec.text.trim(),
      variables: [...surface.variables],
      view: surface.variables.map(() => [-h, h]),
      knownPoints: [],
    };
  },
};
