import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { lionRule } from '../../src/engine';
import { parseWorkspace } from '../../src/io/workspace-schema';
import { createAppStore, workspaceOf } from '../../src/store/app-store';
import { demoWorkspace } from '../../src/store/demo';
import type { Workspace } from '../../src/store/workspace';
import { inProcessLink } from './in-process-link';

function setup(initial: Workspace = demoWorkspace()) {
  const env = inProcessLink();
  const app = createAppStore({ link: env.link, requestFrame: env.requestFrame, initial });
  return { ...env, app, state: () => app.store.getState(), actions: app.store.getState().actions };
}

/** Adds a Lion run (the library rule) and an Adam run, runs everything to its end. */
function lionAgainstAdam() {
  const t = setup();
  t.actions.setPace('max');
  const lion = t.actions.addRun('rule');
  const run = t.state().workspace.runs.find((r) => r.id === lion)!;
  t.actions.updateRun(lion, { label: 'Lion', optimizer: { ...run.optimizer, learningRate: 0.01, hyper: { beta1: 0.9, beta2: 0.99, decay: 0 }, rule: { name: 'Lion', text: lionRule.text } } });
  const adam = t.actions.addRun('adam');
  t.drain();
  return { t, lion, adam };
}

describe('rule runs are first-class runs (real store, real worker handler)', () => {
  it('a Lion rule runs beside Adam to an end, and both are in the trajectory and results CSV files', async () => {
    const { trajectoriesCsv, resultsCsv } = await import('../../src/ui/export/exports');
    const { t, lion, adam } = lionAgainstAdam();
    for (const id of [lion, adam]) {
      expect(t.state().status[id].phase).toBe('ended');
      expect(t.state().status[id].error).toBeFalsy();
    }
    const steps = t.state().status[lion].summary.steps;
    expect(steps).toBeGreaterThan(10);
    expect(t.app.live.trajectory(lion)!.count).toBe(steps + 1);

    const rows = Papa.parse<Record<string, string>>(trajectoriesCsv(t.state(), t.app.live).trim(), { header: true }).data;
    const lionRows = rows.filter((r) => r.run_id === lion);
    expect(lionRows).toHaveLength(steps + 1);
    expect(new Set(lionRows.map((r) => r.optimizer))).toEqual(new Set(['Lion']));
    const results = Papa.parse<Record<string, string>>(resultsCsv(t.state()).trim(), { header: true }).data;
    expect(results.find((r) => r.run_id === lion)?.optimizer).toBe('Lion');
  });

  it('the saved workspace (experiment file) keeps the rule and reopens to the same run', () => {
    const { t, lion } = lionAgainstAdam();
    const json = JSON.stringify(workspaceOf(t.state()));
    const parsed = parseWorkspace(json);
    if (!parsed.ok) throw new Error(parsed.error);
    const reopened = parsed.workspace.runs.find((r) => r.id === lion)!;
    expect(reopened.optimizer.rule).toEqual({ name: 'Lion', text: lionRule.text });

    const again = setup(parsed.workspace);
    again.actions.setPace('max');
    again.drain();
    const before = t.app.live.trajectory(lion)!;
    const after = again.app.live.trajectory(lion)!;
    expect(after.count).toBe(before.count);
    expect(Array.from(after.point(after.count - 1))).toEqual(Array.from(before.point(before.count - 1)));
  });

  it('version-1 files without any rule still load, and a bad rule field is refused with its path', () => {
    expect(parseWorkspace(JSON.stringify(demoWorkspace())).ok).toBe(true);
    const ws = demoWorkspace();
    ws.runs[0].optimizer = { ...ws.runs[0].optimizer, kind: 'rule', rule: { name: '', text: 'x = x - lr * g' } };
    const bad = parseWorkspace(JSON.stringify(ws));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error).toMatch(/\$\.runs\[0\]\.optimizer\.rule\.name: Too small/);
  });

  it('a rule that does not compile is reported on the run with its line and column, and nothing is launched', () => {
    const t = setup();
    const id = t.actions.addRun('rule');
    t.drain();
    const run = t.state().workspace.runs.find((r) => r.id === id)!;
    const before = t.sent.filter((m) => m.type === 'run/start').length;
    t.actions.updateRun(id, { optimizer: { ...run.optimizer, rule: { name: 'typo', text: 'x = x - lr * gg' } } });
    t.drain();
    expect(t.sent.filter((m) => m.type === 'run/start').length).toBe(before);
    expect(t.state().status[id].error?.message).toBe("rule: unknown name 'gg' at line 1, column 14; did you mean 'g'?");
  });

  it("the optimizer x learning-rate table's rule row runs the selected rule run's rule at each rate", () => {
    const { t, lion } = lionAgainstAdam();
    t.actions.selectRun(lion);
    t.actions.setPanels({ tableOptimizers: ['adam', 'rule'], tableLearningRates: [0.001, 0.01] });
    t.actions.buildTableRuns();
    t.drain();
    const ruleCells = t.state().workspace.runs.filter((r) => r.cell?.row === 1);
    expect(ruleCells.map((r) => r.label)).toEqual(['Lion lr=0.001', 'Lion lr=0.01']);
    for (const r of ruleCells) {
      expect(r.optimizer.rule).toEqual({ name: 'Lion', text: lionRule.text });
      expect(t.state().status[r.id].phase).toBe('ended');
    }
  });
});
