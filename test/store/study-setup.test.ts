import { describe, expect, it } from 'vitest';
import { readExperiment } from '../../src/io/experiment';
import { createAppStore, studyOfKind, workspaceOf } from '../../src/store/app-store';
import { demoWorkspace } from '../../src/store/demo';
import { multiStartStudy, rateSweepStudy, startMapStudy } from '../study-examples';
import { inProcessLink } from './in-process-link';

function setup() {
  const env = inProcessLink();
  const app = createAppStore({ link: env.link, requestFrame: env.requestFrame, initial: { ...demoWorkspace(), surface: { kind: 'catalogue', id: 'himmelblau' } } });
  return { ...env, app, state: () => app.store.getState(), actions: app.store.getState().actions };
}

describe('studies set up on the page', () => {
  it('one per kind: setting a study replaces the one of its kind, others stay in order', () => {
    const t = setup();
    expect(workspaceOf(t.state()).studies).toBeUndefined();
    t.actions.setStudy(startMapStudy());
    t.actions.setStudy(rateSweepStudy());
    t.actions.setStudy({ ...startMapStudy(), resolution: 32 });
    expect(t.state().workspace.studies!.map((s) => s.kind)).toEqual(['start-map', 'lr-sweep']);
    expect(studyOfKind(t.state().workspace.studies, 'start-map')!.resolution).toBe(32);
    expect(studyOfKind(t.state().workspace.studies, 'multi-start')).toBeNull();
  });

  it('"Save experiment" writes them into a file that reads back to the same studies', () => {
    const t = setup();
    t.actions.setStudy(startMapStudy());
    t.actions.setStudy(multiStartStudy());
    const text = JSON.stringify(workspaceOf(t.state()), null, 2);
    const r = readExperiment(text);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.experiment.studies).toEqual([startMapStudy(), multiStartStudy()]);
  });

  it('opening a file restores its studies; a file without studies clears them', () => {
    const t = setup();
    t.actions.loadWorkspace({ ...workspaceOf(t.state()), studies: [rateSweepStudy(), startMapStudy()] });
    expect(t.state().workspace.studies).toEqual([rateSweepStudy(), startMapStudy()]);
    const { studies: _none, ...plain } = workspaceOf(t.state());
    t.actions.loadWorkspace(plain);
    expect(t.state().workspace.studies).toBeUndefined();
  });
});
