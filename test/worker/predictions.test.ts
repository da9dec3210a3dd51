import { describe, expect, it } from 'vitest';
import type { SurfaceSpec } from '../../src/problems';
import type { FromWorker } from '../../src/protocol';
import { FitPredictor } from '../../src/worker/predictions';

const rows = [
  [0.5, 1.0, 1],
  [-1.0, 2.0, 0],
  [2.0, -0.5, 1],
  [0.0, 0.0, 0],
];
const logistic: SurfaceSpec = {
  kind: 'datafit',
  dataset: { kind: 'table', name: 'made-up', columns: ['u', 'v', 'c'], rows, categories: { c: ['no', 'yes'] } },
  model: { kind: 'logistic', inputs: ['u', 'v'], target: 'c' },
};

function ask(spec: SurfaceSpec, params: number[], inputs: number[][]) {
  const out: FromWorker[] = [];
  new FitPredictor((m) => out.push(m)).predict('r1', spec, Float64Array.from(params), Float64Array.from(inputs.flat()), inputs.length);
  return out[0];
}

describe('predictions for the data view, computed in the worker', () => {
  it('gives a logistic model P(y = 1) = 1 / (1 + exp(-(b + w_u u + w_v v))) at each row (hand-computed)', () => {
    // Parameter order of the logistic surface: intercept, w_u, w_v.
    const [b, wu, wv] = [0.3, -1.2, 0.8];
    const inputs = [[0.5, 1], [-1, 2], [3, -2]];
    const reply = ask(logistic, [b, wu, wv], inputs);
    expect(reply.type).toBe('fit/predictions');
    if (reply.type !== 'fit/predictions') return;
    expect(reply.width).toBe(1);
    inputs.forEach(([u, v], k) => expect(reply.outputs[k]).toBeCloseTo(1 / (1 + Math.exp(-(b + wu * u + wv * v))), 14));
  });

  it('gives a softmax model one probability per class, summing to 1', () => {
    const spec: SurfaceSpec = { ...logistic, model: { kind: 'softmax', inputs: ['u', 'v'], target: 'c' } } as SurfaceSpec;
    // Two classes, each with intercept and two weights: class scores z_k = b_k + w_k . x.
    const params = [0.1, 0.5, -0.5, -0.2, 1.0, 0.25];
    const reply = ask(spec, params, [[1, 2]]);
    if (reply.type !== 'fit/predictions') throw new Error(JSON.stringify(reply));
    expect(reply.width).toBe(2);
    expect(reply.outputs[0] + reply.outputs[1]).toBeCloseTo(1, 14);
  });

  it('refuses parameters of the wrong length, a ragged batch and a surface that is not a data fit, by name', () => {
    const wrong = ask(logistic, [1, 2], [[0, 0]]);
    expect(wrong).toEqual({ type: 'fit/error', requestId: 'r1', message: 'predictions: the model has 3 parameters, got 2' });
    const out: FromWorker[] = [];
    new FitPredictor((m) => out.push(m)).predict('r2', logistic, Float64Array.of(0, 0, 0), Float64Array.of(1, 2, 3), 2);
    expect(out[0]).toEqual({ type: 'fit/error', requestId: 'r2', message: 'predictions: expected 2 rows of 2 inputs, got 3 numbers' });
    const other = ask({ kind: 'catalogue', id: 'himmelblau' }, [0, 0], [[0, 0]]);
    expect(other).toMatchObject({ type: 'fit/error', message: 'predictions: the surface is a catalogue surface, not a model fitted to data' });
  });
});
