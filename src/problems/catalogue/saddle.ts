import { CLOSED_FORM } from './sources';
import type { CatalogueEntry } from './types';

/**
 * A pure saddle: f(x, y) = x^2 - y^2, one stationary point at the origin with Hessian diag(2, -2).
 * Unbounded below along y: there is no minimum at all.
 */
export const saddle: CatalogueEntry = {
  id: 'saddle',
  label: 'Saddle',
  formula: 'x^2 - y^2',
  variables: ['x', 'y'],
  domain: [
    [-2, 2],
    [-2, 2],
  ],
  domainSource: 'own choice',
  view: [
    [-2, 2],
    [-2, 2],
  ],
  suggestedStart: [1.8, 0.01],
  knownPoints: [{ point: [0, 0], value: 0, kind: 'saddle', source: CLOSED_FORM, hessianEigenvalues: [-2, 2] }],
  source: `textbook example; stationary point in ${CLOSED_FORM}`,
  notes:
    'Unbounded below (f -> -infinity as |y| grows), so every run that leaves y = 0 eventually diverges; ' +
    'no log colour scale is possible. Started on y = 0 exactly, gradient descent converges to the saddle; ' +
    'from a tiny y offset it first approaches the saddle and then escapes at a rate that grows like (1 + 2 lr)^t.',
};
