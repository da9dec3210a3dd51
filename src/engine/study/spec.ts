import type { OptimizerSpec } from '../optim/spec';
import { SettingError } from '../optim/types';
import type { StopRules } from '../run';
import type { StartDistribution } from './starts';
import type { StartMapSpec } from './start-map';

/**
 * A multi-start study as plain data: `count` starts drawn from `distribution` with `seed` (starts.ts),
 * each run with one configuration; the result is every run's outcome plus the median and quartile
 * bands of the loss across runs, step by step.
 */
export interface MultiStartSpec {
  kind: 'multi-start';
  optimizer: OptimizerSpec;
  stop: StopRules;
  /** Seed of each run (gradient noise, minibatches); the starts have their own. */
  seed: number;
  distribution: StartDistribution;
  count: number;
  startSeed: number;
}

export const MAX_MULTI_STARTS = 10_000;

/**
 * A learning-rate sweep as plain data: each optimizer (a full spec, its learning rate replaced) at
 * `count` log-spaced learning rates from range[0] to range[1], all from one start; then, per optimizer,
 * the observed divergence threshold between the last stable and the first unstable rate, refined by
 * bisection (sweep/rates.ts), beside the threshold predicted from the Hessian at the start
 * (stability.ts). Cell index: optimizer o, rate k -> o * count + k.
 */
export interface LearningRateSweepSpec {
  kind: 'lr-sweep';
  optimizers: { label: string; spec: OptimizerSpec }[];
  stop: StopRules;
  seed: number;
  start: number[];
  range: [number, number];
  count: number;
}

export const MAX_SWEEP_RATES = 1024;

/** Every study kind; each is plain data and goes into the experiment file as it is. */
export type StudySpec = StartMapSpec | MultiStartSpec | LearningRateSweepSpec;

/** The validators below throw a SettingError naming the spec's field ('range', 'box.a', ...). */
export function validateLearningRateSweep(spec: LearningRateSweepSpec, dimension: number): void {
  const [lo, hi] = spec.range;
  if (!(lo > 0 && hi > lo && Number.isFinite(hi))) throw new SettingError('range', `learning-rate sweep: range must satisfy 0 < low < high (finite), got [${lo}, ${hi}]`);
  if (!Number.isInteger(spec.count) || spec.count < 2 || spec.count > MAX_SWEEP_RATES)
    throw new SettingError('count', `learning-rate sweep: count must be a whole number from 2 to ${MAX_SWEEP_RATES}, got ${spec.count}`);
  if (spec.optimizers.length < 1) throw new SettingError('optimizers', 'learning-rate sweep: choose at least one optimizer');
  if (spec.start.length !== dimension) throw new SettingError('start', `learning-rate sweep: start must have ${dimension} coordinates, got ${spec.start.length}`);
}

export function validateMultiStart(spec: MultiStartSpec): void {
  if (!Number.isInteger(spec.count) || spec.count < 1 || spec.count > MAX_MULTI_STARTS)
    throw new SettingError('count', `multi-start: count must be a whole number from 1 to ${MAX_MULTI_STARTS}, got ${spec.count}`);
}
