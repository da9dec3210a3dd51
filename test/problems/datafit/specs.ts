import type { DataFitSpec, DatasetSpec, DemoDatasetId, DemoDatasetSpec, ModelSpec } from '../../../src/problems';

/** A data-fit spec: this model fitted to this dataset, with the optional penalty and standardisation. */
function fit(dataset: DatasetSpec, model: ModelSpec, options: Pick<DataFitSpec, 'l2' | 'standardise'> = {}): DataFitSpec {
  return { kind: 'datafit', dataset, model, ...options };
}

/** The first `rows` rows of a made-up demo dataset (default seed). */
function demo(id: DemoDatasetId, rows: number): DemoDatasetSpec {
  return { kind: 'demo', id, rows };
}

/** Small data-fit specs covering every model, head and option, shared by the data-fit tests. */
export const SPECS: Record<string, DataFitSpec> = {
  'linear rss': fit(demo('probe-calibration', 30), { kind: 'linear', inputs: ['flow'], target: 'signal', loss: 'rss' }),
  'linear mse, 2 inputs, l2, standardised': fit(
    demo('seed-pods', 40),
    { kind: 'linear', inputs: ['length_mm', 'mass_g'], target: 'ripe', loss: 'mse' },
    { l2: 0.3, standardise: true },
  ),
  'logistic, l2, standardised': fit(demo('seed-pods', 40), { kind: 'logistic', inputs: ['length_mm', 'mass_g'], target: 'ripe' }, { l2: 0.1, standardise: true }),
  'logistic, raw inputs': fit(demo('wave-boundary', 40), { kind: 'logistic', inputs: ['u', 'v'], target: 'kind' }),
  'softmax, l2, standardised': fit(demo('pebbles', 30), { kind: 'softmax', inputs: ['roundness', 'density'], target: 'beach' }, { l2: 0.05, standardise: true }),
  'softmax on iris': fit({ kind: 'iris' }, { kind: 'softmax', inputs: ['sepal_length', 'petal_width'], target: 'species' }),
  'mlp tanh binary': fit(
    demo('wave-boundary', 30),
    { kind: 'mlp', inputs: ['u', 'v'], target: 'kind', hidden: [3], activation: 'tanh', head: 'binary' },
    { l2: 0.01 },
  ),
  'mlp tanh 2 layers softmax': fit(
    demo('pebbles', 24),
    { kind: 'mlp', inputs: ['roundness', 'density'], target: 'beach', hidden: [3, 2], activation: 'tanh', head: 'softmax' },
    { standardise: true },
  ),
  'mlp relu regression': fit(
    demo('probe-calibration', 25),
    { kind: 'mlp', inputs: ['flow'], target: 'signal', hidden: [4], activation: 'relu', head: 'regression' },
    { standardise: true, l2: 0.02 },
  ),
  'mlp relu 2 layers binary': fit(
    demo('seed-pods', 20),
    { kind: 'mlp', inputs: ['length_mm', 'mass_g'], target: 'ripe', hidden: [3, 3], activation: 'relu', head: 'binary' },
    { standardise: true },
  ),
  'formula mse, l2': fit(
    demo('probe-calibration', 30),
    { kind: 'formula', text: 'b1 * (1 - exp(-b2 * f))', parameters: ['b1', 'b2'], inputs: ['flow'], inputNames: ['f'], target: 'signal' },
    { l2: 0.01 },
  ),
  'formula rss with a constant': fit(demo('probe-calibration', 20), {
    kind: 'formula',
    text: 'a + b * flow^k',
    parameters: ['a', 'b'],
    inputs: ['flow'],
    target: 'signal',
    constants: { k: 0.5 },
    loss: 'rss',
  }),
};
