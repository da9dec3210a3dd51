import type { LockstepCode } from './lockstep';
import type { Optimizer, StepReport } from './types';

/**
 * A gradient transform: one small, pure-in-spirit stage of a first-order optimizer.
 *
 * `init(params)` makes the stage's state from the start point (plain data: numbers, Float64Array,
 * plain objects, so a run can be cloned, sent and compared). `update(u, state, params, t)` rewrites
 * the update vector `u` in place (for speed; on entry it holds the previous stage's output, for the
 * first stage the gradient) and returns the new state (usually the same object, updated in place).
 * `params` is the point before the step, read-only; `t` is the 1-based step counter.
 *
 * A named optimizer is a chain of transforms whose last output is added to the point: x <- x + u.
 * The minus sign of gradient descent lives in exactly one transform, `scaleByLearningRate`, which
 * also reports the step's learning rate (the only transform with `learningRate`).
 */
export interface GradientTransform<S = unknown> {
  readonly name: string;
  init(params: Float64Array): S;
  update(u: Float64Array, state: S, params: Float64Array, t: number): S;
  /** Only on the learning-rate transform: the (scheduled) learning rate at step t, positive. */
  learningRate?(t: number): number;
  /**
   * Set when the transform works entry by entry: u[i] depends only on u[i], params[i], t and the
   * state's own entry i (its Float64Arrays hold one entry per parameter; its numbers, such as a step
   * count, move the same way whatever the length). Then one state over the concatenated points of
   * many runs in lockstep gives each run exactly the numbers its own state would (the sweep engine
   * relies on this). Not set on transforms that mix entries (clipping by the global norm).
   */
  readonly elementwise?: boolean;
  /** On some elementwise transforms: the same per-entry operations as code for the sweep's fused kernel (lockstep.ts). */
  readonly lockstep?: LockstepCode;
}

/** State of a chained optimizer: one entry per transform, in chain order. */
export interface ChainState {
  stages: unknown[];
}

/** Runs the transforms over `u` in order, updating their states. */
export function applyTransforms(
  transforms: readonly GradientTransform[],
  state: ChainState,
  u: Float64Array,
  params: Float64Array,
  t: number,
): void {
  for (let i = 0; i < transforms.length; i++) state.stages[i] = transforms[i].update(u, state.stages[i], params, t);
}

export function initTransforms(transforms: readonly GradientTransform[], params: Float64Array): ChainState {
  return { stages: transforms.map((tr) => tr.init(params)) };
}

/** The one learning-rate transform of a chain; throws when there is none or more than one. */
export function learningRateStage(transforms: readonly GradientTransform[], label: string): GradientTransform & { learningRate(t: number): number } {
  const withRate = transforms.filter((tr) => tr.learningRate !== undefined);
  if (withRate.length !== 1)
    throw new Error(`chain '${label}': expected exactly one learning-rate transform (the one that carries the minus sign), got ${withRate.length}`);
  return withRate[0] as GradientTransform & { learningRate(t: number): number };
}

/** A chained optimizer, with its transforms in order (the sweep engine steps many runs through them at once). */
export interface ChainOptimizer extends Optimizer<ChainState> {
  readonly transforms: readonly GradientTransform[];
}

/** Whether an optimizer is a chain of transforms (transform.ts) rather than a method using the oracle. */
export function isChainOptimizer(o: Optimizer): o is ChainOptimizer {
  return Array.isArray((o as Partial<ChainOptimizer>).transforms);
}

/**
 * Turns a list of transforms into an `Optimizer`: each step runs the gradient through the chain in
 * the run loop's work buffer and adds the result to the point. One surface evaluation per step (the
 * run loop's own).
 */
export function chain(label: string, transforms: readonly GradientTransform[]): ChainOptimizer {
  const rate = learningRateStage(transforms, label);
  return {
    label,
    transforms,
    init: (x0) => initTransforms(transforms, x0),
    step(x, grad, state, ctx): StepReport {
      applyTransforms(transforms, state, grad, x, ctx.t);
      for (let i = 0; i < x.length; i++) x[i] += grad[i];
      return { learningRate: rate.learningRate(ctx.t), extraEvaluations: 0 };
    },
  };
}
