import { describe, expect, it } from 'vitest';
import type { EndPoint, TrajectoryBatch } from '../../src/engine';

const END: EndPoint = { gradNorm: 1, gradThreshold: 0, stationary: false, curvature: null, newtonStep: null };
import { KEPT_BYTES, TrajectoryBuffer, keptRowsLimit, upfrontCapacity } from '../../src/store/trajectory-buffer';

/** Rows whose every number encodes its step: points (step * dimension + column), loss = step. */
function batch(firstStep: number, count: number, dimension: number, ended = false): TrajectoryBatch {
  const points = Float64Array.from({ length: count * dimension }, (_, i) => firstStep * dimension + i);
  const loss = Float64Array.from({ length: count }, (_, k) => firstStep + k);
  const outcome = ended ? { kind: 'step-limit' as const, step: firstStep + count - 1, point: END } : null;
  return { firstStep, count, dimension, points, loss, gradNorm: loss.map((v) => 2 * v), learningRate: loss.map((v) => 3 * v), outcome };
}

describe('trajectory buffers on the page', () => {
  it('reserve a whole run up front while it fits, so a long run of many parameters is never copied', () => {
    expect(upfrontCapacity(1185, 3000)).toBe(3001);
    expect(upfrontCapacity(2, 5000)).toBe(5001);
    // Past the byte cap: as many rows as fit (8 bytes per coordinate and per recorded number).
    expect(upfrontCapacity(1185, 1_000_000)).toBe(keptRowsLimit(1185));
    expect(keptRowsLimit(1185)).toBe(2 * Math.floor(KEPT_BYTES / (8 * 1189) / 2));
    expect(upfrontCapacity(3, 2)).toBe(16);
    const b = new TrajectoryBuffer(1185, upfrontCapacity(1185, 3000));
    expect(b.points.length).toBe(0); // reserved with the first batch, not at launch
    b.append(batch(0, 250, 1185));
    const points = b.points;
    expect(points.length).toBe(3001 * 1185);
    for (let s = 250; s <= 3000; s += 250) b.append(batch(s, Math.min(250, 3001 - s), 1185));
    expect(b.count).toBe(3001);
    expect(b.points).toBe(points);
    expect(b.point(3000)[1184]).toBe(3000 * 1185 + 1184);
  });

  it('grows past its capacity keeping every step', () => {
    const b = new TrajectoryBuffer(2, 16);
    for (let s = 0; s < 100; s += 10) b.append(batch(s, 10, 2));
    expect(b.count).toBe(100);
    expect(Array.from(b.point(99))).toEqual([198, 199]);
    expect(Array.from(b.point(7))).toEqual([14, 15]);
  });

  it('keeps every step until its rows fill, then every 2nd, 4th, ... step, and always the last one of an ended run', () => {
    const b = new TrajectoryBuffer(2, 8, 16);
    for (let s = 0; s < 16; s += 4) b.append(batch(s, 4, 2));
    expect([b.count, b.keepEvery, b.generation]).toEqual([16, 1, 0]);
    const before = b.points;
    b.append(batch(16, 7, 2)); // steps 16..22: the rows are full, so steps thin to the even ones
    expect(b.keepEvery).toBe(2);
    expect(b.generation).toBe(1);
    expect(b.points).not.toBe(before); // new arrays, so readers caching per array start over
    expect(Array.from(b.steps.subarray(0, b.count))).toEqual([0, 2, 4, 6, 8, 10, 12, 14, 16, 18, 20, 22]);
    b.append(batch(23, 20, 2, true)); // steps 23..42, ended: the rows fill again at step 30 and thin to multiples of 4
    const steps = Array.from(b.steps.subarray(0, b.count));
    expect(b.keepEvery).toBe(4);
    expect(steps).toEqual([0, 4, 8, 12, 16, 20, 24, 28, 32, 36, 40, 42]);
    // Every kept row is the row of its step, in every column.
    for (let k = 0; k < b.count; k++) {
      const step = steps[k];
      expect(Array.from(b.point(k))).toEqual([2 * step, 2 * step + 1]);
      expect([b.loss[k], b.gradNorm[k], b.learningRate[k], b.stepOf(k)]).toEqual([step, 2 * step, 3 * step, step]);
    }
    expect(b.count).toBeLessThanOrEqual(16);
    expect(Array.from(b.asBatch().steps!)).toEqual(steps);
  });

  it('stays within its byte budget over a run of 10^7 steps in 2-D, and hands out step numbers only once it thinned', () => {
    const b = new TrajectoryBuffer(2, upfrontCapacity(2, 10_000_000));
    expect(b.asBatch().steps).toBeUndefined();
    const size = 50_000;
    for (let s = 0; s < 10_000_000; s += size) b.append(batch(s, Math.min(size, 10_000_000 - s), 2, s + size >= 10_000_000));
    const bytes = b.points.byteLength + b.loss.byteLength + b.gradNorm.byteLength + b.learningRate.byteLength + b.steps.byteLength;
    expect(bytes).toBeLessThanOrEqual(KEPT_BYTES);
    expect(b.keepEvery).toBe(16); // 10^7 / 16 = 625,000 rows fit, 10^7 / 8 do not
    expect(b.stepOf(b.count - 1)).toBe(9_999_999);
    expect(b.stepOf(b.count - 2)).toBe(9_999_984);
    expect(b.asBatch().steps?.length).toBe(b.count);
  });

  it('refuses a batch that does not continue where the last one ended', () => {
    const b = new TrajectoryBuffer(2, 8, 8);
    b.append(batch(0, 10, 2));
    expect(() => b.append(batch(9, 2, 2))).toThrow('batch starts at step 9, expected 10');
  });
});
