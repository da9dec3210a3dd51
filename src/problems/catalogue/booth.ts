import { CLOSED_FORM } from './sources';
import type { CatalogueEntry } from './types';

/**
 * Booth's function: f(x, y) = (x + 2y - 7)^2 + (2x + y - 5)^2, a convex quadratic with constant
 * Hessian [[10, 8], [8, 10]] (eigenvalues 2 and 18) and minimum f(1, 3) = 0.
 */
export const booth: CatalogueEntry = {
  id: 'booth',
  label: 'Booth',
  formula: '(x + 2*y - 7)^2 + (2*x + y - 5)^2',
  variables: ['x', 'y'],
  domain: [
    [-10, 10],
    [-10, 10],
  ],
  domainSource: 'SciPy benchmarks/test_functions.py',
  view: [
    [-10, 10],
    [-10, 10],
  ],
  suggestedStart: [-6, -6],
  knownPoints: [
    {
      point: [1, 3],
      value: 0,
      kind: 'global-min',
      source: `SciPy benchmarks/test_functions.py; eigenvalues ${CLOSED_FORM}`,
      hessianEigenvalues: [2, 18],
    },
  ],
  source: 'SciPy benchmarks/test_functions.py (Booth)',
  notes: 'A rotated quadratic bowl with condition number 9: plain gradient descent converges iff lr < 2/18.',
};
