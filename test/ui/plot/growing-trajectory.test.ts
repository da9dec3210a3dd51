// growingTrajectoryPath extends the walked polyline as a run streams; it must give exactly what the
// one-shot trajectoryPath gives for the same rows, whatever the increments (clipping, decimation,
// non-finite breaks and off-screen excursions included).
import { describe, expect, it } from 'vitest';
import { growingTrajectoryPath, trajectoryPath, viewTransform } from '../../../src/ui/plot';
import { createRng, nextUniform } from '../../../src/engine/rng';

const view = viewTransform({ a: [-1, 1], b: [-1, 1] }, { width: 300, height: 200 });

/** A random walk with jumps far off the view and a few NaN rows, 3 numbers per row (a, b in columns 2, 0). */
function walk(rows: number, seed: number): Float64Array {
  const rng = createRng(seed);
  const out = new Float64Array(rows * 3);
  let a = 0, b = 0;
  for (let r = 0; r < rows; r++) {
    const u = nextUniform(rng);
    if (u < 0.01) a = b = Number.NaN;
    else if (u < 0.03) a = 40 * (nextUniform(rng) - 0.5);
    else {
      if (!Number.isFinite(a)) a = b = 0;
      a += 0.01 * (nextUniform(rng) - 0.5);
      b += 0.01 * (nextUniform(rng) - 0.5);
      if (Math.abs(a) > 3) a = 0;
    }
    out[3 * r] = b;
    out[3 * r + 2] = a;
  }
  return out;
}

describe('growingTrajectoryPath', () => {
  const options = { layout: { stride: 3, a: 2, b: 0 }, markerEvery: 50 };

  it('equals trajectoryPath at every count, streamed in uneven increments', () => {
    const points = walk(5000, 7);
    const rng = createRng(11);
    for (let count = 0; count <= 5000; count += 1 + Math.floor(300 * nextUniform(rng))) {
      expect(growingTrajectoryPath(points, count, view, options)).toEqual(trajectoryPath(points, count, view, options));
    }
    expect(growingTrajectoryPath(points, 5000, view, options)).toEqual(trajectoryPath(points, 5000, view, options));
  });

  it('walks again for a shorter count, another view or other options', () => {
    const points = walk(2000, 3);
    growingTrajectoryPath(points, 2000, view, options);
    expect(growingTrajectoryPath(points, 700, view, options)).toEqual(trajectoryPath(points, 700, view, options));
    const zoomed = viewTransform({ a: [-0.2, 0.2], b: [-0.2, 0.2] }, { width: 300, height: 200 });
    expect(growingTrajectoryPath(points, 1500, zoomed, options)).toEqual(trajectoryPath(points, 1500, zoomed, options));
    const coarse = { ...options, minPixelStep: 5 };
    expect(growingTrajectoryPath(points, 1500, view, coarse)).toEqual(trajectoryPath(points, 1500, view, coarse));
    expect(growingTrajectoryPath(points, 1500, view, options)).toEqual(trajectoryPath(points, 1500, view, options));
  });
});
