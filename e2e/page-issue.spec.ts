import { expect, test, type Page } from '@playwright/test';
import Papa from 'papaparse';
import { readFileSync } from 'node:fs';
import { openFresh, waitForContours, waitForRunsToEnd } from './helpers';

async function removeAllRuns(page: Page) {
  for (const name of ['Remove Gradient descent', 'Remove Momentum', 'Remove Adam']) await page.getByRole('button', { name }).click();
  await expect(page.locator('.run-item')).toHaveCount(0);
}

async function addRun(page: Page, label: string) {
  await page.getByLabel('New run with').selectOption({ label });
  await page.getByRole('button', { name: 'Add run' }).click();
}

/** The probe data fitted with standardised inputs, one L-BFGS run to the end. */
async function fitProbeData(page: Page) {
  await openFresh(page);
  await page.getByLabel('Model on data').check();
  await expect(page.getByLabel('standardise inputs (mean 0, standard deviation 1)')).toBeChecked();
  await page.getByRole('button', { name: 'Use this data and model' }).click();
  await expect(page.getByTestId('surface-name')).toContainText('Linear regression of signal on flow');
  await waitForContours(page);
  await removeAllRuns(page);
  await addRun(page, 'L-BFGS');
  await expect(page.locator('.run-status[data-phase="ended"]')).toHaveCount(1, { timeout: 30_000 });
}

test.describe('issue 10: what the page shows', () => {
  test('the data view, the results table and the results CSV give a parameter the same value', async ({ page }) => {
    await fitProbeData(page);
    const params = page.getByTestId('param-table').locator('tbody tr');
    const table = page.getByTestId('run-table');
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Results CSV' }).click();
    const parsed = Papa.parse<string[]>(readFileSync((await (await download).path())!, 'utf8').trim());
    const [header, csvRow] = parsed.data;
    for (const [k, name] of ['intercept', 'w_flow'].entries()) {
      await expect(params.nth(k).locator('th')).toHaveText(name);
      const shown = Number(await params.nth(k).locator('td[data-col="run"]').innerText());
      const cell = table.locator(`td[data-col="param:${k}"]`);
      const full = Number(await cell.getAttribute('data-value'));
      expect(Math.abs(full - shown)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(shown)));
      // Compact on the page, every digit on hover and in the CSV.
      expect((await cell.innerText()).replace(/^-/, '').replace(/[.e].*$/, '').length).toBeLessThanOrEqual(4);
      expect(Number(await cell.getAttribute('title'))).toBe(full);
      expect(Number(csvRow[header.indexOf(`final_${name}`)])).toBe(full);
    }
    await expect(page.getByTestId('run-table').locator('thead')).toContainText('intercept');
    // The map stays in the optimiser's coordinates and says so.
    await expect(page.locator('.surface-canvas-box').first()).toHaveAttribute('aria-label', /intercept \(standardised\) and w_flow \(standardised\)/);
  });

  test('at 1280 x 800 the chosen results columns are all in view, compact and sortable', async ({ page }) => {
    await page.setViewportSize({ width: 1280, height: 800 });
    await openFresh(page);
    const table = page.getByTestId('run-table');
    await expect(table.locator('td[data-col="steps"]')).toHaveCount(3);
    await page.getByText(/^Columns \(/).click();
    await page.getByRole('checkbox', { name: 'Rate' }).check();
    await page.getByText(/^Columns \(/).click();
    const headers = table.locator('thead th');
    const names = await headers.allInnerTexts();
    expect(names.map((n) => n.trim())).toEqual(['Run', 'Rate', 'Outcome', 'Steps', 'Final loss', 'x', 'y', 'Distance', 'Reached at', 'Evals']);
    const scroll = page.locator('.table-scroll');
    const box = (await scroll.boundingBox())!;
    for (let k = 0; k < names.length; k++) {
      const h = (await headers.nth(k).boundingBox())!;
      expect(h.x + h.width).toBeLessThanOrEqual(box.x + box.width + 0.5);
      expect(h.height).toBeLessThan(30); // one line
    }
    expect(box.x + box.width).toBeLessThanOrEqual(1280);
    for (const text of await table.locator('td[data-col="final-loss"], td[data-col="x"], td[data-col="param:0"], td[data-col="param:1"]').allInnerTexts()) {
      const digits = text.replace(/e.*$/, '').replace(/[^0-9]/g, '').replace(/^0+/, '');
      expect(digits.length).toBeLessThanOrEqual(4);
    }
    // Sort by the rate from the keyboard: ascending puts momentum's 0.0005 first.
    const rate = table.locator('thead th[data-col="learning-rate"]');
    await rate.getByRole('button').focus();
    await page.keyboard.press('Enter');
    await expect(rate).toHaveAttribute('aria-sort', 'ascending');
    await expect(table.locator('tbody tr').first()).toHaveAttribute('data-run-id', 'demo-momentum');
    await page.keyboard.press('Enter');
    await expect(rate).toHaveAttribute('aria-sort', 'descending');
    await expect(table.locator('tbody tr').first()).toHaveAttribute('data-run-id', 'demo-adam');
  });
});

test.describe('issue 10: defaults', () => {
  test('a new gradient descent run on the demo gets the rate the curvature allows, keeps it across kinds and does not diverge', async ({ page }) => {
    await openFresh(page);
    await addRun(page, 'Gradient descent');
    const editor = page.getByRole('region', { name: /^Settings of/ });
    const hint = page.getByTestId('rate-hint');
    // Rosenbrock at (-1.2, 1): lambda_max = 1506.4, 2 / lambda_max = 0.0013277.
    await expect(hint).toContainText('2/λmax at the start = 0.001328');
    await expect(hint).toContainText('0.5 of it is 0.00066');
    await expect(editor.getByLabel('learning rate', { exact: true })).toHaveValue('0.00066');
    await expect(editor.getByLabel('max steps')).toHaveValue('3000');
    await editor.getByLabel('Optimizer', { exact: true }).selectOption({ label: 'Nesterov momentum' });
    await expect(editor.getByLabel('learning rate', { exact: true })).toHaveValue('0.00066');
    const item = page.locator('.run-item').last();
    await expect(item.locator('.run-status')).toHaveAttribute('data-phase', 'ended', { timeout: 30_000 });
    await expect(item.locator('.run-status')).not.toHaveAttribute('data-outcome', 'diverged');
  });

  test('a network on two-class data gets a cross-entropy output', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    await page.getByLabel('Data', { exact: true }).selectOption('demo:seed-pods');
    await page.getByLabel('Model', { exact: true }).selectOption('mlp');
    await expect(page.getByLabel('Output', { exact: true })).toHaveValue('binary');
  });
});

test.describe('issue 10: many variables', () => {
  test('fourteen variables are listed in natural order, every held value is shown at the run start and can be edited', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Your formula').check();
    const text = Array.from({ length: 14 }, (_, k) => `(x${k + 1} - ${k % 3})^2`).join(' + ');
    await page.getByLabel('Formula', { exact: true }).fill(text);
    await page.getByRole('button', { name: 'Use this formula' }).click();
    await expect(page.getByText('Slice through 14 variables')).toBeVisible();
    await waitForContours(page);
    const axis = page.getByLabel('Horizontal axis');
    expect((await axis.locator('option').allInnerTexts()).map((t) => t.trim())).toEqual(Array.from({ length: 14 }, (_, k) => `x${k + 1}`));
    const held = page.getByTestId('held-values');
    await expect(held.getByRole('textbox')).toHaveCount(12);
    // Held at the first run's start, then at the selected run's current point.
    const x14 = held.getByLabel('x14 held at');
    await x14.scrollIntoViewIfNeeded();
    await expect(x14).toBeVisible();
    const heldAt = Number(await x14.inputValue());
    await page.locator('.run-item').first().locator('.run-select').click();
    expect(Number(await page.getByRole('region', { name: /^Settings of/ }).getByLabel('x14', { exact: true }).inputValue())).toBe(heldAt);
    await waitForRunsToEnd(page, 3);
    await page.locator('.run-item').nth(2).locator('.run-select').click();
    await expect.poll(async () => Number(await x14.inputValue())).toBeCloseTo(1, 2); // (x14 - 1)^2: Adam's end
    await x14.fill('2.5');
    await x14.press('Enter');
    await expect(x14).toHaveValue('2.5');
    await waitForContours(page);
  });
});

test.describe('issue 10: messages in the page labels', () => {
  test('a bad learning rate is named as the field is labelled', async ({ page }) => {
    await openFresh(page);
    await page.locator('.run-item').nth(2).locator('.run-select').click();
    const editor = page.getByRole('region', { name: 'Settings of Adam' });
    const rate = editor.getByLabel('learning rate', { exact: true });
    await rate.fill('-1');
    await rate.press('Enter');
    await expect(editor.getByText('Adam: learning rate must be a finite number > 0, got -1')).toBeVisible();
    await expect(editor).not.toContainText('learningRate');
  });

  test('a network with three hidden layers is refused in the editor’s words', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    await page.getByLabel('Data', { exact: true }).selectOption('demo:seed-pods');
    await page.getByLabel('Model', { exact: true }).selectOption('mlp');
    await page.getByLabel('Hidden widths').fill('8, 4, 2');
    await page.getByRole('button', { name: 'Use this data and model' }).click();
    const alert = page.getByRole('alert').filter({ hasText: 'layer widths' });
    await expect(alert).toContainText('Model on data: small neural network: Hidden widths must list 1 or 2 layer widths');
    await expect(alert).not.toContainText('surface spec');
  });

  test('a model formula error is marked under its column', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    await page.getByLabel('Model', { exact: true }).selectOption('formula');
    await page.getByLabel('Model formula').fill('b1 * (1 - exp(-b2 * flow)');
    await page.getByRole('button', { name: 'Use this data and model' }).click();
    const problem = page.locator('.datafit-editor .formula-problem');
    await expect(problem).toContainText("unmatched '(' at column 6");
    await expect(problem.locator('.formula-caret')).toHaveText('b1 * (1 - exp(-b2 * flow)\n     ^');
  });

  test('a row with too many fields is reported by row, and a failed import leaves no stale file in the menu', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    const input = page.getByLabel('Import a CSV file…');
    await input.setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from('dose,response\n1,2\n2,4\n3,6.1\n') });
    const data = page.getByLabel('Data', { exact: true });
    await expect(data).toHaveValue('table');
    await expect(data.locator('option[value="table"]')).toContainText('good.csv');
    await input.setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('dose,response\n1,2\n2,4,7\n') });
    await expect(page.getByTestId('csv-problems')).toContainText('row 3: more fields than the header has ("7")');
    await expect(page.getByTestId('csv-problems')).not.toContainText('column :');
    await expect(page.getByTestId('csv-error')).toContainText('bad.csv: 1 value could not be read (first: row 3: more fields than the header has ("7"))');
    await expect(data.locator('option[value="table"]')).toHaveCount(0);
    await expect(data).not.toHaveValue('table');
  });
});

test.describe('issue 10: run cards', () => {
  test('each card shows its progress against the step budget and stays compact', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Pace').selectOption('100');
    const card = page.locator('.run-item').first();
    await expect(card.getByTestId('run-progress')).toContainText(/step \d+ of 3000/);
    await page.getByRole('button', { name: 'Restart Gradient descent' }).click();
    await expect.poll(async () => Number((await card.getByTestId('run-progress').innerText()).match(/step (\d+) of 3000/)![1])).toBeGreaterThan(0);
    await page.getByRole('button', { name: 'Pause Gradient descent' }).click();
    await expect(card.locator('.run-status')).toHaveAttribute('data-phase', 'paused');
    // Read the text and the bar at the same moment (a batch already on its way may still land).
    const { text, value, max } = await card.getByTestId('run-progress').evaluate((el) => ({
      text: el.textContent ?? '',
      value: (el.querySelector('progress') as HTMLProgressElement).value,
      max: (el.querySelector('progress') as HTMLProgressElement).max,
    }));
    const steps = Number(text.match(/step (\d+) of 3000/)![1]);
    expect(steps).toBeGreaterThan(0);
    expect(steps).toBeLessThan(3000);
    expect(max).toBe(3000);
    expect(value).toBe(steps);
    await page.getByRole('button', { name: 'Resume Gradient descent' }).click();
    await page.getByLabel('Pace').selectOption('max');
    await expect(card.getByTestId('run-progress')).toContainText('step 3000 of 3000', { timeout: 30_000 });
    // Every control of a run sits on one line (beside the name where both fit), and the card stays compact.
    for (const k of [0, 1, 2]) {
      const item = page.locator('.run-item').nth(k);
      const buttons = item.locator('.run-buttons button');
      await expect(buttons).toHaveCount(6);
      const tops = await buttons.evaluateAll((els) => els.map((e) => Math.round(e.getBoundingClientRect().top)));
      expect(new Set(tops).size).toBe(1);
      expect((await item.boundingBox())!.height).toBeLessThan(80);
    }
    for (const name of ['One step of Adam', 'Restart Adam', 'Hide Adam', 'Duplicate Adam', 'Remove Adam']) await expect(page.getByRole('button', { name })).toBeVisible();
  });
});

test.describe('issue 10: copying the results', () => {
  test('copying from the table and the Copy table button give every digit', async ({ page, context }) => {
    await context.grantPermissions(['clipboard-read', 'clipboard-write']);
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    const table = page.getByTestId('run-table');
    const full = await table.locator('tr[data-run-id="demo-adam"] td[data-col="final-loss"]').getAttribute('data-value');
    expect(full!.replace(/e.*$/, '').replace(/[^0-9]/g, '').length).toBeGreaterThan(4);
    const copied = await table.evaluate((el) => {
      const row = el.querySelector('tr[data-run-id="demo-adam"]')!;
      const range = document.createRange();
      range.selectNodeContents(row);
      const sel = window.getSelection()!;
      sel.removeAllRanges();
      sel.addRange(range);
      let text = '';
      const read = (e: ClipboardEvent) => (text = e.clipboardData!.getData('text/plain'));
      window.addEventListener('copy', read);
      document.execCommand('copy');
      window.removeEventListener('copy', read);
      return text;
    });
    const [head, line] = copied.trim().split('\n');
    expect(head.split('\t')).toContain('Final loss');
    expect(line.split('\t')[0]).toBe('Adam');
    expect(line.split('\t')[head.split('\t').indexOf('Final loss')]).toBe(full);
    await page.getByRole('button', { name: 'Copy table' }).click();
    await expect(page.getByText('copied at full precision')).toBeVisible();
    const all = await page.evaluate(() => navigator.clipboard.readText());
    expect(all.trim().split('\n')).toHaveLength(4);
    expect(all).toContain(`\t${full}\t`);
  });
});
