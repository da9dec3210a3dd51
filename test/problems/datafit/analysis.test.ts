import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { classifyPoint, sharpnessAlong } from '../../../src/engine';
import { buildDataFitSurface, initialNetworkParameters, MlpSurface } from '../../../src/problems';

/**
 * classifyPoint and sharpnessAlong on a data-fit network past the dense limit (n = 265 > 200), so
 * both go through Lanczos on the network's exact Hessian-vector products; checked against ml-matrix
 * 6.15.1's dense symmetric EigenvalueDecomposition of the full exact Hessian.
 */
const surface = buildDataFitSurface({
  kind: 'datafit',
  dataset: { kind: 'demo', id: 'wave-boundary', rows: 60 },
  model: { kind: 'mlp', inputs: ['u', 'v'], target: 'kind', hidden: [16, 12], activation: 'tanh', head: 'binary' },
  l2: 0.001,
}) as MlpSurface;
const n = surface.dimension;

function denseExtremes(x: ArrayLike<number>): [number, number] {
  const hessian = new Float64Array(n * n);
  surface.valueGradientHessian(x, new Float64Array(n), hessian);
  const rows = Array.from({ length: n }, (_, i) => Array.from(hessian.subarray(i * n, (i + 1) * n)));
  const values = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true }).realEigenvalues;
  return [Math.min(...values), Math.max(...values)];
}

describe('analysis of a 265-parameter network', () => {
  it('classifyPoint takes the Lanczos path and agrees with the dense extremes', () => {
    expect(n).toBe(265);
    const x = initialNetworkParameters(surface, 4);
    const c = classifyPoint(surface, x, { lanczos: { maxIterations: n, seed: 2 } });
    const [lo, hi] = denseExtremes(x);
    expect(c?.method).toBe('lanczos');
    expect(c?.kind).toBe(lo < 0 && hi > 0 ? 'saddle' : lo > 0 ? 'minimum' : 'degenerate');
    expect(Math.abs(c!.smallest - lo)).toBeLessThanOrEqual(1e-8 * Math.abs(lo));
    expect(Math.abs(c!.largest - hi)).toBeLessThanOrEqual(1e-8 * Math.abs(hi));
    expect(c?.negative).toBeUndefined();
  });

  it('sharpnessAlong gives the dense lambda_max at each point of a path', () => {
    const a = initialNetworkParameters(surface, 5);
    const b = initialNetworkParameters(surface, 6);
    const count = 3;
    const points = new Float64Array(count * n);
    for (let k = 0; k < count; k++) for (let j = 0; j < n; j++) points[k * n + j] = a[j] + (k / (count - 1)) * (b[j] - a[j]);
    const sharp = sharpnessAlong(surface, points, count, { lanczos: { maxIterations: n } });
    for (let k = 0; k < count; k++) {
      const hi = denseExtremes(points.subarray(k * n, (k + 1) * n))[1];
      expect(Math.abs(sharp[k] - hi)).toBeLessThanOrEqual(1e-8 * Math.abs(hi));
    }
  });
});
