import { gridA, gridB, hasParameterGroups, randomPlane, sampleGrid, type GridRequest } from '../src/engine';
import { buildSurface, designFor, linearLeastSquares, type DataFitSpec } from '../src/problems';
import { bestMsInTurn, sink } from './measure';

const SIDE = 128;
const ROWS = 1000;

/**
 * The benchmark's data-fit surface: linear regression of pod mass on pod length and ripeness (mean
 * squared error, 3 parameters [intercept, w_length_mm, w_ripe]) over 1,000 rows of the made-up
 * seed-pods data.
 */
export const DATAFIT_SPEC: DataFitSpec = {
  kind: 'datafit',
  dataset: { kind: 'demo', id: 'seed-pods', seed: 1, rows: ROWS },
  model: { kind: 'linear', inputs: ['length_mm', 'ripe'], target: 'mass_g', loss: 'mse' },
};

const design = () => designFor(DATAFIT_SPEC.dataset, DATAFIT_SPEC.model.inputs, DATAFIT_SPEC.model.target, false);

/**
 * A 128 x 128 slice on a filter-normalised random plane (seed 7; the intercept held, the paper's
 * treatment of biases) through the least-squares fit, a in [-1, 1], b in [-1, 1].
 */
export function datafitSlice(): { spec: DataFitSpec; grid: GridRequest } {
  const surface = buildSurface(DATAFIT_SPEC);
  if (!hasParameterGroups(surface)) throw new Error('bench: the data-fit surface has no parameter groups');
  const centre = linearLeastSquares(design(), 'mse', 0);
  const plane = randomPlane(centre, surface.parameterGroups, 7);
  return { spec: DATAFIT_SPEC, grid: { plane, a: [-1, 1], b: [-1, 1], nx: SIDE, ny: SIDE } };
}

/**
 * sampleGrid on the data-fit surface built by buildSurface, against a plain loop written for this one
 * model: it forms each point of the plane and averages the squared residuals of b + w1 x1 + w2 x2 over
 * the same design matrix itself.
 */
export function datafitGridVsHandwritten() {
  const { grid } = datafitSlice();
  const surface = buildSurface(DATAFIT_SPEC);
  const { x, y, rows, p } = design();
  if (p !== 2 || surface.dimension !== 3) throw new Error('bench: expected 2 inputs and 3 parameters');
  const { origin, u, v } = grid.plane;
  const engineOut = new Float64Array(SIDE * SIDE);
  const handOut = new Float64Array(SIDE * SIDE);
  const hand = () => {
    for (let j = 0; j < SIDE; j++) {
      const b = gridB(grid, j);
      for (let i = 0; i < SIDE; i++) {
        const a = gridA(grid, i);
        const t0 = origin[0] + b * v[0] + a * u[0];
        const t1 = origin[1] + b * v[1] + a * u[1];
        const t2 = origin[2] + b * v[2] + a * u[2];
        let s = 0;
        for (let r = 0; r < rows; r++) {
          const e = t0 + t1 * x[2 * r] + t2 * x[2 * r + 1] - y[r];
          s += e * e;
        }
        handOut[i + j * SIDE] = s / rows;
      }
    }
    sink.value += handOut[1234];
  };
  // The same loop written for any number of inputs, as a general model has to be: how much of the gap
  // to the loop above is the model's generality rather than the engine's slice and surface layers.
  const genericOut = new Float64Array(SIDE * SIDE);
  const theta = new Float64Array(p + 1);
  const handGeneric = () => {
    for (let j = 0; j < SIDE; j++) {
      const b = gridB(grid, j);
      for (let i = 0; i < SIDE; i++) {
        const a = gridA(grid, i);
        for (let k = 0; k <= p; k++) theta[k] = origin[k] + b * v[k] + a * u[k];
        let s = 0;
        for (let r = 0; r < rows; r++) {
          let f = theta[0];
          for (let c = 0; c < p; c++) f += theta[c + 1] * x[r * p + c];
          const e = f - y[r];
          s += e * e;
        }
        genericOut[i + j * SIDE] = s / rows;
      }
    }
    sink.value += genericOut[1234];
  };
  const engine = () => {
    sampleGrid(surface, grid, engineOut);
    sink.value += engineOut[1234];
  };
  engine();
  hand();
  handGeneric();
  for (let k = 0; k < engineOut.length; k++)
    for (const other of [handOut, genericOut])
      if (!(Math.abs(engineOut[k] - other[k]) <= 1e-12 * (1 + Math.abs(other[k])))) throw new Error(`bench: data-fit grid values differ at ${k}: ${engineOut[k]} vs ${other[k]}`);
  const [engineMs, handMs, genericMs] = bestMsInTurn([engine, hand, handGeneric]);
  return {
    surface: 'linear regression, 2 inputs, seed-pods',
    rows,
    parameters: surface.dimension,
    engineMs,
    handwrittenMs: handMs,
    handwrittenGenericMs: genericMs,
    ratio: handMs / engineMs,
    genericRatio: genericMs / engineMs,
  };
}
