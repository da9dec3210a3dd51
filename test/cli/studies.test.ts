import { existsSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildOptimizer, cellStart, logSpaced, drawStarts, outcomeDetail, RunCursor, Sweep, type StudySpec } from '../../src/engine';
import { studyCsvOf } from '../../src/io/study-exports';
import { knownMinima, basinRadiusOf } from '../../src/io/study-basins';
import { studyTarget } from '../../src/ui/study/basin-inputs';
import { buildSurface, describeSurface } from '../../src/problems';
import { createStudyStore } from '../../src/store/study-store';
import { inProcessLink } from '../store/in-process-link';
import { buildCli, fall, scratch, writeJson } from './built-cli';
import { studyExperiment } from './experiments';
import { SPECS } from '../problems/datafit/specs';
import { hasParameterGroups } from '../../src/engine';

const STUDY_FILES = ['fall-line-start-map.study-0.csv', 'fall-line-multi-start.study-1.csv', 'fall-line-learning-rates.study-2.csv'];
const ALL_FILES = ['fall-line-trajectories.csv', 'fall-line-results.csv', 'summary.json', ...STUDY_FILES];
const read = (dir: string, name: string) => readFileSync(join(dir, name), 'utf8');
const rowsOf = (text: string) => Papa.parse<string[]>(text.trim()).data;

const experiment = studyExperiment();
const studies = experiment.studies!;
const himmelblau = buildSurface(experiment.surface);
/** Numbers as the CSV writes them (String(n), NaN empty). */
const cell = (v: number) => (Number.isNaN(v) ? '' : String(v));

let single = '';

beforeAll(() => {
  buildCli();
  const dir = scratch();
  const file = writeJson(dir, 'studies.fall.json', experiment);
  const r = fall(['run', file, '--out', join(dir, 'single'), '--threads', '2']);
  if (r.code !== 0) throw new Error(`fall run failed: ${r.stderr}`);
  single = join(dir, 'single');
}, 180_000);

describe('fall run with studies', () => {
  it('writes one CSV per study beside the run files, with the columns of the page\'s study CSV', () => {
    expect(readdirSync(single).sort()).toEqual([...ALL_FILES].sort());
    const header = ['study', 'index', 'optimizer', 'learning_rate', 'start_x', 'start_y', 'outcome', 'outcome_detail', 'outcome_step', 'steps', 'final_loss', 'final_x', 'final_y', 'basin', 'steps_to_tolerance'];
    const sizes = [256, 40, 32];
    STUDY_FILES.forEach((name, k) => {
      const rows = rowsOf(read(single, name));
      expect(rows[0]).toEqual(header);
      expect(rows.slice(1).map((r) => r[1])).toEqual(Array.from({ length: sizes[k] }, (_, i) => String(i)));
      expect(new Set(rows.slice(1).map((r) => r[0]))).toEqual(new Set([['start-map', 'multi-start', 'learning-rate sweep'][k]]));
    });
  });

  it('the summary lists each study with its file and outcome counts', () => {
    const summary = JSON.parse(read(single, 'summary.json'));
    expect(summary.experiment).toMatchObject({ title: 'Himmelblau studies', runs: 2, studies: 3 });
    expect(summary.studies.map((s: { kind: string; file: string; cells: number }) => [s.kind, s.file, s.cells])).toEqual([
      ['start-map', STUDY_FILES[0], 256], ['multi-start', STUDY_FILES[1], 40], ['lr-sweep', STUDY_FILES[2], 32],
    ]);
    // Counted from the CSV: the summary says what the file holds.
    const sweepOutcomes = rowsOf(read(single, STUDY_FILES[2])).slice(1).map((r) => r[6]);
    expect(summary.studies[2].totals.diverged).toBe(sweepOutcomes.filter((o) => o === 'diverged').length);
    expect(summary.studies[2].totals.diverged).toBeGreaterThan(0);
  });

  it('a start map\'s cells are the same bits as a direct Sweep from the cell centres (Himmelblau: every small-step start converges to one of the four minima)', () => {
    const spec = studies[0] as Extract<StudySpec, { kind: 'start-map' }>;
    const rows = rowsOf(read(single, STUDY_FILES[0])).slice(1);
    const sample = [0, 1, 37, 128, 200, 255];
    const starts = new Float64Array(sample.length * 2);
    sample.forEach((c, k) => cellStart(spec, c, starts.subarray(2 * k, 2 * k + 2)));
    const sweep = new Sweep({ surface: himmelblau, optimizer: spec.optimizer, stop: spec.stop, seed: spec.seed, starts });
    while (!sweep.finished) sweep.advance(100);
    const r = sweep.result();
    sample.forEach((c, k) => {
      const row = rows[c];
      expect(row.slice(4, 6)).toEqual([cell(starts[2 * k]), cell(starts[2 * k + 1])]);
      expect(row.slice(6, 13)).toEqual([r.outcomes[k]!.kind, outcomeDetail(r.outcomes[k]!), String(r.outcomes[k]!.step), String(r.steps[k]), cell(r.losses[k]), cell(r.endPoints[2 * k]), cell(r.endPoints[2 * k + 1])]);
    });
    // Himmelblau's four minima (Himmelblau 1972) are listed; with lr 0.01 every cell converges to one.
    const basins = new Set(rows.map((row) => row[13]));
    expect(rows.every((row) => row[6] === 'converged')).toBe(true);
    expect([...basins].sort()).toEqual(knownMinima(describeSurface(experiment.surface).knownPoints).map((m) => m.label).sort());
  });

  it('a learning-rate sweep\'s rows are the runs a RunCursor makes at each log-spaced rate', () => {
    const spec = studies[2] as Extract<StudySpec, { kind: 'lr-sweep' }>;
    const rows = rowsOf(read(single, STUDY_FILES[2])).slice(1);
    const rates = logSpaced(spec.range[0], spec.range[1], spec.count);
    for (const c of [0, 5, 15, 16, 24, 31]) {
      const o = spec.optimizers[Math.floor(c / spec.count)];
      const rate = rates[c % spec.count];
      const cursor = new RunCursor(himmelblau, buildOptimizer({ ...o.spec, learningRate: rate }), { start: spec.start, seed: spec.seed, stop: spec.stop });
      cursor.runToEnd();
      expect(rows[c].slice(2, 4)).toEqual([o.label, String(rate)]);
      expect(rows[c].slice(6, 13)).toEqual([cursor.outcome!.kind, outcomeDetail(cursor.outcome!), String(cursor.outcome!.step), String(cursor.state.t), cell(cursor.state.loss), cell(cursor.state.x[0]), cell(cursor.state.x[1])]);
    }
    // Plain gradient descent diverges at the top of the range and converges or runs on at the bottom.
    expect(rows[15][6]).toBe('diverged');
    expect(rows[0][6]).not.toBe('diverged');
  });

  it('a multi-start\'s rows start at the seeded draws and are the runs a RunCursor makes from them', () => {
    const spec = studies[1] as Extract<StudySpec, { kind: 'multi-start' }>;
    const rows = rowsOf(read(single, STUDY_FILES[1])).slice(1);
    const starts = drawStarts(spec.distribution, 2, spec.count, spec.startSeed);
    for (const c of [0, 13, 39]) {
      const start = Array.from(starts.subarray(2 * c, 2 * c + 2));
      const cursor = new RunCursor(himmelblau, buildOptimizer(spec.optimizer), { start, seed: spec.seed, stop: spec.stop });
      cursor.runToEnd();
      expect(rows[c].slice(4, 6)).toEqual(start.map(cell));
      expect(rows[c].slice(6, 13)).toEqual([cursor.outcome!.kind, outcomeDetail(cursor.outcome!), String(cursor.outcome!.step), String(cursor.state.t), cell(cursor.state.loss), cell(cursor.state.x[0]), cell(cursor.state.x[1])]);
    }
  });

  it('the page\'s study worker computes the same cells: its results make the same CSV bytes', () => {
    const info = describeSurface(experiment.surface);
    studies.forEach((spec, k) => {
      const harness = inProcessLink();
      const store = createStudyStore(harness.link);
      // The target the page's panels pass: the file's tolerance above the lowest known minimum.
      const target = studyTarget(info.knownPoints, experiment.tolerance);
      expect(target).not.toBeNull();
      store.start({ surface: experiment.surface, variables: info.variables, spec, configLabel: 'test', known: knownMinima(info.knownPoints), basinRadius: basinRadiusOf(experiment.view), target });
      harness.drain();
      const s = store.store.getState();
      expect(s.status).toBe('done');
      expect(s.cells!.stepsToTolerance.some((v) => v >= 0)).toBe(true);
      expect(studyCsvOf(spec, himmelblau, info, experiment.view, s.cells!)).toBe(read(single, STUDY_FILES[k]));
      // The sweep's divergence thresholds in summary.json are the ones the page's table shows.
      if (spec.kind === 'lr-sweep') expect(JSON.parse(read(single, 'summary.json')).studies[k].thresholds).toEqual(s.thresholds);
    });
  });

  it('a sweep on x^2 + 10 y^2 finds the divergence thresholds the update rules give: 2/lambda_max for descent, 2(1 + mu)/lambda_max for heavy ball', () => {
    // lambda_max = 20. Gradient descent multiplies the error along the top eigenvector by 1 - lr * 20 per
    // step (stable iff lr < 0.1); heavy ball with mu = 0.9 (Polyak 1964) is stable iff lr * 20 < 2 * 1.9.
    const dir = scratch();
    const quadratic = { ...experiment, surface: { kind: 'formula' as const, text: 'x^2 + 10*y^2' }, runs: [], studies: [{ ...studies[2], range: [0.01, 1] as [number, number], count: 24, stop: { maxSteps: 400 } }] };
    const r = fall(['run', writeJson(dir, 'quadratic.fall.json', quadratic), '--out', join(dir, 'out')]);
    expect(r.code).toBe(0);
    const [gd, heavy] = JSON.parse(read(join(dir, 'out'), 'summary.json')).studies[0].thresholds;
    expect(gd.lambdaMax).toBeCloseTo(20, 10);
    expect(gd.predicted).toBeCloseTo(0.1, 12);
    expect(heavy.predicted).toBeCloseTo(0.19, 12);
    for (const [t, exact] of [[gd, 0.1], [heavy, 0.19]]) {
      expect(t.observed.refined).toBe(true);
      expect(t.observed.lo).toBeLessThanOrEqual(exact * (1 + 1e-9));
      expect(t.observed.hi).toBeGreaterThanOrEqual(exact * (1 - 1e-9));
      expect(t.observed.hi / t.observed.lo - 1).toBeLessThan(2e-6);
    }
    expect(r.stderr).toMatch(/diverges at rates: plain steps between 0\.1 and 0\.1 \(predicted 0\.1\), heavy ball between 0\.19 and 0\.19 \(predicted 0\.19\)/);
  });

  it('the same bytes whatever the number of threads; progress per study on stderr', () => {
    const dir = scratch();
    const r = fall(['run', writeJson(dir, 'studies.fall.json', experiment), '--out', join(dir, 'one'), '--threads', '1']);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/^study 0 \(start-map\): 256\/256 runs$/m);
    expect(r.stderr).toMatch(/^study 2 \(learning-rate sweep\): 32 runs; .*diverged \d+/m);
    for (const name of ALL_FILES) expect(read(join(dir, 'one'), name)).toBe(read(single, name));
  });

  it('--json reports study progress as events, counted in the total', () => {
    const dir = scratch();
    const r = fall(['run', writeJson(dir, 'studies.fall.json', experiment), '--out', join(dir, 'out'), '--json', '--threads', '1']);
    const events = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(events[0]).toEqual({ event: 'start', total: 2 + 256 + 40 + 32 });
    const last = (study: number) => events.filter((e) => e.event === 'study' && e.study === study).at(-1);
    expect([last(0), last(1), last(2)].map((e) => [e.kind, e.done, e.total])).toEqual([['start-map', 256, 256], ['multi-start', 40, 40], ['lr-sweep', 32, 32]]);
    expect(events.at(-1)).toMatchObject({ event: 'finish', done: 330, total: 330 });
  });
});

describe('studies in shards', () => {
  it.each([2, 3, 7])('%i shards, merged, give the bytes of the single run (every file)', (n) => {
    const dir = scratch();
    const file = writeJson(dir, 'studies.fall.json', experiment);
    for (let i = 0; i < n; i++) expect(fall(['run', file, '--out', join(dir, 'shards'), '--shard', `${i}/${n}`, '--threads', '1']).code).toBe(0);
    expect(readdirSync(join(dir, 'shards'))).toHaveLength(4 * n);
    const merged = fall(['merge', join(dir, 'shards'), '--out', join(dir, 'merged')]);
    expect(merged.stderr).toContain(`merged ${n} shards (2 runs, 3 studies of 328 runs)`);
    expect(merged.code).toBe(0);
    for (const name of ALL_FILES) expect(read(join(dir, 'merged'), name)).toBe(read(single, name));
  });

  it('every shard takes a share of every study', () => {
    const dir = scratch();
    const file = writeJson(dir, 'studies.fall.json', experiment);
    fall(['run', file, '--out', dir + '/s', '--shard', '1/4']);
    const summary = JSON.parse(read(join(dir, 's'), 'summary.shard-1-of-4.json'));
    expect(summary.studies.map((s: { cells: number }) => s.cells)).toEqual([64, 10, 8]);
  });

  it('refuses a shard whose study cells are missing, naming the file', () => {
    const dir = scratch();
    const file = writeJson(dir, 'studies.fall.json', experiment);
    fall(['run', file, '--out', join(dir, 's'), '--shard', '0/2']);
    fall(['run', file, '--out', join(dir, 's'), '--shard', '1/2']);
    rmSync(join(dir, 's', 'fall-line-studies.shard-1-of-2.json'));
    const r = fall(['merge', join(dir, 's'), '--out', join(dir, 'm')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`shard 1/2 in ${join(dir, 's')} is incomplete: fall-line-studies.shard-1-of-2.json is missing`);
    expect(existsSync(join(dir, 'm'))).toBe(false);
  });

  it('fall check names a bad study field with its line', () => {
    const dir = scratch();
    const bad = { ...experiment, studies: [{ ...studies[0], resolution: 1000 }] };
    const r = fall(['check', writeJson(dir, 'bad.fall.json', bad)]);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/bad\.fall\.json:\d+:\d+: \$\.studies\[0\]\.resolution: /);
  });
});

describe('studies of a network (a model fitted to data, 13 parameters)', () => {
  const net = SPECS['mlp tanh binary'];
  const surface = buildSurface(net);
  const n = surface.dimension;
  const base = Array.from({ length: n }, (_, k) => 0.1 * (k % 3) - 0.1);
  const stop = { maxSteps: 150, lossChangeTolerance: 1e-12 };
  const networkStudies: StudySpec[] = [
    { kind: 'multi-start', optimizer: { kind: 'adam', learningRate: 0.05 }, stop, seed: 4, distribution: { kind: 'glorot' }, count: 12, startSeed: 9 },
    { kind: 'start-map', optimizer: { kind: 'gd', learningRate: 0.1 }, stop, seed: 4, box: { a: [-2, 2], b: [-1, 3] }, axes: [1, 4], base, resolution: 16 },
  ];
  const file = { ...experiment, surface: net, runs: [], studies: networkStudies };

  it('Glorot starts from the network\'s layers, a map over a slice through two weights; 3 shards merge into the same bytes', () => {
    expect(n).toBe(13);
    const dir = scratch();
    const path = writeJson(dir, 'network.fall.json', file);
    expect(fall(['run', path, '--out', join(dir, 'single')]).code).toBe(0);
    for (let i = 0; i < 3; i++) expect(fall(['run', path, '--out', join(dir, 'shards'), '--shard', `${i}/3`]).code).toBe(0);
    expect(fall(['merge', join(dir, 'shards'), '--out', join(dir, 'merged')]).code).toBe(0);
    const names = ['fall-line-multi-start.study-0.csv', 'fall-line-start-map.study-1.csv', 'summary.json'];
    for (const name of names) expect(read(join(dir, 'merged'), name)).toBe(read(join(dir, 'single'), name));

    const starts = drawStarts({ kind: 'glorot' }, n, 12, 9, hasParameterGroups(surface) ? surface.parameterGroups : undefined);
    const multi = rowsOf(read(join(dir, 'single'), names[0])).slice(1);
    expect(multi).toHaveLength(12);
    multi.forEach((row, c) => expect(row.slice(4, 4 + n)).toEqual(Array.from(starts.subarray(c * n, (c + 1) * n), cell)));
    const map = rowsOf(read(join(dir, 'single'), names[1])).slice(1);
    const spec = networkStudies[1] as Extract<StudySpec, { kind: 'start-map' }>;
    for (const c of [0, 77, 255]) {
      const start = cellStart(spec, c, new Float64Array(n));
      expect(map[c].slice(4, 4 + n)).toEqual(Array.from(start, cell));
      const cursor = new RunCursor(surface, buildOptimizer(spec.optimizer), { start: Array.from(start), seed: spec.seed, stop });
      cursor.runToEnd();
      expect(map[c].slice(4 + n + 2, 4 + n + 5)).toEqual([String(cursor.outcome!.step), String(cursor.state.t), cell(cursor.state.loss)]);
      expect(map[c].slice(4 + n + 5, 4 + 2 * n + 5)).toEqual(Array.from(cursor.state.x, cell));
    }
  });
});
