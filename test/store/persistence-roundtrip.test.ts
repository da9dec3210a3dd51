/**
 * Save and load through the page's storage (persistence.ts -> the experiment file's schema): every
 * optimizer kind at its default settings and every surface kind come back unchanged; a version-1 file
 * saved by an earlier page loads; a formula longer than the old 5,000-character schema cap (but within
 * the parser's limit) loads.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { defaultOptimizerSpec, MAX_FORMULA_LENGTH, OPTIMIZERS } from '../../src/engine';
import { buildSurface, SURFACE_KINDS, type SurfaceSpec, type SurfaceSpecKind } from '../../src/problems';
import { demoWorkspace } from '../../src/store/demo';
import { loadSavedWorkspace, saveWorkspace, type KeyValueStorage } from '../../src/store/persistence';
import type { Workspace } from '../../src/store/workspace';

function memoryStorage(): KeyValueStorage & { items: Map<string, string> } {
  const items = new Map<string, string>();
  return { items, getItem: (k) => items.get(k) ?? null, setItem: (k, v) => void items.set(k, v) };
}

function saveAndLoad(workspace: Workspace): ReturnType<typeof loadSavedWorkspace> {
  const storage = memoryStorage();
  expect(saveWorkspace(storage, workspace)).toBeNull();
  return loadSavedWorkspace(storage);
}

/** One surface per registered kind; the mapped type makes a new kind fail to compile here until added. */
const SURFACE_EXAMPLES: { [K in SurfaceSpecKind]: Extract<SurfaceSpec, { kind: K }> } = {
  catalogue: { kind: 'catalogue', id: 'rosenbrock', constants: { a: 1, b: 100 } },
  formula: { kind: 'formula', text: 'x^2 + k*y^2', variables: ['x', 'y'], constants: { k: 10 } },
  datafit: {
    kind: 'datafit',
    dataset: { kind: 'demo', id: 'seed-pods' },
    model: { kind: 'mlp', inputs: ['length_mm'], target: 'ripe', hidden: [3], activation: 'tanh', head: 'binary' },
    l2: 0.01,
    standardise: true,
  },
};

describe('saved workspaces load back unchanged', () => {
  it.each(OPTIMIZERS.map((o) => o.kind))('optimizer %s at its default settings', (kind) => {
    const w = demoWorkspace();
    const workspace: Workspace = { ...w, runs: [{ ...w.runs[0], optimizer: defaultOptimizerSpec(kind) }] };
    expect(saveAndLoad(workspace)).toEqual({ workspace, problem: null, saving: true });
  });

  it('has an example for every surface kind, and each builds', () => {
    expect(Object.keys(SURFACE_EXAMPLES).sort()).toEqual([...SURFACE_KINDS].sort());
    for (const spec of Object.values(SURFACE_EXAMPLES)) expect(buildSurface(spec).dimension).toBeGreaterThan(0);
  });

  it.each(SURFACE_KINDS)('surface kind %s', (kind) => {
    const workspace: Workspace = { ...demoWorkspace(), surface: SURFACE_EXAMPLES[kind] };
    expect(saveAndLoad(workspace)).toEqual({ workspace, problem: null, saving: true });
  });

  it('a 6,000-character formula (over the old 5,000 cap, within the parser limit) loads', () => {
    const text = `x^2 + y^2 + 0.${'0'.repeat(5985)}1`;
    expect(text.length).toBe(6000);
    expect(text.length).toBeLessThan(MAX_FORMULA_LENGTH);
    const workspace: Workspace = { ...demoWorkspace(), surface: { kind: 'formula', text } };
    expect(saveAndLoad(workspace)).toEqual({ workspace, problem: null, saving: true });
  });

  it('a version-1 file saved by an earlier page loads as the current version', () => {
    const storage = memoryStorage();
    const v1 = readFileSync(new URL('../fixtures/experiments/v1-demo.fall.json', import.meta.url), 'utf8');
    storage.setItem('fall-line/workspace', v1);
    const loaded = loadSavedWorkspace(storage);
    expect(loaded.problem).toBeNull();
    // Unchanged apart from the version and the option value version 3 renamed (io/experiment/renamed-options.ts).
    const expected = JSON.parse(v1);
    for (const run of expected.runs) if (run.optimizer.hyper?.epsilonForm === 'algorithm1') run.optimizer.hyper.epsilonForm = 'eps-after-correction';
    expect({ ...loaded.workspace, version: 1 }).toEqual(expected);
  });

  it('a workspace the schema refuses is kept aside and reported', () => {
    const storage = memoryStorage();
    storage.setItem('fall-line/workspace', JSON.stringify({ ...demoWorkspace(), surface: { kind: 'formula', text: 'x'.repeat(MAX_FORMULA_LENGTH + 1) } }));
    const loaded = loadSavedWorkspace(storage);
    expect(loaded.workspace).toBeNull();
    expect(loaded.problem).toMatch(/^The saved workspace could not be read \(line 1, column \d+: \$\.surface\.text: .*<=10000 characters\)/);
    expect(storage.items.has('fall-line/workspace/unreadable')).toBe(true);
  });
});
