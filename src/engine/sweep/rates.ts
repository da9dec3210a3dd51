import type { OptimizerSpec } from '../optim/spec';
import type { StopRules } from '../run/settings';
import type { Surface } from '../surface';
import { Sweep } from './engine';

/**
 * `count` learning rates from lo to hi, equally spaced in log: lo (hi/lo)^(k/(count-1)), with lo and
 * hi exact at the ends (one rate: lo).
 */
export function logSpaced(lo: number, hi: number, count: number): Float64Array {
  if (!(lo > 0 && hi > 0 && Number.isFinite(lo) && Number.isFinite(hi))) throw new Error(`logSpaced: lo and hi must be finite and > 0, got ${lo}, ${hi}`);
  if (!Number.isInteger(count) || count < 1) throw new Error(`logSpaced: count must be a whole number >= 1, got ${count}`);
  const out = new Float64Array(count);
  const ratio = Math.log(hi / lo);
  for (let k = 0; k < count; k++) out[k] = k === 0 ? lo : k === count - 1 ? hi : lo * Math.exp((ratio * k) / (count - 1));
  return out;
}

/** One configuration from one start, for a learning-rate sweep. */
export interface RateSweepConfig {
  surface: Surface;
  optimizer: OptimizerSpec;
  start: ArrayLike<number>;
  /** Steps per trial run (default 2000): the test compares the loss at half of them and at the end. */
  steps?: number;
  seed?: number;
}

export interface RateTrial {
  learningRates: Float64Array;
  /** 1 where the run was unstable (see `unstableRates`). */
  unstable: Uint8Array;
}

/**
 * Runs one sweep over the learning rates from the same start and says which were unstable. A run is
 * unstable when it diverged (non-finite or blow-up, as the run loop judges it), or when it is still
 * going at the last step and its loss there is above its loss at half the steps: the run is moving
 * away again after any transient. That second test sees the edge of stability sharply. For gradient
 * descent on a quadratic, the error along an eigenvector of eigenvalue lambda is multiplied by
 * |1 - lr lambda| each step, so past lr = 2/lambda_max it grows and below it shrinks, however little;
 * heavy-ball momentum (Polyak 1964) multiplies it by the roots of z^2 - (1 + mu - lr lambda) z + mu,
 * inside the unit circle exactly when 0 < lr lambda < 2(1 + mu). (Exactly at the edge the mode
 * neither grows nor shrinks and the run counts as stable.) The trial runs have only the step limit
 * as stop rule; whatever the end judgement then calls the end point (step limit, oscillating,
 * escaping, converged), only the two tests above decide.
 */
export function unstableRates(config: RateSweepConfig, learningRates: Float64Array): RateTrial {
  const steps = config.steps ?? 2000;
  const n = config.surface.dimension;
  const count = learningRates.length;
  const starts = new Float64Array(count * n);
  for (let r = 0; r < count; r++) for (let i = 0; i < n; i++) starts[r * n + i] = config.start[i];
  const stop: StopRules = { maxSteps: steps };
  const sweep = new Sweep({ surface: config.surface, optimizer: config.optimizer, stop, starts, learningRates, seed: config.seed });
  const half = Math.floor(steps / 2);
  sweep.advance(half);
  const mid = sweep.result().losses;
  sweep.advance(steps);
  const end = sweep.result();
  const unstable = new Uint8Array(count);
  for (let r = 0; r < count; r++) {
    const o = end.outcomes[r];
    if (o?.kind === 'diverged') unstable[r] = 1;
    else if (end.steps[r] === steps && end.losses[r] > mid[r]) unstable[r] = 1;
  }
  return { learningRates, unstable };
}

export interface DivergenceThreshold {
  /** The bracket's ends: lo observed stable, hi observed unstable, hi / lo - 1 <= relativeTolerance. */
  lo: number;
  hi: number;
  /** Their geometric mean. */
  threshold: number;
  /** Sweeps run (one per refinement). */
  sweeps: number;
}

/**
 * Narrows the observed divergence threshold of a learning-rate sweep: from a bracket [lo, hi] with lo
 * stable and hi unstable (unstableRates), each refinement runs one sweep of `perSweep` rates spaced
 * in log strictly inside the bracket and keeps the sub-bracket around the first unstable one (a
 * multi-point bisection: the bracket shrinks by a factor of perSweep + 1 per sweep), until
 * hi / lo - 1 <= relativeTolerance (default 1e-9). Assumes one threshold in the bracket: where
 * stability switches back and forth the first switch is followed.
 */
export function refineDivergenceThreshold(config: RateSweepConfig, lo: number, hi: number, options: { relativeTolerance?: number; perSweep?: number; maxSweeps?: number } = {}): DivergenceThreshold {
  const tol = options.relativeTolerance ?? 1e-9;
  const perSweep = options.perSweep ?? 8;
  const maxSweeps = options.maxSweeps ?? 100;
  if (!(lo > 0 && hi > lo)) throw new Error(`refineDivergenceThreshold: need 0 < lo < hi, got ${lo}, ${hi}`);
  const ends = unstableRates(config, Float64Array.of(lo, hi));
  if (ends.unstable[0]) throw new Error(`refineDivergenceThreshold: the run at lo = ${lo} is already unstable`);
  if (!ends.unstable[1]) throw new Error(`refineDivergenceThreshold: the run at hi = ${hi} is stable`);
  let sweeps = 1;
  while (hi / lo - 1 > tol && sweeps < maxSweeps) {
    const rates = logSpaced(lo, hi, perSweep + 2).subarray(1, perSweep + 1);
    const trial = unstableRates(config, rates);
    sweeps++;
    let k = 0;
    while (k < perSweep && !trial.unstable[k]) k++;
    const nextLo = k > 0 ? rates[k - 1] : lo;
    const nextHi = k < perSweep ? rates[k] : hi;
    lo = nextLo;
    hi = nextHi;
  }
  return { lo, hi, threshold: Math.sqrt(lo * hi), sweeps };
}
