import { CLOSED_FORM, SCIPY_GO } from './sources';
import type { CatalogueEntry, KnownPointsRule } from './types';

/**
 * Rastrigin (2-D): f(x, y) = 2A + [x^2 - A cos(2 pi x)] + [y^2 - A cos(2 pi y)], published with A = 10.
 * For A >= 0, f >= x^2 + y^2, so f(0, 0) = 0 is the unique global minimum; the Hessian there is
 * (2 + 4 pi^2 A) I.
 */
export const rastriginPoints: KnownPointsRule = (c) => {
  const A = c.A;
  if (!(A >= 0)) return []; // A < 0 turns the ripples upside down and the origin into a local maximum.
  const curvature = 2 + 4 * Math.PI * Math.PI * A;
  return [
    {
      point: [0, 0],
      value: 0,
      kind: 'global-min',
      source: `${SCIPY_GO}; eigenvalues ${CLOSED_FORM}`,
      hessianEigenvalues: [curvature, curvature],
    },
  ];
};

const defaults = { A: 10 };

export const rastrigin: CatalogueEntry = {
  id: 'rastrigin',
  label: 'Rastrigin',
  formula: '2*A + (x^2 - A*cos(2*pi*x)) + (y^2 - A*cos(2*pi*y))',
  variables: ['x', 'y'],
  constants: defaults,
  constantInfo: [{ name: 'A', label: 'A (ripple height)', min: 0, max: 40, step: 0.5 }],
  domain: [
    [-5.12, 5.12],
    [-5.12, 5.12],
  ],
  domainSource: SCIPY_GO,
  view: [
    [-5.12, 5.12],
    [-5.12, 5.12],
  ],
  suggestedStart: [3.3, -2.6],
  knownPoints: rastriginPoints(defaults),
  source: `Rastrigin (1974); formula as in the ${SCIPY_GO} code (2A + sum, A = 10)`,
  notes:
    'A local minimum near every integer lattice point: descent stops in the nearest one. ' +
    "SciPy's docstring prints the sum as a product; the code (and this formula) adds 10n.",
};
