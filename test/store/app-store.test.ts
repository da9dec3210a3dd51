import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { createAppStore } from '../../src/store/app-store';
import { demoWorkspace } from '../../src/store/demo';
import { inProcessLink } from './in-process-link';

function setup(initial = demoWorkspace()) {
  const env = inProcessLink();
  const app = createAppStore({ link: env.link, requestFrame: env.requestFrame, initial });
  return { ...env, app, state: () => app.store.getState(), actions: app.store.getState().actions };
}

describe('app store with the real worker handler', () => {
  it('loads the demo: three runs stream to an end and the grid arrives', () => {
    const t = setup();
    t.app.store.getState().actions.setPace('max');
    t.drain();
    const s = t.state();
    expect(s.workspace.runs).toHaveLength(3);
    for (const r of s.workspace.runs) {
      const st = s.status[r.id];
      expect(st.phase).toBe('ended');
      expect(st.summary.outcome).not.toBeNull();
      expect(t.app.live.trajectory(r.id)!.count).toBe(st.summary.steps + 1);
    }
    expect(s.grid.phase).toBe('ready');
    expect(s.grid.values!.length).toBe(s.workspace.display.resolution ** 2);
  });

  it("a new surface drops the old surface's grid at once; a new constant keeps it until the new grid comes", () => {
    const t = setup();
    t.actions.setPace('max');
    t.drain();
    const rosenbrock = t.state().grid.values;
    expect(rosenbrock).not.toBeNull();
    // The demo is Rosenbrock: a new value of its constant a is the same surface, so the old contours stay up.
    expect(t.state().workspace.surface).toMatchObject({ kind: 'catalogue', id: 'rosenbrock' });
    t.actions.setConstant('a', 2);
    expect(t.state().grid.values).not.toBeNull();
    t.drain();
    const seen: (Float64Array | null)[] = [];
    const stop = t.app.store.subscribe((s) => seen.push(s.grid.values));
    t.actions.setSurface({ kind: 'catalogue', id: 'himmelblau' });
    t.drain();
    stop();
    // The first change the store makes for the new surface shows no grid: none of Rosenbrock's values.
    expect(seen[0]).toBeNull();
    expect(seen).not.toContain(rosenbrock);
    expect(t.state().grid.phase).toBe('ready');
    expect(t.state().grid.values!.length).toBe(t.state().workspace.display.resolution ** 2);
  });

  it('drops batches of a superseded launch: editing a run restarts it from step 0', () => {
    const t = setup();
    t.actions.setPace(1000);
    const id = t.state().workspace.runs[2].id;
    t.drain(3);
    t.actions.updateRun(id, { optimizer: { ...t.state().workspace.runs[2].optimizer, learningRate: 0.01 } });
    t.actions.setPace('max');
    t.drain();
    const buffer = t.app.live.trajectory(id)!;
    // Only the new launch's rows: one contiguous trajectory from step 0 that ends with the outcome.
    expect(buffer.count).toBe(t.state().status[id].summary.steps + 1);
    expect(Array.from(buffer.point(0))).toEqual([-1.2, 1]);
  });

  it('a bad optimizer setting is reported on the run and nothing is launched', () => {
    const t = setup();
    const run = t.state().workspace.runs[2];
    const before = t.sent.filter((m) => m.type === 'run/start').length;
    t.actions.updateRun(run.id, { optimizer: { ...run.optimizer, hyper: { beta1: 1.2 } } });
    t.drain();
    expect(t.sent.filter((m) => m.type === 'run/start').length).toBe(before);
    expect(t.state().status[run.id].error?.message).toMatch(/beta1/);
  });

  it('the trajectory CSV has one row per run per step and its last row matches the run table', async () => {
    const { trajectoriesCsv } = await import('../../src/ui/export/exports');
    const t = setup();
    t.actions.setPace('max');
    t.drain();
    const csv = trajectoriesCsv(t.state(), t.app.live);
    const parsed = Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true });
    const [header, ...rows] = parsed.data;
    expect(header.slice(0, 5)).toEqual(['run_id', 'run_label', 'optimizer', 'learning_rate', 'step']);
    const total = t.state().workspace.runs.reduce((n, r) => n + t.app.live.trajectory(r.id)!.count, 0);
    expect(rows).toHaveLength(total);
    const last = rows[rows.length - 1];
    const lastRun = t.state().workspace.runs[2];
    expect(Number(last[header.indexOf('loss')])).toBe(t.state().status[lastRun.id].summary.finalLoss);
  });

  it('a typed formula with an error leaves the surface as it was and says what is wrong', () => {
    const t = setup();
    expect(t.actions.setSurface({ kind: 'formula', text: 'x^2 + sinn(y)' })).toBe(false);
    expect(t.state().surfaceError).toMatch(/sinn/);
    expect(t.state().workspace.surface).toEqual({ kind: 'catalogue', id: 'rosenbrock' });
  });

  it('a surface in three variables is sliced; runs start in three dimensions', () => {
    const t = setup();
    expect(t.actions.setSurface({ kind: 'formula', text: 'x^2 + 2*y^2 + 3*z^2' })).toBe(true);
    t.actions.setPace('max');
    t.drain();
    const s = t.state();
    expect(s.surfaceInfo.variables).toEqual(['x', 'y', 'z']);
    for (const r of s.workspace.runs) expect(r.settings.start).toHaveLength(3);
    expect(s.grid.request!.plane.origin).toHaveLength(3);
  });

  it('a formula of fewer than two variables is refused with a message, not drawn', () => {
    const t = setup();
    expect(t.actions.setSurface({ kind: 'formula', text: 'x^2' })).toBe(false);
    expect(t.state().surfaceError).toBe('the map needs two or more variables, this surface has 1 (x); list them under Variable order, for example "x, y"');
    expect(t.actions.setSurface({ kind: 'formula', text: '3' })).toBe(false);
    expect(t.state().surfaceError).toMatch(/this surface has none/);
    expect(t.state().workspace.surface).toEqual({ kind: 'catalogue', id: 'rosenbrock' });
    // A variable named in the order but unused by the text still counts.
    expect(t.actions.setSurface({ kind: 'formula', text: 'x^2', variables: ['x', 'y'] })).toBe(true);
    expect(t.state().surfaceError).toBeNull();
  });

  it('a saved workspace with a one-variable surface loads the demo and says why', () => {
    const t = setup({ ...demoWorkspace(), surface: { kind: 'formula', text: 'x^2' } });
    expect(t.state().workspace.surface).toEqual({ kind: 'catalogue', id: 'rosenbrock' });
    expect(t.state().notice).toMatch(/two or more variables/);
  });

  it('switching surfaces keeps a start inside the new box and moves one outside it to the suggested start', () => {
    const t = setup();
    // Rosenbrock's demo start (-1.2, 1) lies inside Himmelblau's box [-5, 5]^2 but not Easom's [-1, 7]^2.
    t.actions.setSurface({ kind: 'catalogue', id: 'himmelblau' });
    for (const r of t.state().workspace.runs) expect(r.settings.start).toEqual([-1.2, 1]);
    t.actions.setSurface({ kind: 'catalogue', id: 'easom' });
    for (const r of t.state().workspace.runs) expect(r.settings.start).toEqual(t.state().surfaceInfo.suggestedStart);
  });

  it('the table builds one run per optimizer and learning rate', () => {
    const t = setup();
    t.actions.setPanels({ tableOptimizers: ['gd', 'adam'], tableLearningRates: [0.001, 0.01, 0.1] });
    t.actions.buildTableRuns();
    const cells = t.state().workspace.runs.filter((r) => r.cell);
    expect(cells).toHaveLength(6);
    expect(cells.map((r) => [r.optimizer.kind, r.optimizer.learningRate])).toContainEqual(['adam', 0.1]);
    expect(new Set(cells.map((r) => r.style)).size).toBe(6);
  });
});

describe('app store with a grid pool', () => {
  it('samples the grid through the pool: the same values as the engine worker gives', async () => {
    const { fakeWorld, flush } = await import('../client/fake-workers');
    const { createGridPool } = await import('../../src/client/grid-pool');
    const { sampleGrid } = await import('../../src/engine');
    const { buildSurface } = await import('../../src/problems');
    const world = fakeWorld(1);
    const env = inProcessLink();
    const app = createAppStore({ link: env.link, requestFrame: env.requestFrame, initial: demoWorkspace(), grids: createGridPool(world.factory, 2) });
    for (let k = 0; k < 50 && app.store.getState().grid.phase !== 'ready'; k++) {
      world.run();
      env.drain();
      await flush();
    }
    const g = app.store.getState().grid;
    expect(g.phase).toBe('ready');
    expect(g.stage).toBe('final');
    const direct = sampleGrid(buildSurface(app.store.getState().workspace.surface), g.request!);
    expect(Array.from(g.values!)).toEqual(Array.from(direct));
    // Both members took part.
    expect(new Set(world.log.filter((m) => m.direction === 'out' && m.msg.type === 'band/result').map((m) => m.member)).size).toBe(2);
  });
});

describe('small conveniences', () => {
  it('a clicked coordinate is rounded to a thousandth of the visible span', async () => {
    const { roundToView } = await import('../../src/ui/view/frame');
    expect(roundToView(0.6750878049616227, [-2, 2])).toBe(0.675);
    expect(roundToView(-1.23456789, [-100, 100])).toBe(-1.2);
    expect(roundToView(0.000123456, [0, 0.01])).toBe(0.00012);
  });

  it('table runs are labelled by optimizer and learning rate only', () => {
    const t = setup();
    t.actions.setPanels({ tableOptimizers: ['adam'], tableLearningRates: [0.001] });
    t.actions.buildTableRuns();
    expect(t.state().workspace.runs.filter((r) => r.cell).map((r) => r.label)).toEqual(['Adam lr=0.001']);
  });
});
