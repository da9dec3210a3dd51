/**
 * Page-level hostile conditions, in Debian's Chromium on the built app: the Content-Security-Policy
 * (no violation, every request on localhost, and formulas really need the one exception), corrupt,
 * refused and full browser storage, a worker that throws or is killed, a run of 10^7 steps that
 * can be cancelled while the page stays responsive, and 50 runs at once. The longest main-thread task
 * of the long runs is written to e2e-results/hardening.json (measured, not asserted beyond a bound
 * that means "the page froze").
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { demoWorkspace } from '../src/store/demo';
import { applyFormula, openFresh, waitForContours, waitForRunsToEnd } from './helpers';

const origin = `http://localhost:${process.env.FALL_LINE_E2E_PORT ?? 4173}`;
/** A main-thread task this long means the page froze (a frame is 16 ms; the bound is generous for a loaded machine). */
const FROZEN_MS = 1_000;

/** Records CSP violations and long main-thread tasks from the first script on. */
async function watchPage(page: Page): Promise<void> {
  await page.addInitScript(() => {
    const w = window as unknown as { cspViolations: string[]; longTasks: number[] };
    w.cspViolations = [];
    w.longTasks = [];
    document.addEventListener('securitypolicyviolation', (e) => w.cspViolations.push(`${e.violatedDirective} ${e.blockedURI}`));
    new PerformanceObserver((list) => list.getEntries().forEach((t) => w.longTasks.push(t.duration))).observe({ type: 'longtask', buffered: true });
  });
}

const violations = (page: Page) => page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);
const longestTask = (page: Page) => page.evaluate(() => Math.max(0, ...(window as unknown as { longTasks: number[] }).longTasks));
const clearLongTasks = (page: Page) => page.evaluate(() => ((window as unknown as { longTasks: number[] }).longTasks.length = 0));

function record(name: string, value: number): void {
  mkdirSync('e2e-results', { recursive: true });
  const file = 'e2e-results/hardening.json';
  let all: Record<string, number> = {};
  try {
    all = JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    // first entry
  }
  writeFileSync(file, JSON.stringify({ ...all, [name]: value }, null, 2));
}

test.describe('content security policy and network', () => {
  test('the page runs under the policy with no violation, and no request leaves localhost', async ({ page, context }) => {
    const requests: string[] = [];
    context.on('request', (r) => requests.push(r.url()));
    await watchPage(page);
    await openFresh(page);
    const policy = await page.locator('meta[http-equiv="Content-Security-Policy"]').getAttribute('content');
    expect(policy).toContain("default-src 'none'");
    expect(policy).toContain("script-src 'self' 'unsafe-eval'");
    await waitForRunsToEnd(page, 3);
    await applyFormula(page, 'x^2 + 3*y^2 + sin(x*y)');
    await waitForRunsToEnd(page, 3);
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Trajectories CSV' }).click();
    await download;
    expect(await violations(page)).toEqual([]);
    expect(page.workers().length).toBeGreaterThan(0);
    for (const w of page.workers()) expect(w.url().startsWith(`${origin}/`)).toBe(true);
    const outside = requests.filter((url) => !(url.startsWith(`${origin}/`) || /^(data|blob):/.test(url)));
    expect(requests.length).toBeGreaterThan(3);
    expect(outside).toEqual([]);
  });

  test("without 'unsafe-eval' the compiled formulas are blocked: the exception is needed", async ({ page }) => {
    const strict = (policy: string) => policy.replace(" 'unsafe-eval'", '');
    await page.route(`${origin}/**`, async (route) => {
      const response = await route.fetch();
      const headers = { ...response.headers() };
      if (headers['content-security-policy']) headers['content-security-policy'] = strict(headers['content-security-policy']);
      const type = headers['content-type'] ?? '';
      const body = type.includes('text/html') ? (await response.text()).replace(/'unsafe-eval'/g, '').replace(/&#39;unsafe-eval&#39;/g, '') : await response.body();
      await route.fulfill({ response, headers, body });
    });
    await watchPage(page);
    await page.goto('/');
    await expect.poll(() => violations(page), { timeout: 15_000 }).toContainEqual(expect.stringMatching(/^script-src eval$/));
    // Requests still being rewritten when the test ends must not fail the next test.
    await page.unrouteAll({ behavior: 'ignoreErrors' });
  });
});

test.describe('browser storage', () => {
  test('a corrupt saved workspace: the page comes up with a message, the text is kept aside', async ({ page }) => {
    await page.addInitScript(() => {
      if (!sessionStorage.getItem('seeded')) {
        localStorage.setItem('fall-line/workspace', '{"version": 2, "surface": {');
        sessionStorage.setItem('seeded', '1');
      }
    });
    await page.goto('/');
    await waitForContours(page);
    await expect(page.locator('.notice')).toContainText('The saved workspace could not be read (line 1, column 28: $: not valid JSON');
    await expect(page.locator('.notice')).toContainText('it was kept aside and the demo loaded instead');
    await waitForRunsToEnd(page, 3);
    expect(await page.evaluate(() => localStorage.getItem('fall-line/workspace/unreadable'))).toBe('{"version": 2, "surface": {');
  });

  test('full storage: the save is refused with a message and the page keeps working', async ({ page }) => {
    await page.addInitScript(() => {
      Storage.prototype.setItem = function () {
        throw new DOMException("Failed to execute 'setItem' on 'Storage': Setting the value of 'fall-line/workspace' exceeded the quota.", 'QuotaExceededError');
      };
    });
    await page.goto('/');
    await waitForContours(page);
    await page.getByRole('button', { name: 'Duplicate Adam' }).click();
    await expect(page.locator('.notice')).toContainText('The workspace could not be saved in this browser: Failed to execute \'setItem\' on \'Storage\'', { timeout: 10_000 });
    await waitForRunsToEnd(page, 4);
  });

  test('storage refused by the browser: the page comes up with a message', async ({ page }) => {
    await page.addInitScript(() => {
      Object.defineProperty(window, 'localStorage', {
        get() {
          throw new DOMException("Failed to read the 'localStorage' property from 'Window': Access is denied for this document.", 'SecurityError');
        },
      });
    });
    await page.goto('/');
    await waitForContours(page);
    await expect(page.locator('.notice')).toContainText('This browser refused the page its storage');
    await waitForRunsToEnd(page, 3);
  });
});

/** The page's engine worker (named 'engine' by main.tsx), found by its name. */
async function engineWorker(page: Page) {
  for (const w of page.workers()) if ((await w.evaluate(() => self.name)) === 'engine') return w;
  throw new Error('no engine worker');
}

test.describe('worker failures', () => {
  test('a worker that throws: the page reports it, restarts the worker, and runs again on Restart', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Pace').selectOption('100');
    await page.getByRole('button', { name: 'Restart', exact: true }).click();
    await expect(page.locator('.run-status[data-phase="running"]')).toHaveCount(3);
    const worker = await engineWorker(page);
    await worker.evaluate(() => setTimeout(() => {
      throw new Error('simulated fault');
    }));
    await expect(page.locator('.notice')).toContainText('The engine worker threw an error: Uncaught Error: simulated fault. It was restarted', { timeout: 10_000 });
    await expect(page.locator('.run-status[data-phase="error"]')).toHaveCount(3);
    await expect(page.locator('.run-status').first()).toContainText('the engine worker threw an error');
    await page.getByLabel('Pace').selectOption('max');
    await page.getByRole('button', { name: 'Restart', exact: true }).click();
    await waitForRunsToEnd(page, 3);
  });

  test('a killed worker: the page notices the silence, restarts it, and runs again on Restart', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    const worker = await engineWorker(page);
    await worker.evaluate(() => self.close()).catch(() => undefined); // the worker is gone before it can answer
    await expect(page.locator('.notice')).toContainText('The engine worker stopped answering (nothing for 15 s). It was restarted', { timeout: 40_000 });
    await page.getByRole('button', { name: 'Restart', exact: true }).click();
    await waitForRunsToEnd(page, 3);
  });
});

test.describe('long and many runs', () => {
  /** Four Plain descent runs of 10^7 steps (the most the field takes), no tolerances: only the step limit or Cancel ends them. */
  async function startLongRuns(page: Page, hidden: boolean): Promise<void> {
    const demo = demoWorkspace();
    const runs = [0, 1, 2, 3].map((k) => ({ ...demo.runs[0], hidden, id: `long-${k}`, label: `long ${k}`, style: k, settings: { start: [-1.2 + 0.1 * k, 1], seed: 1, stop: { maxSteps: 10_000_000 } } }));
    await page.locator('input[type="file"][accept=".json,application/json"]').setInputFiles({ name: 'long.fall.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify({ ...demo, runs, pace: 'max' })) });
    await expect(page.locator('.run-status[data-phase="running"]')).toHaveCount(4, { timeout: 10_000 });
  }

  test('1e9 steps is refused at the field; four 10^7-step runs go flat out and are cancelled', async ({ page }) => {
    await watchPage(page);
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    await page.locator('.run-item').first().locator('.run-select').click();
    const maxSteps = page.getByLabel('max steps');
    await maxSteps.fill('1e9');
    await maxSteps.press('Enter');
    await expect(page.getByRole('alert').filter({ hasText: 'max steps must be a whole number from 1 to 10000000, got 1000000000' })).toBeVisible();
    // Hidden from the view (see the fixme below for drawn ones): the page keeps answering and repainting.
    await startLongRuns(page, true);
    await clearLongTasks(page);
    const progress = page.locator('.run-item').first().getByRole('progressbar');
    await page.waitForTimeout(1_000);
    const before = Number(await progress.getAttribute('value'));
    await page.waitForTimeout(500);
    const after = Number(await progress.getAttribute('value'));
    expect(after).toBeGreaterThan(before);
    expect(after).toBeLessThan(10_000_000);
    await page.getByRole('button', { name: 'Cancel', exact: true }).click();
    await expect(page.locator('.run-status[data-outcome="cancelled"]')).toHaveCount(4, { timeout: 10_000 });
    record('longest main-thread task during four hidden 10^7-step runs (ms)', await longestTask(page));
  });

  // With the runs drawn, a frame used to walk every run's whole path twice and the loss chart scanned
  // every step for its range, so four runs of millions of steps froze the page for seconds. Paths are
  // now extended incrementally (plot/trajectory.ts growingTrajectoryPath) and the chart keeps running
  // extremes (chart/loss-range.ts). Four whole runs also used to hold 1.9 GB of steps and froze the
  // page for seconds as their buffers doubled; a buffer now keeps at most KEPT_BYTES of rows, thinning
  // to every 2nd, 4th, ... step (store/trajectory-buffer.ts).
  test('four drawn 10^7-step runs go to the end with the page responsive and its memory bounded', async ({ page }) => {
    test.setTimeout(240_000);
    await watchPage(page);
    await openFresh(page);
    await startLongRuns(page, false);
    await clearLongTasks(page);
    let heapMb = 0;
    const heap = () => page.evaluate(() => (performance as unknown as { memory: { usedJSHeapSize: number } }).memory.usedJSHeapSize / 2 ** 20);
    await expect(async () => {
      heapMb = Math.max(heapMb, await heap());
      expect(await page.locator('.run-status[data-phase="ended"]').count()).toBe(4);
    }).toPass({ timeout: 200_000, intervals: [1_000] });
    const longest = await longestTask(page);
    record('longest main-thread task during four drawn 10^7-step runs to their end (ms)', longest);
    record('largest JS heap seen during four drawn 10^7-step runs (MB)', Math.round(heapMb));
    expect(longest).toBeLessThan(FROZEN_MS);
    // 4 runs x 32 MiB of kept rows, plus the page itself; the whole runs would need 1.9 GB.
    expect(heapMb).toBeLessThan(600);
    // Every run went all the way, and its card says so.
    await expect(page.locator('.run-status[data-outcome="step-limit"]')).toHaveCount(4);
    for (const row of await page.locator('.run-item').all()) await expect(row.getByRole('progressbar')).toHaveAttribute('value', '10000000');
  });

  test('50 runs at once from an experiment file all end, with the page responsive', async ({ page }) => {
    await watchPage(page);
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    const demo = demoWorkspace();
    const kinds = ['gd', 'momentum', 'adam', 'rmsprop', 'nesterov'] as const;
    const runs = Array.from({ length: 50 }, (_, k) => ({
      ...demo.runs[0],
      id: `many-${k}`,
      label: `run ${k}`,
      style: k % 8,
      optimizer: { kind: kinds[k % kinds.length], learningRate: 1e-4 * (1 + (k % 10)) },
      settings: { ...demo.runs[0].settings, start: [-1.5 + (k % 10) * 0.3, -0.5 + Math.floor(k / 10) * 0.5] },
    }));
    await clearLongTasks(page);
    await page.locator('input[type="file"][accept=".json,application/json"]').setInputFiles({ name: 'many.fall.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify({ ...demo, runs, pace: 'max' })) });
    await expect(page.locator('.run-item')).toHaveCount(50);
    await waitForRunsToEnd(page, 50);
    await expect(page.locator('[data-testid="run-table"] tr[data-run-id]')).toHaveCount(50);
    const longest = await longestTask(page);
    record('longest main-thread task while 50 runs stream (ms)', longest);
    expect(longest).toBeLessThan(FROZEN_MS);
  });
});
