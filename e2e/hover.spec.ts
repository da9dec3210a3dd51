import { expect, test } from '@playwright/test';
import { openFresh, waitForRunsToEnd } from './helpers';

// The point under the pointer lives in a store of its own (store/hover-store.ts): a pointer move
// redraws the crosshair on every panel's overlay and updates the readout, but re-renders no panel.
test('pointer moves over the optimizer x learning-rate table re-render no panel', async ({ page }) => {
  await openFresh(page);
  await waitForRunsToEnd(page, 3);
  await page.getByRole('tab', { name: 'Optimizer × learning rate' }).click();
  await page.getByRole('button', { name: /^Build table runs/ }).click();
  const bases = page.getByTestId('panel-grid').getByTestId('surface-base');
  await expect(bases.first()).toHaveAttribute('data-drawn', 'contours', { timeout: 15_000 });
  await expect(page.getByRole('progressbar', { name: 'Sampling the surface' })).toHaveCount(0, { timeout: 30_000 });
  await page.waitForTimeout(500);
  const rendersOf = () => bases.evaluateAll((cs) => cs.map((c) => Number((c as HTMLCanvasElement).dataset.renders)));
  const before = await rendersOf();
  expect(before.length).toBeGreaterThanOrEqual(4);
  const overlay = page.getByTestId('panel-grid').getByTestId('surface-overlay').first();
  const box = (await overlay.boundingBox())!;
  const pixelsOf = () => page.getByTestId('panel-grid').getByTestId('surface-overlay').nth(1).evaluate((c) => (c as HTMLCanvasElement).toDataURL());
  const drawnBefore = await pixelsOf();
  for (let k = 0; k < 20; k++) await page.mouse.move(box.x + box.width * (0.3 + 0.02 * k), box.y + box.height * 0.5);
  await page.waitForTimeout(300);
  // The crosshair is drawn on another panel too (linked hover), and no panel rendered again.
  expect(await pixelsOf()).not.toBe(drawnBefore);
  expect(await rendersOf()).toEqual(before);
});
