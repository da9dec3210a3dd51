import { CLOSED_FORM } from './sources';
import type { CatalogueEntry, KnownPointsRule } from './types';

/**
 * Quadratic bowls with a chosen condition number and orientation (own family, common practice for
 * studying conditioning):
 *
 *   f(x, y) = u^2 + kappa v^2,  u = cos(t) x + sin(t) y,  v = cos(t) y - sin(t) x,  t = angle * pi/180.
 *
 * (u, v) are the coordinates rotated by `angle` degrees, so the Hessian is 2 R^T diag(1, kappa) R with
 * eigenvalues 2 and 2 kappa for every angle: kappa is the condition number, the minimum f(0, 0) = 0.
 * With angle = 0 and kappa = 10 this is x^2 + 10 y^2, the bowl of the standard worked examples.
 * Fixed-step gradient descent converges iff 0 < lr < 2 / lambda_max = 1 / max(1, kappa); the best fixed
 * step 2/(lambda_min + lambda_max) contracts the error by (kappa - 1)/(kappa + 1) per step (textbook fact,
 * e.g. Nesterov 2004, Thm 2.1.15).
 */
export const QUADRATIC_FORMULA =
  '(cos(angle*pi/180)*x + sin(angle*pi/180)*y)^2 + kappa*(cos(angle*pi/180)*y - sin(angle*pi/180)*x)^2';

export const quadraticPoints: KnownPointsRule = (c) => {
  const kappa = c.kappa;
  if (kappa === 0 || !Number.isFinite(kappa)) return []; // kappa = 0: a line of minima, no isolated point.
  const eig = [Math.min(2, 2 * kappa), Math.max(2, 2 * kappa)];
  return [{ point: [0, 0], value: 0, kind: kappa > 0 ? 'global-min' : 'saddle', source: CLOSED_FORM, hessianEigenvalues: eig }];
};

const constantInfo = [
  { name: 'kappa', label: 'condition number kappa', min: 1, max: 1000, step: 1 },
  { name: 'angle', label: 'rotation (degrees)', min: 0, max: 180, step: 1 },
];

const quadraticNotes =
  'Hessian eigenvalues 2 and 2 kappa at every point. Plain gradient descent is stable iff lr < 1/kappa ' +
  '(for kappa >= 1) and zigzags across the narrow direction near that limit.';

const axisDefaults = { kappa: 10, angle: 0 };

export const quadratic: CatalogueEntry = {
  id: 'quadratic',
  label: 'Quadratic bowl',
  formula: QUADRATIC_FORMULA,
  variables: ['x', 'y'],
  constants: axisDefaults,
  constantInfo,
  domain: [
    [-5, 5],
    [-5, 5],
  ],
  domainSource: 'own choice (the bowl has no published domain)',
  view: [
    [-2, 2],
    [-2, 2],
  ],
  suggestedStart: [1, 1],
  knownPoints: quadraticPoints(axisDefaults),
  source: `own family; minimum and eigenvalues in ${CLOSED_FORM}`,
  notes: `Axis-aligned by default (x^2 + 10 y^2). ${quadraticNotes}`,
};

const rotatedDefaults = { kappa: 50, angle: 30 };

export const rotatedQuadratic: CatalogueEntry = {
  ...quadratic,
  id: 'rotated-quadratic',
  label: 'Rotated quadratic bowl',
  constants: rotatedDefaults,
  suggestedStart: [-1.5, 1],
  knownPoints: quadraticPoints(rotatedDefaults),
  notes:
    `Rotated 30 degrees with condition number 50, so the narrow direction mixes x and y and ` +
    `per-coordinate methods (AdaGrad, RMSProp, Adam) lose their axis-aligned advantage. ${quadraticNotes}`,
};
