import { describe, expect, it } from 'vitest';
import { axisPlane, sampleGrid, sampleGridRows, type GridRequest } from '../../src/engine';
import { buildSurface, type SurfaceSpec } from '../../src/problems';
import type { FromPoolMember } from '../../src/protocol';
import { createBandHandler, isPoolMessage } from '../../src/worker/bands';
import type { Timing } from '../../src/worker/scheduler';

const spec: SurfaceSpec = { kind: 'catalogue', id: 'himmelblau' };
const grid: GridRequest = { plane: axisPlane([0, 0], 0, 1), a: [-5, 5], b: [-5, 5], nx: 21, ny: 19 };

function member(msPerRead = 0) {
  let clock = 0;
  const slices: (() => void)[] = [];
  const timing: Timing = { now: () => (clock += msPerRead), later: (fn) => slices.push(fn) };
  const out: FromPoolMember[] = [];
  const handle = createBandHandler((m) => out.push(m), timing);
  return {
    handle,
    out,
    drain: () => {
      while (slices.length) slices.shift()!();
    },
  };
}

describe('sampleGridRows', () => {
  it('fills a compact band buffer with the same numbers as the whole grid', () => {
    const s = buildSurface(spec);
    const whole = sampleGrid(s, grid);
    const band = sampleGridRows(s, grid, new Float64Array(grid.nx * 5), 7, 12, 7);
    expect(Array.from(band)).toEqual(Array.from(whole.subarray(7 * grid.nx, 12 * grid.nx)));
  });
});

describe('band handler', () => {
  it('answers a band with its rows, min and max; progress in between when slices end', () => {
    const m = member(5);
    m.handle({ type: 'band/sample', requestId: 'r', surface: spec, grid, rows: [3, 11] });
    m.drain();
    const result = m.out.find((x) => x.type === 'band/result');
    expect(result?.type === 'band/result' && Array.from(result.values)).toEqual(Array.from(sampleGrid(buildSurface(spec), grid).subarray(3 * 21, 11 * 21)));
    expect(m.out.filter((x) => x.type === 'band/progress').map((x) => x.type === 'band/progress' && x.rowsDone)).toEqual([2, 4, 6]);
    if (result?.type === 'band/result') {
      expect(result.min).toBe(Math.min(...result.values));
      expect(result.max).toBe(Math.max(...result.values));
    }
  });

  it('rejects rows outside the grid and surfaces of the wrong dimension', () => {
    const m = member();
    m.handle({ type: 'band/sample', requestId: 'r', surface: spec, grid, rows: [5, 5] });
    m.handle({ type: 'band/sample', requestId: 's', surface: spec, grid, rows: [0, 20] });
    m.handle({ type: 'band/sample', requestId: 't', surface: { kind: 'formula', text: 'x + y + z' }, grid, rows: [0, 2] });
    expect(m.out).toEqual([
      { type: 'band/error', requestId: 'r', rows: [5, 5], message: 'grid band: rows must satisfy 0 <= j0 < j1 <= 19, got [5, 5)' },
      { type: 'band/error', requestId: 's', rows: [0, 20], message: 'grid band: rows must satisfy 0 <= j0 < j1 <= 19, got [0, 20)' },
      { type: 'band/error', requestId: 't', rows: [0, 2], message: 'grid: the slice plane has 2 coordinates but the surface has 3' },
    ]);
  });

  it('works through queued bands in order; cancel drops queued and half-done bands of that request only', () => {
    const m = member();
    m.handle({ type: 'band/sample', requestId: 'a', surface: spec, grid, rows: [0, 4] });
    m.handle({ type: 'band/sample', requestId: 'b', surface: spec, grid, rows: [4, 8] });
    m.handle({ type: 'band/sample', requestId: 'a', surface: spec, grid, rows: [8, 12] });
    m.handle({ type: 'band/cancel', requestId: 'a' });
    m.drain();
    expect(m.out.map((x) => `${x.type} ${x.requestId} ${x.rows.join('-')}`)).toEqual(['band/result b 4-8']);
  });

  it('tells pool messages from engine-link messages', () => {
    expect(isPoolMessage({ type: 'band/sample' })).toBe(true);
    expect(isPoolMessage({ type: 'band/cancel' })).toBe(true);
    expect(isPoolMessage({ type: 'grid/sample' })).toBe(false);
  });
});
