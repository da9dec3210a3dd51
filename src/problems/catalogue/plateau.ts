import { CLOSED_FORM } from './sources';
import type { CatalogueEntry, KnownPointsRule } from './types';

/**
 * Plateau (own design): f(x, y) = tanh(q / w^2) with q = (x - 1)^2 + 4 (y - 0.5)^2.
 *
 * Near the basin tanh(s) ~ s, a bowl; far away f -> 1 and the gradient sech^2(q / w^2) grad(q) / w^2
 * decays like 4 exp(-2q / w^2) |grad q| / w^2, a wide nearly flat region. tanh is increasing and q has one
 * minimum, so the only stationary point is the global minimum f(1, 0.5) = 0; since tanh'(0) = 1 and
 * tanh''(0) = 0 the Hessian there is diag(2, 8) / w^2 (closed form). At the suggested start (-2.5, 2)
 * with w = 2 the gradient norm is about 3.4e-4: plain descent barely moves while sign-like updates do.
 */
export const plateauPoints: KnownPointsRule = (c) => {
  const w2 = c.w * c.w;
  if (!(w2 > 0) || !Number.isFinite(w2)) return [];
  return [{ point: [1, 0.5], value: 0, kind: 'global-min', source: `own design; ${CLOSED_FORM}`, hessianEigenvalues: [2 / w2, 8 / w2] }];
};

const defaults = { w: 2 };

export const plateau: CatalogueEntry = {
  id: 'plateau',
  label: 'Plateau',
  formula: 'tanh(((x - 1)^2 + 4*(y - 0.5)^2) / w^2)',
  variables: ['x', 'y'],
  constants: defaults,
  constantInfo: [{ name: 'w', label: 'w (basin width)', min: 0.5, max: 5, step: 0.1 }],
  domain: [
    [-10, 10],
    [-10, 10],
  ],
  domainSource: 'own choice',
  view: [
    [-4, 6],
    [-4.5, 5.5],
  ],
  suggestedStart: [-2.5, 2],
  knownPoints: plateauPoints(defaults),
  source: `own design; minimum in ${CLOSED_FORM}`,
  notes:
    'Values lie in [0, 1). Outside an ellipse of a few w the surface is flat to many digits: gradient-norm ' +
    'stopping rules can report convergence on the plateau, far from the minimum.',
};
