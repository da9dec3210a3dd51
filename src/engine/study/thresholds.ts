import { sharpnessAlong } from '../analysis';
import type { RunOutcome } from '../run/outcome';
import type { Surface } from '../surface';
import { logSpaced, refineDivergenceThreshold } from '../sweep/rates';
import type { LearningRateSweepSpec } from './spec';
import { predictedStabilityLimit } from './stability';

/** One optimizer's divergence threshold in a learning-rate sweep, observed and predicted. */
export interface SweepThreshold {
  /** Largest eigenvalue of the exact Hessian at the sweep's start. */
  lambdaMax: number;
  /** The rate above which the local quadratic model diverges (stability.ts); null where there is no such result. */
  predicted: number | null;
  /** Between the last rate before the first diverged run and that run's rate; null if none diverged (or the lowest did). */
  observed: { lo: number; hi: number; refined: boolean } | null;
}

/**
 * Per optimizer of a finished sweep (outcomes by cell, o * count + k): the observed bracket, narrowed by
 * refineDivergenceThreshold (sweep/rates.ts) to 1e-6 relative where that refinement's own stability
 * test agrees with the sweep at the bracket's ends (`refined`), and the prediction from lambda_max at
 * the start. The one home of this rule for the page's study worker and the command line.
 */
export function sweepThresholds(spec: LearningRateSweepSpec, surface: Surface, outcomes: readonly (RunOutcome | undefined)[]): SweepThreshold[] {
  const rates = logSpaced(spec.range[0], spec.range[1], spec.count);
  const lambdaMax = sharpnessAlong(surface, Float64Array.from(spec.start), 1)[0];
  return spec.optimizers.map((o, q) => {
    const predicted = predictedStabilityLimit(o.spec, lambdaMax);
    const first = rates.findIndex((_, k) => outcomes[q * spec.count + k]?.kind === 'diverged');
    if (first <= 0) return { lambdaMax, predicted, observed: null };
    let lo = rates[first - 1];
    let hi = rates[first];
    let refined = false;
    try {
      const r = refineDivergenceThreshold({ surface, optimizer: o.spec, start: spec.start, seed: spec.seed, steps: Math.min(spec.stop.maxSteps, 2000) }, lo, hi, { relativeTolerance: 1e-6 });
      [lo, hi, refined] = [r.lo, r.hi, true];
    } catch {
      // The refinement's own stability test disagrees with the sweep at the bracket's ends (e.g. a run
      // that diverges only after more steps than a trial takes): keep the sweep's bracket, unrefined.
    }
    return { lambdaMax, predicted, observed: { lo, hi, refined } };
  });
}
