import { defaultOptimizerSpec } from '../engine';
import { CURRENT_VERSION } from '../io/experiment';
import { DEFAULT_PACE } from './pace';
import { DEFAULT_STOP } from './run-configs';
import { DEFAULT_DISPLAY, type RunConfig, type Workspace } from './workspace';

/**
 * The workspace a newcomer sees: Rosenbrock's curved valley with gradient descent, heavy-ball momentum
 * and Adam racing from the classical start (-1.2, 1). Gradient descent creeps along the valley floor, momentum
 * overshoots across it, Adam gets there first: the point of the tool at a glance.
 */
export function demoWorkspace(): Workspace {
  const start = [-1.2, 1];
  const run = (id: string, label: string, style: number, optimizer: RunConfig['optimizer']): RunConfig => ({
    id,
    label,
    style,
    optimizer,
    settings: { start: start.slice(), seed: 1, stop: { ...DEFAULT_STOP } },
  });
  return {
    version: CURRENT_VERSION,
    surface: { kind: 'catalogue', id: 'rosenbrock' },
    slice: { axes: [0, 1], at: [0, 0] },
    view: { a: [-2, 2], b: [-1, 3] },
    display: { ...DEFAULT_DISPLAY },
    runs: [
      run('demo-gd', 'Gradient descent', 0, { ...defaultOptimizerSpec('gd'), learningRate: 0.001 }),
      run('demo-momentum', 'Momentum', 1, { ...defaultOptimizerSpec('momentum'), learningRate: 0.0005, hyper: { momentum: 0.9 } }),
      run('demo-adam', 'Adam', 2, { ...defaultOptimizerSpec('adam'), learningRate: 0.02 }),
    ],
    panels: { mode: 'single', tableOptimizers: ['gd', 'momentum', 'adam'], tableLearningRates: [0.0003, 0.001, 0.003] },
    tolerance: 1e-6,
    pace: DEFAULT_PACE,
  };
}
