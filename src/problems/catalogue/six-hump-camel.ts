import { COMPUTED_IN_REFERENCE, SCIPY_GO, SFU_LIBRARY } from './sources';
import type { CatalogueEntry } from './types';

/** Value published by SciPy; location digits refined in the reference file (SciPy's are off by ~1e-9). */
const GLOBAL_SOURCE = `${SCIPY_GO} f = -1.031628453489877; location ${COMPUTED_IN_REFERENCE}`;
const LOCAL_SOURCE = `${COMPUTED_IN_REFERENCE}; ${SFU_LIBRARY} states six local minima, two global`;

/**
 * Six-hump camel: f(x, y) = (4 - 2.1x^2 + x^4/3) x^2 + x y + (-4 + 4y^2) y^2. Six minima, two of them
 * global with f = -1.0316284534898774, symmetric under (x, y) -> (-x, -y).
 */
export const sixHumpCamel: CatalogueEntry = {
  id: 'six-hump-camel',
  label: 'Six-hump camel',
  formula: '(4 - 2.1*x^2 + x^4/3) * x^2 + x*y + (-4 + 4*y^2) * y^2',
  variables: ['x', 'y'],
  domain: [
    [-3, 3],
    [-2, 2],
  ],
  domainSource: `${SFU_LIBRARY} (camel6 page); ${SCIPY_GO} uses [-5, 5]^2`,
  view: [
    [-2, 2],
    [-1.2, 1.2],
  ],
  suggestedStart: [-1.5, -1],
  knownPoints: [
    { point: [0.08984201310031806, -0.7126564030207396], value: -1.0316284534898774, kind: 'global-min', source: GLOBAL_SOURCE, hessianEigenvalues: [7.682251, 16.493195] },
    { point: [-0.08984201310031806, 0.7126564030207396], value: -1.0316284534898774, kind: 'global-min', source: GLOBAL_SOURCE, hessianEigenvalues: [7.682251, 16.493195] },
    { point: [-1.703606714969981, 0.7960835686726251], value: -0.21546382438371764, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [18.817139, 22.697515] },
    { point: [1.703606714969981, -0.7960835686726251], value: -0.21546382438371764, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [18.817139, 22.697515] },
    { point: [1.6071047529201972, 0.5686514548841314], value: 2.1042503103112584, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [7.121512, 10.021603] },
    { point: [-1.6071047529201972, -0.5686514548841314], value: 2.1042503103112584, kind: 'local-min', source: LOCAL_SOURCE, hessianEigenvalues: [7.121512, 10.021603] },
  ],
  source: `${SCIPY_GO}; ${SFU_LIBRARY} (camel6), citing Molga & Smutnicki (2005)`,
  notes:
    'The minimum value is negative: a log colour scale needs an offset. The commonly quoted ' +
    '4-digit minima (+/-0.0898, -/+0.7126), f = -1.0316, are rounded.',
  logScaleOffset: -1.0316284534898774,
};
