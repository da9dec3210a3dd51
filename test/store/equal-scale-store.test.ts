// Equal scale in the store: the grid is asked for over the box the map shows on its frame, the choice is
// saved in the workspace, and a new surface starts from its own default.
import { describe, expect, it } from 'vitest';
import type { GridRequest } from '../../src/engine';
import { createAppStore, workspaceOf } from '../../src/store/app-store';
import { demoWorkspace } from '../../src/store/demo';
import { inProcessLink } from './in-process-link';

function setup() {
  const env = inProcessLink();
  const app = createAppStore({ link: env.link, requestFrame: env.requestFrame, initial: demoWorkspace() });
  const lastGrid = (): GridRequest => {
    const sent = env.sent.filter((m) => m.type === 'grid/sample');
    return (sent[sent.length - 1] as { grid: GridRequest }).grid;
  };
  return { ...env, app, state: () => app.store.getState(), actions: app.store.getState().actions, lastGrid };
}

describe('equal scale in the store', () => {
  it('samples the grid over the shown box once the frame is measured, and over the saved view when off', () => {
    const t = setup();
    // The demo: Rosenbrock, view [-2, 2] x [-1, 3]; before the frame is known the grid covers the view.
    expect([t.lastGrid().a, t.lastGrid().b]).toEqual([[-2, 2], [-1, 3]]);
    t.actions.setFrame({ width: 600, height: 400 });
    // 400 px over 4 units of y: 100 px per unit, so x spans 600 / 100 = 6 units about 0.
    expect([t.lastGrid().a, t.lastGrid().b]).toEqual([[-3, 3], [-1, 3]]);
    expect(t.state().workspace.view).toEqual({ a: [-2, 2], b: [-1, 3] }); // the saved view is what was asked for
    t.actions.setDisplay({ equalScale: false });
    expect([t.lastGrid().a, t.lastGrid().b]).toEqual([[-2, 2], [-1, 3]]);
    expect(workspaceOf(t.state()).display.equalScale).toBe(false);
  });

  it('a new surface starts from its default: on for a 2-D test function, off for a typed formula', () => {
    const t = setup();
    t.actions.setFrame({ width: 600, height: 400 });
    t.actions.setDisplay({ equalScale: false });
    t.actions.setSurface({ kind: 'catalogue', id: 'himmelblau' });
    expect(workspaceOf(t.state()).display.equalScale).toBeUndefined();
    const g = t.lastGrid();
    expect((g.a[1] - g.a[0]) / 600).toBeCloseTo((g.b[1] - g.b[0]) / 400, 12);
    t.actions.setSurface({ kind: 'formula', text: 'x^2 + y^2' });
    expect([t.lastGrid().a, t.lastGrid().b]).toEqual([t.state().workspace.view.a, t.state().workspace.view.b]);
  });
});
