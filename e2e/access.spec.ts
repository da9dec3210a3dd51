import { expect, test } from '@playwright/test';
import { openFresh } from './helpers';

test.describe('keyboard and labels', () => {
  test('every control has an accessible name', async ({ page }) => {
    await openFresh(page);
    await page.getByRole('button', { name: /^Adam/ }).first().click(); // open a run's settings too
    const unnamed = await page.evaluate(() => {
      const out: string[] = [];
      for (const el of Array.from(document.querySelectorAll('input, select, textarea, button'))) {
        const e = el as HTMLInputElement;
        if (e.type === 'hidden' || e.classList.contains('visually-hidden')) continue;
        const labelled = (e.labels && e.labels.length > 0) || e.getAttribute('aria-label') || e.getAttribute('aria-labelledby') || (el.tagName === 'BUTTON' && el.textContent!.trim());
        if (!labelled) out.push(el.outerHTML.slice(0, 120));
      }
      return out;
    });
    expect(unnamed).toEqual([]);
  });

  test('the surface view pans and zooms from the keyboard', async ({ page }) => {
    await openFresh(page);
    const box = page.locator('.surface-canvas-box').first();
    await box.focus();
    const before = await page.getByTestId('surface-base').first().evaluate((c) => (c as HTMLCanvasElement).toDataURL());
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('+');
    await expect
      .poll(async () => (await page.getByTestId('surface-base').first().evaluate((c) => (c as HTMLCanvasElement).toDataURL())) !== before)
      .toBe(true);
    await page.keyboard.press('0');
  });

  test('a typed start point restarts the run from there', async ({ page }) => {
    await openFresh(page);
    await page.getByRole('button', { name: /^Adam/ }).first().click();
    const x = page.getByRole('group', { name: 'Start point' }).getByLabel('x', { exact: true });
    await x.fill('abc');
    await x.press('Enter');
    await expect(page.getByText('x: "abc" is not a number')).toBeVisible();
    await x.fill('0.5');
    await x.press('Enter');
    await expect(page.getByText('x: "abc" is not a number')).toHaveCount(0);
  });
});
