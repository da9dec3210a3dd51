import { describe, expect, it, vi } from 'vitest';

const builds = vi.hoisted(() => ({ count: 0 }));
vi.mock('../../../src/problems', async (original) => {
  const actual = await original<typeof import('../../../src/problems')>();
  return { ...actual, buildSurface: (spec: Parameters<typeof actual.buildSurface>[0]) => (builds.count++, actual.buildSurface(spec)) };
});

const { mainThreadSurface } = await import('../../../src/ui/view/use-surface');

describe('the page-side surface', () => {
  it('is built once per spec object, however many panels ask', () => {
    const spec = { kind: 'catalogue', id: 'himmelblau' } as const;
    const first = mainThreadSurface(spec);
    expect(first).not.toBeNull();
    for (let k = 0; k < 4; k++) expect(mainThreadSurface(spec)).toBe(first);
    expect(builds.count).toBe(1);
    // A new spec object (the store's way of changing the surface) is built afresh.
    expect(mainThreadSurface({ ...spec })).not.toBe(first);
    expect(builds.count).toBe(2);
  });

  it('is null for a spec that does not build', () => {
    expect(mainThreadSurface({ kind: 'formula', text: 'x +' })).toBeNull();
  });
});
