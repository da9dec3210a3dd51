import { describe, expect, it } from 'vitest';
import { createProgress, duration } from '../../src/cli/progress';
import { parseShard, shareOf } from '../../src/cli/work-units';
import type { RunLine } from '../../src/cli/summary-file';

const line = (id: string): RunLine => ({ id, label: `run ${id}`, outcome: 'converged', step: 12, detail: 'loss-change', steps: 12, finalLoss: 0.5 });

function sinks() {
  const out = { stdout: '', stderr: '' };
  return { out, sinks: { stdout: { write: (t: string) => void (out.stdout += t) }, stderr: { write: (t: string) => void (out.stderr += t) } } };
}

describe('progress', () => {
  it('a bar on a terminal: runs done, rate and time left, redrawn in place', () => {
    let t = 0;
    const { out, sinks: s } = sinks();
    const p = createProgress('bar', 4, s, () => t);
    t = 2000;
    p.runDone(line('a'));
    expect(out.stderr.split('\r').at(-1)).toBe('[######------------------] 1/4 runs  0.5 runs/s  ETA 6s  ');
    p.finish();
    expect(out.stderr.endsWith('\n')).toBe(true);
    expect(out.stdout).toBe('');
  });

  it('plain lines when not a terminal, JSON lines with --json', () => {
    const plain = sinks();
    createProgress('lines', 2, plain.sinks, () => 0).runDone(line('a'));
    expect(plain.out.stderr).toBe('run 1/2 a (run a): converged at step 12\n');
    let t = 0;
    const json = sinks();
    const p = createProgress('json', 2, json.sinks, () => t);
    t = 1000;
    p.runDone(line('a'));
    p.finish();
    expect(json.out.stdout.trim().split('\n').map((l) => JSON.parse(l))).toEqual([
      { event: 'start', total: 2 },
      { event: 'run', done: 1, total: 2, id: 'a', outcome: 'converged', step: 12, runsPerSecond: 1, etaSeconds: 1 },
      { event: 'finish', done: 1, total: 2, seconds: 1 },
    ]);
  });

  it.each([[0.2, '1s'], [59.2, '60s'], [61, '1m01s'], [3725, '1h02m'], [Number.NaN, '--']])('duration(%d) = %s', (s, text) => {
    expect(duration(s)).toBe(text);
  });
});

describe('shards', () => {
  it('the shares partition the units in order and differ in size by at most one', () => {
    const units = Array.from({ length: 10 }, (_, k) => k);
    for (const n of [1, 2, 3, 4, 7, 10, 13]) {
      const shares = Array.from({ length: n }, (_, i) => shareOf(units, { index: i, count: n }));
      expect(shares.flat()).toEqual(units);
      const sizes = shares.map((s) => s.length);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
    }
  });

  it.each([['0/1', { index: 0, count: 1 }], ['3/4', { index: 3, count: 4 }], [' 2/16 ', { index: 2, count: 16 }]])('parseShard(%j)', (text, shard) => {
    expect(parseShard(text)).toEqual(shard);
  });

  it.each([['4/4', 'shard index 4 is out of range'], ['0/0', 'at least 1'], ['-1/4', 'expected i/n'], ['1/2/3', 'expected i/n'], ['1.5/4', 'expected i/n']])('parseShard(%j) is refused', (text, message) => {
    expect(() => parseShard(text)).toThrow(message);
  });
});

describe('progress of studies', () => {
  it('counts study runs in the total: a line per finished piece, a JSON event with the study\'s own count', () => {
    const plain = sinks();
    const p = createProgress('lines', 5, plain.sinks, () => 0);
    p.runDone(line('a'));
    p.cellsDone(0, 'start-map', 3, 3, 4);
    expect(plain.out.stderr).toBe('run 1/5 a (run a): converged at step 12\nstudy 0 (start-map): 3/4 runs\n');
    let t = 0;
    const json = sinks();
    const q = createProgress('json', 5, json.sinks, () => t);
    t = 1000;
    q.cellsDone(1, 'lr-sweep', 4, 4, 4);
    q.finish();
    const events = json.out.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(events[1]).toEqual({ event: 'study', study: 1, kind: 'lr-sweep', done: 4, total: 4, runsPerSecond: 4, etaSeconds: 0.25 });
    expect(events[2]).toMatchObject({ event: 'finish', done: 4, total: 5 });
  });
});
