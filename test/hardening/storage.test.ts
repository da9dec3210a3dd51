/**
 * Corrupt, refused and full browser storage, one row per case: the notice the page opens with
 * (persistence.ts, shown by main.tsx) and what happens to the stored text. Nothing stored is lost: an
 * unreadable workspace is copied aside before anything can be saved over it, or saving is paused.
 */
import { describe, expect, it } from 'vitest';
import { STORAGE_KEY, UNREADABLE_KEY, loadSavedWorkspace, openStorage, saveWorkspace, type KeyValueStorage } from '../../src/store/persistence';
import { demoWorkspace } from '../../src/store/demo';

/** A Map-backed storage; `quota` (characters over all values) makes setItem throw as browsers do when full. */
function memoryStorage(initial: Record<string, string>, quota = Infinity): KeyValueStorage & { items: Map<string, string> } {
  const items = new Map(Object.entries(initial));
  return {
    items,
    getItem: (key) => items.get(key) ?? null,
    setItem(key, value) {
      const used = [...items].reduce((n, [k, v]) => n + (k === key ? 0 : v.length), 0);
      if (used + value.length > quota) throw new DOMException("Failed to execute 'setItem' on 'Storage': Setting the value exceeded the quota.", 'QuotaExceededError');
      items.set(key, value);
    },
  };
}

const demoText = JSON.stringify(demoWorkspace());

describe('browser storage: the notice the page opens with', () => {
  it.each<[string, string, RegExp]>([
    ['random bytes', '\u0000\u00ff\ufffd garbage', /^The saved workspace could not be read \(line 1, column 1: \$: not valid JSON: .*\); it was kept aside and the demo loaded instead\.$/],
    ['cut-off JSON', demoText.slice(0, 100), /^The saved workspace could not be read \(line 1, column \d+: \$: not valid JSON: .*\); it was kept aside/],
    ['an empty string', '', /^The saved workspace could not be read \(line 1, column 1: \$: not valid JSON: unexpected end of the text/],
    ['a future version', JSON.stringify({ ...demoWorkspace(), version: 7 }), /could not be read \(line 1, column 12: \$\.version: version 7 is newer than this program reads \(1 to 3\); update Fall Line to open it\); it was kept aside/],
    ['a prototype key', demoText.replace('{', '{"__proto__":{"x":1},'), /could not be read \(line 1, column 14: \$\.__proto__: a key named "__proto__" is not allowed/],
    ['JSON that is not a workspace', '[1,2,3]', /could not be read \(line 1, column 1: \$: expected a JSON object \(an experiment\), got an array\)/],
  ])('%s: reported, kept aside, saving goes on', (_what, stored, notice) => {
    const storage = memoryStorage({ [STORAGE_KEY]: stored });
    const saved = loadSavedWorkspace(storage);
    expect(saved.workspace).toBeNull();
    expect(saved.problem).toMatch(notice);
    expect(saved.saving).toBe(true);
    expect(storage.items.get(UNREADABLE_KEY)).toBe(stored);
    expect(storage.items.get(STORAGE_KEY)).toBe(stored);
  });

  it('corrupt and full: nothing can be kept aside, so saving is paused and the stored text stays', () => {
    const stored = 'x'.repeat(1000);
    const storage = memoryStorage({ [STORAGE_KEY]: stored }, 1500);
    const saved = loadSavedWorkspace(storage);
    expect(saved.problem).toMatch(/^The saved workspace could not be read \(.*\) nor kept aside \(Failed to execute 'setItem' on 'Storage': Setting the value exceeded the quota\.\); the demo loaded instead, and nothing will be saved until space is freed, so the old workspace is not overwritten\.$/);
    expect(saved.saving).toBe(false);
    expect(storage.items.get(STORAGE_KEY)).toBe(stored);
  });

  it('reading throws (storage broken): the demo loads and nothing is saved over what is there', () => {
    const storage: KeyValueStorage = {
      getItem: () => {
        throw new DOMException('The operation is insecure.', 'SecurityError');
      },
      setItem: () => undefined,
    };
    expect(loadSavedWorkspace(storage)).toEqual({
      workspace: null,
      problem: 'The saved workspace could not be read from browser storage (The operation is insecure.); the demo loaded instead and will not be saved over it.',
      saving: false,
    });
  });

  it('storage refused on access (privacy settings)', () => {
    const opened = openStorage(() => {
      throw new DOMException("Failed to read the 'localStorage' property from 'Window': Access is denied for this document.", 'SecurityError');
    });
    expect(opened).toEqual({
      storage: null,
      problem: "This browser refused the page its storage (Failed to read the 'localStorage' property from 'Window': Access is denied for this document.), so the workspace will not be kept after you close it.",
    });
    expect(openStorage(() => null).problem).toBe('This browser offers no storage for the page, so the workspace will not be kept after you close it.');
  });

  it('full on save: the save is refused with the browser\'s reason, the old copy stays', () => {
    const storage = memoryStorage({ [STORAGE_KEY]: demoText }, demoText.length + 10);
    const bigger = { ...demoWorkspace(), title: 'a'.repeat(100) };
    expect(saveWorkspace(storage, bigger)).toBe("The workspace could not be saved in this browser: Failed to execute 'setItem' on 'Storage': Setting the value exceeded the quota.");
    expect(storage.items.get(STORAGE_KEY)).toBe(demoText);
  });

  it('a valid saved workspace loads without a notice', () => {
    const saved = loadSavedWorkspace(memoryStorage({ [STORAGE_KEY]: demoText }));
    expect(saved).toMatchObject({ problem: null, saving: true });
    expect(saved.workspace?.runs.map((r) => r.id)).toEqual(['demo-gd', 'demo-momentum', 'demo-adam']);
  });
});
