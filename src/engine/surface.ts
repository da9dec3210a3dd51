/**
 * A surface: a real-valued function of n parameters with exact first and second derivatives.
 *
 * Points are read, never kept; outputs go into buffers the caller owns, so the hot loops of the run
 * and of grid sampling allocate nothing per evaluation. Every kind of surface (catalogue test
 * function, typed formula, data-fit loss) implements this one interface.
 */
export interface Surface {
  /** Number of parameters n. */
  readonly dimension: number;
  /** Parameter names in order, length n (e.g. ['x', 'y'] or ['b0', 'b1', 'b2']). */
  readonly variables: readonly string[];
  /** f(x). */
  value(x: ArrayLike<number>): number;
  /** Writes grad f(x) into `grad` (length n) and returns f(x). */
  valueGradient(x: ArrayLike<number>, grad: Float64Array): number;
  /**
   * Writes grad f(x) into `grad` and the Hessian into `hessian` (row-major n x n, symmetric)
   * and returns f(x).
   */
  valueGradientHessian(x: ArrayLike<number>, grad: Float64Array, hessian: Float64Array): number;
  /**
   * Optional: why the value (or the gradient) is not finite at x, in words with the place in the
   * surface's text where there is one ("log of a negative number (-2) (columns 1-8)"); null when it is
   * finite or the surface cannot tell.
   */
  explainUndefined?(x: ArrayLike<number>, what: 'value' | 'gradient'): string | null;
  /**
   * Optional: writes the exact Hessian-vector product H(x) v into `out` (length n) without forming
   * H (for a network, Pearlmutter's R-operator; for a model linear in its rows, one pass over the
   * rows). Surfaces without it are multiplied through their full Hessian by the engine's
   * `hessianVectorProduct`.
   */
  hessianVector?(x: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array): void;
}

/**
 * A surface that is a loss over data rows (a sum or a mean of one term per row, plus any penalty on
 * the parameters), so a run can step along minibatch gradients.
 *
 * The `...OnRows` methods evaluate the minibatch estimate of the full loss on the rows
 * `rowIndices[0..count)`: the data term over those rows, rescaled to the full loss's normalisation (a
 * sum over rows is multiplied by rows / count, a mean becomes the mean over the batch), plus the
 * parameter penalty in full. The estimate is unbiased for a uniformly drawn batch, and with every row
 * once in order it is the full loss and gradient. Rows may repeat; `count` may be less than
 * `rowIndices.length` (the buffer is reused between batches).
 */
export interface RowwiseSurface extends Surface {
  /** Number of data rows N. */
  readonly rows: number;
  /** Writes the minibatch gradient into `grad` and returns the minibatch loss. */
  valueGradientOnRows(x: ArrayLike<number>, grad: Float64Array, rowIndices: Int32Array, count: number): number;
  /** Also writes the minibatch Hessian (row-major n x n). */
  valueGradientHessianOnRows(x: ArrayLike<number>, grad: Float64Array, hessian: Float64Array, rowIndices: Int32Array, count: number): number;
}

/** Whether a surface offers minibatch evaluation. */
export function isRowwiseSurface(surface: Surface): surface is RowwiseSurface {
  const s = surface as Partial<RowwiseSurface>;
  return typeof s.rows === 'number' && typeof s.valueGradientOnRows === 'function' && typeof s.valueGradientHessianOnRows === 'function';
}

/**
 * Parameters that belong together, for filter-wise normalisation of random slice directions (Li, Xu,
 * Taylor, Studer & Goldstein, "Visualizing the Loss Landscape of Neural Nets", NeurIPS 2018): a
 * direction is rescaled group by group to the norm of the same group of the parameters. 'weights' is
 * one filter (a unit's incoming weights, a class's weight vector); 'bias' holds intercepts or biases,
 * which Li et al. treat apart (their directions are commonly set to zero).
 */
export interface ParameterGroup {
  name: string;
  /** Indices into the parameter vector (0-based, ascending). */
  indices: number[];
  kind: 'weights' | 'bias';
}

/** A surface whose parameters come in named groups (every data-fit surface). */
export interface GroupedSurface extends Surface {
  readonly parameterGroups: readonly ParameterGroup[];
}

export function hasParameterGroups(surface: Surface): surface is GroupedSurface {
  return Array.isArray((surface as Partial<GroupedSurface>).parameterGroups);
}
