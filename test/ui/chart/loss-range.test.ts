// The loss chart's running extremes (loss-range.ts) against the full scan they replace: for every
// axis kind, every count of a growing series, the same range and the same axis choice.
import { describe, expect, it } from 'vitest';
import { axisRange, axisValue, chooseLossAxis, type LossAxis } from '../../../src/ui/chart/loss-chart';
import { runStyle } from '../../../src/ui/plot';
import { lossExtremes } from '../../../src/ui/chart/loss-range';
import { createRng, nextUniform } from '../../../src/engine/rng';

/** The scan drawLossChart did before: axis values that are finite (and > 0 off the linear axis). */
function scannedRange(axis: LossAxis, loss: Float64Array, count: number): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (let k = 0; k < count; k++) {
    const v = axisValue(axis, loss[k]);
    if (!Number.isFinite(v) || (axis.kind !== 'linear' && v <= 0)) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return [lo, hi];
}

function series(rows: number, seed: number, withNonPositive: boolean): Float64Array {
  const rng = createRng(seed);
  const specials = [Number.NaN, Infinity, -Infinity, 0, -3];
  return Float64Array.from({ length: rows }, (_, k) => {
    const u = nextUniform(rng);
    if (u < 0.02) return specials[Math.floor(nextUniform(rng) * (withNonPositive ? 5 : 3))];
    return 10 ** (4 - 8 * nextUniform(rng)) + k * 1e-9;
  });
}

describe('loss chart extremes', () => {
  for (const withNonPositive of [false, true])
    it(`match the full scan for every axis at every count of a growing series (${withNonPositive ? 'with' : 'without'} values <= 0)`, () => {
      const loss = series(3000, withNonPositive ? 5 : 9, withNonPositive);
      const axes: LossAxis[] = [{ kind: 'gap', minimum: 0.5 }, { kind: 'gap', minimum: -2 }, { kind: 'log' }, { kind: 'linear' }];
      for (let count = 0; count <= loss.length; count += 37) {
        const e = lossExtremes(loss, count);
        for (const axis of axes) expect(axisRange(axis, e)).toEqual(scannedRange(axis, loss, count));
        const scannedChoice = Array.from(loss.subarray(0, count)).some((v) => !(v > 0) && Number.isFinite(v)) ? 'linear' : 'log';
        expect(chooseLossAxis([{ loss, count, style: runStyle(0), label: 'a' }], null).kind).toBe(scannedChoice);
      }
    });

  it('start over for a shorter count', () => {
    const loss = Float64Array.of(5, 1, 9, -1);
    expect(lossExtremes(loss, 4).minFinite).toBe(-1);
    expect(lossExtremes(loss, 2)).toMatchObject({ rows: 2, minFinite: 1, maxFinite: 5, nonPositive: false });
  });
});
