import { describe, expect, it } from 'vitest';
import type { TrajectoryBatch } from '../../src/engine';
import { TrajectoryBuffer, UPFRONT_BYTES, upfrontCapacity } from '../../src/store/trajectory-buffer';

function batch(firstStep: number, count: number, dimension: number): TrajectoryBatch {
  const points = Float64Array.from({ length: count * dimension }, (_, i) => firstStep * dimension + i);
  return { firstStep, count, dimension, points, loss: new Float64Array(count), gradNorm: new Float64Array(count), learningRate: new Float64Array(count), outcome: null };
}

describe('trajectory buffers on the page', () => {
  it('reserve a whole run up front while it fits, so a long run of many parameters is never copied', () => {
    expect(upfrontCapacity(1185, 3000)).toBe(3001);
    expect(upfrontCapacity(2, 5000)).toBe(5001);
    // Past the byte cap: as many rows as fit (8 bytes per coordinate and per recorded number).
    expect(upfrontCapacity(1185, 1_000_000)).toBe(Math.floor(UPFRONT_BYTES / (8 * 1188)));
    expect(upfrontCapacity(3, 2)).toBe(16);
    const b = new TrajectoryBuffer(1185, upfrontCapacity(1185, 3000));
    const points = b.points;
    for (let s = 0; s <= 3000; s += 250) b.append(batch(s, Math.min(250, 3001 - s), 1185));
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
});
