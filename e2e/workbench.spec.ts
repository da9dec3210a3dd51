import { expect, test } from '@playwright/test';
import Papa from 'papaparse';
import { readFileSync } from 'node:fs';
import { canvasPixels, countColour, openFresh, waitForContours, waitForRunsToEnd } from './helpers';

// Okabe-Ito colours of run styles 0-2 (src/ui/plot/run-style.ts): orange, sky blue, bluish green.
const RUN_COLOURS = ['#E69F00', '#56B4E9', '#009E73'];

test.describe('the workbench in Chromium', () => {
  test('the demo draws filled contours and a legend with values', async ({ page }) => {
    await openFresh(page);
    await expect(page.getByTestId('surface-name')).toHaveText('Rosenbrock');
    const px = await canvasPixels(page, 'surface-base');
    // Sample a 20 x 20 lattice inside the plot frame: a contour map has many distinct colours, none white.
    const colours = new Set<string>();
    for (let gy = 1; gy < 20; gy++)
      for (let gx = 1; gx < 20; gx++) {
        const x = Math.round(px.width * (0.1 + 0.65 * (gx / 20)));
        const y = Math.round(px.height * (0.05 + 0.85 * (gy / 20)));
        const k = 4 * (y * px.width + x);
        colours.add(`${px.data[k]},${px.data[k + 1]},${px.data[k + 2]}`);
      }
    expect(colours.size).toBeGreaterThan(8);
    expect(colours.has('255,255,255')).toBe(false);
  });

  test('the three demo runs stream in and are drawn in their own colours', async ({ page }) => {
    await openFresh(page);
    await expect(page.getByTestId('surface-overlay').first()).toHaveAttribute('data-trajectories', '3', { timeout: 15_000 });
    await waitForRunsToEnd(page, 3);
    const px = await canvasPixels(page, 'surface-overlay');
    for (const c of RUN_COLOURS) expect(countColour(px, c, 30), `pixels of ${c}`).toBeGreaterThan(10);
    const rows = page.getByTestId('run-table').locator('tbody tr');
    await expect(rows).toHaveCount(3);
  });

  test('a typed formula with an error shows the message under the offending column', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Your formula').check();
    const formula = page.getByLabel('Formula', { exact: true });
    await formula.fill('x^2 + sinn(y)');
    await page.getByRole('button', { name: 'Use this formula' }).click();
    const problem = page.locator('.formula-problem').first();
    await expect(problem).toContainText('sinn');
    await expect(problem).toContainText('column 7');
    const caret = await problem.locator('.formula-caret').innerText();
    const caretLine = caret.split('\n')[1];
    expect(caretLine.indexOf('^')).toBe(6);
    expect(caretLine.trim()).toBe('^^^^');
    // The surface did not change and nothing was lost.
    await expect(page.getByTestId('surface-name')).toHaveText('Rosenbrock');
    await expect(formula).toHaveValue('x^2 + sinn(y)');
  });

  test('a typed formula in three variables is sliced and runs on it', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Your formula').check();
    await page.getByLabel('Formula', { exact: true }).fill('(x - 1)^2 + 3*(y + 0.5)^2 + z^2 + x*z');
    await page.getByRole('button', { name: 'Use this formula' }).click();
    await expect(page.getByText('Slice through 3 variables')).toBeVisible();
    await expect(page.getByLabel('z held at')).toBeVisible();
    await waitForContours(page);
  });

  test('adding three runs streams three trajectories', async ({ page }) => {
    await openFresh(page);
    for (const name of ['Remove Gradient descent', 'Remove Momentum', 'Remove Adam']) await page.getByRole('button', { name }).click();
    await expect(page.locator('.run-item')).toHaveCount(0);
    const kind = page.getByLabel('New run with');
    for (const k of ['Gradient descent', 'Nesterov momentum', 'RMSProp']) {
      await kind.selectOption({ label: k });
      await page.getByRole('button', { name: 'Add run' }).click();
    }
    await expect(page.locator('.run-item')).toHaveCount(3);
    await expect(page.getByTestId('surface-overlay').first()).toHaveAttribute('data-trajectories', '3', { timeout: 15_000 });
    await waitForRunsToEnd(page, 3);
    const px = await canvasPixels(page, 'surface-overlay');
    for (const c of RUN_COLOURS) expect(countColour(px, c, 30), `pixels of ${c}`).toBeGreaterThan(10);
  });

  test('the exported trajectory CSV parses and its last row matches the final loss in the table', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Trajectories CSV' }).click();
    const file = await (await download).path();
    const text = readFileSync(file!, 'utf8');
    const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const [header, ...rows] = parsed.data;
    expect(header).toEqual(['run_id', 'run_label', 'optimizer', 'learning_rate', 'step', 'x', 'y', 'loss', 'grad_norm', 'step_learning_rate']);
    const last = rows[rows.length - 1];
    const lastRunId = last[0];
    const finalLoss = await page.locator(`[data-testid="run-table"] tr[data-run-id="${lastRunId}"] td[data-col="final-loss"]`).getAttribute('data-value');
    expect(Number(last[header.indexOf('loss')])).toBe(Number(finalLoss));
    expect(Number(last[header.indexOf('step')])).toBe(Number(await page.locator(`tr[data-run-id="${lastRunId}"] td[data-col="steps"]`).innerText()));
  });

  test('the workspace survives a reload', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
    await expect(page.getByTestId('surface-name')).toHaveText('Himmelblau');
    await page.getByRole('button', { name: 'Duplicate Adam' }).click();
    await expect(page.locator('.run-item')).toHaveCount(4);
    await page.waitForTimeout(600); // the save is debounced
    await page.reload();
    await waitForContours(page);
    await expect(page.getByTestId('surface-name')).toHaveText('Himmelblau');
    await expect(page.locator('.run-item')).toHaveCount(4);
    await expect(page.locator('.run-label', { hasText: 'Adam (copy)' })).toBeVisible();
  });

  test('the panel grid shows one panel per run with linked hover', async ({ page }) => {
    await openFresh(page);
    await page.getByRole('tab', { name: 'One panel per run' }).click();
    const panels = page.getByTestId('panel-grid').getByTestId('surface-base');
    await expect(panels).toHaveCount(3);
    for (let k = 0; k < 3; k++) await expect(panels.nth(k)).toHaveAttribute('data-drawn', 'contours');
    await expect(page.getByTestId('panel-grid').getByTestId('surface-overlay').nth(2)).toHaveAttribute('data-trajectories', '1', { timeout: 15_000 });
  });

  test('no request leaves localhost', async ({ page }) => {
    const outside: string[] = [];
    page.on('request', (r) => {
      const url = r.url();
      const origin = `http://localhost:${process.env.FALL_LINE_E2E_PORT ?? 4173}/`; // the preview server (playwright.config.ts)
      if (!(url.startsWith(origin) || /^(data|blob):/.test(url))) outside.push(url);
    });
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    await page.getByRole('tab', { name: 'One panel per run' }).click();
    await page.waitForTimeout(500);
    expect(outside).toEqual([]);
  });

  test('the view exports as a PNG image and as an SVG document with the runs in it', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    const png = page.waitForEvent('download');
    await page.getByRole('button', { name: 'View PNG' }).click();
    const pngBytes = readFileSync((await (await png).path())!);
    expect([...pngBytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(pngBytes.length).toBeGreaterThan(20_000);
    const svg = page.waitForEvent('download');
    await page.getByRole('button', { name: 'View SVG' }).click();
    const text = readFileSync((await (await svg).path())!, 'utf8');
    // The browser's own XML parser must accept it, and it must hold contours, axes and the three runs.
    const check = await page.evaluate((t) => {
      const doc = new DOMParser().parseFromString(t, 'image/svg+xml');
      return { error: doc.querySelector('parsererror')?.textContent ?? null, paths: doc.querySelectorAll('path').length, text: doc.documentElement.textContent ?? '' };
    }, text);
    expect(check.error).toBeNull();
    expect(check.paths).toBeGreaterThan(20);
    for (const label of ['Gradient descent', 'Momentum', 'Adam', 'loss']) expect(check.text).toContain(label);
  });
});
