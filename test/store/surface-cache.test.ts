import { describe, expect, it } from 'vitest';
import type { SurfaceSpec } from '../../src/problems';
import { buildCheckedSurface, mainThreadSurface } from '../../src/store/surface-cache';

describe('surfaces built on the page', () => {
  it('a spec checked by the store is not built again for the views', () => {
    const spec: SurfaceSpec = { kind: 'formula', text: 'x^2 + 3*y^2' };
    const checked = buildCheckedSurface(spec);
    expect(mainThreadSurface(spec)).toBe(checked);
    expect(checked.value(new Float64Array([1, 1]))).toBe(4);
    // Another object with the same text is another spec: built on its own.
    expect(mainThreadSurface({ ...spec })).not.toBe(checked);
  });

  it('a spec that does not build throws its own error when checked, and is null for the views', () => {
    const spec: SurfaceSpec = { kind: 'formula', text: 'x^2 + sinn(y)' };
    expect(() => buildCheckedSurface(spec)).toThrow(/sinn/);
    expect(mainThreadSurface(spec)).toBeNull();
  });
});
