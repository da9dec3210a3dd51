import type { RunOutcome } from '../run';
import { quantile } from './quantiles';

/** One run of a multi-start study, as the summary reads it. */
export interface StartResult {
  outcome: RunOutcome;
  finalLoss: number;
  endPoint: ArrayLike<number>;
  /** First step whose loss came within the tolerance of the lowest known minimum's value; null if never (or not measured). */
  stepsToTolerance: number | null;
}

export interface MultiStartSummary {
  runs: number;
  converged: number;
  /** The target the success rate is measured against, and where it came from. */
  target: { loss: number; source: 'known minimum' | 'best end point' };
  /** Runs that converged to a point whose loss is within `tolerance` of the target. */
  successes: number;
  successRate: number;
  /** Final loss over the runs with a finite one: min, quartiles, max. */
  finalLoss: { min: number; q1: number; median: number; q3: number; max: number; finite: number };
  /**
   * Steps to tolerance over the runs that got there: how many did, and the quartiles of their first
   * steps within the tolerance (NaN when none did). Only meaningful where the steps were measured
   * (a surface with a known minimum); the caller says so.
   */
  stepsToTolerance: { reached: number; q1: number; median: number; q3: number };
  /** Runs by outcome kind. */
  outcomes: Record<string, number>;
}

/**
 * Summary of a multi-start study. Success: the run's outcome is `converged` (a strict local minimum by
 * the end-state judgement) and its final loss is within `tolerance` (absolute, in loss units) of the
 * target: the lowest known minimum's value when the surface has one, otherwise the lowest converged
 * final loss of the study itself (said in `target.source`, since then "success" only means "as good as
 * the best start found").
 */
export function summariseStarts(results: readonly StartResult[], tolerance: number, knownMinimum: number | null): MultiStartSummary {
  if (!(tolerance >= 0 && Number.isFinite(tolerance))) throw new RangeError(`summariseStarts: tolerance must be a finite number >= 0, got ${tolerance}`);
  const converged = results.filter((r) => r.outcome.kind === 'converged');
  const best = converged.reduce((m, r) => Math.min(m, r.finalLoss), Infinity);
  const target = knownMinimum !== null ? { loss: knownMinimum, source: 'known minimum' as const } : { loss: best, source: 'best end point' as const };
  const successes = converged.filter((r) => r.finalLoss - target.loss <= tolerance).length;
  const finite = Float64Array.from(results.map((r) => r.finalLoss).filter(Number.isFinite)).sort();
  const reached = Float64Array.from(results.map((r) => r.stepsToTolerance).filter((s): s is number => s !== null)).sort();
  const outcomes: Record<string, number> = {};
  for (const r of results) outcomes[r.outcome.kind] = (outcomes[r.outcome.kind] ?? 0) + 1;
  return {
    runs: results.length,
    converged: converged.length,
    target,
    successes,
    successRate: results.length ? successes / results.length : Number.NaN,
    finalLoss: {
      min: finite.length ? finite[0] : Number.NaN,
      q1: quantile(finite, 0.25),
      median: quantile(finite, 0.5),
      q3: quantile(finite, 0.75),
      max: finite.length ? finite[finite.length - 1] : Number.NaN,
      finite: finite.length,
    },
    stepsToTolerance: { reached: reached.length, q1: quantile(reached, 0.25), median: quantile(reached, 0.5), q3: quantile(reached, 0.75) },
    outcomes,
  };
}
