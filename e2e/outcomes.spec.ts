import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import Papa from 'papaparse';
import { applyFormula, canvasPixels, openFresh, waitForRunsToEnd } from './helpers';

/**
 * The page shows what a run really did: on x^2 + 10 y^2 (lambda_max = 20), gradient descent at exactly
 * 2 / lambda_max = 0.1 bounces between two points (oscillating), at 0.05 it converges; the results
 * table and the results CSV carry the same outcome words and details.
 */
test('gradient descent at 2 / lambda_max is shown as oscillating, below it as converged, in the table and the CSV', async ({ page }) => {
  await openFresh(page);
  await applyFormula(page, 'x^2 + 10*y^2');
  for (const name of ['Remove Gradient descent', 'Remove Momentum', 'Remove Adam']) await page.getByRole('button', { name }).click();
  const kind = page.getByLabel('New run with');
  for (const rate of ['0.1', '0.05']) {
    await kind.selectOption({ label: 'Gradient descent' });
    await page.getByRole('button', { name: 'Add run' }).click();
    const lr = page.getByLabel('learning rate', { exact: true });
    await lr.fill(rate);
    await lr.press('Enter');
    const start = page.getByRole('group', { name: 'Start point' });
    for (const v of ['x', 'y']) {
      await start.getByLabel(v, { exact: true }).fill('1');
      await start.getByLabel(v, { exact: true }).press('Enter');
    }
  }
  await waitForRunsToEnd(page, 2);
  const cells = page.locator('[data-testid="run-table"] td[data-col="outcome"]');
  await expect(cells.nth(0)).toHaveAttribute('data-outcome', 'oscillating');
  await expect(cells.nth(0)).toHaveText('oscillating (period 2)');
  await expect(cells.nth(0)).toHaveAttribute('title', /^period 2, amplitude 1\.00; gradient norm 20\.0 \(not stationary/);
  await expect(cells.nth(1)).toHaveAttribute('data-outcome', 'converged');
  await expect(cells.nth(1)).toHaveAttribute('title', /Hessian: minimum, eigenvalues 2\.00 to 20\.0/);

  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Results CSV' }).click();
  const parsed = Papa.parse<string[]>(readFileSync((await (await download).path())!, 'utf8').trim(), { skipEmptyLines: true });
  const [header, ...rows] = parsed.data;
  const col = (name: string) => header.indexOf(name);
  expect(rows.map((r) => r[col('outcome')])).toEqual(['oscillating', 'converged']);
  expect(rows[1][col('point_kind')]).toBe('minimum');
  expect(Number(rows[0][col('final_grad_norm')])).toBeCloseTo(20, 6);
});

test('the loss chart has a legend naming every visible run with its colour', async ({ page }) => {
  await openFresh(page);
  const legend = page.getByTestId('loss-legend').locator('li');
  await expect(legend).toHaveText(['Gradient descent', 'Momentum', 'Adam']);
  const fills = await legend.locator('svg :is(circle, polygon)').evaluateAll((els) => els.map((e) => e.getAttribute('fill')));
  expect(new Set(fills).size).toBe(3);
  await page.getByRole('button', { name: 'Hide Momentum' }).click();
  await expect(legend).toHaveText(['Gradient descent', 'Adam']);
});

test('the map explains its known-point glyphs: Himmelblau shows a key for minima, saddle points and a maximum', async ({ page }) => {
  await openFresh(page);
  await expect(page.getByTestId('known-point-key').first().locator('[data-kind]')).toHaveText(['minimum']); // Rosenbrock: one minimum
  await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
  const key = page.getByTestId('known-point-key').first();
  await expect(key.locator('[data-kind]')).toHaveText(['minimum', 'saddle point', 'maximum']);
  expect(await key.locator('svg').count()).toBe(3);
});

test('the panel grid has a colour bar with loss values, like the single map', async ({ page }) => {
  await openFresh(page);
  await page.getByRole('tab', { name: 'One panel per run' }).click();
  const bar = page.getByTestId('panel-colour-bar');
  await expect(bar).toHaveAttribute('data-drawn', 'legend', { timeout: 15_000 });
  const px = await canvasPixels(page, 'panel-colour-bar');
  const colours = new Set<string>();
  for (let k = 0; k < px.data.length; k += 4) if (px.data[k + 3] > 200) colours.add(`${px.data[k] >> 3},${px.data[k + 1] >> 3},${px.data[k + 2] >> 3}`);
  expect(colours.size).toBeGreaterThan(10); // the bands of the colour map, not a blank box
});
