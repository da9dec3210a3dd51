import { CLOSED_FORM, SCIPY_GO_CITING_JY } from './sources';
import type { CatalogueEntry } from './types';

/**
 * Matyas: f(x, y) = 0.26 (x^2 + y^2) - 0.48 x y, a convex quadratic with Hessian
 * [[0.52, -0.48], [-0.48, 0.52]] (eigenvalues 0.04 and 1, condition number 25), minimum f(0, 0) = 0.
 */
export const matyas: CatalogueEntry = {
  id: 'matyas',
  label: 'Matyas',
  formula: '0.26 * (x^2 + y^2) - 0.48 * x * y',
  variables: ['x', 'y'],
  domain: [
    [-10, 10],
    [-10, 10],
  ],
  domainSource: SCIPY_GO_CITING_JY,
  view: [
    [-10, 10],
    [-10, 10],
  ],
  suggestedStart: [8, 3],
  knownPoints: [
    { point: [0, 0], value: 0, kind: 'global-min', source: `${SCIPY_GO_CITING_JY}; eigenvalues ${CLOSED_FORM}`, hessianEigenvalues: [0.04, 1] },
  ],
  source: SCIPY_GO_CITING_JY,
  notes: 'A flat, diagonal valley along y = x (curvature 0.04 along it, 1 across it): slow for plain descent.',
};
