import { COMPUTED_IN_REFERENCE, SCIPY_GO, WIKIPEDIA_HIMMELBLAU } from './sources';
import type { CatalogueEntry } from './types';

/** Published 6-decimal locations [Wikipedia], refined to full precision in the reference file. */
const PUBLISHED_REFINED = `${WIKIPEDIA_HIMMELBLAU} (6 decimals); digits ${COMPUTED_IN_REFERENCE}`;
/** The saddles were not found in any source the reference read; they are computed only. */
const SADDLE_SOURCE = `${COMPUTED_IN_REFERENCE}; not a published value`;

/**
 * Himmelblau's function: f(x, y) = (x^2 + y - 11)^2 + (x + y^2 - 7)^2 (Himmelblau, Applied Nonlinear
 * Programming, 1972). Nine stationary points: four global minima with f = 0, one local maximum and
 * four saddles (the gradient is a pair of cubics).
 */
export const himmelblau: CatalogueEntry = {
  id: 'himmelblau',
  label: 'Himmelblau',
  formula: '(x^2 + y - 11)^2 + (x + y^2 - 7)^2',
  variables: ['x', 'y'],
  domain: [
    [-5, 5],
    [-5, 5],
  ],
  domainSource: `${SCIPY_GO} (code bounds; its docstring says [-6, 6])`,
  view: [
    [-5, 5],
    [-5, 5],
  ],
  suggestedStart: [0, 0],
  knownPoints: [
    { point: [3, 2], value: 0, kind: 'global-min', source: `${WIKIPEDIA_HIMMELBLAU}; ${SCIPY_GO} (exact)`, hessianEigenvalues: [25.715729, 82.284271] },
    { point: [-2.805118086952745, 3.131312518250573], value: 0, kind: 'global-min', source: PUBLISHED_REFINED, hessianEigenvalues: [64.840373, 80.550072] },
    { point: [-3.779310253377747, -3.2831859912861696], value: 0, kind: 'global-min', source: PUBLISHED_REFINED, hessianEigenvalues: [70.714355, 133.785615] },
    { point: [3.5844283403304917, -1.8481265269644036], value: 0, kind: 'global-min', source: PUBLISHED_REFINED, hessianEigenvalues: [28.690677, 105.418908] },
    {
      point: [-0.2708445906673476, -0.9230385564799815],
      value: 181.6165215225827,
      kind: 'local-max',
      source: `${WIKIPEDIA_HIMMELBLAU} (-0.270845, -0.923039), f = 181.617; digits ${COMPUTED_IN_REFERENCE}`,
      hessianEigenvalues: [-45.605229, -16.06602],
    },
    { point: [0.08667750455539636, 2.884254701174776], value: 67.71915008752615, kind: 'saddle', source: SADDLE_SOURCE, hessianEigenvalues: [-31.706622, 75.507609] },
    { point: [-3.0730257507643897, -0.08135304428796751], value: 104.0151629175581, kind: 'saddle', source: SADDLE_SOURCE, hessianEigenvalues: [-39.651496, 72.435248] },
    { point: [3.385154183607021, 0.07385187983774928], value: 13.31192627040559, kind: 'saddle', source: SADDLE_SOURCE, hessianEigenvalues: [-14.135178, 97.547878] },
    { point: [-0.12796134673068008, -1.9537149802445763], value: 178.33723920192747, kind: 'saddle', source: SADDLE_SOURCE, hessianEigenvalues: [-50.610239, 20.28405] },
  ],
  source: `Himmelblau (1972), Applied Nonlinear Programming; formula as in ${WIKIPEDIA_HIMMELBLAU} and ${SCIPY_GO}`,
  notes:
    'Four equal minima: which one a run reaches depends on the start and the optimizer, a clear picture of ' +
    'basins of attraction. Several web copies misprint two minima as (3.584458, -1.848126) and ' +
    '(-2.805118, 3.283186); those points are not minima.',
};
