import { classLabelsOf, checkBinaryTarget } from './classes';
import { designFor } from './design';
import { compiledModelFor, FormulaModelSurface } from './formula-model';
import { LinearRegressionSurface } from './linear';
import { LogisticRegressionSurface } from './logistic';
import { MlpSurface } from './mlp';
import { SoftmaxRegressionSurface } from './softmax';
import type { DataFitSpec } from './spec';
import type { DataFitSurface } from './types';

/**
 * The surface a (validated) data-fit spec names. The parsed data, the design matrix (standardised or
 * not) and compiled formulas are cached, so rebuilding from a spec costs little more than allocating
 * the model's scratch buffers.
 */
export function buildDataFitSurface(spec: DataFitSpec): DataFitSurface {
  const { model } = spec;
  const l2 = spec.l2 ?? 0;
  const design = designFor(spec.dataset, model.inputs, model.target, spec.standardise ?? false);
  switch (model.kind) {
    case 'linear':
      return new LinearRegressionSurface(design, model.loss ?? 'mse', l2);
    case 'logistic':
      checkBinaryTarget(design, 'logistic regression');
      return new LogisticRegressionSurface(design, l2);
    case 'softmax':
      return new SoftmaxRegressionSurface(design, classLabelsOf(design), l2);
    case 'mlp': {
      let labels: string[] = [];
      let outputs = 1;
      if (model.head === 'binary') checkBinaryTarget(design, 'a network with a binary head');
      if (model.head === 'softmax') {
        labels = classLabelsOf(design);
        outputs = labels.length;
      }
      const shape = { sizes: [design.p, ...model.hidden, outputs], activation: model.activation, head: model.head };
      return new MlpSurface(design, shape, labels, l2);
    }
    case 'formula': {
      const compiled = compiledModelFor(model.text, model.parameters, model.inputNames ?? model.inputs, model.constants);
      return new FormulaModelSurface(design, compiled, model.loss ?? 'mse', l2);
    }
  }
}
