import { axisPlane, compileFormula, sampleGrid } from '../src/engine';
import { rosenbrock, ROSENBROCK } from './handwritten';
import { bestMsInTurn, sink } from './measure';

const SIDE = 256;

/** A 256 x 256 grid of Rosenbrock through sampleGrid and the compiled formula, against a plain loop. */
export function gridVsHandwritten() {
  const surface = compileFormula(ROSENBROCK);
  const req = { plane: axisPlane([0, 0], 0, 1), a: [-2, 2] as [number, number], b: [-1, 3] as [number, number], nx: SIDE, ny: SIDE };
  const engineOut = new Float64Array(SIDE * SIDE);
  const handOut = new Float64Array(SIDE * SIDE);
  const hand = () => {
    for (let j = 0; j < SIDE; j++) {
      const y = -1 + (j * 4) / (SIDE - 1);
      for (let i = 0; i < SIDE; i++) handOut[i + j * SIDE] = rosenbrock(-2 + (i * 4) / (SIDE - 1), y);
    }
    sink.value += handOut[12345];
  };
  const engine = () => {
    sampleGrid(surface, req, engineOut);
    sink.value += engineOut[12345];
  };
  engine();
  hand();
  for (let k = 0; k < engineOut.length; k++)
    if (Math.abs(engineOut[k] - handOut[k]) > 1e-9 * (1 + handOut[k])) throw new Error(`bench: grid values differ at ${k}`);
  const [engineMs, handMs] = bestMsInTurn([engine, hand]);
  return { engineMs, handwrittenMs: handMs, ratio: handMs / engineMs };
}
