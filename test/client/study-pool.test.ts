import { describe, expect, it } from 'vitest';
import { BasinTracker, type StudySpec } from '../../src/engine';
import { describeSurface, type SurfaceSpec } from '../../src/problems';
import { StudyPool } from '../../src/client/study-pool';
import { sharedWorkers } from '../../src/client/shared-workers';
import { createStudyStore, type StudyParams, type StudyState } from '../../src/store/study-store';
import { inProcessLink } from '../store/in-process-link';
import { fakeWorld, flush } from './fake-workers';

const himmelblau: SurfaceSpec = { kind: 'catalogue', id: 'himmelblau' };
const minima = describeSurface(himmelblau).knownPoints.filter((p) => p.kind === 'global-min').map((p) => ({ point: p.point, label: `minimum (${p.point.join(', ')})` }));
/** A formula with no known points: its basins are clusters of end points, labelled in arrival order. */
const wells: SurfaceSpec = { kind: 'formula', text: '(x^2 - 1)^2 + (y^2 - 1)^2 + 0.3*x*y' };

const map: StudySpec = {
  kind: 'start-map',
  optimizer: { kind: 'adam', learningRate: 0.05 },
  stop: { maxSteps: 300, gradientNormTolerance: 1e-8 },
  seed: 1,
  box: { a: [-2, 2], b: [-2, 2] },
  axes: [0, 1],
  base: [0, 0],
  resolution: 24,
};
const multi: StudySpec = {
  kind: 'multi-start',
  optimizer: { kind: 'adam', learningRate: 0.05 },
  stop: { maxSteps: 250, gradientNormTolerance: 1e-8 },
  seed: 1,
  distribution: { kind: 'uniform', box: [[-5, 5], [-5, 5]] },
  count: 23,
  startSeed: 3,
};
const sweep: StudySpec = {
  kind: 'lr-sweep',
  optimizers: [{ label: 'GD', spec: { kind: 'gd', learningRate: 0.01 } }, { label: 'heavy ball', spec: { kind: 'momentum', learningRate: 0.01, hyper: { momentum: 0.9 } } }],
  stop: { maxSteps: 1000, gradientNormTolerance: 1e-10 },
  seed: 1,
  start: [1, 1],
  range: [0.01, 1],
  count: 19,
};

const params = (surface: SurfaceSpec, spec: StudySpec, known = minima): StudyParams => ({ surface, variables: ['x', 'y'], spec, configLabel: 'test', known, basinRadius: 0.05 });

/** A study run on `members` pool workers (in-process, messages and slices interleaved in one queue). */
async function onPool(members: number, p: StudyParams) {
  const world = fakeWorld();
  const pool = new StudyPool(sharedWorkers(world.factory, members), () => 0);
  const study = createStudyStore(pool, () => 0);
  study.start(p);
  for (let k = 0; k < 50 && !world.idle; k++) {
    world.run();
    await flush();
  }
  return { state: study.store.getState(), world };
}

/** The same study on one worker without parts (the engine handler in-process, as before the pool). */
function onOneWorker(p: StudyParams): StudyState {
  const h = inProcessLink();
  const study = createStudyStore(h.link, () => 0);
  study.start(p);
  h.drain();
  return study.store.getState();
}

/** Everything a finished study shows, as plain arrays (typed arrays compared element by element, so -0 and NaN count). */
function results(s: StudyState) {
  const c = s.cells!;
  return {
    status: s.status,
    done: s.done,
    filled: Array.from(c.filled),
    kind: Array.from(c.kind),
    basin: Array.from(c.basin),
    steps: Array.from(c.steps),
    loss: Array.from(c.loss),
    endPoints: Array.from(c.endPoints),
    outcomes: c.outcomes,
    basinLabels: s.basinLabels,
    bands: s.bands?.map((b) => Array.from(b)) ?? null,
    thresholds: s.thresholds,
  };
}

describe('studies on the worker pool: the same results as one worker, bit for bit', () => {
  it.each([
    ['a start-point map on Himmelblau (basins of the known minima)', himmelblau, map, minima],
    ['a start-point map of a surface without known points (basins are clusters of end points)', wells, map, []],
    ['a multi-start study (loss bands from every run)', himmelblau, multi, minima],
    ['a learning-rate sweep (thresholds from every outcome)', { kind: 'formula', text: 'x^2 + 10*y^2' } as SurfaceSpec, sweep, []],
  ] as const)('%s', async (_, surface, spec, known) => {
    const p = params(surface, spec, [...known]);
    const alone = results(onOneWorker(p));
    expect(alone.status).toBe('done');
    for (const members of [1, 2, 3]) {
      const { state, world } = await onPool(members, p);
      expect(results(state), `${members} workers`).toEqual(alone);
      // Every member ran a share of it.
      const parts = world.log.filter((e) => e.direction === 'in' && e.msg.type === 'study/start').map((e) => e.member);
      expect(parts.sort()).toEqual(Array.from({ length: members }, (_, k) => k));
      const served = new Set(world.log.filter((e) => e.direction === 'out' && e.msg.type === 'study/cells' && e.msg.cells.indices.length > 0).map((e) => e.member));
      expect(served.size).toBe(members);
    }
  });

  it('the clusters of a map without known points really depend on arrival order until they are settled', async () => {
    // Guards the test above: were the labels order-free anyway, it could not show that settling works.
    const p = params(wells, map, []);
    const { state, world } = await onPool(3, p);
    const arrival = world.log.flatMap((e) => (e.direction === 'out' && e.msg.type === 'study/cells' ? Array.from(e.msg.cells.indices) : []));
    expect(new Set(arrival).size).toBe(24 * 24);
    const c = state.cells!;
    const tracker = new BasinTracker([], p.basinRadius);
    const live = new Int32Array(24 * 24);
    for (const i of arrival) live[i] = tracker.assign(c.endPoints.subarray(2 * i, 2 * i + 2), c.outcomes[i]!.kind);
    expect(tracker.labels.length).toBeGreaterThan(1);
    expect(Array.from(live)).not.toEqual(Array.from(c.basin));
  });

  it('every part starts on its share of the coarse grid of the map (the first wave is split, not given to one worker)', async () => {
    const { world } = await onPool(3, params(himmelblau, map));
    const firstCells = [0, 1, 2].map((m) => world.log.find((e) => e.member === m && e.direction === 'out' && e.msg.type === 'study/cells' && e.msg.cells.indices.length > 0));
    // Stride-8 cells of a 24 x 24 map: i and j multiples of 8 (coarseToFineOrder's first wave).
    for (const e of firstCells) {
      const msg = e!.msg as { cells: { indices: Int32Array } };
      const c = msg.cells.indices[0];
      expect([(c % 24) % 8, Math.floor(c / 24) % 8]).toEqual([0, 0]);
    }
  });
});

describe('studies on the worker pool: progress, cancel, errors', () => {
  it('progress counts every part and ends at the total', async () => {
    const world = fakeWorld();
    const study = createStudyStore(new StudyPool(sharedWorkers(world.factory, 3), () => 0), () => 0);
    const seen: number[] = [];
    study.store.subscribe((s) => seen.push(s.done));
    study.start(params(himmelblau, map));
    for (let k = 0; k < 50 && !world.idle; k++) {
      world.run();
      await flush();
    }
    expect(seen.at(-1)).toBe(24 * 24);
    for (let k = 1; k < seen.length; k++) expect(seen[k]).toBeGreaterThanOrEqual(seen[k - 1]);
  });

  it('cancel tells every member and no cell arrives after it', async () => {
    const world = fakeWorld();
    const study = createStudyStore(new StudyPool(sharedWorkers(world.factory, 3), () => 0), () => 0);
    study.start(params(himmelblau, { ...map, resolution: 64 } as StudySpec));
    world.run(40);
    await flush();
    study.cancel();
    const filled = () => study.store.getState().cells!.filled.reduce((a, b) => a + b, 0);
    const atCancel = filled();
    world.run();
    await flush();
    expect(study.store.getState().status).toBe('cancelled');
    expect(filled()).toBe(atCancel);
    const cancels = world.log.filter((e) => e.direction === 'in' && e.msg.type === 'study/cancel').map((e) => e.member);
    expect(cancels.sort()).toEqual([0, 1, 2]);
    // And the members stopped: once the queue ran dry no member was still sending cells of it.
    expect(world.idle).toBe(true);
  });

  it('a bad spec is reported once, with the engine message', async () => {
    const { state } = await onPool(3, params(himmelblau, { ...map, resolution: 7 } as StudySpec));
    expect(state).toMatchObject({ status: 'error', message: 'start-point map: resolution must be a whole number from 16 to 512, got 7' });
  });

  it('a member that fails ends the study with an error naming it', async () => {
    const world = fakeWorld();
    world.failing.add(1);
    const study = createStudyStore(new StudyPool(sharedWorkers(world.factory, 3), () => 0), () => 0);
    study.start(params(himmelblau, map));
    world.run();
    await flush();
    expect(study.store.getState()).toMatchObject({ status: 'error', message: 'a study worker stopped (simulated crash); start the study again' });
  });
});
