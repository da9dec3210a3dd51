import { expect, test, type Page } from '@playwright/test';
import { openFresh, waitForContours } from './helpers';

async function removeAllRuns(page: Page) {
  for (const name of ['Remove Gradient descent', 'Remove Momentum', 'Remove Adam']) await page.getByRole('button', { name }).click();
  await expect(page.locator('.run-item')).toHaveCount(0);
}

async function addRun(page: Page, label: string) {
  await page.getByLabel('New run with').selectOption({ label });
  await page.getByRole('button', { name: 'Add run' }).click();
}

test.describe('surfaces from data', () => {
  test('an imported CSV with a bad row is reported by row number, and the row can be dropped', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    const csv = 'dose,response\n1,2.1\n2,abc\n3,6.2\n4,\n5,9.8\n';
    await page.getByLabel('Import a CSV file…').setInputFiles({ name: 'trial.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    const problems = page.getByTestId('csv-problems');
    await expect(problems).toContainText('row 3, column response: not a number ("abc")');
    await expect(problems).toContainText('row 5, column response: missing');
    await page.getByLabel('drop rows that cannot be read').check();
    await expect(problems).toContainText('2 rows dropped');
    await expect(page.getByLabel('Data', { exact: true })).toHaveValue('table');
    await page.getByRole('button', { name: 'Use this data and model' }).click();
    await expect(page.getByTestId('surface-name')).toContainText('trial.csv');
    await waitForContours(page);
  });

  test('a line fitted by L-BFGS reaches the least-squares answer shown beside it', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    await page.getByLabel('standardise inputs (mean 0, standard deviation 1)').check();
    await page.getByRole('button', { name: 'Use this data and model' }).click();
    await expect(page.getByTestId('surface-name')).toContainText('Linear regression of signal on flow');
    await removeAllRuns(page);
    await addRun(page, 'L-BFGS');
    await expect(page.locator('.run-status[data-phase="ended"]')).toHaveCount(1, { timeout: 30_000 });
    await expect(page.locator('.run-status').first()).toContainText('converged');
    const table = page.getByTestId('param-table');
    await expect(table).toContainText('least-squares answer');
    const rows = table.locator('tbody tr');
    await expect(rows).toHaveCount(2);
    for (let k = 0; k < 2; k++) {
      const mine = Number(await rows.nth(k).locator('td[data-col="run"]').innerText());
      const answer = Number(await rows.nth(k).locator('td[data-col="known"]').innerText());
      expect(Math.abs(mine - answer)).toBeLessThanOrEqual(1e-5 * Math.max(1, Math.abs(answer)));
    }
    // The fitted line is drawn over the data.
    await expect(page.getByTestId('data-view')).toHaveAttribute('data-drawn-for', /.+/);
  });

  test('a many-parameter model can be sliced along filter-normalised random directions', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    await page.getByLabel('Data', { exact: true }).selectOption('iris');
    await page.getByRole('button', { name: 'Use this data and model' }).click();
    await expect(page.getByTestId('surface-name')).toContainText('iris');
    await expect(page.getByText(/Slice through \d+ variables/)).toBeVisible();
    await waitForContours(page);
    await page.getByRole('button', { name: 'Random directions' }).click();
    await expect(page.getByTestId('plane-note')).toContainText('Random plane through');
    await expect(page.getByTestId('surface-base').first()).toHaveAttribute('data-drawn', 'contours');
    await page.getByRole('button', { name: /^Principal directions of/ }).click();
    await expect(page.getByTestId('plane-note')).toContainText('principal directions');
    await expect(page.getByTestId('surface-overlay').first()).toHaveAttribute('data-trajectories', /[1-9]/);
  });
});
