import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { StudySpec } from '../../../src/engine';
import { checkMeaning, CURRENT_VERSION, readExperiment, type FileProblem } from '../../../src/io/experiment';
import { demoWorkspace } from '../../../src/store/demo';
import { everyStudy, multiStartStudy, rateSweepStudy, startMapStudy } from '../../study-examples';

const V2_TEXT = readFileSync(new URL('../../fixtures/experiments/v2-demo.fall.json', import.meta.url), 'utf8');

/** The demo workspace on Himmelblau's function (2 variables) with the given studies. */
const withStudies = (studies: unknown[]) => ({ ...JSON.parse(JSON.stringify(demoWorkspace())), surface: { kind: 'catalogue', id: 'himmelblau' }, studies });

/** Every problem the file has: schema problems, else meaning problems (placed in the text). */
function problemsOf(value: unknown): FileProblem[] {
  const text = JSON.stringify(value, null, 2);
  const r = readExperiment(text);
  return r.ok ? checkMeaning(r.experiment, text) : r.problems;
}

/** The line of the file a problem points at. */
const lineAt = (value: unknown, p: FileProblem) => JSON.stringify(value, null, 2).split('\n')[p.at!.line - 1].trim();

describe('studies in the experiment file (version 3)', () => {
  it('a version-2 file saved by the page still opens, migrated, without studies', () => {
    expect(CURRENT_VERSION).toBe(3);
    const r = readExperiment(V2_TEXT);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.experiment.version).toBe(3);
    expect(r.experiment.studies).toBeUndefined();
    // Unchanged apart from the version and the one option value version 3 renamed (renamed-options.ts).
    const v2 = JSON.parse(V2_TEXT);
    for (const run of v2.runs) if (run.optimizer.hyper?.epsilonForm === 'algorithm1') run.optimizer.hyper.epsilonForm = 'eps-after-correction';
    expect({ ...r.experiment, version: 2 }).toEqual(v2);
    expect(checkMeaning(r.experiment, V2_TEXT)).toEqual([]);
  });

  it('a version-2 file with studies is refused: studies came with version 3', () => {
    const [p] = problemsOf({ ...withStudies([startMapStudy()]), version: 2 });
    expect(p).toMatchObject({ path: '$.studies', message: 'unknown field (not part of this version of the experiment file)' });
  });

  const kinds: [string, StudySpec][] = [
    ['start-point map', startMapStudy()],
    ['multi-start, uniform box', multiStartStudy()],
    ['multi-start, Gaussian with one sd', { ...multiStartStudy(), distribution: { kind: 'gaussian', centre: [1, 2], sd: 0.5 } }],
    ['multi-start, Gaussian with an sd per coordinate', { ...multiStartStudy(), distribution: { kind: 'gaussian', centre: [1, 2], sd: [0.5, 0.25] } }],
    ['learning-rate sweep', rateSweepStudy()],
  ];
  it.each(kinds)('%s: round-trips unchanged and passes the checks', (_name, study) => {
    const w = withStudies([study]);
    const r = readExperiment(JSON.stringify(w));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.experiment).toEqual(w);
    expect(r.experiment.studies).toEqual([study]);
    expect(checkMeaning(r.experiment)).toEqual([]);
  });

  it('several studies of several kinds, in file order', () => {
    const r = readExperiment(JSON.stringify(withStudies(everyStudy())));
    expect(r.ok && r.experiment.studies!.map((s) => s.kind)).toEqual(['start-map', 'multi-start', 'lr-sweep']);
  });

  it('network initialisations need a model fitted to data: refused on a test function, at the distribution', () => {
    const w = withStudies([{ ...multiStartStudy(), distribution: { kind: 'glorot' } }]);
    const [p] = problemsOf(w);
    expect(p.path).toBe('$.studies[0].distribution');
    expect(p.message).toBe("starts: 'glorot' initialisation needs a surface with parameter groups (a model fitted to data)");
    expect(lineAt(w, p)).toBe('"distribution": {');
  });
});

describe('bad study input: a specific message at its path and line', () => {
  const cases: [string, () => unknown, string, string | RegExp, string?][] = [
    ['an unknown field', () => withStudies([{ ...startMapStudy(), colour: 'red' }]), '$.studies[0].colour', 'unknown field (not part of this version of the experiment file)', '"colour": "red"'],
    ['an unknown kind', () => withStudies([{ ...startMapStudy(), kind: 'heat-map' }]), '$.studies[0].kind', /unknown kind/],
    ['a missing field', () => { const s: Record<string, unknown> = { ...rateSweepStudy() }; delete s.range; return withStudies([s]); }, '$.studies[0].range', 'missing (this field is required)'],
    ['a resolution out of range', () => withStudies([{ ...startMapStudy(), resolution: 8 }]), '$.studies[0].resolution', /16/, '"resolution": 8'],
    ['a fractional count', () => withStudies([{ ...multiStartStudy(), count: 2.5 }]), '$.studies[0].count', /expected int/, '"count": 2.5,'],
    ['an unknown optimizer kind in a sweep', () => withStudies([{ ...rateSweepStudy(), optimizers: [rateSweepStudy().optimizers[0], { label: 'x', spec: { kind: 'sgd-ish', learningRate: 1 } }] }]), '$.studies[0].optimizers[1].spec.kind', /sgd-ish|Invalid option/],
    ['a start of the wrong dimension', () => withStudies([{ ...rateSweepStudy(), start: [1, 2, 3] }]), '$.studies[0].start', 'learning-rate sweep: start must have 2 coordinates, got 3', '"start": ['],
    ['a base of the wrong dimension', () => withStudies([{ ...startMapStudy(), base: [0] }]), '$.studies[0].base', 'start-point map: base must have 2 coordinates, got 1', '"base": ['],
    ['axes beyond the dimension', () => withStudies([{ ...startMapStudy(), axes: [0, 2] }]), '$.studies[0].axes', 'start-point map: axes must be two different parameter indices below 2, got [0, 2]', '"axes": ['],
    ['an empty box side', () => withStudies([{ ...startMapStudy(), box: { a: [-5, 5], b: [2, 2] } }]), '$.studies[0].box.b', 'start-point map: box.b must be finite with lo < hi, got [2, 2]', '"b": ['],
    ['a rate range the wrong way round', () => withStudies([{ ...rateSweepStudy(), range: [0.1, 0.001] }]), '$.studies[0].range', 'learning-rate sweep: range must satisfy 0 < low < high (finite), got [0.1, 0.001]', '"range": ['],
    ['a bad learning rate of a swept optimizer', () => { const s = rateSweepStudy(); s.optimizers[1].spec.learningRate = -1; return withStudies([s]); }, '$.studies[0].optimizers[1].spec.learningRate', /^momentum: learningRate must be/, '"learningRate": -1,'],
    ['an unknown setting of a map\'s optimizer', () => { const s = startMapStudy(); s.optimizer.hyper = { beta9: 1 }; return withStudies([s]); }, '$.studies[0].optimizer.hyper.beta9', /unknown setting 'beta9'/, '"beta9": 1'],
    ['a uniform box of the wrong dimension', () => withStudies([{ ...multiStartStudy(), distribution: { kind: 'uniform', box: [[0, 1]] } }]), '$.studies[0].distribution', 'starts: box must have 2 entries (one per parameter), got 1'],
  ];
  it.each(cases)('%s', (_name, make, path, message, line) => {
    const w = make();
    const found = problemsOf(w);
    expect(found).toHaveLength(1);
    expect(found[0].path).toBe(path);
    if (typeof message === 'string') expect(found[0].message).toBe(message);
    else expect(found[0].message).toMatch(message);
    if (line) expect(lineAt(w, found[0])).toBe(line);
  });

  it('names the study by its place when a later study is the bad one', () => {
    const found = problemsOf(withStudies([startMapStudy(), multiStartStudy(), { ...rateSweepStudy(), count: 1 }]));
    expect(found.map((p) => p.path)).toEqual(['$.studies[2].count']);
  });
});
