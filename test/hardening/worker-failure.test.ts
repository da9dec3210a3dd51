/**
 * A worker that throws, sends an unreadable message, or is killed (goes silent): the page's link
 * replaces it (store/engine-link.ts, driven here with a stand-in Worker class and fake timers), and the
 * store ends the runs in flight with the reason, answers pending requests, resends the pace and shows
 * a notice (driven with the real worker handler in-process). The browser-level version is in
 * e2e/hardening.spec.ts.
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { MAX_RESTARTS, WORKER_SILENCE_LIMIT_MS, workerLink } from '../../src/store/engine-link';
import { createAppStore } from '../../src/store/app-store';
import { demoWorkspace } from '../../src/store/demo';
import { inProcessLink } from '../store/in-process-link';

/** Stands in for the browser's Worker: records posts, can fire error events, answers pings while alive. */
class StandInWorker extends EventTarget {
  static made: StandInWorker[] = [];
  posted: unknown[] = [];
  terminated = false;
  answersPings = true;
  constructor(
    readonly url: URL,
    readonly options: WorkerOptions,
  ) {
    super();
    StandInWorker.made.push(this);
  }
  postMessage(msg: { type: string }): void {
    this.posted.push(msg);
    if (msg.type === 'link/ping' && this.answersPings && !this.terminated) queueMicrotask(() => this.reply({ type: 'link/pong' }));
  }
  terminate(): void {
    this.terminated = true;
  }
  reply(data: unknown): void {
    this.dispatchEvent(new MessageEvent('message', { data }));
  }
  fail(message: string): void {
    const event = new Event('error', { cancelable: true }) as Event & { message: string };
    event.message = message;
    this.dispatchEvent(event);
  }
}

describe('workerLink replaces a failed worker', () => {
  beforeEach(() => {
    StandInWorker.made = [];
    vi.stubGlobal('Worker', StandInWorker);
    vi.useFakeTimers({ toFake: ['setInterval', 'clearInterval', 'setTimeout', 'performance', 'queueMicrotask'] });
  });
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it('an uncaught error: the worker is terminated, a fresh one takes over, the reason is reported', () => {
    const link = workerLink({ name: 'engine' });
    const reasons: string[] = [];
    const heard: unknown[] = [];
    link.onRestart!((r) => reasons.push(r));
    link.listen((m) => heard.push(m));
    StandInWorker.made[0].fail('Uncaught RangeError: Maximum call stack size exceeded');
    expect(StandInWorker.made).toHaveLength(2);
    expect(StandInWorker.made[0].terminated).toBe(true);
    expect(StandInWorker.made[1].options).toEqual({ type: 'module', name: 'engine' });
    expect(reasons).toEqual(['threw an error: Uncaught RangeError: Maximum call stack size exceeded']);
    // The listeners hear the new worker, and sends go to it.
    StandInWorker.made[1].reply({ type: 'run/error', runId: 'r1', message: 'x' });
    expect(heard).toEqual([{ type: 'run/error', runId: 'r1', message: 'x' }]);
    link.send({ type: 'run/pace', pace: 'max' });
    expect(StandInWorker.made[1].posted).toEqual([{ type: 'run/pace', pace: 'max' }]);
  });

  it('an unreadable message is a failure too', () => {
    const link = workerLink({ name: 'engine' });
    const reasons: string[] = [];
    link.onRestart!((r) => reasons.push(r));
    StandInWorker.made[0].dispatchEvent(new MessageEvent('messageerror'));
    expect(reasons).toEqual(['sent a message that could not be read']);
  });

  it('a killed worker (no event, no answers) is replaced after the silence limit, a live one never', async () => {
    const link = workerLink({ name: 'engine', watchSilence: true });
    const reasons: string[] = [];
    link.onRestart!((r) => reasons.push(r));
    await vi.advanceTimersByTimeAsync(5 * WORKER_SILENCE_LIMIT_MS);
    expect(reasons).toEqual([]); // it answered every ping
    StandInWorker.made[0].answersPings = false; // killed
    await vi.advanceTimersByTimeAsync(WORKER_SILENCE_LIMIT_MS - 2_000);
    expect(reasons).toEqual([]);
    await vi.advanceTimersByTimeAsync(4_000);
    expect(reasons).toEqual([`stopped answering (nothing for ${WORKER_SILENCE_LIMIT_MS / 1000} s)`]);
    expect(StandInWorker.made).toHaveLength(2);
    expect(StandInWorker.made[1].posted.some((m) => (m as { type: string }).type === 'link/ping')).toBe(false);
  });

  it(`gives up after ${MAX_RESTARTS} restarts within a minute and says to reload`, () => {
    const link = workerLink({ name: 'engine' });
    const reasons: string[] = [];
    link.onRestart!((r) => reasons.push(r));
    for (let k = 0; k <= MAX_RESTARTS + 2; k++) StandInWorker.made.at(-1)!.fail('boom');
    expect(StandInWorker.made).toHaveLength(MAX_RESTARTS + 1);
    expect(reasons).toEqual([...Array(MAX_RESTARTS).fill('threw an error: boom'), `threw an error: boom, and failed ${MAX_RESTARTS} times within a minute; reload the page`]);
  });
});

describe('the store when its worker was replaced', () => {
  function setup() {
    const env = inProcessLink();
    const restartHandlers: ((reason: string) => void)[] = [];
    const link = { ...env.link, onRestart: (h: (reason: string) => void) => restartHandlers.push(h) };
    const workspace = { ...demoWorkspace(), pace: 50 };
    const app = createAppStore({ link, requestFrame: env.requestFrame, initial: workspace });
    return { env, app, restart: (reason: string) => restartHandlers.forEach((h) => h(reason)) };
  }

  it('runs in flight end with the reason, the notice says what happened, the pace is sent again', () => {
    const { env, app, restart } = setup();
    env.drain(20); // a few slices at 50 steps/s: the runs are still going
    const ids = app.store.getState().workspace.runs.map((r) => r.id);
    expect(ids.map((id) => app.store.getState().status[id]?.phase)).toEqual(['running', 'running', 'running']);
    const sentBefore = env.sent.length;
    restart('threw an error: Uncaught Error: simulated fault');
    env.drain(5);
    const s = app.store.getState();
    for (const id of ids) {
      expect(s.status[id].phase).toBe('error');
      expect(s.status[id].error?.message).toBe('the engine worker threw an error: Uncaught Error: simulated fault; it was restarted: press Restart to run again');
      expect(s.status[id].summary.steps).toBeGreaterThan(0); // the streamed trajectory is kept
    }
    expect(s.notice).toBe('The engine worker threw an error: Uncaught Error: simulated fault. It was restarted; runs that were in progress were stopped (Restart runs them again).');
    expect(env.sent.slice(sentBefore)).toContainEqual({ type: 'run/pace', pace: 50 });
  });

  it('a CSV import waiting on the lost worker returns a failure instead of waiting for ever', async () => {
    const env = inProcessLink();
    const restartHandlers: ((reason: string) => void)[] = [];
    // A link whose worker never answers CSV requests (it was killed while parsing).
    const link = { send: (m: Parameters<typeof env.link.send>[0]) => (m.type === 'csv/parse' ? undefined : env.link.send(m)), listen: env.link.listen, onRestart: (h: (r: string) => void) => restartHandlers.push(h) };
    const app = createAppStore({ link, requestFrame: env.requestFrame });
    const pending = app.store.getState().actions.importCsv('a,b\n1,2\n', { name: 't.csv', dropBadRows: false });
    restartHandlers.forEach((h) => h('stopped answering (nothing for 15 s)'));
    await expect(pending).resolves.toEqual({ ok: false, message: 'the engine worker stopped answering (nothing for 15 s); it was restarted', problems: [], moreProblems: 0 });
  });
});
