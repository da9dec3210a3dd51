/**
 * The contract between the run loop and every optimizer.
 *
 * First-order methods are built from small gradient transforms (see transform.ts); methods that need
 * more than the gradient (line searches, Hessians) use the oracle in the step context. Either way the
 * run loop sees one `Optimizer`: it hands over the point, the gradient there and the optimizer's own
 * state, and the optimizer moves the point in place.
 *
 * State is plain data (numbers, Float64Array, plain objects), so `structuredClone` snapshots it, a worker
 * can send it, and tests can compare it. For speed, steps update the point, the gradient buffer and the
 * state in place rather than allocating new arrays on every step.
 */

/** Evaluations an optimizer may request during a step (line searches, Newton's Hessian). */
export interface Oracle {
  readonly dimension: number;
  value(x: ArrayLike<number>): number;
  /** Writes the gradient into `grad`, returns the loss. Includes gradient noise when the run has it. */
  valueGradient(x: ArrayLike<number>, grad: Float64Array): number;
  valueGradientHessian(x: ArrayLike<number>, grad: Float64Array, hessian: Float64Array): number;
}

export interface StepContext {
  /** 1-based step counter: bias corrections in Adam and relatives use beta^t from t = 1. */
  readonly t: number;
  /** Loss at the point before the step. */
  readonly loss: number;
  readonly oracle: Oracle;
}

export interface StepReport {
  /**
   * The step size this step used: the scheduled learning rate for first-order methods, the accepted
   * line-search step length for L-BFGS, the damping factor for Newton.
   */
  learningRate: number;
  /**
   * Surface evaluations the step itself made. Without `lossAtNewPoint` the run loop adds one more for
   * the new point; with it, the count must already include the step's evaluation there.
   */
  extraEvaluations: number;
  /**
   * Set when the step already evaluated the new point: `grad` then holds the gradient there and this
   * is the loss, so the run loop skips its own evaluation.
   */
  lossAtNewPoint?: number;
  /**
   * Set when the method found no step that lowers the loss and left the point where it was (every
   * line-search trial rejected). The run loop then ends the run and judges the point: converged if it
   * is stationary, stalled otherwise. A first-order step at a scheduled learning rate of 0 is not this.
   */
  noDescent?: boolean;
}

export interface Optimizer<S = unknown> {
  /** Human-readable name, e.g. "Adam". */
  readonly label: string;
  init(x0: Float64Array): S;
  /** Moves `x` in place by one step. `grad` is the gradient at `x`; the step may overwrite it. */
  step(x: Float64Array, grad: Float64Array, state: S, ctx: StepContext): StepReport;
}

/** A bad setting, named so the page can show the message beside the field that holds it. */
export class SettingError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'SettingError';
  }
}
