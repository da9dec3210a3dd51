import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import Papa from 'papaparse';
import { openFresh, waitForContours, waitForRunsToEnd } from './helpers';

test('an own update rule: type Lion, see a typo under its column, race it against Adam, export and reopen', async ({ page }) => {
  await openFresh(page);
  for (const name of ['Remove Gradient descent', 'Remove Momentum']) await page.getByRole('button', { name }).click();
  await page.getByLabel('New run with').selectOption({ label: 'Own update rule' });
  await page.getByRole('button', { name: 'Add run' }).click();
  const ruleRun = page.locator('.run-item', { hasText: 'Adam (rule)' });
  await expect(ruleRun).toHaveCount(1);
  if ((await ruleRun.locator('.run-select').getAttribute('aria-pressed')) !== 'true') await ruleRun.locator('.run-select').click();

  // A typo: the message names the line and column, and carets sit under the offending name.
  const editor = page.getByRole('form', { name: 'Update rule' });
  const text = editor.getByLabel('Rule', { exact: true });
  await text.fill('# plain descent\nx = x - lr * gg');
  await editor.getByRole('button', { name: 'Use this rule' }).click();
  const problem = editor.locator('.field-error').first();
  await expect(problem).toContainText("unknown name 'gg' at line 2, column 14; did you mean 'g'?");
  await expect(problem.locator('.formula-caret')).toHaveText('x = x - lr * gg\n             ^^');

  // Lion from the library, typed as its text, at a rate that moves on Rosenbrock.
  await editor.getByLabel('Start from').selectOption({ label: 'Lion' });
  await expect(text).toHaveValue(/sign\(c\)/);
  await editor.getByRole('button', { name: 'Use this rule' }).click();
  await expect(editor.locator('.field-error')).toHaveCount(0);
  await expect(page.locator('.run-item', { hasText: 'Lion' })).toHaveCount(1);
  await expect(page.getByRole('group', { name: 'Lion settings' }).getByLabel('beta2')).toHaveValue('0.99');
  const rate = page.getByLabel('learning rate', { exact: true });
  await rate.fill('0.003');
  await rate.press('Enter');
  await waitForRunsToEnd(page, 2);

  // Side by side in the panel grid.
  await page.getByRole('tab', { name: 'One panel per run' }).click();
  await expect(page.getByTestId('panel-grid').getByTestId('surface-base')).toHaveCount(2);
  await expect(page.getByTestId('panel-grid').getByTestId('surface-overlay').nth(1)).toHaveAttribute('data-trajectories', '1', { timeout: 15_000 });

  // Trajectories name the rule.
  const csvDownload = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Trajectories CSV' }).click();
  const rows = Papa.parse<Record<string, string>>(readFileSync((await (await csvDownload).path())!, 'utf8').trim(), { header: true }).data;
  expect(new Set(rows.map((r) => r.optimizer))).toEqual(new Set(['Adam', 'Lion']));

  // The experiment file carries the rule; reopening it after a fresh start brings the Lion run back.
  const fileDownload = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Save experiment' }).click();
  const experiment = readFileSync((await (await fileDownload).path())!, 'utf8');
  const lion = JSON.parse(experiment).runs.find((r: { label: string }) => r.label === 'Lion');
  expect(lion.optimizer.kind).toBe('rule');
  expect(lion.optimizer.rule.text).toContain('x = x - lr * (sign(c) + decay * x)');
  await openFresh(page);
  await expect(page.locator('.run-item', { hasText: 'Lion' })).toHaveCount(0);
  await page.locator('input[type="file"]').setInputFiles({ name: 'lion.fall.json', mimeType: 'application/json', buffer: Buffer.from(experiment) });
  await waitForContours(page);
  await expect(page.locator('.run-item', { hasText: 'Lion' })).toHaveCount(1);
  await waitForRunsToEnd(page, 2);
});
