import { describe, expect, it } from 'vitest';
import type { EndPoint, TrajectoryBatch } from '../../src/engine';

const END: EndPoint = { gradNorm: 1, gradThreshold: 0, stationary: false, curvature: null, newtonStep: null };
import { emptySummary, resummarise, updateSummary } from '../../src/io/run-summary';
import { TrajectoryBuffer } from '../../src/store/trajectory-buffer';

/** A run whose loss is 100 / (step + 1) above a minimum of 0, in one batch. */
function decaying(steps: number): TrajectoryBatch {
  const loss = Float64Array.from({ length: steps + 1 }, (_, k) => 100 / (k + 1));
  return { firstStep: 0, count: steps + 1, dimension: 1, points: loss.slice(), loss, gradNorm: loss.slice(), learningRate: loss.slice(), outcome: { kind: 'step-limit', step: steps, point: END } };
}

const minima = [{ point: [0], value: 0 }];

describe('summaries recomputed for a new tolerance', () => {
  it('match the streamed summary exactly while every step is kept', () => {
    const run = decaying(400);
    const streamed = updateSummary(emptySummary(), run, minima, 1);
    const buffer = new TrajectoryBuffer(1, 1024, 1024);
    buffer.append(run);
    // loss <= 0.5 first at step 199 (100 / 200), by the formula above.
    expect(resummarise(streamed, buffer.asBatch(), minima, 0.5)).toEqual({ ...updateSummary(emptySummary(), run, minima, 0.5) });
    expect(resummarise(streamed, buffer.asBatch(), minima, 0.5).stepsToTolerance).toBe(199);
  });

  it('are marked as an upper bound where the page kept only every k-th step', () => {
    const run = decaying(400);
    const streamed = updateSummary(emptySummary(), run, minima, 1);
    const buffer = new TrajectoryBuffer(1, 64, 64);
    buffer.append(run);
    expect(buffer.keepEvery).toBe(8);
    const again = resummarise(streamed, buffer.asBatch(), minima, 0.5);
    // Kept steps are multiples of 8: the first kept one within 0.5 is 200, one past the true 199.
    expect(again.stepsToTolerance).toBe(200);
    expect(again.stepsToToleranceIsBound).toBe(true);
    // Step 0 is always kept, so a tolerance met at the start is exact.
    expect(resummarise(streamed, buffer.asBatch(), minima, 100)).toMatchObject({ stepsToTolerance: 0 });
    expect(resummarise(streamed, buffer.asBatch(), minima, 100).stepsToToleranceIsBound).toBeUndefined();
    // Beyond the best loss of the whole stream, not reached, and that is certain.
    expect(resummarise(streamed, buffer.asBatch(), minima, 0.2)).toMatchObject({ stepsToTolerance: null });
    // The rest of the summary is the streamed one (final loss and point, best loss, steps).
    expect(again).toMatchObject({ steps: 400, finalLoss: 100 / 401, bestLoss: 100 / 401, finalPoint: [100 / 401] });
  });
});
