import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import Papa from 'papaparse';
import { buildCli, fall, scratch, writeJson } from '../test/cli/built-cli';
import { openFresh, waitForContours } from './helpers';

/** Clicks a button (inside `scope` when given) and returns the downloaded file's text. */
async function exported(page: Page, button: string, scope = page.locator('body')): Promise<string> {
  const download = page.waitForEvent('download');
  await scope.getByRole('button', { name: button }).click();
  return readFileSync((await (await download).path())!, 'utf8');
}

/** `fall run` on an experiment's text; the folder it wrote. */
function runCli(experiment: string): string {
  const dir = scratch();
  const r = fall(['run', writeJson(dir, 'from-page.fall.json', experiment), '--out', join(dir, 'out'), '--threads', '2']);
  expect(r.stderr).toContain('fall-line-start-map.study-0.csv');
  expect([0, 2]).toContain(r.code);
  return join(dir, 'out');
}

test.describe('studies in the experiment file', () => {
  test.beforeAll(() => {
    buildCli();
  });

  test('a map made on the page is saved in the experiment; the command line writes the page\'s map CSV byte for byte', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
    await waitForContours(page);
    const panel = page.getByTestId('start-map');
    await panel.getByLabel('cells per side').selectOption('16');
    await panel.getByRole('button', { name: 'Map start points' }).click();
    await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
    await expect(panel.getByTestId('start-map-set-up')).toContainText('16 × 16 cells');
    const pageCsv = await exported(page, 'Map CSV', panel);
    // The map's CSV carries steps to tolerance (Himmelblau's known minima are at 0), so the byte check covers them.
    const rows = Papa.parse<string[]>(pageCsv.trim()).data;
    const column = rows[0].indexOf('steps_to_tolerance');
    expect(rows.slice(1).filter((r) => /^\d+$/.test(r[column] ?? '')).length).toBeGreaterThan(100);

    const experiment = await exported(page, 'Save experiment');
    const file = JSON.parse(experiment);
    expect(file.version).toBe(3);
    expect(file.studies).toHaveLength(1);
    expect(file.studies[0]).toMatchObject({ kind: 'start-map', resolution: 16, axes: [0, 1] });
    // Changing the panel's setting changes the saved study (the file has the panel's current settings).
    await panel.getByLabel('cells per side').selectOption('32');
    expect(JSON.parse(await exported(page, 'Save experiment')).studies[0].resolution).toBe(32);

    const out = runCli(experiment);
    expect(readFileSync(join(out, 'fall-line-start-map.study-0.csv'), 'utf8')).toBe(pageCsv);
  });

  test('opening a file with studies sets them up in their panels without running them; "Run as set up" runs the file\'s map', async ({ page }) => {
    await openFresh(page);
    const w = JSON.parse(readFileSync(new URL('../examples/camel-ridge-studies.fall.json', import.meta.url), 'utf8'));
    const text = JSON.stringify(w);
    await page.locator('input[type="file"]').setInputFiles({ name: 'studies.fall.json', mimeType: 'application/json', buffer: Buffer.from(text) });
    const panel = page.getByTestId('start-map');
    await expect(panel.getByTestId('start-map-set-up')).toContainText(`${w.studies[0].resolution} × ${w.studies[0].resolution} cells`);
    await expect(panel.locator('.study-progress')).toHaveCount(0);
    await page.getByRole('tab', { name: 'Learning-rate sweep' }).click();
    await expect(page.getByTestId('rate-sweep-set-up')).toContainText(`at ${w.studies[1].count} rates`);
    await expect(page.getByTestId('rate-sweep').locator('.study-progress')).toHaveCount(0);

    await page.getByRole('tab', { name: 'Start-point map' }).click();
    await panel.getByTestId('start-map-run-set-up').click();
    await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
    const pageCsv = await exported(page, 'Map CSV', panel);
    const out = runCli(text);
    expect(readFileSync(join(out, 'fall-line-start-map.study-0.csv'), 'utf8')).toBe(pageCsv);
  });
});
