import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, test, type Page } from '@playwright/test';
import { buildCli, fall, scratch, writeJson } from '../test/cli/built-cli';
import { openFresh, waitForRunsToEnd } from './helpers';

/** Clicks an export button and returns the downloaded file's text. */
async function exported(page: Page, button: string): Promise<string> {
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: button }).click();
  return readFileSync((await (await download).path())!, 'utf8');
}

/** The page's experiment file and CSVs, then the command line on that file: the same bytes. */
async function compareWithCommandLine(page: Page): Promise<void> {
  const experiment = await exported(page, 'Save experiment');
  const trajectories = await exported(page, 'Trajectories CSV');
  const results = await exported(page, 'Results CSV');
  const dir = scratch();
  const r = fall(['run', writeJson(dir, 'from-page.fall.json', experiment), '--out', join(dir, 'out'), '--threads', '2']);
  expect(r.stderr).toContain('wrote fall-line-trajectories.csv');
  expect([0, 2]).toContain(r.code);
  expect(trajectories.length).toBeGreaterThan(1000);
  expect(readFileSync(join(dir, 'out', 'fall-line-trajectories.csv'), 'utf8')).toBe(trajectories);
  expect(readFileSync(join(dir, 'out', 'fall-line-results.csv'), 'utf8')).toBe(results);
}

test.describe('the command line computes what the page computes', () => {
  test.beforeAll(() => {
    buildCli();
  });

  test('the demo: trajectories and results CSVs byte for byte', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    await compareWithCommandLine(page);
  });

  test('the README example opened in the page: 24 runs, distances to known minima', async ({ page }) => {
    await openFresh(page);
    const example = readFileSync(new URL('../examples/camel-ridge.fall.json', import.meta.url), 'utf8');
    await page.locator('input[type="file"]').setInputFiles({ name: 'camel-ridge.fall.json', mimeType: 'application/json', buffer: Buffer.from(example) });
    await expect(page.locator('.run-item')).toHaveCount(24);
    await waitForRunsToEnd(page, 24);
    const results = await exported(page, 'Results CSV');
    expect(results).toMatch(/,"\(-?[\d.]+, -?[\d.]+\)",/); // the nearest known minimum is filled in
    await compareWithCommandLine(page);
  });

  test('a typed polynomial formula (with **) and a diverging run', async ({ page }) => {
    await openFresh(page);
    const w = JSON.parse(readFileSync(new URL('../examples/camel-ridge.fall.json', import.meta.url), 'utf8'));
    w.surface = { kind: 'formula', text: '(x**2 - 1)**2 + 0.5*y**2 + 0.1*x**3*y' };
    w.runs = w.runs.slice(0, 6);
    w.runs[5].optimizer.learningRate = 3;
    w.runs[5].label = '=risky label, big rate';
    await page.locator('input[type="file"]').setInputFiles({ name: 'formula.fall.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(w)) });
    await expect(page.locator('.run-item')).toHaveCount(6);
    await waitForRunsToEnd(page, 6);
    await compareWithCommandLine(page);
  });
});
