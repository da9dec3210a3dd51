import type { GroupedSurface, RowwiseSurface } from '../../engine';
import type { ModelKind } from './spec';

/**
 * The loss of a model fitted to a dataset, as an engine surface over the model's parameters: the run
 * loop, the optimizers and grid slicing use it like any surface, and minibatch runs use its rows.
 */
export interface DataFitSurface extends RowwiseSurface, GroupedSurface {
  readonly model: ModelKind;
  /** E.g. 'mean squared error', 'residual sum of squares', 'mean binary cross-entropy'. */
  readonly lossName: string;
  /** Whether the surface's coordinates are parameters for standardised inputs. */
  readonly standardised: boolean;
  /** The input columns the model reads, in the order `predict` takes them. */
  readonly inputs: readonly string[];
  readonly target: string;
  /** Exact H(x) v without forming H (every data-fit model has one). */
  hessianVector(x: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array): void;
  /** The same fitted function with parameters for inputs in their original units (a copy when not standardised). */
  toOriginalUnits(params: ArrayLike<number>): number[];
  /** The inverse of `toOriginalUnits`. */
  fromOriginalUnits(params: ArrayLike<number>): number[];
  /**
   * The model's output for one row of inputs in original units (`inputs` order): the prediction for
   * regression, P(y = 1) for a binary model, the class probabilities for a softmax model.
   */
  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number | number[];
}
