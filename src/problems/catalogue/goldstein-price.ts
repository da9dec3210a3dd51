import { COMPUTED_IN_REFERENCE, SCIPY_GO_CITING_JY, SFU_LIBRARY } from './sources';
import type { CatalogueEntry } from './types';

const LOCAL_SOURCE = `${COMPUTED_IN_REFERENCE} (exact values; also commonly quoted in the literature)`;

/**
 * Goldstein-Price:
 * f(x, y) = [1 + (x + y + 1)^2 (19 - 14x + 3x^2 - 14y + 6xy + 3y^2)]
 *         x [30 + (2x - 3y)^2 (18 - 32x + 12x^2 + 48y - 36xy + 27y^2)],
 * global minimum f(0, -1) = 3 (Goldstein & Price, Math. Comp. 25, 1971).
 */
export const goldsteinPrice: CatalogueEntry = {
  id: 'goldstein-price',
  label: 'Goldstein-Price',
  formula:
    '(1 + (x + y + 1)^2 * (19 - 14*x + 3*x^2 - 14*y + 6*x*y + 3*y^2))' +
    ' * (30 + (2*x - 3*y)^2 * (18 - 32*x + 12*x^2 + 48*y - 36*x*y + 27*y^2))',
  variables: ['x', 'y'],
  domain: [
    [-2, 2],
    [-2, 2],
  ],
  domainSource: `${SFU_LIBRARY} (goldpr page)`,
  view: [
    [-2, 2],
    [-2, 2],
  ],
  suggestedStart: [1, 1],
  knownPoints: [
    { point: [0, -1], value: 3, kind: 'global-min', source: `${SCIPY_GO_CITING_JY}; eigenvalues ${COMPUTED_IN_REFERENCE}`, hessianEigenvalues: [402.831012, 965.168988] },
    { point: [-0.6, -0.4], value: 30, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [447.917782, 4340.082218] },
    { point: [1.8, 0.2], value: 84, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [207.625967, 26216.374033] },
    { point: [1.2, 0.8], value: 840, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [2061.414393, 13202.585607] },
  ],
  source: `Goldstein & Price (1971), Mathematics of Computation 25; ${SCIPY_GO_CITING_JY}`,
  notes:
    'Values span 3 to about 1e6 in the domain: use a log colour scale (offset 3). One documentation page ' +
    'misprints the coefficient 48y as 4y. Large curvature (up to 2.6e4 at a local minimum) forces small learning rates.',
  logScaleOffset: 3,
};
