import type { DataFitSpec } from '../../../src/problems';

/** Small data-fit specs covering every model, head and option, shared by the data-fit tests. */
export const SPECS: Record<string, DataFitSpec> = {
  'linear rss': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'probe-calibration', rows: 30 },
    model: { kind: 'linear', inputs: ['flow'], target: 'signal', loss: 'rss' },
  },
  'linear mse, 2 inputs, l2, standardised': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'seed-pods', rows: 40 },
    model: { kind: 'linear', inputs: ['length_mm', 'mass_g'], target: 'ripe', loss: 'mse' },
    l2: 0.3,
    standardise: true,
  },
  'logistic, l2, standardised': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'seed-pods', rows: 40 },
    model: { kind: 'logistic', inputs: ['length_mm', 'mass_g'], target: 'ripe' },
    l2: 0.1,
    standardise: true,
  },
  'logistic, raw inputs': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'wave-boundary', rows: 40 },
    model: { kind: 'logistic', inputs: ['u', 'v'], target: 'kind' },
  },
  'softmax, l2, standardised': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'pebbles', rows: 30 },
    model: { kind: 'softmax', inputs: ['roundness', 'density'], target: 'beach' },
    l2: 0.05,
    standardise: true,
  },
  'softmax on iris': {
    kind: 'datafit',
    dataset: { kind: 'iris' },
    model: { kind: 'softmax', inputs: ['sepal_length', 'petal_width'], target: 'species' },
  },
  'mlp tanh binary': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'wave-boundary', rows: 30 },
    model: { kind: 'mlp', inputs: ['u', 'v'], target: 'kind', hidden: [3], activation: 'tanh', head: 'binary' },
    l2: 0.01,
  },
  'mlp tanh 2 layers softmax': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'pebbles', rows: 24 },
    model: { kind: 'mlp', inputs: ['roundness', 'density'], target: 'beach', hidden: [3, 2], activation: 'tanh', head: 'softmax' },
    standardise: true,
  },
  'mlp relu regression': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'probe-calibration', rows: 25 },
    model: { kind: 'mlp', inputs: ['flow'], target: 'signal', hidden: [4], activation: 'relu', head: 'regression' },
    standardise: true,
    l2: 0.02,
  },
  'mlp relu 2 layers binary': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'seed-pods', rows: 20 },
    model: { kind: 'mlp', inputs: ['length_mm', 'mass_g'], target: 'ripe', hidden: [3, 3], activation: 'relu', head: 'binary' },
    standardise: true,
  },
  'formula mse, l2': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'probe-calibration', rows: 30 },
    model: { kind: 'formula', text: 'b1 * (1 - exp(-b2 * f))', parameters: ['b1', 'b2'], inputs: ['flow'], inputNames: ['f'], target: 'signal' },
    l2: 0.01,
  },
  'formula rss with a constant': {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'probe-calibration', rows: 20 },
    model: { kind: 'formula', text: 'a + b * flow^k', parameters: ['a', 'b'], inputs: ['flow'], target: 'signal', constants: { k: 0.5 }, loss: 'rss' },
  },
};
