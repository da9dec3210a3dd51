/** Small studies of every kind on Himmelblau's function, shared by the file, CLI and engine tests (made up for the tests). */
import { defaultOptimizerSpec, type LearningRateSweepSpec, type MultiStartSpec, type StartMapSpec, type StudySpec } from '../src/engine';

const stop = { maxSteps: 300, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-8 };

export function startMapStudy(): StartMapSpec {
  return { kind: 'start-map', optimizer: { ...defaultOptimizerSpec('gd'), learningRate: 0.01 }, stop, seed: 3, box: { a: [-5, 5], b: [-5, 5] }, axes: [0, 1], base: [0, 0], resolution: 16 };
}

export function multiStartStudy(): MultiStartSpec {
  return { kind: 'multi-start', optimizer: { ...defaultOptimizerSpec('adam'), learningRate: 0.05 }, stop, seed: 1, distribution: { kind: 'uniform', box: [[-4, 4], [-4, 4]] }, count: 40, startSeed: 7 };
}

export function rateSweepStudy(): LearningRateSweepSpec {
  return {
    kind: 'lr-sweep',
    optimizers: [
      { label: 'plain steps', spec: { ...defaultOptimizerSpec('gd'), learningRate: 0.01 } },
      { label: 'heavy ball', spec: { ...defaultOptimizerSpec('momentum'), learningRate: 0.01 } },
    ],
    stop: { maxSteps: 200, lossChangeTolerance: 1e-12 },
    seed: 2,
    start: [0.5, -0.5],
    range: [1e-4, 0.2],
    count: 16,
  };
}

export function everyStudy(): StudySpec[] {
  return [startMapStudy(), multiStartStudy(), rateSweepStudy()];
}
