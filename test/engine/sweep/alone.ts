import { buildOptimizer, RunCursor, type OptimizerSpec, type RunOutcome, type StopRules, type Surface } from '../../../src/engine';

/** Runs each start alone through RunCursor: the reference every sweep result must equal bit for bit. */
export function runAlone(
  surface: Surface,
  spec: OptimizerSpec,
  stop: StopRules,
  starts: Float64Array,
  options: { learningRates?: Float64Array; seeds?: Float64Array; seed?: number; gradientNoise?: number } = {},
) {
  const n = surface.dimension;
  const count = starts.length / n;
  const out: { point: number[]; loss: number; steps: number; evaluations: number; outcome: RunOutcome | null }[] = [];
  for (let r = 0; r < count; r++) {
    const optimizer = buildOptimizer({ ...spec, learningRate: options.learningRates ? options.learningRates[r] : spec.learningRate });
    const cursor = new RunCursor(surface, optimizer, {
      start: Array.from(starts.subarray(r * n, (r + 1) * n)),
      stop,
      seed: options.seeds ? options.seeds[r] : (options.seed ?? 0),
      gradientNoise: options.gradientNoise,
    });
    cursor.runToEnd();
    const s = cursor.state;
    out.push({ point: Array.from(s.x), loss: s.loss, steps: s.t, evaluations: s.evaluations, outcome: cursor.outcome });
  }
  return out;
}

/** count x 2 starts on a res x res grid over [x0, x1] x [y0, y1] (cell centres), written out by hand. */
export function gridStarts(x0: number, x1: number, y0: number, y1: number, res: number): Float64Array {
  const s = new Float64Array(res * res * 2);
  for (let j = 0; j < res; j++)
    for (let i = 0; i < res; i++) {
      s[2 * (j * res + i)] = x0 + ((i + 0.5) * (x1 - x0)) / res;
      s[2 * (j * res + i) + 1] = y0 + ((j + 0.5) * (y1 - y0)) / res;
    }
  return s;
}
