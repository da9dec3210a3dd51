import { SCIPY_GO, SFU_LIBRARY } from './sources';
import type { CatalogueEntry, KnownPointsRule } from './types';

/**
 * Ackley (2-D): f(x, y) = -a exp(-b sqrt((x^2 + y^2)/2)) - exp((cos(c x) + cos(c y))/2) + a + e,
 * published with a = 20, b = 0.2, c = 2 pi (Ackley 1987). For a > 0 and b > 0 each term is bounded
 * below by its value at the origin, so f(0, 0) = 0 is the unique global minimum. The sqrt makes f a
 * cone at the origin: there the gradient and Hessian do not exist, so no eigenvalues are listed.
 */
export const ackleyPoints: KnownPointsRule = (c) => {
  if (!(c.a > 0 && c.b > 0)) return [];
  return [
    {
      point: [0, 0],
      value: 0,
      kind: 'global-min',
      source: `${SFU_LIBRARY}; ${SCIPY_GO} (Ackley01)`,
    },
  ];
};

const defaults = { a: 20, b: 0.2, c: 2 * Math.PI };

export const ackley: CatalogueEntry = {
  id: 'ackley',
  label: 'Ackley',
  formula: '-a * exp(-b * sqrt((x^2 + y^2) / 2)) - exp((cos(c*x) + cos(c*y)) / 2) + a + e',
  variables: ['x', 'y'],
  constants: defaults,
  constantInfo: [
    { name: 'a', label: 'a (depth of the funnel)', min: 0.5, max: 40, step: 0.5 },
    { name: 'b', label: 'b (funnel decay)', min: 0.05, max: 1, step: 0.05 },
    { name: 'c', label: 'c (ripple frequency)', min: 0, max: 4 * Math.PI, step: 0.1 },
  ],
  domain: [
    [-32.768, 32.768],
    [-32.768, 32.768],
  ],
  domainSource: `${SFU_LIBRARY} (quoted); ${SCIPY_GO} uses [-35, 35]`,
  view: [
    [-5, 5],
    [-5, 5],
  ],
  suggestedStart: [2.6, -1.7],
  knownPoints: ackleyPoints(defaults),
  source: `Ackley (1987), A Connectionist Machine for Genetic Hillclimbing; defaults from ${SFU_LIBRARY}`,
  notes:
    'Not differentiable at the minimum (a cone tip at the origin): the gradient there is undefined, ' +
    'so gradient-norm stopping rules cannot fire exactly at it. In float64, f(0, 0) evaluates to about ' +
    '4.4e-16, not 0. Jamil & Yang print the factor b as 0.02 (a misprint noted by SciPy).',
};
