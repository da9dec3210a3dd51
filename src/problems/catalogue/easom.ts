import { CLOSED_FORM, SCIPY_GO } from './sources';
import type { CatalogueEntry } from './types';

/**
 * Easom: f(x, y) = -cos(x) cos(y) exp(-((x - pi)^2 + (y - pi)^2)), global minimum f(pi, pi) = -1 with
 * Hessian 3 I (expand to second order in u = x - pi, v = y - pi: f = -1 + 1.5 (u^2 + v^2) + ...).
 */
export const easom: CatalogueEntry = {
  id: 'easom',
  label: 'Easom',
  formula: '-cos(x) * cos(y) * exp(-((x - pi)^2 + (y - pi)^2))',
  variables: ['x', 'y'],
  domain: [
    [-100, 100],
    [-100, 100],
  ],
  domainSource: SCIPY_GO,
  view: [
    [-1, 7],
    [-1, 7],
  ],
  suggestedStart: [2.2, 3.9],
  knownPoints: [
    { point: [Math.PI, Math.PI], value: -1, kind: 'global-min', source: `${SCIPY_GO} (code; its docstring shows another formula); eigenvalues ${CLOSED_FORM}`, hessianEigenvalues: [3, 3] },
  ],
  source: `Easom (1990); formula as in the ${SCIPY_GO} code`,
  notes:
    'A needle: f is about 0 everywhere except a small well around (pi, pi), so gradients vanish a few ' +
    'units away and descent started outside the well does not move.',
  logScaleOffset: -1,
};
