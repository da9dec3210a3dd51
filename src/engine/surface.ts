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
}
