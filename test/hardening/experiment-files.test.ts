/**
 * Bad and hostile experiment files (.fall.json), one row per file: the first problem as the command
 * line prints it (`fall run` and `fall check`: readExperiment, then checkMeaning) with its line and
 * column; the page's "Open experiment" shows the same problem without the file name (parseWorkspace).
 */
import { describe, expect, it } from 'vitest';
import { checkMeaning, experimentSchema, formatProblem, readExperiment } from '../../src/io/experiment';
import { parseWorkspace } from '../../src/io/workspace-schema';
import { demoWorkspace } from '../../src/store/demo';

const demo = demoWorkspace();
const json = (value: unknown) => JSON.stringify(value);
const withRun = (patch: (run: (typeof demo.runs)[number]) => unknown) => json({ ...demo, runs: [patch(structuredClone(demo.runs[0]))] });

/** The first problem `fall check f.fall.json` prints, or 'accepted'. */
function firstProblem(text: string): string {
  const read = readExperiment(text);
  const problems = read.ok ? checkMeaning(read.experiment, text) : read.problems;
  return problems.length ? formatProblem('f.fall.json', problems[0]) : 'accepted';
}

describe('experiment files: refused, with the first problem and where', () => {
  it.each<[string, string, RegExp]>([
    ['not JSON', 'hello', /^f\.fall\.json:1:1: \$: not valid JSON: expected a value .*found "h"$/],
    ['an empty file', '', /^f\.fall\.json:1:1: \$: not valid JSON: unexpected end of the text/],
    ['cut off half way', json(demo).slice(0, 50), /^f\.fall\.json:1:\d+: \$: not valid JSON: /],
    ['NaN written out', json(demo).replace('"tolerance":0.000001', '"tolerance":NaN'), /^f\.fall\.json:1:\d+: \$: not valid JSON: expected a value .*found "N"$/],
    ['a list, not an object', '[]', /^f\.fall\.json:1:1: \$: expected a JSON object \(an experiment\), got an array$/],
    ['null', 'null', /^f\.fall\.json:1:1: \$: expected a JSON object \(an experiment\), got null$/],
    ['no version', '{}', /^f\.fall\.json:1:1: \$: missing 'version': this is not a Fall Line experiment file$/],
    ['version as text', json({ ...demo, version: '2' }), /^f\.fall\.json:1:12: \$\.version: expected a whole number from 1 to 3, got "2"$/],
    ['a future version', json({ ...demo, version: 99 }), /^f\.fall\.json:1:12: \$\.version: version 99 is newer than this program reads \(1 to 3\); update Fall Line to open it$/],
    ['an unknown top-level field', json({ ...demo, colourScheme: 'dark' }), /^f\.fall\.json:1:\d+: \$\.colourScheme: unknown field \(not part of this version of the experiment file\)$/],
    ['an unknown field in a run', withRun((r) => ({ ...r, colour: 'red' })), /^f\.fall\.json:1:\d+: \$\.runs\[0\]\.colour: unknown field/],
    ['__proto__ at the top', json(demo).replace('{', '{"__proto__":{"polluted":true},'), /^f\.fall\.json:1:14: \$\.__proto__: a key named "__proto__" is not allowed anywhere in the file/],
    ['__proto__ inside constants', json({ ...demo, surface: { kind: 'formula', text: 'a*x^2+y^2', constants: { a: 2 } } }).replace('"constants":{', '"constants":{"__proto__":{"b":1},'), /\$\.surface\.constants\.__proto__: a key named "__proto__" is not allowed/],
    ['__proto__ inside hyperparameters', withRun((r) => ({ ...r, optimizer: { kind: 'adam', learningRate: 0.01, hyper: {} } })).replace('"hyper":{}', '"hyper":{"__proto__":{"beta1":0.5}}'), /\$\.runs\[0\]\.optimizer\.hyper\.__proto__: a key named "__proto__"/],
    ['constructor.prototype at the top', json(demo).replace('{', '{"constructor":{"prototype":{"polluted":true}},'), /^f\.fall\.json:1:16: \$\.constructor: unknown field/],
    ['201 runs', json({ ...demo, runs: Array.from({ length: 201 }, (_, k) => ({ ...demo.runs[0], id: `r${k}` })) }), /\$\.runs: Too big: expected array to have <=200 items$/],
    ['a start of a million coordinates', withRun((r) => ({ ...r, settings: { ...r.settings, start: new Array(1_000_000).fill(0) } })), /\$\.runs\[0\]\.settings\.start: start: expected 2 coordinates, got 1000000$/],
    ['100,000 table learning rates', json({ ...demo, panels: { ...demo.panels, tableLearningRates: new Array(100_000).fill(0.1) } }), /\$\.panels\.tableLearningRates: Too big: expected array to have <=12 items$/],
    ['a table of 200,000 rows', json({ ...demo, surface: { kind: 'datafit', dataset: { kind: 'table', name: 't', columns: ['a', 'b'], rows: new Array(200_000).fill([1, 2]) }, model: { kind: 'linear', inputs: ['a'], target: 'b' } } }), /\$\.surface: surface spec \(datafit\): dataset \(table t\): at most 100000 rows, got 200000$/],
    ['a 10 MB title', json({ ...demo, title: 'x'.repeat(10_000_000) }), /\$\.title: Too big: expected string to have <=200 characters$/],
    ['nested 100,000 lists deep', json({ ...demo, surface: 0 }).replace('"surface":0', `"surface":${'['.repeat(100_000)}${']'.repeat(100_000)}`), /\$\.surface: Invalid input: expected object, received array$/],
    ['a number that overflows', json(demo).replace('"tolerance":0.000001', '"tolerance":1e400'), /\$\.tolerance: Invalid input: expected number, received Infinity$/],
    ['a formula with an error', json({ ...demo, surface: { kind: 'formula', text: 'x + (y' } }), /^f\.fall\.json:1:\d+: \$\.surface\.text: formula: unmatched '\(' at column 5$/],
    ['a formula of 12,000 characters', json({ ...demo, surface: { kind: 'formula', text: 'x+'.repeat(6000) } }), /\$\.surface\.text: Too big: expected string to have <=10000 characters$/],
    ['learning rate 0', withRun((r) => ({ ...r, optimizer: { kind: 'gd', learningRate: 0 } })), /\$\.runs\[0\]\.optimizer\.learningRate: gd: learningRate must be a finite number > 0, got 0$/],
    ['1e9 steps', withRun((r) => ({ ...r, settings: { ...r.settings, stop: { maxSteps: 1e9 } } })), /\$\.runs\[0\]\.settings\.stop\.maxSteps: stop: maxSteps must be a whole number from 1 to 10000000, got 1000000000$/],
    ['two runs with one id', json({ ...demo, runs: [demo.runs[0], demo.runs[0]] }), /\$\.runs\[1\]\.id: run id "demo-gd" is already used by runs\[0\]$/],
  ])('%s', (_what, text, problem) => {
    expect(firstProblem(text)).toMatch(problem);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('the page reports the same problem when opening the file (without the file name)', () => {
    const parsed = parseWorkspace(json({ ...demo, version: 99 }));
    expect(parsed).toEqual({ ok: false, error: 'line 1, column 12: $.version: version 99 is newer than this program reads (1 to 3); update Fall Line to open it' });
  });

  it('why "__proto__" is refused: the schema alone drops it without checking its value', () => {
    const text = withRun((r) => ({ ...r, optimizer: { kind: 'adam', learningRate: 0.01, hyper: {} } })).replace('"hyper":{}', '"hyper":{"__proto__":{"beta1":"not a number"}}');
    const bare = experimentSchema.safeParse(JSON.parse(text));
    expect(bare.success).toBe(true); // the value "not a number" was never checked
    const hyper = (bare.data as typeof demo).runs[0].optimizer.hyper as Record<string, unknown>;
    expect(Object.keys(hyper)).toEqual([]);
    expect(firstProblem(text)).toMatch(/\$\.runs\[0\]\.optimizer\.hyper\.__proto__: a key named "__proto__" is not allowed/);
  });
});
