import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildOptimizer, MAX_FORMULA_LENGTH, OPTIMIZERS, RunCursor } from '../../../src/engine';
import { checkMeaning, CURRENT_VERSION, experimentJsonSchema, OPTIMIZER_KINDS, readExperiment, type FileProblem } from '../../../src/io/experiment';
import { buildSurface, SURFACE_KINDS } from '../../../src/problems';
import { demoWorkspace } from '../../../src/store/demo';

const V1_TEXT = readFileSync(new URL('../../fixtures/experiments/v1-demo.fall.json', import.meta.url), 'utf8');
const V2_OLD_VALUES = readFileSync(new URL('../../fixtures/experiments/v2-old-option-values.fall.json', import.meta.url), 'utf8');

function problems(input: unknown): FileProblem[] {
  const r = readExperiment(input);
  if (r.ok) throw new Error('expected the file to be refused');
  return r.problems;
}

const current = () => JSON.parse(JSON.stringify(demoWorkspace()));

describe('readExperiment: versions', () => {
  it('opens a version-1 file saved by the page and migrates it to the current version', () => {
    const r = readExperiment(V1_TEXT);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.experiment.version).toBe(CURRENT_VERSION);
    expect(r.experiment.runs.map((x) => x.id)).toEqual(['demo-gd', 'demo-momentum', 'demo-adam']);
    // Unchanged apart from the version and Adam's renamed epsilon form.
    const v1 = JSON.parse(V1_TEXT);
    v1.runs[2].optimizer.hyper.epsilonForm = 'eps-after-correction';
    expect({ ...r.experiment, version: 1 }).toEqual(v1);
  });

  it('round-trips the current version unchanged', () => {
    const w = current();
    const r = readExperiment(JSON.stringify(w));
    expect(r.ok && r.experiment).toEqual(w);
  });

  it('refuses a future version, naming the versions it reads', () => {
    expect(problems(JSON.stringify({ ...current(), version: CURRENT_VERSION + 1 }))).toEqual([
      { path: '$.version', message: `version ${CURRENT_VERSION + 1} is newer than this program reads (1 to ${CURRENT_VERSION}); update Fall Line to open it`, at: { line: 1, column: 12 } },
    ]);
  });

  it.each([[0], ['2'], [1.5]])('refuses version %j', (version) => {
    expect(problems({ ...current(), version })[0]).toMatchObject({ path: '$.version', message: expect.stringContaining('expected a whole number from 1') });
  });

  it('refuses a file without a version', () => {
    const { version: _v, ...rest } = current();
    expect(problems(rest)[0].message).toBe("missing 'version': this is not a Fall Line experiment file");
  });
});

describe('readExperiment: option values renamed in version 3', () => {
  /** Run id in the fixture -> the setting values it must have after reading. */
  const RENAMED: Record<string, Record<string, string>> = {
    'adam-algorithm1': { epsilonForm: 'eps-after-correction' },
    'adam-hat': { epsilonForm: 'eps-before-correction' },
    'adamw-library': { decayForm: 'times-learning-rate', epsilonForm: 'eps-after-correction' },
    'adamw-paper': { decayForm: 'times-schedule', epsilonForm: 'eps-before-correction' },
    'amsgrad-pytorch': { form: 'max-raw-moment' },
    'amsgrad-optax': { form: 'max-corrected-moment' },
    'amsgrad-paper': { form: 'no-bias-correction' },
    'nadam-scheduled': { form: 'rising-momentum' },
    'nadam-constant-beta1': { form: 'constant-momentum' },
    'nesterov-library': { form: 'record-look-ahead' },
    'nesterov-sutskever': { form: 'record-base-point' },
  };

  it('a version-2 file with every old value opens with the new names, and the engine accepts each run', () => {
    const r = readExperiment(V2_OLD_VALUES);
    if (!r.ok) throw new Error(JSON.stringify(r.problems));
    expect(r.experiment.version).toBe(CURRENT_VERSION);
    expect(Object.fromEntries(r.experiment.runs.map((run) => [run.id, pickStrings(run.optimizer.hyper ?? {})]))).toEqual(RENAMED);
    expect(checkMeaning(r.experiment)).toEqual([]);
    // Nothing else moved: the file equals its input with only the renamed values and the version changed.
    const input = JSON.parse(V2_OLD_VALUES);
    input.version = CURRENT_VERSION;
    for (const run of input.runs) Object.assign(run.optimizer.hyper, RENAMED[run.id]);
    expect(r.experiment).toEqual(input);
  });

  it('each renamed convention still runs its own iterates (the old names would have failed validation)', () => {
    const r = readExperiment(V2_OLD_VALUES);
    if (!r.ok) throw new Error('expected the fixture to open');
    const surface = buildSurface(r.experiment.surface);
    const ends = r.experiment.runs.map((run) => {
      const cursor = new RunCursor(surface, buildOptimizer(run.optimizer), { ...run.settings, stop: { maxSteps: 5 } });
      const batch = cursor.advance(5);
      return Array.from(batch.points.slice(-2)).join(',');
    });
    // Two forms of one method give different points after 5 steps: each old name reached its own convention.
    for (const [a, b] of [['adam-algorithm1', 'adam-hat'], ['amsgrad-pytorch', 'amsgrad-paper'], ['nadam-scheduled', 'nadam-constant-beta1'], ['nesterov-library', 'nesterov-sutskever'], ['adamw-library', 'adamw-paper']]) {
      const ids = r.experiment.runs.map((run) => run.id);
      expect(ends[ids.indexOf(a)]).not.toBe(ends[ids.indexOf(b)]);
    }
  });

  it('an old value on a kind that never had it is left alone (and refused by the engine as before)', () => {
    const w = JSON.parse(V2_OLD_VALUES);
    w.runs = [{ ...w.runs[0], optimizer: { kind: 'rmsprop', learningRate: 0.01, hyper: { epsilonPlacement: 'pytorch' } } }];
    const r = readExperiment(w);
    if (!r.ok) throw new Error('expected the schema to pass');
    expect(r.experiment.runs[0].optimizer.hyper).toEqual({ epsilonPlacement: 'pytorch' });
    expect(checkMeaning(r.experiment)[0].message).toMatch(/epsilonPlacement must be one of 'outside', 'inside', got 'pytorch'/);
  });
});

function pickStrings(hyper: Record<string, unknown>): Record<string, string> {
  return Object.fromEntries(Object.entries(hyper).filter((e): e is [string, string] => typeof e[1] === 'string'));
}

describe('readExperiment: problems are named by JSON path and placed in the text', () => {
  it('not JSON: the parser reason and where', () => {
    const [p] = problems('{\n  "version": 2,\n  "runs": [,]\n}');
    expect(p.path).toBe('$');
    expect(p.message).toBe('not valid JSON: expected a value (object, list, string, number, true, false or null), found ","');
    expect(p.at).toEqual({ line: 3, column: 12 });
    expect(problems('{"version": 2')[0]).toMatchObject({ message: "not valid JSON: unexpected end of the text (expected ',' or '}' after a field's value)", at: { line: 1, column: 14 } });
  });

  it('an unknown field is refused, with its path, in any version', () => {
    const w = current();
    w.runs[1].optimizer.colour = 'red';
    const text = JSON.stringify(w, null, 2);
    const [p] = problems(text);
    expect(p.path).toBe('$.runs[1].optimizer.colour');
    expect(p.message).toMatch(/^unknown field/);
    expect(text.split('\n')[p.at!.line - 1]).toContain('"colour"');
    const v1 = JSON.parse(V1_TEXT);
    v1.surface.extra = 1;
    expect(problems(v1).map((x) => x.path)).toEqual(['$.surface.extra']);
  });

  it('lists every problem, not only the first', () => {
    const w = current();
    w.runs[0].optimizer.kind = 'sgd-ish';
    w.runs[2].settings.stop.maxSteps = 0;
    w.tolerance = 'small';
    expect(problems(w).map((p) => p.path)).toEqual(['$.runs[0].optimizer.kind', '$.runs[2].settings.stop.maxSteps', '$.tolerance']);
  });

  it('accepts a formula up to the parser\'s length limit and refuses one beyond it', () => {
    const sixThousand = { ...current(), surface: { kind: 'formula', text: `x^2 + y^2 + 0.${'0'.repeat(5985)}1` } };
    expect(sixThousand.surface.text.length).toBeGreaterThan(5000);
    const r = readExperiment(JSON.stringify(sixThousand));
    expect(r.ok).toBe(true);
    if (r.ok) expect(checkMeaning(r.experiment)).toEqual([]);
    const tooLong = { ...current(), surface: { kind: 'formula', text: 'x'.repeat(MAX_FORMULA_LENGTH + 1) } };
    expect(problems(tooLong)[0].path).toBe('$.surface.text');
  });
});

describe('the schema comes from the registries', () => {
  it('optimizer kinds are the catalogue\'s', () => {
    expect(OPTIMIZER_KINDS).toEqual(OPTIMIZERS.map((o) => o.kind));
  });

  it('the JSON Schema lists the same optimizer and surface kinds and forbids extra fields', () => {
    const schema = experimentJsonSchema() as { properties: Record<string, any>; additionalProperties: unknown };
    expect(schema.additionalProperties).toBe(false);
    const run = schema.properties.runs.items;
    expect(run.properties.optimizer.properties.kind.enum).toEqual(OPTIMIZER_KINDS);
    const kinds = schema.properties.surface.oneOf ?? schema.properties.surface.anyOf;
    expect(kinds.map((k: any) => k.properties.kind.const)).toEqual(SURFACE_KINDS);
  });
});

describe('checkMeaning', () => {
  it('places a formula syntax error at its line and column in the file', () => {
    const w = { ...current(), surface: { kind: 'formula', text: 'x^2 + sinn(y)' } };
    const text = JSON.stringify(w, null, 2);
    const r = readExperiment(text);
    if (!r.ok) throw new Error('schema should pass');
    const [p] = checkMeaning(r.experiment, text);
    expect(p.path).toBe('$.surface.text');
    expect(p.message).toBe("formula: unknown function 'sinn' at column 7; did you mean 'sin'?");
    const line = text.split('\n')[p.at!.line - 1];
    expect(line.slice(p.at!.column - 1, p.at!.column + 3)).toBe('sinn');
  });

  it('counts escaped characters when placing the error', () => {
    const text = '{"version":2,"surface":{"kind":"formula","text":"x\\u0020+ \\t# y"}}';
    const [p] = checkMeaning({ ...current(), surface: JSON.parse(text).surface }, text);
    expect(p.message).toContain("unexpected character '#'");
    expect(text.slice(p.at!.column - 1, p.at!.column)).toBe('#');
  });

  it('names duplicate run ids and a start of the wrong dimension', () => {
    const w = current();
    w.runs[1].id = w.runs[0].id;
    w.runs[2].settings.start = [1, 2, 3];
    const found = checkMeaning(w);
    expect(found.map((p) => p.path)).toEqual(['$.runs[1].id', expect.stringMatching(/^\$\.runs\[2\]/)]);
    expect(found[1].message).toMatch(/3/);
  });
});

describe('parseWorkspace (the page\'s loader)', () => {
  it('opens what the page saves, including a 6,000-character formula', async () => {
    const { parseWorkspace } = await import('../../../src/io/workspace-schema');
    const w = { ...current(), surface: { kind: 'formula', text: `x^2 + y^2 + 0.${'0'.repeat(5985)}1` } };
    expect(w.surface.text.length).toBe(6000);
    expect(parseWorkspace(JSON.stringify(w))).toEqual({ ok: true, workspace: w });
  });

  it('reports the first problem with its path', async () => {
    const { parseWorkspace } = await import('../../../src/io/workspace-schema');
    expect(parseWorkspace({ ...current(), extra: true })).toEqual({ ok: false, error: '$.extra: unknown field (not part of this version of the experiment file)' });
  });
});

describe('missing fields', () => {
  it('are named as missing, placed at the object that lacks them', () => {
    const w = current();
    delete w.runs[1].settings.stop;
    delete w.tolerance;
    const text = JSON.stringify(w, null, 2);
    const found = problems(text);
    expect(found.map((p) => [p.path, p.message])).toEqual([
      ['$.runs[1].settings.stop', 'missing (this field is required)'],
      ['$.tolerance', 'missing (this field is required)'],
    ]);
    expect(text.split('\n')[found[0].at!.line - 1].trim()).toBe('"settings": {');
    expect(found[1].at).toEqual({ line: 1, column: 1 });
  });
});
