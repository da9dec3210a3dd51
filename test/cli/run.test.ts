import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildCli, fall, fallInBackground, scratch, writeJson } from './built-cli';
import { divergingExperiment, slowExperiment, sweepExperiment } from './experiments';

const SINGLE = ['fall-line-trajectories.csv', 'fall-line-results.csv', 'summary.json'];
const read = (dir: string, name: string) => readFileSync(join(dir, name), 'utf8');

beforeAll(() => {
  buildCli();
}, 120_000);

describe('fall run', () => {
  it('writes the two CSVs and a summary, one row per run in file order', () => {
    const dir = scratch();
    const file = writeJson(dir, 'sweep.fall.json', sweepExperiment());
    const r = fall(['run', file, '--out', join(dir, 'out'), '--threads', '3']);
    expect(r.stderr).toContain('wrote fall-line-trajectories.csv');
    expect(r.code).toBe(0);
    expect(readdirSync(join(dir, 'out')).sort()).toEqual([...SINGLE].sort());
    const results = read(join(dir, 'out'), 'fall-line-results.csv').split('\r\n');
    expect(results[0]).toMatch(/^run_id,run_label,optimizer,learning_rate,outcome,/);
    expect(results.slice(1, -1).map((l) => l.split(',')[0])).toEqual(['r0', 'r1', 'r2', 'r3', 'r4', 'r5', 'r6']);
    const summary = JSON.parse(read(join(dir, 'out'), 'summary.json'));
    expect(summary.experiment.title).toBe('Himmelblau sweep');
    expect(summary.runs).toHaveLength(7);
  });

  it('gives the same bytes whatever the number of threads', () => {
    const dir = scratch();
    const file = writeJson(dir, 'sweep.fall.json', sweepExperiment());
    expect(fall(['run', file, '--out', join(dir, 'one'), '--threads', '1']).code).toBe(0);
    expect(fall(['run', file, '--out', join(dir, 'four'), '--threads', '4']).code).toBe(0);
    for (const name of SINGLE) expect(read(join(dir, 'four'), name)).toBe(read(join(dir, 'one'), name));
  });

  it('prints progress as JSON lines with --json', () => {
    const dir = scratch();
    const r = fall(['run', writeJson(dir, 'sweep.fall.json', sweepExperiment()), '--out', join(dir, 'out'), '--json']);
    const events = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(events[0]).toEqual({ event: 'start', total: 7 });
    expect(events.filter((e) => e.event === 'run').map((e) => e.done)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    expect(events.at(-1)).toMatchObject({ event: 'finish', done: 7, total: 7 });
  });

  it('records a diverging run as such, finishes the others and exits with 2', () => {
    const dir = scratch();
    const r = fall(['run', writeJson(dir, 'bad-rate.fall.json', divergingExperiment()), '--out', join(dir, 'out')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/run r2 \(too fast\) diverged at step \d+/);
    const summary = JSON.parse(read(join(dir, 'out'), 'summary.json'));
    expect(summary.runs[2].outcome).toBe('diverged');
    expect(summary.runs.filter((x: { outcome: string }) => x.outcome !== 'diverged')).toHaveLength(6);
    expect(read(join(dir, 'out'), 'fall-line-results.csv')).toMatch(/\r\nr2,too fast,Gradient descent,5,diverged,/);
  });
});

describe('fall run --shard and fall merge', () => {
  it.each([1, 3, 4, 9])('%i shards merge into the bytes of a single run', (n) => {
    const dir = scratch();
    const file = writeJson(dir, 'sweep.fall.json', sweepExperiment());
    expect(fall(['run', file, '--out', join(dir, 'single')]).code).toBe(0);
    for (let i = 0; i < n; i++) expect(fall(['run', file, '--out', join(dir, 'shards'), '--shard', `${i}/${n}`, '--threads', '2']).code).toBe(0);
    expect(readdirSync(join(dir, 'shards'))).toHaveLength(3 * n);
    const merged = fall(['merge', join(dir, 'shards'), '--out', join(dir, 'merged')]);
    expect(merged.stderr).toContain(`merged ${n} shard`);
    expect(merged.code).toBe(0);
    for (const name of SINGLE) expect(read(join(dir, 'merged'), name)).toBe(read(join(dir, 'single'), name));
  });

  it("a shard writes beside another shard's file still being written (the tasks of a job array share one folder)", () => {
    // Seen on the one-node Slurm: task 2 found task 3's temporary file and refused the folder.
    const dir = scratch();
    const file = writeJson(dir, 'sweep.fall.json', sweepExperiment());
    mkdirSync(join(dir, 'shards'));
    writeFileSync(join(dir, 'shards', '.fall-line-trajectories.shard-3-of-4.csv.partial-12345'), '');
    expect(fall(['run', file, '--out', join(dir, 'shards'), '--shard', '2/4']).code).toBe(0);
    // Anything else in the folder is still refused.
    writeFileSync(join(dir, 'shards', 'notes.txt'), 'mine');
    expect(fall(['run', file, '--out', join(dir, 'shards'), '--shard', '1/4']).code).toBe(1);
  });

  it('merges shards spread over several folders, into the first by default', () => {
    const dir = scratch();
    const file = writeJson(dir, 'sweep.fall.json', sweepExperiment());
    fall(['run', file, '--out', join(dir, 'single')]);
    fall(['run', file, '--out', join(dir, 'a'), '--shard', '0/2']);
    fall(['run', file, '--out', join(dir, 'b'), '--shard', '1/2']);
    expect(fall(['merge', join(dir, 'a'), join(dir, 'b')]).code).toBe(0);
    for (const name of SINGLE) expect(read(join(dir, 'a'), name)).toBe(read(join(dir, 'single'), name));
    const again = fall(['merge', join(dir, 'a'), join(dir, 'b')]);
    expect(again.code).toBe(1);
    expect(again.stderr).toContain('already has files (fall-line-results.csv, fall-line-trajectories.csv, summary.json)');
    expect(fall(['merge', join(dir, 'a'), join(dir, 'b'), '--force']).code).toBe(0);
  });

  it('refuses shards of two different experiment files, naming both', () => {
    const dir = scratch();
    const one = writeJson(dir, 'one.fall.json', sweepExperiment());
    const other = sweepExperiment();
    other.runs[0].optimizer.learningRate = 0.011;
    const two = writeJson(dir, 'two.fall.json', other);
    fall(['run', one, '--out', join(dir, 'a'), '--shard', '0/2']);
    fall(['run', two, '--out', join(dir, 'b'), '--shard', '1/2']);
    const r = fall(['merge', join(dir, 'a'), join(dir, 'b'), '--out', join(dir, 'm')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(new RegExp(`shard 1/2 in ${join(dir, 'b')} is from a different experiment \\(sha256:[0-9a-f]{64}\\) than shard 0/2 in ${join(dir, 'a')}`));
    expect(existsSync(join(dir, 'm'))).toBe(false);
  });

  it('refuses a split with a missing shard, naming it', () => {
    const dir = scratch();
    const file = writeJson(dir, 'sweep.fall.json', sweepExperiment());
    fall(['run', file, '--out', join(dir, 's'), '--shard', '0/3']);
    fall(['run', file, '--out', join(dir, 's'), '--shard', '2/3']);
    const r = fall(['merge', join(dir, 's')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('missing shard 1/3');
    expect(readdirSync(join(dir, 's'))).toHaveLength(6);
  });

  it('the same experiment saved as version 1 or 2, in any layout, hashes the same (its shards merge)', () => {
    const dir = scratch();
    const w = sweepExperiment();
    const { title: _t, ...untitled } = w;
    const v2 = writeJson(dir, 'v2.fall.json', JSON.stringify(untitled));
    const v1 = writeJson(dir, 'v1.fall.json', { ...untitled, version: 1 });
    fall(['run', v2, '--out', join(dir, 's'), '--shard', '0/2']);
    fall(['run', v1, '--out', join(dir, 's'), '--shard', '1/2']);
    expect(fall(['merge', join(dir, 's')]).code).toBe(0);
  });
});

describe('bad input: a clear message, exit 1, nothing written', () => {
  const cases: [string, (dir: string) => string[], RegExp][] = [
    ['not JSON', (d) => ['run', writeJson(d, 'x.fall.json', '{\n  "version": 2,\n  oops\n}'), '--out', join(d, 'out')], /x\.fall\.json:3:3: \$: not valid JSON: expected a field name in double quotes, found "o"/],
    ['a future version', (d) => ['run', writeJson(d, 'x.fall.json', { ...sweepExperiment(), version: 9 }), '--out', join(d, 'out')], /x\.fall\.json:\d+:\d+: \$\.version: version 9 is newer than this program reads \(1 to 3\)/],
    ['a wrong version', (d) => ['run', writeJson(d, 'x.fall.json', { ...sweepExperiment(), version: 'two' }), '--out', join(d, 'out')], /\$\.version: expected a whole number from 1 to 3, got "two"/],
    ['an unknown field', (d) => ['run', writeJson(d, 'x.fall.json', { ...sweepExperiment(), runs: [{ ...sweepExperiment().runs[0], colour: 'red' }] }), '--out', join(d, 'out')], /x\.fall\.json:\d+:\d+: \$\.runs\[0\]\.colour: unknown field/],
    ['a formula that does not parse', (d) => ['run', writeJson(d, 'x.fall.json', { ...sweepExperiment(), surface: { kind: 'formula', text: 'x^2 + sinn(y)' } }), '--out', join(d, 'out')], /x\.fall\.json:\d+:\d+: \$\.surface\.text: formula: unknown function 'sinn' at column 7; did you mean 'sin'\?/],
    ['--shard 5/4', (d) => ['run', writeJson(d, 'x.fall.json', sweepExperiment()), '--out', join(d, 'out'), '--shard', '5/4'], /--shard 5\/4: shard index 5 is out of range; shards of 4 are numbered 0 to 3/],
    ['--shard 0/0', (d) => ['run', writeJson(d, 'x.fall.json', sweepExperiment()), '--out', join(d, 'out'), '--shard', '0/0'], /--shard 0\/0: the number of shards must be at least 1/],
    ['--shard a/b', (d) => ['run', writeJson(d, 'x.fall.json', sweepExperiment()), '--out', join(d, 'out'), '--shard', 'a/b'], /--shard "a\/b": expected i\/n with whole numbers/],
    ['--threads 0', (d) => ['run', writeJson(d, 'x.fall.json', sweepExperiment()), '--out', join(d, 'out'), '--threads', '0'], /--threads 0: expected a whole number of at least 1/],
    ['a missing file', (d) => ['run', join(d, 'nowhere.fall.json'), '--out', join(d, 'out')], /nowhere\.fall\.json: cannot read the file/],
    ['an unknown option', (d) => ['run', writeJson(d, 'x.fall.json', sweepExperiment()), '--out', join(d, 'out'), '--speed', '3'], /Unknown option '--speed'/],
  ];
  it.each(cases)('%s', (_name, args, message) => {
    const dir = scratch();
    const r = fall(args(dir));
    expect(r.stderr).toMatch(message);
    expect(r.code).toBe(1);
    expect(existsSync(join(dir, 'out'))).toBe(false);
  });

  it('places the formula error at its line and column in the file', () => {
    const dir = scratch();
    const text = JSON.stringify({ ...sweepExperiment(), surface: { kind: 'formula', text: 'x^2 + sinn(y)' } }, null, 2);
    const r = fall(['check', writeJson(dir, 'x.fall.json', text)]);
    const [, line, column] = /x\.fall\.json:(\d+):(\d+): \$\.surface\.text/.exec(r.stdout)!;
    expect(text.split('\n')[Number(line) - 1].slice(Number(column) - 1)).toMatch(/^sinn\(y\)"/);
  });

  it('refuses an output folder holding other files unless --force', () => {
    const dir = scratch();
    const file = writeJson(dir, 'x.fall.json', sweepExperiment());
    mkdirSync(join(dir, 'out'));
    writeFileSync(join(dir, 'out', 'notes.txt'), 'mine');
    const r = fall(['run', file, '--out', join(dir, 'out')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`the output folder ${join(dir, 'out')} already has files (notes.txt); use an empty folder, or --force`);
    expect(readdirSync(join(dir, 'out'))).toEqual(['notes.txt']);
    expect(fall(['run', file, '--out', join(dir, 'out'), '--force']).code).toBe(0);
    expect(read(join(dir, 'out'), 'notes.txt')).toBe('mine');
    expect(readdirSync(join(dir, 'out'))).toHaveLength(4);
  });

  it('refuses to run a shard again over its own finished files unless --force', () => {
    const dir = scratch();
    const file = writeJson(dir, 'x.fall.json', sweepExperiment());
    expect(fall(['run', file, '--out', join(dir, 's'), '--shard', '1/2']).code).toBe(0);
    const again = fall(['run', file, '--out', join(dir, 's'), '--shard', '1/2']);
    expect(again.code).toBe(1);
    expect(again.stderr).toContain('summary.shard-1-of-2.json');
  });

  it('refuses an output folder it cannot create or write, naming it', () => {
    const dir = scratch();
    const file = writeJson(dir, 'x.fall.json', sweepExperiment());
    const r = fall(['run', file, '--out', join(file, 'out')]);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`cannot create the output folder ${join(file, 'out')}: ENOTDIR`);
    // A folder the process may not write: read-only for a normal user; root ignores modes, so for root
    // a folder in /sys, where nobody may create one.
    const locked = process.getuid?.() === 0 ? '/sys/fall-line-out' : join(dir, 'locked');
    if (locked !== '/sys/fall-line-out') mkdirSync(locked, { mode: 0o555 });
    const r2 = fall(['run', file, '--out', locked]);
    expect(r2.code).toBe(1);
    expect(r2.stderr).toMatch(new RegExp(`cannot (create|write into) the output folder ${locked}: E[A-Z]+`));
  });

  it('fall check lists every problem with its path and exits 1; a good file exits 0', () => {
    const dir = scratch();
    const w = sweepExperiment() as unknown as Record<string, any>;
    w.runs[0].optimizer.kind = 'newtonish';
    w.runs[3].settings.extra = true;
    w.tolerance = 'x';
    const r = fall(['check', writeJson(dir, 'x.fall.json', w)]);
    expect(r.code).toBe(1);
    expect(r.stdout.trim().split('\n').map((l) => l.split(': ')[1])).toEqual(['$.runs[0].optimizer.kind', '$.runs[3].settings.extra', '$.tolerance']);
    const ok = fall(['check', writeJson(dir, 'y.fall.json', sweepExperiment())]);
    expect(ok).toMatchObject({ code: 0, stdout: `${join(dir, 'y.fall.json')}: ok\n` });
  });
});

describe('fall schema', () => {
  it('prints a JSON Schema that refuses unknown fields', () => {
    const r = fall(['schema']);
    expect(r.code).toBe(0);
    const schema = JSON.parse(r.stdout);
    expect(schema.$schema).toMatch(/json-schema\.org/);
    expect(schema.additionalProperties).toBe(false);
    expect(schema.properties.version).toMatchObject({ const: 3 });
  });
});

describe('Ctrl-C', () => {
  it('stops cleanly: exit 130, no file of the interrupted shard, the finished shard intact', async () => {
    const dir = scratch();
    const file = writeJson(dir, 'slow.fall.json', slowExperiment());
    expect(fall(['run', file, '--out', join(dir, 's'), '--shard', '0/2']).code).toBe(0);
    const before = readdirSync(join(dir, 's')).sort();
    const bytes = before.map((n) => read(join(dir, 's'), n));
    const child = fallInBackground(['run', file, '--out', join(dir, 's'), '--shard', '1/2', '--json']);
    await new Promise<void>((resolve) => child.stdout.on('data', (d: Buffer) => d.toString().includes('"start"') && resolve()));
    await new Promise((resolve) => setTimeout(resolve, 300));
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    child.kill('SIGINT');
    expect(await exited).toBe(130);
    expect(readdirSync(join(dir, 's')).sort()).toEqual(before);
    expect(before.map((n) => read(join(dir, 's'), n))).toEqual(bytes);
  });
});
