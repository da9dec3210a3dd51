// Data-fit surfaces: the loss of a model fitted to a dataset, over the model's parameters.
export type {
  Activation,
  DataFitSpec,
  FormulaModelSpec,
  LinearModelSpec,
  LogisticModelSpec,
  MlpModelSpec,
  ModelKind,
  ModelSpec,
  NetworkHead,
  RegressionLoss,
  SoftmaxModelSpec,
} from './spec';
export type { DataFitSurface } from './types';
export { buildDataFitSurface } from './build';
export { describeDataFit } from './describe';
export { validateDataFitSpec, validateModelSpec, MAX_HIDDEN_LAYERS, MAX_HIDDEN_WIDTH } from './validate';
export { designFor, type Design } from './design';
export { linearLeastSquares, solveLeastSquares } from './least-squares';
export { LinearRegressionSurface } from './linear';
export { LogisticRegressionSurface } from './logistic';
export { SoftmaxRegressionSurface } from './softmax';
export { MlpSurface, initialNetworkParameters } from './mlp';
export { FormulaModelSurface } from './formula-model';
export { RowLossSurface } from './row-loss';
export { classLabelsOf, MAX_CLASSES } from './classes';
export { isCertifiedNonlinearFit, nistDataFitSpec, nistFormulaText, nistModelSpec } from './nist-models';
export { logSumExp, sigmoid, softplus } from './stable';
