import { symmetricEigenvalues2 } from './eigen2';
import { CLOSED_FORM, SCIPY_GO, SCIPY_GO_CITING_JY } from './sources';
import type { CatalogueEntry, KnownPointsRule } from './types';

/**
 * Rosenbrock's banana valley: f(x, y) = (a - x)^2 + b (y - x^2)^2, published with a = 1, b = 100
 * (Rosenbrock, Computer Journal 3, 1960). For b > 0 the only minimum is f(a, a^2) = 0, where the
 * Hessian is [[2 + 8 b a^2, -4 a b], [-4 a b, 2 b]] (differentiate twice and use y = x^2).
 */
export const rosenbrockPoints: KnownPointsRule = (c) => {
  const a = c.a;
  const b = c.b;
  if (!(b > 0)) return []; // b = 0 leaves a line of minima x = a; b < 0 is unbounded below.
  return [
    {
      point: [a, a * a],
      value: 0,
      kind: 'global-min',
      source: `${SCIPY_GO_CITING_JY} (in general (a, a^2)); eigenvalues ${CLOSED_FORM}`,
      hessianEigenvalues: symmetricEigenvalues2(2 + 8 * b * a * a, -4 * a * b, 2 * b),
    },
  ];
};

const defaults = { a: 1, b: 100 };

export const rosenbrock: CatalogueEntry = {
  id: 'rosenbrock',
  label: 'Rosenbrock',
  formula: '(a - x)^2 + b * (y - x^2)^2',
  variables: ['x', 'y'],
  constants: defaults,
  constantInfo: [
    { name: 'a', label: 'a (minimum at (a, a^2))', min: -2, max: 2, step: 0.1 },
    { name: 'b', label: 'b (valley steepness)', min: 1, max: 200, step: 1 },
  ],
  domain: [
    [-5, 10],
    [-5, 10],
  ],
  domainSource: `Surjanovic & Bingham (quoted); ${SCIPY_GO} uses [-30, 30] with a [-2, 2] plotting box`,
  view: [
    [-2, 2],
    [-1, 3],
  ],
  suggestedStart: [-1.2, 1],
  knownPoints: rosenbrockPoints(defaults),
  source: `Rosenbrock (1960), The Computer Journal 3(3); minimum from ${SCIPY_GO_CITING_JY}`,
  notes:
    'A long curved valley along y = x^2: descent finds the valley quickly and then crawls along it. ' +
    'Hessian condition number at the minimum is about 2508 for a = 1, b = 100. ' +
    'The classical start (-1.2, 1) (Rosenbrock 1960) has f = 24.2.',
};
