import { createStore, type StoreApi } from 'zustand/vanilla';
import { assignBasins, BasinTracker, OUTCOME_KINDS, type CriticalPoint, type KnownPoint, type OutcomeKind, type RunOutcome, type StudySpec, type ToleranceTarget } from '../engine';
import type { SurfaceSpec } from '../problems';
import type { FromWorker, StudyCells, StudyThreshold } from '../protocol';
import type { EngineLink } from './engine-link';
import { freshId } from './ids';
import { studyCellCount } from '../client/study-pool';

/** The cells of a start-point map as they arrive (typed arrays indexed by cell). */
export interface StudyCellsState {
  filled: Uint8Array;
  /** Index into OUTCOME_KINDS. */
  kind: Uint8Array;
  basin: Int32Array;
  steps: Int32Array;
  loss: Float64Array;
  endPoints: Float64Array;
  /** First step within the study's tolerance target, -1 if never or not measured (StudyState.target). */
  stepsToTolerance: Int32Array;
  outcomes: (RunOutcome | undefined)[];
}

export interface StudyState {
  status: 'idle' | 'running' | 'done' | 'cancelled' | 'error';
  message: string | null;
  requestId: string | null;
  spec: StudySpec | null;
  surface: SurfaceSpec | null;
  variables: string[];
  /** The run whose configuration the study uses. */
  configLabel: string;
  done: number;
  total: number;
  elapsedMs: number;
  cells: StudyCellsState | null;
  basinLabels: string[];
  /** The known minima the basins are measured against (drawn on the map). */
  known: KnownPoint[];
  /**
   * What the cells' steps to tolerance were measured against when the study started (the lowest known
   * minimum's value and the page's tolerance then); null: the surface has no known minimum.
   */
  target: ToleranceTarget | null;
  /** Multi-start studies: the 25%, 50% and 75% quantiles of the loss across runs, per step. */
  bands: Float64Array[] | null;
  /** Learning-rate sweeps: per optimizer, the observed and predicted divergence thresholds. */
  thresholds: StudyThreshold[] | null;
  /** Bumped whenever cells arrive, so views redraw. */
  version: number;
}

export interface StudyParams {
  surface: SurfaceSpec;
  variables: string[];
  spec: StudySpec;
  configLabel: string;
  known: KnownPoint[];
  /** End points within this distance share a basin (BasinTracker). */
  basinRadius: number;
  /** What steps to tolerance are measured against (io/run-summary.ts toleranceTarget); absent: not measured. */
  target?: ToleranceTarget | null;
}

export interface StudyStore {
  store: StoreApi<StudyState>;
  start(params: StudyParams): void;
  cancel(): void;
  /** The largest Hessian eigenvalue at each point (count x n), computed in the study worker. */
  sharpness(surface: SurfaceSpec, points: Float64Array, count: number): Promise<Float64Array>;
  /** Critical points found from the starts (count x n), computed in the study worker. */
  criticalPoints(surface: SurfaceSpec, starts: Float64Array, count: number): Promise<{ points: CriticalPoint[]; converged: number; failed: number }>;
}

/**
 * Studies on the page: one study (a start-point map, a multi-start study, a learning-rate sweep) at a
 * time, run through `link`: on the page the study pool (src/client/study-pool.ts), which splits it
 * across the pool workers, so ordinary runs keep streaming in the engine worker. Cells arrive as they finish (a map's in coarse-to-fine
 * order); each is assigned its basin as it arrives (BasinTracker: the nearest known minimum within
 * `basinRadius`, else a cluster of end points within that distance; the page uses 1% of the view's
 * diagonal).
 */
/** Least time between two redraws of a running study. */
const UPDATE_MS = 200;

export function createStudyStore(link: EngineLink, clock: () => number = () => performance.now()): StudyStore {
  let lastUpdate = -Infinity;
  const store = createStore<StudyState>(() => ({
    status: 'idle', message: null, requestId: null, spec: null, surface: null, variables: [], configLabel: '',
    done: 0, total: 0, elapsedMs: 0, cells: null, basinLabels: [], known: [], target: null, bands: null, thresholds: null, version: 0,
  }));
  let tracker: BasinTracker | null = null;
  let basinRadius = 1;

  const receive = (cells: StudyCells) => {
    const s = store.getState();
    const c = s.cells;
    if (!c || !tracker || !s.spec) return;
    const n = s.variables.length;
    cells.indices.forEach((index, k) => {
      const outcome = cells.outcomes[k];
      const end = cells.endPoints.subarray(k * n, (k + 1) * n);
      c.filled[index] = 1;
      c.kind[index] = OUTCOME_KINDS.indexOf(outcome.kind as OutcomeKind);
      c.basin[index] = tracker!.assign(end, outcome.kind);
      c.steps[index] = cells.steps[k];
      c.loss[index] = cells.loss[k];
      c.stepsToTolerance[index] = cells.stepsToTolerance[k];
      c.endPoints.set(end, index * n);
      c.outcomes[index] = outcome;
    });
  };

  /**
   * Clusters of end points (basins away from the known minima) take their labels in the order cells
   * arrive, which depends on how the work was split between workers and on timing; once every cell is
   * in they are assigned again in cell order, so a finished study's basins are the same however it ran.
   * (With known minima only, each cell's basin does not depend on the others and nothing changes.)
   */
  const settleBasins = (): string[] => {
    const s = store.getState();
    const c = s.cells;
    if (!c || !tracker) return [];
    if (tracker.centres.length === 0) return [...tracker.labels];
    const kinds = Array.from(c.kind, (k) => OUTCOME_KINDS[k]);
    const again = assignBasins(c.endPoints, s.variables.length, kinds, s.known, basinRadius);
    c.basin.set(again.basin);
    return again.labels;
  };

  // Answers to one-off analysis requests, by request id.
  const waiting = new Map<string, { resolve: (msg: FromWorker) => void; reject: (e: Error) => void }>();
  const ask = <T,>(msg: Extract<Parameters<EngineLink['send']>[0], { requestId: string }>, read: (reply: FromWorker) => T) =>
    new Promise<T>((resolve, reject) => {
      waiting.set(msg.requestId, { resolve: (reply) => resolve(read(reply)), reject });
      link.send(msg);
    });

  link.listen((msg: FromWorker) => {
    const asked = 'requestId' in msg ? waiting.get(msg.requestId) : undefined;
    if (asked) {
      waiting.delete((msg as { requestId: string }).requestId);
      if (msg.type === 'analysis/error') asked.reject(new Error(msg.message));
      else asked.resolve(msg);
      return;
    }
    const current = store.getState();
    if (!('requestId' in msg) || msg.requestId !== current.requestId || current.status !== 'running') return;
    switch (msg.type) {
      case 'study/cells': {
        receive(msg.cells);
        // The view redraws the whole map on each update: at most every UPDATE_MS, so a fast study does
        // not keep the main thread busy repainting (the cells themselves are stored as they arrive).
        const now = clock();
        if (now - lastUpdate < UPDATE_MS && msg.done < msg.total) return;
        lastUpdate = now;
        store.setState((s) => ({ done: msg.done, total: msg.total, elapsedMs: msg.elapsedMs, basinLabels: [...(tracker?.labels ?? [])], version: s.version + 1 }));
        return;
      }
      case 'study/done': {
        const basinLabels = settleBasins();
        store.setState((s) => ({ status: 'done', elapsedMs: msg.elapsedMs, done: s.total, bands: msg.bands ?? null, thresholds: msg.thresholds ?? null, basinLabels, version: s.version + 1 }));
        return;
      }
      case 'study/error':
        store.setState({ status: 'error', message: msg.message });
        return;
    }
  });

  // A replaced worker took the study and the one-off requests with it.
  link.onRestart?.((reason) => {
    const message = `the study worker ${reason}; it was restarted, start again`;
    for (const asked of waiting.values()) asked.reject(new Error(message));
    waiting.clear();
    if (store.getState().status === 'running') store.setState({ status: 'error', message });
  });

  return {
    store,
    start({ surface, variables, spec, configLabel, known, basinRadius: radius, target = null }) {
      const previous = store.getState().requestId;
      if (previous) link.send({ type: 'study/cancel', requestId: previous });
      const count = studyCellCount(spec);
      const n = variables.length;
      tracker = new BasinTracker(known, radius);
      basinRadius = radius;
      const requestId = freshId('study');
      store.setState({
        status: 'running', message: null, requestId, spec, surface, variables, configLabel, done: 0, total: count, elapsedMs: 0, basinLabels: [...tracker.labels], known, target, bands: null, thresholds: null,
        cells: {
          filled: new Uint8Array(count), kind: new Uint8Array(count), basin: new Int32Array(count).fill(-1), steps: new Int32Array(count),
          loss: new Float64Array(count), endPoints: new Float64Array(count * n), stepsToTolerance: new Int32Array(count).fill(-1), outcomes: new Array(count),
        },
        version: store.getState().version + 1,
      });
      link.send({ type: 'study/start', requestId, surface, study: spec, target });
    },
    sharpness(surface, points, count) {
      return ask({ type: 'sharpness/sample', requestId: freshId('sharp'), surface, points, count }, (m) => (m.type === 'sharpness/result' ? m.values : new Float64Array(0)));
    },
    criticalPoints(surface, starts, count) {
      return ask({ type: 'critical/find', requestId: freshId('crit'), surface, starts, count }, (m) => (m.type === 'critical/result' ? { points: m.points, converged: m.converged, failed: m.failed } : { points: [], converged: 0, failed: 0 }));
    },
    cancel() {
      const { requestId, status } = store.getState();
      if (!requestId || status !== 'running') return;
      link.send({ type: 'study/cancel', requestId });
      store.setState({ status: 'cancelled' });
    },
  };
}
