import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { createRng, nextGaussian } from '../../src/engine';
import { buildDataFitSurface, designFor, linearLeastSquares, type DataFitSpec, type TableDatasetSpec } from '../../src/problems';

/**
 * Ordinary and ridge least squares against the reference library ml-matrix 6.15.1 (its `solve`
 * uses Householder QR for a tall matrix, its own code, independent of ours) on generated data.
 */
function generatedTable(seed: number, rows: number): TableDatasetSpec {
  const rng = createRng(seed);
  const data: number[][] = [];
  for (let i = 0; i < rows; i++) {
    const a = 10 + 3 * nextGaussian(rng);
    const b = -200 + 50 * nextGaussian(rng);
    const c = 0.5 * a + 0.01 * b + nextGaussian(rng);
    data.push([a, b, c, 4 - 1.5 * a + 0.02 * b + 3 * c + 2 * nextGaussian(rng)]);
  }
  return { kind: 'table', name: `generated ${seed}`, columns: ['a', 'b', 'c', 'y'], rows: data };
}

function mlMatrixFit(table: TableDatasetSpec, ridge: number): number[] {
  const X = new Matrix(table.rows.map((r) => [1, r[0], r[1], r[2]]));
  const y = Matrix.columnVector(table.rows.map((r) => r[3]));
  if (ridge === 0) return solve(X, y).to1DArray();
  // (X^T X + ridge D) w = X^T y with D = diag(0, 1, 1, 1): a square system, solved by LU.
  const lhs = X.transpose().mmul(X);
  for (let j = 1; j < 4; j++) lhs.set(j, j, lhs.get(j, j) + ridge);
  return solve(lhs, X.transpose().mmul(y)).to1DArray();
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('least squares agrees with ml-matrix 6.15.1', () => {
  it.each([1, 2, 3])('ordinary least squares on generated data, seed %i', (seed) => {
    const table = generatedTable(seed, 80);
    const design = designFor(table, ['a', 'b', 'c'], 'y', false);
    const mine = Array.from(linearLeastSquares(design, 'rss', 0));
    const theirs = mlMatrixFit(table, 0);
    mine.forEach((w, j) => expect(relative(w, theirs[j])).toBeLessThan(1e-10));
  });

  it.each([
    ['rss', 0.8],
    ['mse', 0.05],
  ] as const)('ridge with the intercept unpenalised (%s loss, lambda %s)', (loss, l2) => {
    const table = generatedTable(9, 60);
    const design = designFor(table, ['a', 'b', 'c'], 'y', false);
    const mine = Array.from(linearLeastSquares(design, loss, l2));
    // scale |X w - y|^2 + l2/2 |w|^2 is minimal where (X^T X + l2 / (2 scale) D) w = X^T y.
    const scale = loss === 'rss' ? 1 : 1 / 60;
    const theirs = mlMatrixFit(table, l2 / (2 * scale));
    mine.forEach((w, j) => expect(relative(w, theirs[j])).toBeLessThan(1e-9));
    // And the surface's exact gradient vanishes there.
    const spec: DataFitSpec = { kind: 'datafit', dataset: table, model: { kind: 'linear', inputs: ['a', 'b', 'c'], target: 'y', loss }, l2 };
    const g = new Float64Array(4);
    buildDataFitSurface(spec).valueGradient(mine, g);
    expect(Math.max(...g.map(Math.abs))).toBeLessThan(1e-8);
  });
});
