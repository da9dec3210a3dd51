import { expect, type Page } from '@playwright/test';

/** Opens the app with storage cleared, so every test starts from the demo. */
export async function openFresh(page: Page): Promise<void> {
  await page.goto('/');
  await page.evaluate(() => localStorage.clear());
  await page.reload();
  await waitForContours(page);
}

export async function waitForContours(page: Page): Promise<void> {
  await expect(page.getByTestId('surface-base').first()).toHaveAttribute('data-drawn', 'contours', { timeout: 15_000 });
}

/** RGBA pixels of a canvas in device pixels, read in the page. */
export async function canvasPixels(page: Page, testId: string) {
  return page.getByTestId(testId).first().evaluate((el) => {
    const c = el as HTMLCanvasElement;
    const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
    return { width: c.width, height: c.height, data: Array.from(data) };
  });
}

/** Count of pixels whose colour is close to `hex` (run colours are drawn exactly). */
export function countColour(px: { data: number[] }, hex: string, tolerance = 12): number {
  const r = parseInt(hex.slice(1, 3), 16);
  const g = parseInt(hex.slice(3, 5), 16);
  const b = parseInt(hex.slice(5, 7), 16);
  let n = 0;
  for (let k = 0; k < px.data.length; k += 4) {
    if (px.data[k + 3] < 200) continue;
    if (Math.abs(px.data[k] - r) <= tolerance && Math.abs(px.data[k + 1] - g) <= tolerance && Math.abs(px.data[k + 2] - b) <= tolerance) n++;
  }
  return n;
}

/** Waits until every run in the list shows an ended state (or error). */
export async function waitForRunsToEnd(page: Page, count: number): Promise<void> {
  await expect(page.locator('.run-status[data-phase="ended"]')).toHaveCount(count, { timeout: 60_000 });
}

/** Types a formula into the surface panel, applies it and waits for its contours. */
export async function applyFormula(page: Page, text: string): Promise<void> {
  await page.getByLabel('Your formula').check();
  await page.getByLabel('Formula', { exact: true }).fill(text);
  await page.getByRole('button', { name: 'Use this formula' }).click();
  await waitForContours(page);
}
