import { columnIndex, datasetKey, datasetTable, LruCache, type DataTable, type DatasetSpec } from '../datasets';

/**
 * The numbers a model is fitted to: the input columns as a row-major N x p matrix (standardised when
 * asked) and the target column, each a Float64Array, so the loss loops read typed memory only.
 * Standardisation: z_ij = (x_ij - mean_j) / sd_j with the sample standard deviation
 * sd_j = sqrt(sum_i (x_ij - mean_j)^2 / (N - 1)).
 */
export interface Design {
  readonly key: string;
  readonly table: DataTable;
  readonly inputs: readonly string[];
  readonly target: string;
  readonly rows: number;
  /** Number of input columns p. */
  readonly p: number;
  /** x[i * p + j]: row i, input j (standardised when `standardised`). */
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly standardised: boolean;
  /** Mean and sample standard deviation of each raw input column (computed either way). */
  readonly means: Float64Array;
  readonly sds: Float64Array;
  readonly targetMean: number;
  readonly targetSd: number;
}

const DESIGNS = new LruCache<Design>(16);

/** The design for these columns of this dataset, from the cache when built before. */
export function designFor(dataset: DatasetSpec, inputs: readonly string[], target: string, standardise: boolean): Design {
  const key = `${datasetKey(dataset)}|${JSON.stringify(inputs)}|${JSON.stringify(target)}|${standardise ? 's' : 'r'}`;
  return DESIGNS.getOrMake(key, () => buildDesign(key, datasetTable(dataset), inputs, target, standardise));
}

function meanAndSd(values: Float64Array, stride: number, offset: number, n: number): [number, number] {
  let mean = 0;
  for (let i = 0; i < n; i++) mean += values[i * stride + offset];
  mean /= n;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const d = values[i * stride + offset] - mean;
    ss += d * d;
  }
  return [mean, n > 1 ? Math.sqrt(ss / (n - 1)) : 0];
}

export function buildDesign(key: string, table: DataTable, inputs: readonly string[], target: string, standardise: boolean): Design {
  if (inputs.length === 0) throw new Error(`dataset ${table.name}: the model needs at least one input column`);
  if (new Set(inputs).size !== inputs.length) throw new Error(`dataset ${table.name}: an input column is listed twice (${inputs.join(', ')})`);
  const cols = inputs.map((c) => columnIndex(table, c, 'input'));
  const t = columnIndex(table, target, 'target');
  if (inputs.includes(target)) throw new Error(`dataset ${table.name}: column '${target}' cannot be both an input and the target`);
  const n = table.rows;
  const m = table.columns.length;
  const p = inputs.length;
  if (n < 1) throw new Error(`dataset ${table.name}: no rows`);
  const means = new Float64Array(p);
  const sds = new Float64Array(p);
  cols.forEach((c, j) => ([means[j], sds[j]] = meanAndSd(table.values, m, c, n)));
  if (standardise) {
    if (n < 2) throw new Error(`dataset ${table.name}: standardising needs at least 2 rows`);
    inputs.forEach((c, j) => {
      if (!(sds[j] > 0)) throw new Error(`dataset ${table.name}: input column '${c}' is constant, so it cannot be standardised`);
    });
  }
  const x = new Float64Array(n * p);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) {
      const v = table.values[i * m + cols[j]];
      x[i * p + j] = standardise ? (v - means[j]) / sds[j] : v;
    }
    y[i] = table.values[i * m + t];
  }
  const [targetMean, targetSd] = meanAndSd(y, 1, 0, n);
  return Object.freeze({ key, table, inputs: Object.freeze([...inputs]), target, rows: n, p, x, y, standardised: standardise, means, sds, targetMean, targetSd });
}
