import { CLOSED_FORM, SCIPY_GO } from './sources';
import type { CatalogueEntry } from './types';

/**
 * Levy N.13: f(x, y) = sin^2(3 pi x) + (x - 1)^2 [1 + sin^2(3 pi y)] + (y - 1)^2 [1 + sin^2(2 pi y)],
 * global minimum f(1, 1) = 0 with Hessian diag(2 + 18 pi^2, 2).
 */
export const levy13: CatalogueEntry = {
  id: 'levy13',
  label: 'Levy N.13',
  formula: 'sin(3*pi*x)^2 + (x - 1)^2 * (1 + sin(3*pi*y)^2) + (y - 1)^2 * (1 + sin(2*pi*y)^2)',
  variables: ['x', 'y'],
  domain: [
    [-10, 10],
    [-10, 10],
  ],
  domainSource: SCIPY_GO,
  view: [
    [-3, 5],
    [-3, 5],
  ],
  suggestedStart: [-2, 3.5],
  knownPoints: [
    {
      point: [1, 1],
      value: 0,
      kind: 'global-min',
      source: `${SCIPY_GO} (Levy13), citing Mishra (2006), MPRA paper 2718; eigenvalues ${CLOSED_FORM}`,
      hessianEigenvalues: [2, 2 + 18 * Math.PI * Math.PI],
    },
  ],
  source: `Mishra (2006), "Some new test functions for global optimization and performance of repulsive particle swarm method", MPRA paper 2718; as in ${SCIPY_GO}`,
  notes: 'In float64, f(1, 1) evaluates to about 1.35e-31 (sin(3 pi) is not exactly 0). Many ripples along x.',
};
