import { CLOSED_FORM, SCIPY_GO, SCIPY_GO_CITING_JY } from './sources';
import type { CatalogueEntry } from './types';

/**
 * McCormick: f(x, y) = sin(x + y) + (x - y)^2 - 1.5x + 2.5y + 1.
 *
 * Stationary points in closed form (derived for this catalogue): grad f = 0 gives x - y = 1 and
 * cos(s) = -1/2 with s = x + y, so x = (s + 1)/2, y = (s - 1)/2 and f = sin(s) + s/2. The Hessian is
 * -sin(s) [[1, 1], [1, 1]] + 2 [[1, -1], [-1, 1]], with eigenvalues -2 sin(s) (along (1, 1)) and 4
 * (along (1, -1)): minima at s = -2pi/3 + 2 pi k, saddles at s = 2pi/3 + 2 pi k. In the usual box
 * lie s = -2pi/3 (the published global minimum), s = 4pi/3 (a local minimum) and s = 2pi/3 (a saddle).
 */
function stationary(s: number, kind: 'global-min' | 'local-min' | 'saddle', source: string) {
  const curvature = -2 * Math.sin(s);
  return {
    point: [(s + 1) / 2, (s - 1) / 2],
    value: Math.sin(s) + s / 2,
    kind,
    source,
    hessianEigenvalues: curvature < 4 ? [curvature, 4] : [4, curvature],
  };
}

export const mccormick: CatalogueEntry = {
  id: 'mccormick',
  label: 'McCormick',
  formula: 'sin(x + y) + (x - y)^2 - 1.5*x + 2.5*y + 1',
  variables: ['x', 'y'],
  domain: [
    [-1.5, 4],
    [-3, 4],
  ],
  domainSource: `${SCIPY_GO} docstring (its code uses y in [-3, 3])`,
  view: [
    [-1.5, 4],
    [-3, 4],
  ],
  suggestedStart: [3, 3.5],
  knownPoints: [
    stationary(
      (-2 * Math.PI) / 3,
      'global-min',
      `${SCIPY_GO_CITING_JY} (-0.5471975602214493, -1.547197559268372), f = -1.913222954981037; ${CLOSED_FORM} x = 1/2 - pi/3, y = -1/2 - pi/3`,
    ),
    stationary((4 * Math.PI) / 3, 'local-min', `${CLOSED_FORM} (derived for this catalogue; minimum within the box only)`),
    stationary((2 * Math.PI) / 3, 'saddle', `${CLOSED_FORM} (derived for this catalogue)`),
  ],
  source: SCIPY_GO_CITING_JY,
  notes:
    'Unbounded below on the plane: along x - y = 1, f = sin(x + y) + (x + y)/2 falls without limit as ' +
    'x + y -> -infinity, so the published minimum is a minimum only within the box; an unconstrained run ' +
    'started far away, or with a large learning rate, can run off to the lower left.',
  logScaleOffset: -Math.sqrt(3) / 2 - Math.PI / 3,
};
