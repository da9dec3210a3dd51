import {
  DEMO_DATASETS,
  IRIS_COLUMNS,
  datasetTable,
  nistModelSpec,
  type DataFitSpec,
  type DatasetSpec,
  type ModelKind,
  type ModelSpec,
  type TableDatasetSpec,
} from '../../../problems';

/** What the data-fit editor holds while the user composes a spec (plain data; nothing applied yet). */
export interface DataFitDraft {
  dataset: DatasetSpec;
  inputs: string[];
  target: string;
  model: ModelKind;
  loss: 'rss' | 'mse';
  hidden: string;
  activation: 'tanh' | 'relu';
  head: 'regression' | 'binary' | 'softmax';
  formula: string;
  parameters: string;
  start: string;
  l2: number | undefined;
  standardise: boolean;
}

/** Columns and the defaults a dataset suggests (its first model). */
export function datasetColumns(dataset: DatasetSpec): { columns: string[]; inputs: string[]; target: string } {
  if (dataset.kind === 'demo') {
    const d = DEMO_DATASETS[dataset.id];
    return { columns: [...d.columns], inputs: [...d.defaultInputs], target: d.defaultTarget };
  }
  if (dataset.kind === 'iris') return { columns: [...IRIS_COLUMNS], inputs: ['petal_length', 'petal_width'], target: 'species' };
  if (dataset.kind === 'nist') {
    const m = nistModelSpec(dataset.id);
    return { columns: [...datasetTable(dataset).columns], inputs: [...m.inputs], target: m.target };
  }
  return { columns: [...dataset.columns], inputs: dataset.columns.slice(0, -1), target: dataset.columns[dataset.columns.length - 1] };
}

/** Classes of a dataset's column: the count of its category labels, 0 for a numeric column. */
export function classCount(dataset: DatasetSpec, column: string): number {
  if (dataset.kind === 'demo') return DEMO_DATASETS[dataset.id].categories?.[column]?.length ?? 0;
  if (dataset.kind === 'iris') return column === 'species' ? 3 : 0;
  if (dataset.kind === 'table') return dataset.categories?.[column]?.length ?? 0;
  return 0;
}

/** A network's output for a target: two classes a logistic (cross-entropy) head, more a softmax one, numbers a regression. */
export function headFor(dataset: DatasetSpec, target: string): DataFitDraft['head'] {
  const k = classCount(dataset, target);
  return k === 0 ? 'regression' : k === 2 ? 'binary' : 'softmax';
}

export function draftFor(dataset: DatasetSpec): DataFitDraft {
  const { inputs, target } = datasetColumns(dataset);
  const base: DataFitDraft = {
    dataset,
    inputs,
    target,
    model: 'linear',
    loss: 'mse',
    hidden: '6',
    activation: 'tanh',
    head: headFor(dataset, target),
    formula: `b1 * (1 - exp(-b2 * ${formulaName(inputs[0])}))`,
    parameters: 'b1, b2',
    start: '',
    l2: undefined,
    standardise: false,
  };
  if (dataset.kind === 'nist') {
    const m = nistModelSpec(dataset.id);
    if (m.kind === 'formula') return { ...base, model: 'formula', loss: 'rss', formula: m.text, parameters: m.parameters.join(', '), start: (m.start ?? []).join(', ') };
    return { ...base, loss: 'rss', standardise: dataset.id === 'longley' };
  }
  if (dataset.kind === 'demo' && DEMO_DATASETS[dataset.id].categories) {
    const classes = DEMO_DATASETS[dataset.id].categories![target]?.length ?? 2;
    return { ...base, model: classes > 2 ? 'softmax' : 'logistic', standardise: true };
  }
  if (dataset.kind === 'iris') return { ...base, model: 'softmax', standardise: true };
  // Demo regression data start standardised: the raw inputs span up to 150 units, which puts a plain
  // descent run's default step far beyond 2 / lambda_max (untick it to see exactly that).
  if (dataset.kind === 'demo') return { ...base, standardise: true };
  return base;
}

/** A column as it is written in a model formula: its own name when that is a formula name. */
function formulaName(column: string | undefined): string {
  return column !== undefined && /^[A-Za-z_][A-Za-z0-9_]*$/.test(column) ? column : 'x';
}

/** A draft as a spec, or the message for the field that is wrong. */
export function specOfDraft(d: DataFitDraft): { spec: DataFitSpec } | { field: keyof DataFitDraft; message: string } {
  if (d.inputs.length === 0) return { field: 'inputs', message: 'inputs: choose at least one input column' };
  if (d.inputs.includes(d.target)) return { field: 'target', message: `target: ${d.target} is also chosen as an input` };
  let model: ModelSpec;
  const cols = { inputs: d.inputs, target: d.target };
  switch (d.model) {
    case 'linear':
      model = { kind: 'linear', ...cols, loss: d.loss };
      break;
    case 'logistic':
      model = { kind: 'logistic', ...cols };
      break;
    case 'softmax':
      model = { kind: 'softmax', ...cols };
      break;
    case 'mlp': {
      const hidden = d.hidden.split(/[,\s]+/).filter(Boolean).map(Number);
      if (!hidden.length || hidden.some((h) => !Number.isInteger(h) || h < 1)) return { field: 'hidden', message: `Hidden widths: must be whole numbers like "8" or "8, 4", got "${d.hidden}"` };
      model = { kind: 'mlp', ...cols, hidden, activation: d.activation, head: d.head };
      break;
    }
    case 'formula': {
      const parameters = d.parameters.split(',').map((p) => p.trim()).filter(Boolean);
      if (!parameters.length) return { field: 'parameters', message: 'parameters: name the fitted parameters, e.g. "b1, b2"' };
      const start = d.start.trim() ? d.start.split(/[,\s]+/).filter(Boolean).map(Number) : undefined;
      if (start && (start.length !== parameters.length || start.some((v) => !Number.isFinite(v))))
        return { field: 'start', message: `start: give ${parameters.length} numbers, one per parameter (${parameters.join(', ')})` };
      model = { kind: 'formula', ...cols, text: d.formula, parameters, loss: d.loss, ...(start ? { start } : {}) };
      break;
    }
  }
  const spec: DataFitSpec = { kind: 'datafit', dataset: d.dataset, model };
  if (d.l2 !== undefined) spec.l2 = d.l2;
  if (d.standardise && d.model !== 'formula') spec.standardise = true;
  return { spec };
}

export function tableLabel(t: TableDatasetSpec): string {
  return `${t.name} (${t.rows.length} rows, imported)`;
}
