import { parseFormula, sameTree } from '../../engine';
import { nistFile, type NistDatasetId } from '../datasets';
import type { DataFitSpec, ModelSpec } from './spec';

/**
 * The model each NIST StRD set certifies, as a model spec: linear sets are linear regressions of y on
 * x (or x1..x6) with the residual sum of squares; nonlinear sets are formula models, the file's model
 * line with its square brackets turned into parentheses, fitted by RSS from the file's Start 1.
 */
export function nistModelSpec(id: NistDatasetId): ModelSpec {
  const file = nistFile(id);
  const [target, ...inputs] = file.columns;
  if (file.procedure === 'linear') return { kind: 'linear', inputs, target, loss: 'rss' };
  return { kind: 'formula', text: nistFormulaText(id), parameters: [...file.parameters], inputs, target, loss: 'rss', start: [...file.starts[0]] };
}

/** The nonlinear model in the formula language, e.g. 'b1*(1-exp(-b2*x))'. */
export function nistFormulaText(id: NistDatasetId): string {
  return nistFile(id).modelText.replace(/\[/g, '(').replace(/\]/g, ')');
}

export function nistDataFitSpec(id: NistDatasetId): DataFitSpec {
  return { kind: 'datafit', dataset: { kind: 'nist', id }, model: nistModelSpec(id) };
}

/** Whether a spec is a NIST nonlinear set with its certified model (any loss normalisation, no penalty). */
export function isCertifiedNonlinearFit(spec: DataFitSpec): spec is DataFitSpec & { dataset: { kind: 'nist'; id: NistDatasetId } } {
  const { dataset, model } = spec;
  if (dataset.kind !== 'nist' || model.kind !== 'formula' || (spec.l2 ?? 0) !== 0) return false;
  const file = nistFile(dataset.id);
  if (file.procedure !== 'nonlinear') return false;
  const names = model.inputNames ?? model.inputs;
  if (model.target !== 'y' || model.inputs.length !== 1 || model.inputs[0] !== 'x' || names[0] !== 'x') return false;
  if (model.parameters.join() !== file.parameters.join() || Object.keys(model.constants ?? {}).length > 0) return false;
  const mine = parseFormula(model.text);
  const certified = parseFormula(nistFormulaText(dataset.id));
  return mine.ok && certified.ok && sameTree(mine.ast, certified.ast);
}
