/** Small experiments for the command-line tests (scenarios made up for the tests). */
import { defaultOptimizerSpec, type OptimizerKind } from '../../src/engine';
import type { Workspace } from '../../src/io/experiment/types';
import { demoWorkspace } from '../../src/store/demo';
import { everyStudy } from '../study-examples';

/** Seven runs of five optimizers on Himmelblau's function: enough to split unevenly into shards. */
export function sweepExperiment(): Workspace {
  const kinds: [OptimizerKind, number][] = [['gd', 0.01], ['momentum', 0.005], ['adam', 0.05], ['rmsprop', 0.01], ['nadam', 0.05], ['lbfgs', 1], ['gd', 0.002]];
  return {
    ...demoWorkspace(),
    title: 'Himmelblau sweep',
    surface: { kind: 'catalogue', id: 'himmelblau' },
    runs: kinds.map(([kind, lr], k) => ({
      id: `r${k}`,
      label: `${kind} at ${lr}`,
      optimizer: { ...defaultOptimizerSpec(kind), learningRate: lr },
      settings: { start: [-1 + 0.3 * k, 0.5 - 0.2 * k], seed: k + 1, stop: { maxSteps: 400 + 50 * k, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-8 } },
      style: k,
    })),
  };
}

/** The sweep with one run whose learning rate makes it blow up. */
export function divergingExperiment(): Workspace {
  const w = sweepExperiment();
  w.runs[2] = { ...w.runs[2], label: 'too fast', optimizer: { ...defaultOptimizerSpec('gd'), learningRate: 5 } };
  return w;
}

/** A quick run, then one slow enough (a long formula, a million steps) to interrupt. */
export function slowExperiment(): Workspace {
  const w = sweepExperiment();
  const wiggle = Array.from({ length: 150 }, (_, k) => `sin(x + ${k}) * cos(y - ${k})`).join(' + ');
  w.surface = { kind: 'formula', text: `x^2 + y^2 + 0.0001 * (${wiggle})` };
  w.runs = [
    { ...w.runs[0], settings: { ...w.runs[0].settings, stop: { maxSteps: 50 } } },
    { ...w.runs[1], settings: { ...w.runs[1].settings, stop: { maxSteps: 1_000_000 } } },
  ];
  return w;
}

/** Two quick runs and one study of each kind on Himmelblau's function (test/study-examples.ts). */
export function studyExperiment(): Workspace {
  const w = sweepExperiment();
  return { ...w, version: 3, title: 'Himmelblau studies', runs: w.runs.slice(0, 2), studies: everyStudy() };
}
