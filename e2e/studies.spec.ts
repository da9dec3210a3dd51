import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import Papa from 'papaparse';
import { applyFormula, canvasPixels, countColour, openFresh, waitForContours } from './helpers';

/**
 * A start-point map on Himmelblau (four minima, published in the reference file) with the demo's Adam
 * run: every cell's run ends at one of the minima, the legend lists each with its share, the shares
 * sum to 100%, the canvas shows the basin colours, a clicked cell becomes an ordinary run, and the
 * map exports as CSV with one row per cell.
 */
test('a start-point map on Himmelblau colours the four basins, lists their shares, opens a cell as a run and exports CSV', async ({ page }) => {
  await openFresh(page);
  await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
  await waitForContours(page);
  await page.getByRole('button', { name: /^Adam/ }).first().click(); // select the Adam run
  const panel = page.getByTestId('start-map');
  await panel.getByLabel('cells per side').selectOption('32');
  await panel.getByRole('button', { name: 'Map start points' }).click();
  await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
  await expect(panel.locator('.study-progress')).toContainText('1024 / 1024 runs');

  const rows = panel.getByTestId('start-map-legend').locator('tbody tr');
  const minima = rows.filter({ hasText: 'minimum (' });
  await expect(minima).toHaveCount(4);
  const shares = await rows.locator('td[data-share]').evaluateAll((cells) => cells.map((c) => Number(c.getAttribute('data-share'))));
  expect(shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
  const counts = await rows.locator('td:nth-child(3)').allInnerTexts();
  expect(counts.map(Number).reduce((a, b) => a + b, 0)).toBe(1024);

  // Every pixel of the map is painted, and at least four distinct hues show.
  const px = await canvasPixels(page, 'start-map-canvas');
  const colours = new Set<string>();
  let clear = 0;
  for (let k = 0; k < px.data.length; k += 4) {
    if (px.data[k + 3] === 0) clear++;
    else colours.add(`${px.data[k] >> 4},${px.data[k + 1] >> 4},${px.data[k + 2] >> 4}`);
  }
  expect(clear).toBe(0);
  expect(colours.size).toBeGreaterThanOrEqual(4);

  const before = await page.locator('.run-item').count();
  await page.getByTestId('start-map-canvas').click({ position: { x: 300, y: 20 } });
  await expect(page.locator('.run-item')).toHaveCount(before + 1);
  await expect(page.locator('.run-item').last()).toContainText('from map cell');

  const download = page.waitForEvent('download');
  await panel.getByRole('button', { name: 'Map CSV' }).click();
  const parsed = Papa.parse<string[]>(readFileSync((await (await download).path())!, 'utf8').trim(), { skipEmptyLines: true });
  const [header, ...body] = parsed.data;
  expect(body).toHaveLength(1024);
  expect(header.slice(0, 6)).toEqual(['study', 'index', 'optimizer', 'learning_rate', 'start_x', 'start_y']);
  const basins = new Set(body.map((r) => r[header.indexOf('basin')]));
  expect([...basins].filter((b) => b.startsWith('minimum')).length).toBe(4);
  // Steps to tolerance (Himmelblau's minima are all 0): filled for the runs that got within the
  // page's tolerance, a whole number no larger than the run's steps; the legend says the shade is that.
  const toTolerance = header.indexOf('steps_to_tolerance');
  const filled = body.filter((r) => r[toTolerance] !== '');
  expect(filled.length).toBeGreaterThan(512);
  for (const r of filled) {
    expect(Number.isInteger(Number(r[toTolerance]))).toBe(true);
    expect(Number(r[toTolerance])).toBeLessThanOrEqual(Number(r[header.indexOf('steps')]));
  }
  await expect(panel.getByTestId('start-map-shade')).toContainText("lighter = more steps to tolerance, to a loss within");
});

test('a long start-point map can be cancelled and stops', async ({ page }) => {
  await openFresh(page);
  const panel = page.getByTestId('start-map');
  await panel.getByLabel('cells per side').selectOption('256');
  await panel.getByRole('button', { name: 'Map start points' }).click();
  await expect(panel.locator('.study-progress')).toContainText('/ 65536 runs');
  await panel.getByRole('button', { name: 'Cancel map' }).click();
  await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'cancelled');
  const done = await panel.locator('progress').getAttribute('value');
  await page.waitForTimeout(500);
  expect(await panel.locator('progress').getAttribute('value')).toBe(done);
});

test('multi-start on Himmelblau: summary with the success rate, outcomes, the quartile band drawn, CSV of every start', async ({ page }) => {
  await openFresh(page);
  await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
  await waitForContours(page);
  await page.getByRole('button', { name: /^Adam/ }).first().click();
  await page.getByRole('tab', { name: 'Multi-start' }).click();
  const panel = page.getByTestId('multi-start');
  await panel.getByLabel('number of starts').fill('60');
  await panel.getByRole('button', { name: 'Run starts' }).click();
  await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
  const summary = panel.getByTestId('multi-start-summary');
  await expect(summary).toContainText('Over 60 starts');
  const rate = Number(await summary.locator('tr[data-key="success"] td').getAttribute('data-value'));
  expect(rate).toBeGreaterThan(0.5);
  expect(rate).toBeLessThanOrEqual(1);
  await expect(summary).toContainText('minimum (3, 2)');
  const reach = summary.locator('tr[data-key="steps-to-tolerance"] td');
  await expect(reach).toContainText("of 60 starts that reached it (loss within");
  const reached = Number(await reach.getAttribute('data-reached'));
  expect(reached).toBeGreaterThan(30);
  const px = await canvasPixels(page, 'multi-start-bands');
  let blue = 0;
  for (let k = 0; k < px.data.length; k += 4) if (px.data[k + 2] > 150 && px.data[k] < 120) blue++;
  expect(blue).toBeGreaterThan(100); // the median line and band are drawn
  const download = page.waitForEvent('download');
  await panel.getByRole('button', { name: 'Starts CSV' }).click();
  const parsed = Papa.parse<string[]>(readFileSync((await (await download).path())!, 'utf8').trim(), { skipEmptyLines: true });
  expect(parsed.data).toHaveLength(61);
  expect(parsed.data[1][0]).toBe('multi-start');
  // The CSV's column and the summary count the same starts.
  const column = parsed.data[0].indexOf('steps_to_tolerance');
  expect(parsed.data.slice(1).filter((r) => r[column] !== '').length).toBe(reached);
});

test('learning-rate sweep on x^2 + 10 y^2: observed thresholds at 2/lambda_max and 2(1+mu)/lambda_max beside the predictions, chart drawn', async ({ page }) => {
  // Source of the expected values: standard quadratic stability of GD (lr < 2/lambda_max) and of heavy
  // ball (lr < 2(1 + mu)/lambda_max), common practice; lambda_max = 20 here.
  await openFresh(page);
  await applyFormula(page, 'x^2 + 10*y^2');
  await page.getByRole('tab', { name: 'Learning-rate sweep' }).click();
  const panel = page.getByTestId('rate-sweep');
  await panel.getByRole('button', { name: 'Sweep learning rates' }).click();
  await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
  const table = panel.getByTestId('rate-thresholds');
  const value = async (label: string, col: 'observed' | 'predicted') => Number(await table.locator(`tr[data-optimizer="${label}"] td[data-${col}]`).getAttribute(`data-${col}`));
  expect(Math.abs((await value('Gradient descent', 'observed')) / 0.1 - 1)).toBeLessThan(1e-5);
  expect(Math.abs((await value('Gradient descent', 'predicted')) / 0.1 - 1)).toBeLessThan(1e-9);
  expect(Math.abs((await value('Momentum', 'observed')) / 0.19 - 1)).toBeLessThan(1e-5);
  expect(Math.abs((await value('Momentum', 'predicted')) / 0.19 - 1)).toBeLessThan(1e-9);
  await expect(table.locator('tr[data-optimizer="Adam"] td').nth(2)).toHaveText('no prediction');
  await expect(table).toContainText('λmax of the Hessian at the start: 20');
  const px = await canvasPixels(page, 'rate-chart');
  expect(countColour(px, '#e69f00', 30)).toBeGreaterThan(50); // the first run's colour (Okabe-Ito orange)
});

test("critical points of Himmelblau: all 9 found and classified (4 minima, 4 saddles of index 1, 1 maximum) as the reference lists", async ({ page }) => {
  // Reference: test/fixtures/test-functions.json (Himmelblau's 4 minima, 4 saddles, 1 local maximum).
  await openFresh(page);
  await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
  await waitForContours(page);
  await page.getByRole('tab', { name: 'Critical points' }).click();
  const panel = page.getByTestId('critical-points');
  await panel.getByRole('button', { name: 'Find critical points' }).click();
  const rows = panel.getByTestId('critical-table').locator('tbody tr');
  await expect(rows).toHaveCount(9, { timeout: 30_000 });
  await expect(rows.and(page.locator('[data-kind="minimum"]'))).toHaveCount(4);
  await expect(rows.and(page.locator('[data-kind="saddle"]'))).toHaveCount(4);
  await expect(rows.and(page.locator('[data-kind="maximum"]'))).toHaveCount(1);
  await expect(panel.getByTestId('critical-table')).toContainText('(-0.270845, -0.923039)');
  await expect(panel.getByTestId('critical-table')).toContainText('saddle (index 1)');
  const px = await canvasPixels(page, 'critical-canvas');
  expect(countColour(px, '#d55e00', 20)).toBeGreaterThan(20); // saddle glyphs drawn
});

test('sharpness along gradient descent on x^2 + 10 y^2 is constant at lambda_max = 20, below 2/lr', async ({ page }) => {
  await openFresh(page);
  await applyFormula(page, 'x^2 + 10*y^2');
  await page.getByRole('button', { name: /^Gradient descent/ }).first().click();
  await expect(page.locator('.run-status').first()).toHaveAttribute('data-phase', 'ended', { timeout: 30_000 });
  await page.getByRole('tab', { name: 'Sharpness' }).click();
  const panel = page.getByTestId('sharpness');
  await panel.getByRole('button', { name: 'Measure sharpness' }).click();
  const last = panel.getByTestId('sharpness-last');
  await expect(last).toContainText('λmax = 20');
  expect(Number(await last.getAttribute('data-value'))).toBeCloseTo(20, 9);
  await expect(last).toContainText('2/lr = 2000');
});
