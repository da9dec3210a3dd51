import type { OptimizerSpec } from '../optim/spec';
import { SettingError } from '../optim/types';
import type { RunOutcome } from '../run/outcome';
import { validateStopRules, type StopRules } from '../run/settings';
import type { Surface } from '../surface';

/**
 * One configuration run from many start points (and, for a learning-rate sweep, at many learning
 * rates), as plain data apart from the built surface. Run i starts at row i of `starts`, uses
 * `learningRates[i]` when given (else the spec's learning rate) and the seed `seeds[i]` when given
 * (else `seed`): it is then exactly the run `new RunCursor(surface, buildOptimizer({ ...optimizer,
 * learningRate }), { start, stop, seed, gradientNoise })` would make, bit for bit.
 */
export interface SweepPlan {
  surface: Surface;
  optimizer: OptimizerSpec;
  stop: StopRules;
  /** count x n start points, row-major (n = surface.dimension). */
  starts: Float64Array;
  /** One learning rate per run (length count); absent: `optimizer.learningRate` for every run. */
  learningRates?: Float64Array;
  /** One seed per run (length count); absent: `seed` for every run. */
  seeds?: Float64Array;
  /** Seed of every run without its own; default 0. */
  seed?: number;
  /** Standard deviation of the Gaussian noise on every gradient the optimizer sees (as RunSettings). */
  gradientNoise?: number;
  /**
   * When set, each run's result records the first step at which loss - lossTarget <= lossTolerance
   * (the run summary's test, io/run-summary.ts, written the same way so both give the same step).
   */
  lossTolerance?: number;
  /** What the tolerance is measured from (a study: the lowest known minimum's value); default 0. */
  lossTarget?: number;
}

/** How far a sweep has got: runs ended out of all runs, and optimizer steps taken by all runs together. */
export interface SweepProgress {
  done: number;
  total: number;
  /** Steps taken so far, summed over runs. */
  steps: number;
  /** Lockstep rounds so far (every live run takes one step per round). */
  rounds: number;
}

/**
 * The result of a sweep, one entry per run in plan order. Typed arrays for the numbers; outcomes are
 * the same `RunOutcome` objects a `RunCursor` produces (null for a run still going).
 */
export interface SweepResult {
  count: number;
  dimension: number;
  /** count x n end points (the current points of runs still going). */
  endPoints: Float64Array;
  losses: Float64Array;
  steps: Int32Array;
  /** Surface evaluations per run (a Hessian or minibatch evaluation counts as one), as RunState counts them. */
  evaluations: Float64Array;
  /** First step at which loss - lossTarget <= lossTolerance (0 for the start), -1 if never or without a tolerance. */
  stepsToTolerance: Int32Array;
  outcomes: (RunOutcome | null)[];
}

/** Checks the plan, naming the field and the run: `sweep: start of run 3, coordinate 2 must be ...`. */
export function validateSweepPlan(plan: SweepPlan): number {
  const n = plan.surface.dimension;
  if ((plan as { minibatch?: unknown }).minibatch !== undefined)
    throw new SettingError('minibatch', 'sweep: minibatch runs are not supported in a sweep (every run steps on the exact full-data gradient); run minibatch training as single runs');
  if (!(plan.starts instanceof Float64Array) || plan.starts.length % n !== 0)
    throw new SettingError('starts', `sweep: starts must be a Float64Array of count x ${n} coordinates, got ${plan.starts?.length}`);
  const count = plan.starts.length / n;
  for (let i = 0; i < plan.starts.length; i++)
    if (!Number.isFinite(plan.starts[i])) throw new SettingError('starts', `sweep: start of run ${Math.floor(i / n)}, coordinate ${(i % n) + 1} must be a finite number, got ${plan.starts[i]}`);
  for (const [field, arr] of [['learningRates', plan.learningRates], ['seeds', plan.seeds]] as const) {
    if (arr === undefined) continue;
    if (arr.length !== count) throw new SettingError(field, `sweep: ${field} must hold one value per run (${count}), got ${arr.length}`);
    for (let i = 0; i < count; i++) if (!Number.isFinite(arr[i])) throw new SettingError(field, `sweep: ${field}[${i}] must be a finite number, got ${arr[i]}`);
  }
  if (plan.seed !== undefined && !Number.isFinite(plan.seed)) throw new SettingError('seed', `seed must be a finite number, got ${plan.seed}`);
  const noise = plan.gradientNoise;
  if (noise !== undefined && !(noise >= 0 && Number.isFinite(noise))) throw new SettingError('gradientNoise', `gradientNoise must be a finite number >= 0, got ${noise}`);
  const tol = plan.lossTolerance;
  if (tol !== undefined && Number.isNaN(tol)) throw new SettingError('lossTolerance', `sweep: lossTolerance must be a number, got ${tol}`);
  const target = plan.lossTarget;
  if (target !== undefined && !Number.isFinite(target)) throw new SettingError('lossTarget', `sweep: lossTarget must be a finite number, got ${target}`);
  validateStopRules(plan.stop);
  return count;
}
