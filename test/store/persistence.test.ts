// The workspace saved in browser storage: an old saved workspace (version 2, optimizer option values
// before they were renamed) loads with the new names; an unreadable one is kept aside and reported.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadSavedWorkspace, saveWorkspace, STORAGE_KEY, type KeyValueStorage } from '../../src/store/persistence';
import { demoWorkspace } from '../../src/store/demo';

const V2_OLD_VALUES = readFileSync(new URL('../fixtures/experiments/v2-old-option-values.fall.json', import.meta.url), 'utf8');

function memoryStorage(initial: Record<string, string> = {}): KeyValueStorage & { items: Map<string, string> } {
  const items = new Map(Object.entries(initial));
  return { items, getItem: (k) => items.get(k) ?? null, setItem: (k, v) => void items.set(k, v) };
}

describe('loadSavedWorkspace', () => {
  it('loads a version-2 workspace saved with the old option values, renamed', () => {
    const { workspace, problem } = loadSavedWorkspace(memoryStorage({ [STORAGE_KEY]: V2_OLD_VALUES }));
    expect(problem).toBeNull();
    const forms = Object.fromEntries(workspace!.runs.map((r) => [r.id, r.optimizer.hyper?.form ?? r.optimizer.hyper?.decayForm ?? r.optimizer.hyper?.epsilonForm]));
    expect(forms).toEqual({
      'adam-algorithm1': 'eps-after-correction',
      'adam-hat': 'eps-before-correction',
      'adamw-library': 'times-learning-rate',
      'adamw-paper': 'times-schedule',
      'amsgrad-pytorch': 'max-raw-moment',
      'amsgrad-optax': 'max-corrected-moment',
      'amsgrad-paper': 'no-bias-correction',
      'nadam-scheduled': 'rising-momentum',
      'nadam-constant-beta1': 'constant-momentum',
      'nesterov-library': 'record-look-ahead',
      'nesterov-sutskever': 'record-base-point',
    });
    expect(workspace!.version).toBe(3);
  });

  it('round-trips what it saves', () => {
    const storage = memoryStorage();
    const w = { ...demoWorkspace(), display: { ...demoWorkspace().display, equalScale: false } };
    expect(saveWorkspace(storage, w)).toBeNull();
    expect(loadSavedWorkspace(storage).workspace).toEqual(w);
  });

  it('keeps an unreadable workspace aside and says why', () => {
    const storage = memoryStorage({ [STORAGE_KEY]: '{"version": 3, "runs": 1}' });
    const { workspace, problem } = loadSavedWorkspace(storage);
    expect(workspace).toBeNull();
    expect(problem).toMatch(/^The saved workspace could not be read \(.+\); it was kept aside/);
    expect(storage.items.get(`${STORAGE_KEY}/unreadable`)).toBe('{"version": 3, "runs": 1}');
  });
});
