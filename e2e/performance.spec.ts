import { expect, test } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
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
