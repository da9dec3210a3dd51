import { describe, expect, it } from 'vitest';
import { defaultOptimizerSpec } from '../../src/engine';
import { buildSurface } from '../../src/problems';
import { curvatureAt, roundDown, switchedOptimizer } from '../../src/store/suggest-rate';
import { createAppStore } from '../../src/store/app-store';
import { demoWorkspace } from '../../src/store/demo';
import { DEFAULT_STOP } from '../../src/store/run-configs';
import { headFor } from '../../src/ui/surface/datafit/draft';
import { inProcessLink } from './in-process-link';

describe('curvatureAt', () => {
  it('is 2 / lambda_max of the exact Hessian: Rosenbrock at (-1.2, 1)', () => {
    // H = [[1200 x^2 - 400 y + 2, -400 x], [-400 x, 200]] = [[1330, 480], [480, 200]] there.
    const c = curvatureAt(buildSurface({ kind: 'catalogue', id: 'rosenbrock' }), [-1.2, 1])!;
    const lambda = (1530 + Math.sqrt(1130 ** 2 + 4 * 480 ** 2)) / 2;
    expect(c.lambdaMax).toBeCloseTo(lambda, 8);
    expect(c.stableRate).toBeCloseTo(2 / lambda, 14);
    expect(c.suggestedRate).toBe(0.00066); // 0.5 * 2 / 1506.4 = 0.000664..., rounded down
  });
  it('gives no rate where the curvature is not positive', () => {
    const concave = buildSurface({ kind: 'formula', text: '-(x^2 + y^2)', variables: ['x', 'y'] });
    expect(curvatureAt(concave, [1, 1])).toEqual({ lambdaMax: -2, stableRate: null, suggestedRate: null });
  });
  it('rounds down to two significant digits', () => {
    expect(roundDown(0.000663, 2)).toBe(0.00066);
    expect(roundDown(0.5, 2)).toBe(0.5);
    expect(roundDown(12.99, 2)).toBe(12);
  });
});

describe('switchedOptimizer', () => {
  const gd = { ...defaultOptimizerSpec('gd'), learningRate: 0.0007 };
  it('keeps the rate between plain-gradient kinds and between adaptive kinds', () => {
    expect(switchedOptimizer(gd, 'nesterov', defaultOptimizerSpec('nesterov'), 0.001)).toEqual({ ...defaultOptimizerSpec('nesterov'), learningRate: 0.0007 });
    const adam = { ...defaultOptimizerSpec('adam'), learningRate: 0.03 };
    expect(switchedOptimizer(adam, 'rmsprop', defaultOptimizerSpec('rmsprop'), 0.001).learningRate).toBe(0.03);
  });
  it('gives a plain-gradient kind the suggested rate when coming from elsewhere, and other kinds their defaults', () => {
    const adam = { ...defaultOptimizerSpec('adam'), learningRate: 0.03 };
    expect(switchedOptimizer(adam, 'gd', defaultOptimizerSpec('gd'), 0.00066).learningRate).toBe(0.00066);
    expect(switchedOptimizer(adam, 'gd', defaultOptimizerSpec('gd'), null).learningRate).toBe(0.01);
    expect(switchedOptimizer(gd, 'lbfgs', defaultOptimizerSpec('lbfgs'), 0.00066).learningRate).toBe(1);
    expect(switchedOptimizer(gd, 'adam', defaultOptimizerSpec('adam'), 0.00066).learningRate).toBe(0.001);
  });
});

describe('page defaults', () => {
  function setup() {
    const env = inProcessLink();
    const app = createAppStore({ link: env.link, requestFrame: env.requestFrame, initial: demoWorkspace() });
    return { ...env, state: () => app.store.getState(), actions: app.store.getState().actions };
  }
  it('a new gradient descent or Nesterov run on the demo gets the suggested rate and the demo step budget, and does not diverge', () => {
    const t = setup();
    t.actions.setPace('max');
    const ids = (['gd', 'nesterov'] as const).map((k) => t.actions.addRun(k));
    t.drain();
    for (const id of ids) {
      const run = t.state().workspace.runs.find((r) => r.id === id)!;
      expect(run.optimizer.learningRate).toBe(0.00066);
      expect(run.settings.stop.maxSteps).toBe(3000);
      expect(run.settings.stop.maxSteps).toBe(t.state().workspace.runs[0].settings.stop.maxSteps);
      expect(t.state().status[id].summary.outcome?.kind).not.toBe('diverged');
      expect(Number.isFinite(t.state().status[id].summary.finalLoss)).toBe(true);
    }
    expect(DEFAULT_STOP.maxSteps).toBe(3000);
  });
  it('changing a run between plain-gradient kinds keeps its rate and renames a default label', () => {
    const t = setup();
    const id = t.state().workspace.runs[0].id; // Gradient descent, 0.001
    t.actions.changeOptimizer(id, 'nesterov');
    const run = t.state().workspace.runs.find((r) => r.id === id)!;
    expect(run.optimizer.kind).toBe('nesterov');
    expect(run.optimizer.learningRate).toBe(0.001);
    expect(run.label).toBe('Nesterov momentum');
    t.actions.changeOptimizer(id, 'adam');
    expect(t.state().workspace.runs.find((r) => r.id === id)!.optimizer.learningRate).toBe(0.001);
  });
  it('a slice through many variables holds the others at a run: at its start, then at the selected run', () => {
    const t = setup();
    t.actions.setPace('max');
    t.actions.setSurface({ kind: 'formula', text: '(x1 - 1)^2 + (x2 - 2)^2 + (x3 - 3)^2', variables: ['x1', 'x2', 'x3'] });
    const start = t.state().workspace.runs[0].settings.start;
    expect(t.state().workspace.slice.at).toEqual(start);
    t.drain();
    const id = t.state().workspace.runs[2].id;
    t.actions.selectRun(id);
    const end = t.state().status[id].summary.finalPoint;
    expect(t.state().workspace.slice.at).toEqual(end);
    expect(t.state().workspace.slice.at[2]).toBeCloseTo(3, 3);
  });
});

describe('headFor', () => {
  it('gives a network on two classes a logistic head, on three a softmax one', () => {
    expect(headFor({ kind: 'demo', id: 'wave-boundary' }, 'kind')).toBe('binary');
    expect(headFor({ kind: 'demo', id: 'pebbles' }, 'beach')).toBe('softmax');
    expect(headFor({ kind: 'demo', id: 'probe-calibration' }, 'signal')).toBe('regression');
    expect(headFor({ kind: 'iris' }, 'species')).toBe('softmax');
    expect(headFor({ kind: 'table', name: 't', columns: ['a', 'c'], rows: [[1, 0], [2, 1]], categories: { c: ['no', 'yes'] } }, 'c')).toBe('binary');
    expect(headFor({ kind: 'table', name: 't', columns: ['a', 'c'], rows: [[1, 0], [2, 1]] }, 'c')).toBe('regression');
  });
});
