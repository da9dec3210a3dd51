/**
 * The page's side of the engine worker, apart from the store's state: one-off requests and their
 * replies by request id, and grid scheduling (a quiet time after zooms and pans, a coarse preview before
 * the full grid, the page's grid pool when there is one). Only replies to the current grid request are
 * passed on; run messages go to `onRun` (LiveRuns) untouched.
 */
import type { GridRequest } from '../engine';
import type { SurfaceSpec } from '../problems';
import type { FromWorker, ToWorker } from '../protocol';
import { GridRequestCancelled } from '../protocol';
import type { GridPoolResult } from '../client/grid-pool';
import type { EngineLink } from './engine-link';
import { freshId } from './ids';

/** Quiet time after a zoom or pan before the grid is sampled again. */
export const GRID_SETTLE_MS = 80;

/** Where grids are sampled when not by the engine worker itself: the page's worker pool. */
export interface GridSource {
  request(
    requestId: string,
    spec: SurfaceSpec,
    grid: GridRequest,
    onProgress?: (fraction: number) => void,
    options?: { onCoarse?: (preview: GridPoolResult) => void },
  ): Promise<GridPoolResult>;
}

export type GridReply = Extract<FromWorker, { type: 'grid/progress' | 'grid/error' | 'grid/result' }>;

/** What a grid request samples, read when it is sent (so a delayed request sees the latest view). */
export interface GridJob {
  surface: SurfaceSpec;
  grid: GridRequest;
}

export interface EngineClientOptions {
  link: EngineLink;
  /** A pool for grid sampling; without one, grids go to the engine worker through `link`. */
  grids?: GridSource;
  /** A grid request was sent (its id); replies to older ones are dropped from now on. */
  onGridStart(requestId: string): void;
  /** Progress, a preview or the final grid, or an error, of the current request only. */
  onGrid(reply: GridReply): void;
  onRun(msg: Extract<FromWorker, { type: 'run/batch' | 'run/error' }>): void;
  /** The worker was replaced (after pending requests were rejected and a running grid marked failed). */
  onRestart(reason: string, message: string): void;
  /** setTimeout / clearTimeout, replaceable in tests. */
  timers?: { set(fn: () => void, ms: number): unknown; clear(handle: unknown): void };
}

export interface EngineClient {
  send(msg: ToWorker): void;
  /** Sends a one-off request and resolves with its final reply; `onOther` sees the rest (progress). */
  ask<T extends FromWorker>(msg: ToWorker & { requestId: string }, isFinal: (m: FromWorker) => m is T, onOther?: (m: FromWorker) => void): Promise<T>;
  /** Samples a grid now, superseding any running request and any waiting for quiet. */
  sampleGrid(job: () => GridJob): void;
  /** Samples a grid after GRID_SETTLE_MS without another call (each call restarts the wait). */
  sampleGridWhenQuiet(job: () => GridJob): void;
}

const defaultTimers = {
  set: (fn: () => void, ms: number): unknown => setTimeout(fn, ms),
  clear: (handle: unknown) => clearTimeout(handle as ReturnType<typeof setTimeout>),
};

export function createEngineClient({ link, grids, onGridStart, onGrid, onRun, onRestart, timers = defaultTimers }: EngineClientOptions): EngineClient {
  let currentGrid: string | null = null;
  let gridRunning = false;
  let quietTimer: unknown;
  /** Replies to one-off requests (CSV parsing, profiles), by request id; `lost` when the worker is replaced. */
  const replies = new Map<string, (msg: FromWorker) => void>();
  const lostReplies = new Map<string, (e: Error) => void>();

  function gridReply(msg: GridReply): void {
    if (msg.requestId !== currentGrid) return; // superseded
    if (msg.type !== 'grid/progress' && (msg.type === 'grid/error' || msg.stage === 'final')) gridRunning = false;
    onGrid(msg);
  }

  function sampleGrid(job: () => GridJob): void {
    timers.clear(quietTimer);
    const { surface, grid } = job();
    const requestId = freshId('g');
    currentGrid = requestId;
    gridRunning = true;
    onGridStart(requestId);
    if (!grids) return link.send({ type: 'grid/sample', requestId, surface, grid, coarseFirst: true });
    const rows = grid.ny;
    const result = (r: GridPoolResult, stage: 'coarse' | 'final') => gridReply({ type: 'grid/result', requestId, grid: r.grid, values: r.values, min: r.min, max: r.max, stage });
    grids
      .request(requestId, surface, grid, (f) => gridReply({ type: 'grid/progress', requestId, rowsDone: Math.round(f * rows), rows }), { onCoarse: (r) => result(r, 'coarse') })
      .then((r) => result(r, 'final'))
      .catch((e) => {
        if (!(e instanceof GridRequestCancelled)) gridReply({ type: 'grid/error', requestId, message: e instanceof Error ? e.message : String(e) });
      });
  }

  link.listen((msg) => {
    switch (msg.type) {
      case 'run/batch':
      case 'run/error':
        return onRun(msg);
      case 'grid/progress':
      case 'grid/error':
      case 'grid/result':
        return gridReply(msg);
      default:
        return replies.get(msg.requestId)?.(msg);
    }
  });

  // A replaced worker took its runs and requests with it (a pool's grid is not the engine worker's).
  link.onRestart?.((reason) => {
    const message = `the engine worker ${reason}; it was restarted`;
    for (const reject of lostReplies.values()) reject(new Error(message));
    replies.clear();
    lostReplies.clear();
    if (!grids && gridRunning && currentGrid) gridReply({ type: 'grid/error', requestId: currentGrid, message });
    onRestart(reason, message);
  });

  return {
    send: (msg) => link.send(msg),
    ask(msg, isFinal, onOther) {
      return new Promise((resolve, reject) => {
        replies.set(msg.requestId, (reply) => {
          if (!isFinal(reply)) return onOther?.(reply);
          replies.delete(msg.requestId);
          lostReplies.delete(msg.requestId);
          resolve(reply);
        });
        lostReplies.set(msg.requestId, reject);
        link.send(msg);
      });
    },
    sampleGrid,
    sampleGridWhenQuiet(job) {
      timers.clear(quietTimer);
      quietTimer = timers.set(() => sampleGrid(job), GRID_SETTLE_MS);
    },
  };
}
