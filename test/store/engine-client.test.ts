import { describe, expect, it } from 'vitest';
import { createEngineClient, GRID_SETTLE_MS, type GridJob, type GridReply, type GridSource } from '../../src/store/engine-client';
import type { EngineLink, FromWorker, ToWorker } from '../../src/protocol';
import { GridRequestCancelled } from '../../src/protocol';
import type { GridPoolResult } from '../../src/client/grid-pool';

const surface: GridJob['surface'] = { kind: 'catalogue', id: 'rosenbrock' };
const job = (nx: number) => (): GridJob => ({ surface, grid: { plane: { origin: [0, 0], u: [1, 0], v: [0, 1] }, a: [-1, 1], b: [-1, 1], nx, ny: nx } });

/** A link that records what is sent and lets the test answer; timers that run only when told. */
function setup(grids?: GridSource) {
  const sent: ToWorker[] = [];
  let listener: (m: FromWorker) => void = () => {};
  let restart: (reason: string) => void = () => {};
  const link: EngineLink = { send: (m) => sent.push(m), listen: (h) => (listener = h), onRestart: (h) => (restart = h) };
  let now = 0;
  const waiting = new Map<number, { at: number; fn: () => void }>();
  let nextHandle = 1;
  const timers = {
    set: (fn: () => void, ms: number) => {
      waiting.set(nextHandle, { at: now + ms, fn });
      return nextHandle++;
    },
    clear: (h: unknown) => void waiting.delete(h as number),
  };
  const advance = (ms: number) => {
    now += ms;
    for (const [h, t] of [...waiting].sort((x, y) => x[1].at - y[1].at))
      if (t.at <= now) {
        waiting.delete(h);
        t.fn();
      }
  };
  const started: string[] = [];
  const passed: GridReply[] = [];
  const restarts: string[] = [];
  const client = createEngineClient({
    link,
    grids,
    timers,
    onGridStart: (id) => started.push(id),
    onGrid: (r) => passed.push(r),
    onRun: () => {},
    onRestart: (reason) => restarts.push(reason),
  });
  const gridRequests = () => sent.filter((m): m is Extract<ToWorker, { type: 'grid/sample' }> => m.type === 'grid/sample');
  return { client, sent, gridRequests, reply: (m: FromWorker) => listener(m), restart: (r: string) => restart(r), advance, started, passed, restarts };
}

describe('engine client: grid scheduling', () => {
  it('sends one request for a burst of view changes, after the quiet time, with the latest job', () => {
    const t = setup();
    for (let k = 1; k <= 10; k++) {
      t.client.sampleGridWhenQuiet(job(10 + k));
      t.advance(GRID_SETTLE_MS / 2);
    }
    expect(t.gridRequests()).toHaveLength(0);
    t.advance(GRID_SETTLE_MS);
    expect(t.gridRequests()).toHaveLength(1);
    expect(t.gridRequests()[0].grid.nx).toBe(20);
    expect(t.gridRequests()[0].coarseFirst).toBe(true);
    t.advance(10 * GRID_SETTLE_MS);
    expect(t.gridRequests()).toHaveLength(1);
  });

  it('a request made now cancels one waiting for quiet', () => {
    const t = setup();
    t.client.sampleGridWhenQuiet(job(8));
    t.client.sampleGrid(job(9));
    t.advance(10 * GRID_SETTLE_MS);
    expect(t.gridRequests().map((m) => m.grid.nx)).toEqual([9]);
  });

  it('drops replies to a superseded request and passes those of the current one', () => {
    const t = setup();
    t.client.sampleGrid(job(4));
    t.client.sampleGrid(job(5));
    const [old, current] = t.gridRequests().map((m) => m.requestId);
    expect(t.started).toEqual([old, current]);
    const values = new Float64Array(25);
    t.reply({ type: 'grid/progress', requestId: old, rowsDone: 2, rows: 4 });
    t.reply({ type: 'grid/result', requestId: old, grid: job(4)().grid, values: new Float64Array(16), min: 0, max: 1, stage: 'final' });
    t.reply({ type: 'grid/error', requestId: old, message: 'late' });
    expect(t.passed).toEqual([]);
    t.reply({ type: 'grid/result', requestId: current, grid: job(5)().grid, values, min: 0, max: 2, stage: 'final' });
    expect(t.passed).toHaveLength(1);
    expect(t.passed[0]).toMatchObject({ type: 'grid/result', requestId: current, min: 0, max: 2 });
  });

  it('a replaced worker fails the running grid (engine worker only) and rejects pending requests', async () => {
    const t = setup();
    t.client.sampleGrid(job(4));
    const pending = t.client.ask({ type: 'profile/sample', requestId: 'p1', surface, from: [0, 0], to: [1, 1], alphas: { from: 0, to: 1, count: 3 } }, (m): m is FromWorker => m.type === 'profile/result');
    t.restart('crashed');
    await expect(pending).rejects.toThrow('the engine worker crashed; it was restarted');
    expect(t.passed).toEqual([{ type: 'grid/error', requestId: t.gridRequests()[0].requestId, message: 'the engine worker crashed; it was restarted' }]);
    expect(t.restarts).toEqual(['crashed']);
    // A finished grid is not failed by a later restart.
    t.client.sampleGrid(job(3));
    const id = t.gridRequests()[1].requestId;
    t.reply({ type: 'grid/result', requestId: id, grid: job(3)().grid, values: new Float64Array(9), min: 0, max: 1, stage: 'final' });
    t.restart('crashed again');
    expect(t.passed.filter((r) => r.requestId === id).map((r) => r.type)).toEqual(['grid/result']);
  });

  it('with a pool: coarse then final through the pool, a superseded pool request ends silently', async () => {
    const calls: { id: string; resolve: (r: GridPoolResult) => void; reject: (e: Error) => void; coarse?: (r: GridPoolResult) => void; progress?: (f: number) => void }[] = [];
    const pool: GridSource = {
      request: (id, _spec, _grid, progress, options) => new Promise((resolve, reject) => calls.push({ id, resolve, reject, coarse: options?.onCoarse, progress })),
    };
    const t = setup(pool);
    t.client.sampleGrid(job(6));
    t.client.sampleGrid(job(7));
    expect(t.gridRequests()).toHaveLength(0);
    const grid = job(7)().grid;
    const result = (n: number): GridPoolResult => ({ requestId: 'r', grid, values: new Float64Array(n), min: 0, max: 1 });
    calls[0].reject(new GridRequestCancelled(calls[0].id, 'superseded'));
    calls[0].resolve(result(36));
    calls[1].progress?.(0.5);
    calls[1].coarse?.(result(4));
    calls[1].resolve(result(49));
    await new Promise((r) => setTimeout(r, 0));
    expect(t.passed.map((r) => [r.requestId, r.type, 'stage' in r ? r.stage : null])).toEqual([
      [calls[1].id, 'grid/progress', null],
      [calls[1].id, 'grid/result', 'coarse'],
      [calls[1].id, 'grid/result', 'final'],
    ]);
    expect(t.passed[0]).toMatchObject({ rowsDone: 4, rows: 7 });
  });
});
