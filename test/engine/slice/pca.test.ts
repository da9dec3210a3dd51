import { Matrix, SVD } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createRng, dot, nextGaussian, norm2, pcaPlane, planePoint, type RngState } from '../../../src/engine';

// Reference library: ml-matrix 6.15.1 (npm), its SingularValueDecomposition (Golub-Kahan-Reinsch, from
// JAMA). The PCA construction is Li et al., "Visualizing the Loss Landscape of Neural Nets", NeurIPS
// 2018: rows theta_i - theta_final, first two principal directions, explained variance ratios.

/** A random walk with drift and shrinking steps: roughly what an optimizer's snapshots look like. */
function trajectory(rng: RngState, count: number, n: number): Float64Array {
  const pts = new Float64Array(count * n);
  const drift = Array.from({ length: n }, () => nextGaussian(rng));
  for (let k = 0; k < n; k++) pts[k] = 3 * nextGaussian(rng);
  for (let i = 1; i < count; i++) {
    const step = 1 / Math.sqrt(i);
    for (let k = 0; k < n; k++) pts[i * n + k] = pts[(i - 1) * n + k] + step * (drift[k] + 0.7 * nextGaussian(rng));
  }
  return pts;
}

/** ml-matrix's singular values and right singular vectors of the difference matrix. */
function referenceSvd(pts: Float64Array, count: number, n: number, subtractMean: boolean) {
  const rows = Array.from({ length: count - 1 }, (_, i) => Array.from({ length: n }, (_, k) => pts[i * n + k] - pts[(count - 1) * n + k]));
  if (subtractMean)
    for (let k = 0; k < n; k++) {
      const mean = rows.reduce((s, r) => s + r[k], 0) / rows.length;
      for (const r of rows) r[k] -= mean;
    }
  const svd = new SVD(new Matrix(rows), { autoTranspose: true });
  const s2 = svd.diagonal.map((s) => s * s);
  const total = s2.reduce((a, b) => a + b, 0);
  const v = svd.rightSingularVectors;
  return { explained: [s2[0] / total, s2[1] / total], d1: v.getColumn(0), d2: v.getColumn(1) };
}

const alignment = (a: ArrayLike<number>, b: ArrayLike<number>) => Math.abs(dot(a, b)) / (norm2(a) * norm2(b));

describe('pcaPlane against ml-matrix SVD', () => {
  const cases = [
    { count: 12, n: 40, label: 'fewer snapshots than parameters (Gram route)' },
    { count: 60, n: 9, label: 'more snapshots than parameters (covariance route)' },
    { count: 21, n: 21, label: 'square-ish' },
  ];
  for (const subtractMean of [false, true])
    it.each(cases)(`$label, subtractMean ${subtractMean}: orthonormal, same explained ratios and directions up to sign`, ({ count, n }) => {
      const rng = createRng(count * 100 + n + (subtractMean ? 1 : 0));
      for (let trial = 0; trial < 4; trial++) {
        const pts = trajectory(rng, count, n);
        const { plane, explained, rank } = pcaPlane(pts, count, n, { subtractMean });
        expect(rank).toBe(2);
        expect(norm2(plane.u)).toBeCloseTo(1, 12);
        expect(norm2(plane.v)).toBeCloseTo(1, 12);
        expect(Math.abs(dot(plane.u, plane.v))).toBeLessThan(1e-12);
        const ref = referenceSvd(pts, count, n, subtractMean);
        expect(explained[0]).toBeCloseTo(ref.explained[0], 10);
        expect(explained[1]).toBeCloseTo(ref.explained[1], 10);
        expect(alignment(plane.u, ref.d1)).toBeCloseTo(1, 8);
        expect(alignment(plane.v, ref.d2)).toBeCloseTo(1, 8);
      }
    });
});

describe('pcaPlane on paths of known shape', () => {
  it('recovers a path lying in a known plane: explained sums to 1 and the projection reproduces every point', () => {
    const rng = createRng(11);
    const n = 25;
    const count = 30;
    const centre = Array.from({ length: n }, () => nextGaussian(rng));
    const p = Array.from({ length: n }, () => nextGaussian(rng));
    const q = Array.from({ length: n }, () => nextGaussian(rng));
    const pts = new Float64Array(count * n);
    for (let i = 0; i < count; i++) {
      const s = i / (count - 1);
      const a = 4 * (1 - s) * Math.cos(5 * s);
      const b = 3 * (1 - s) * Math.sin(5 * s);
      for (let k = 0; k < n; k++) pts[i * n + k] = centre[k] + a * p[k] + b * q[k];
    }
    const { plane, explained, projected, rank } = pcaPlane(pts, count, n);
    expect(rank).toBe(2);
    expect(explained[0] + explained[1]).toBeCloseTo(1, 12);
    expect(explained[0]).toBeGreaterThanOrEqual(explained[1]);
    const at = new Float64Array(n);
    for (let i = 0; i < count; i++) {
      planePoint(plane, projected[2 * i], projected[2 * i + 1], at);
      for (let k = 0; k < n; k++) expect(at[k]).toBeCloseTo(pts[i * n + k], 10);
    }
    // The final point is the origin and projects to (0, 0); the start projects to a <= 0, b <= 0.
    expect([projected[2 * count - 2], projected[2 * count - 1]]).toEqual([0, 0]);
    expect(projected[0]).toBeLessThanOrEqual(0);
    expect(projected[1]).toBeLessThanOrEqual(0);
  });

  it('a straight path has rank 1: explained [1, 0] and a unit second direction orthogonal to the first', () => {
    const n = 6;
    const count = 8;
    const start = [1, 2, 3, 4, 5, 6];
    const dir = [0.5, -1, 0, 2, 0.25, 1];
    const pts = new Float64Array(count * n);
    for (let i = 0; i < count; i++) for (let k = 0; k < n; k++) pts[i * n + k] = start[k] + (i / (count - 1)) ** 2 * dir[k];
    for (const subtractMean of [false, true]) {
      const { plane, explained, projected, rank } = pcaPlane(pts, count, n, { subtractMean });
      expect(rank).toBe(1);
      expect(explained[0]).toBeCloseTo(1, 12);
      expect(explained[1]).toBe(0);
      expect(alignment(plane.u, dir)).toBeCloseTo(1, 12);
      expect(norm2(plane.v)).toBeCloseTo(1, 12);
      expect(Math.abs(dot(plane.u, plane.v))).toBeLessThan(1e-12);
      expect(projected.every(Number.isFinite)).toBe(true);
      expect(projected[0]).toBeCloseTo(-norm2(dir), 12);
    }
  });

  it('two points give rank 1; one point or all-equal points give rank 0 with the first two axes and zeros, never NaN', () => {
    expect(pcaPlane([0, 0, 0, 1, 1, 1], 2, 3).rank).toBe(1);
    for (const [pts, count] of [[[4, 5, 6], 1], [[4, 5, 6, 4, 5, 6, 4, 5, 6], 3]] as const) {
      const r = pcaPlane(pts, count, 3);
      expect(r.rank).toBe(0);
      expect(r.explained).toEqual([0, 0]);
      expect(r.plane).toEqual({ origin: [4, 5, 6], u: [1, 0, 0], v: [0, 1, 0] });
      expect(Array.from(r.projected)).toEqual(new Array(2 * count).fill(0));
    }
  });

  it('rejects bad input with messages', () => {
    expect(() => pcaPlane([1, 2], 2, 1)).toThrow('pcaPlane: a plane needs at least 2 parameters, got 1');
    expect(() => pcaPlane([1, 2, 3], 2, 2)).toThrow('pcaPlane: expected 2 x 2 = 4 numbers, got 3');
    expect(() => pcaPlane([1, 2, Number.NaN, 4], 2, 2)).toThrow('pcaPlane: point 1 has a non-finite coordinate 1');
    expect(() => pcaPlane([], 0, 2)).toThrow(/count must be a whole number of at least 1/);
  });
});
