import type { DatasetSpec } from '../datasets';

/**
 * Model specs: plain JSON naming a model, its input columns and its target column. Together with a
 * dataset spec they make a data-fit surface spec, `{ kind: 'datafit', dataset, model, l2?, standardise? }`.
 */

/**
 * Least-squares losses: 'rss' is the residual sum of squares sum_i (y_i - f_i)^2 (the objective NIST
 * certifies), 'mse' the mean squared error rss / N. Default 'mse': its gradient does not grow with the
 * number of rows, so a learning rate carries over between datasets (common practice in ML libraries).
 */
export type RegressionLoss = 'rss' | 'mse';

interface Columns {
  /** Input (feature) columns, in parameter order. */
  inputs: string[];
  /** The column to predict. */
  target: string;
}

/** y = intercept + sum_j w_j x_j, least squares. */
export interface LinearModelSpec extends Columns {
  kind: 'linear';
  loss?: RegressionLoss;
}

/** P(y = 1) = sigmoid(intercept + w . x), mean binary cross-entropy; targets 0 or 1. */
export interface LogisticModelSpec extends Columns {
  kind: 'logistic';
}

/** P(y = k) = softmax_k(b_k + w_k . x) over K classes, mean cross-entropy; targets 0 .. K-1. */
export interface SoftmaxModelSpec extends Columns {
  kind: 'softmax';
}

export type Activation = 'tanh' | 'relu';
export type NetworkHead = 'regression' | 'binary' | 'softmax';

/** A small fully connected network: 1 or 2 hidden layers. */
export interface MlpModelSpec extends Columns {
  kind: 'mlp';
  /** Hidden layer widths, 1 or 2 layers of 1 to 64 units. */
  hidden: number[];
  activation: Activation;
  /** 'regression': one linear output, mean squared error; 'binary': one logit, mean binary
   * cross-entropy; 'softmax': K logits, mean cross-entropy. */
  head: NetworkHead;
  /** Seed of the suggested start (Glorot / He initialisation); default 1. */
  initSeed?: number;
}

/** A typed model formula with named parameters, fitted by least squares. */
export interface FormulaModelSpec extends Columns {
  kind: 'formula';
  /** E.g. 'b1 * (1 - exp(-b2 * x))' in the engine's formula language. */
  text: string;
  /** The fitted parameters, in order. */
  parameters: string[];
  /** Names by which the formula reads the input columns (default: the column names themselves). */
  inputNames?: string[];
  constants?: Record<string, number>;
  loss?: RegressionLoss;
  /** Suggested start; default all ones (a formula says nothing about its scale). */
  start?: number[];
}

export type ModelSpec = LinearModelSpec | LogisticModelSpec | SoftmaxModelSpec | MlpModelSpec | FormulaModelSpec;
export type ModelKind = ModelSpec['kind'];

export interface DataFitSpec {
  kind: 'datafit';
  dataset: DatasetSpec;
  model: ModelSpec;
  /**
   * L2 penalty lambda / 2 |w|^2 added to the loss (default 0). Weights only: intercepts and biases are
   * not penalised (common practice, as in scikit-learn's Ridge and LogisticRegression, since
   * penalising an offset would make the fit depend on where the target's zero is); a formula's
   * parameters are all penalised (the formula does not say which are offsets).
   */
  l2?: number;
  /**
   * Centre each input column and divide by its sample standard deviation (n - 1) before fitting. The
   * surface's coordinates are then parameters in standardised units; `toOriginalUnits` converts them.
   * Not offered for formula models. Default false.
   */
  standardise?: boolean;
}
