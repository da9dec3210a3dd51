import { COMPUTED_IN_REFERENCE, SCIPY_GO, SFU_LIBRARY } from './sources';
import type { CatalogueEntry, KnownPoint, PointKind } from './types';

/**
 * Styblinski-Tang (2-D): f(x, y) = g(x) + g(y) with g(t) = (t^4 - 16 t^2 + 5 t)/2.
 *
 * g'(t) = 2t^3 - 16t + 2.5 has three real roots; every pair of roots is a stationary point of f,
 * and the Hessian there is diag(g''(x), g''(y)) with g''(t) = 6t^2 - 16. The roots and values below
 * were computed for this catalogue with mpmath (40 digits, then rounded to float64); the global
 * minimum matches the published one.
 */
interface Root {
  t: number;
  g: number;
  curvature: number;
}

function root(t: number, g: number): Root {
  return { t, g, curvature: 6 * t * t - 16 };
}

const ROOTS = {
  /** The global 1-D minimiser. */
  low: root(-2.903534027771177, -39.166165703771415),
  /** The 1-D local maximiser. */
  middle: root(0.1567312567803401, 0.19561235905535807),
  /** The other 1-D minimiser. */
  high: root(2.746802770990837, -25.029446655283943),
};

const COMPUTED_HERE = 'computed for this catalogue (mpmath roots of 2t^3 - 16t + 2.5 = 0)';

function pair(p: Root, q: Root, kind: PointKind, source = COMPUTED_HERE): KnownPoint {
  const eig = [p.curvature, q.curvature].sort((u, v) => u - v);
  return { point: [p.t, q.t], value: p.g + q.g, kind, source, hessianEigenvalues: eig };
}

const { low, middle, high } = ROOTS;

export const styblinskiTang: CatalogueEntry = {
  id: 'styblinski-tang',
  label: 'Styblinski-Tang',
  formula: '0.5 * ((x^4 - 16*x^2 + 5*x) + (y^4 - 16*y^2 + 5*y))',
  variables: ['x', 'y'],
  domain: [
    [-5, 5],
    [-5, 5],
  ],
  domainSource: `${SCIPY_GO}; ${SFU_LIBRARY} (quoted)`,
  view: [
    [-5, 5],
    [-5, 5],
  ],
  suggestedStart: [0.5, 0.8],
  knownPoints: [
    {
      point: [low.t, low.t],
      value: -78.33233140754282,
      kind: 'global-min',
      source: `${SCIPY_GO} f = -39.16616570377142 n (n = 2), x = -2.903534018185960; location ${COMPUTED_IN_REFERENCE}`,
      hessianEigenvalues: [low.curvature, low.curvature],
    },
    pair(low, high, 'local-min'),
    pair(high, low, 'local-min'),
    pair(high, high, 'local-min'),
    pair(middle, middle, 'local-max'),
    pair(low, middle, 'saddle'),
    pair(middle, low, 'saddle'),
    pair(high, middle, 'saddle'),
    pair(middle, high, 'saddle'),
  ],
  source: `Styblinski & Tang (1990); formula with the factor 1/2 as in the ${SCIPY_GO} code and ${SFU_LIBRARY}`,
  notes:
    'Four minima at the corners of a square: the global one at (-2.9035, -2.9035), the others higher. ' +
    "Some copies omit the factor 1/2 (values double) or print the minimum as -39.16599 n (wrong). " +
    'The minimum value is negative: a log colour scale needs an offset.',
  logScaleOffset: -78.33233140754282,
};
