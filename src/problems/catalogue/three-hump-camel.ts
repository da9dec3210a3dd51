import { CLOSED_FORM, COMPUTED_IN_REFERENCE, SCIPY_GO_CITING_JY } from './sources';
import type { CatalogueEntry } from './types';

const LOCAL_MIN_SOURCE = `${COMPUTED_IN_REFERENCE}; not published in the sources read`;

/**
 * Three-hump camel: f(x, y) = 2x^2 - 1.05x^4 + x^6/6 + x y + y^2. Global minimum f(0, 0) = 0 with
 * Hessian [[4, 1], [1, 2]] (eigenvalues 3 -/+ sqrt 2); two symmetric local minima.
 */
export const threeHumpCamel: CatalogueEntry = {
  id: 'three-hump-camel',
  label: 'Three-hump camel',
  formula: '2*x^2 - 1.05*x^4 + x^6/6 + x*y + y^2',
  variables: ['x', 'y'],
  domain: [
    [-5, 5],
    [-5, 5],
  ],
  domainSource: `${SCIPY_GO_CITING_JY}; Surjanovic & Bingham (quoted)`,
  view: [
    [-2, 2],
    [-1.5, 1.5],
  ],
  suggestedStart: [1.8, 1.2],
  knownPoints: [
    { point: [0, 0], value: 0, kind: 'global-min', source: `${SCIPY_GO_CITING_JY}; eigenvalues ${CLOSED_FORM}`, hessianEigenvalues: [3 - Math.SQRT2, 3 + Math.SQRT2] },
    { point: [1.7475523458302888, -0.8737761729151444], value: 0.2986384422368598, kind: 'local-min', source: LOCAL_MIN_SOURCE, hessianEigenvalues: [1.902445, 12.250644] },
    { point: [-1.7475523458302888, 0.8737761729151444], value: 0.2986384422368598, kind: 'local-min', source: LOCAL_MIN_SOURCE, hessianEigenvalues: [1.902445, 12.250644] },
  ],
  source: SCIPY_GO_CITING_JY,
  notes: 'Two shallow side minima (f = 0.2986) trap descent started at |x| > 1.5; x^6 makes the walls very steep beyond |x| = 2.',
};
