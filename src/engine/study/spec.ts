import type { OptimizerSpec } from '../optim/spec';
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

/** Every study kind; each is plain data and goes into the experiment file as it is. */
export type StudySpec = StartMapSpec | MultiStartSpec;

export function validateMultiStart(spec: MultiStartSpec): void {
  if (!Number.isInteger(spec.count) || spec.count < 1 || spec.count > MAX_MULTI_STARTS)
    throw new RangeError(`multi-start: count must be a whole number from 1 to ${MAX_MULTI_STARTS}, got ${spec.count}`);
}
