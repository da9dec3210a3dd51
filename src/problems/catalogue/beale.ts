import { COMPUTED_IN_REFERENCE, SCIPY_GO, SCIPY_GO_CITING_JY } from './sources';
import type { CatalogueEntry } from './types';

/**
 * Beale's function: f(x, y) = (1.5 - x + x y)^2 + (2.25 - x + x y^2)^2 + (2.625 - x + x y^3)^2,
 * global minimum f(3, 0.5) = 0.
 */
export const beale: CatalogueEntry = {
  id: 'beale',
  label: 'Beale',
  formula: '(1.5 - x + x*y)^2 + (2.25 - x + x*y^2)^2 + (2.625 - x + x*y^3)^2',
  variables: ['x', 'y'],
  domain: [
    [-4.5, 4.5],
    [-4.5, 4.5],
  ],
  domainSource: SCIPY_GO,
  view: [
    [-4.5, 4.5],
    [-4.5, 4.5],
  ],
  suggestedStart: [1, 1],
  knownPoints: [
    {
      point: [3, 0.5],
      value: 0,
      kind: 'global-min',
      source: `${SCIPY_GO_CITING_JY}; eigenvalues ${COMPUTED_IN_REFERENCE}`,
      hessianEigenvalues: [0.301464, 48.979786],
    },
  ],
  source: `Beale (1958); formula and minimum from ${SCIPY_GO_CITING_JY}`,
  notes:
    'Sharp ridges near the corners; values reach about 1.8e5 in the domain, so use a log colour scale. ' +
    'Standard starts are (1, 1) (easy) and (1, 4) (hard) (More, Garbow & Hillstrom 1981, as quoted in ' +
    'optimization library documentation).',
};
