import { expect, test, type Page } from '@playwright/test';
import { openFresh, waitForContours } from './helpers';

/** Collects page errors and console errors, to assert that nothing went wrong behind a working screen. */
function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  return errors;
}

test.describe('a practitioner trying things', () => {
  test('every catalogue surface draws its contours (negative minima included)', async ({ page }) => {
    const errors = watchErrors(page);
    await openFresh(page);
    const entry = page.getByLabel('Catalogue entry');
    for (const label of await entry.locator('option').allTextContents()) {
      await entry.selectOption({ label });
      await expect(page.getByTestId('surface-name')).toHaveText(label);
      await waitForContours(page);
      await expect(page.locator('.panel-failed'), label).toHaveCount(0);
    }
    expect(errors).toEqual([]);
  });

  test('a formula in one variable is refused with a message and the map stays', async ({ page }) => {
    const errors = watchErrors(page);
    await openFresh(page);
    await page.getByLabel('Your formula').check();
    await page.getByLabel('Formula', { exact: true }).fill('x^2');
    await page.getByRole('button', { name: 'Use this formula' }).click();
    await expect(page.getByRole('alert').filter({ hasText: 'the map needs two or more variables' })).toContainText('this surface has 1 (x)');
    await expect(page.getByTestId('surface-name')).toHaveText('Rosenbrock');
    await expect(page.locator('.panel-failed')).toHaveCount(0);
    // Naming a second variable draws it.
    await page.getByLabel('Variable order (optional)').fill('x, y');
    await page.getByRole('button', { name: 'Use this formula' }).click();
    await expect(page.getByTestId('surface-name')).toHaveText('x^2');
    await waitForContours(page);
    expect(errors).toEqual([]);
  });

  test('plus and the wheel turned away zoom in, minus and the wheel turned back zoom out; the page does not scroll', async ({ page }) => {
    await openFresh(page);
    const span = () => page.evaluate(() => {
      const v = JSON.parse(localStorage.getItem('fall-line/workspace') ?? 'null')?.view;
      return v ? v.a[1] - v.a[0] : null;
    });
    // Rosenbrock's box is 4 wide; with equal scale (on for test functions) the map shows it widened to
    // the frame's shape, `shown` wide, and zooming starts from what is shown.
    const axes = JSON.parse((await page.getByTestId('surface-base').first().getAttribute('data-axes'))!);
    const ticks = axes.a as [number, number][];
    const shown = axes.frame.width / ((ticks[ticks.length - 1][1] - ticks[0][1]) / (ticks[ticks.length - 1][0] - ticks[0][0]));
    expect(shown).toBeGreaterThanOrEqual(4);
    const box = page.locator('.surface-canvas-box').first();
    await box.focus();
    await page.keyboard.press('+');
    await expect.poll(span).toBeCloseTo(shown / 1.25, 9);
    await page.keyboard.press('-');
    await page.keyboard.press('-');
    await expect.poll(span).toBeCloseTo(shown * 1.25, 9);
    await page.keyboard.press('0');
    await expect.poll(span).toBe(4);
    const b = (await page.getByTestId('surface-overlay').first().boundingBox())!;
    await page.mouse.move(b.x + b.width * 0.4, b.y + b.height * 0.5);
    await page.mouse.wheel(0, -100);
    await expect.poll(span).toBeLessThan(shown);
    await page.mouse.wheel(0, 100);
    await page.mouse.wheel(0, 100);
    await expect.poll(span).toBeGreaterThan(shown);
    expect(await page.locator('.main-column').evaluate((e) => e.scrollTop)).toBe(0);
  });

  test('the optimizer x learning-rate table refuses a rate listed twice', async ({ page }) => {
    await openFresh(page);
    await page.getByRole('tab', { name: 'Optimizer × learning rate' }).click();
    const rates = page.getByLabel('Columns: learning rates');
    await rates.fill('0.001, 0.01, 0.01');
    await rates.press('Enter');
    await expect(page.getByRole('alert').filter({ hasText: 'learning rates' })).toHaveText('learning rates: 0.01 is listed twice (each column needs its own rate)');
    await rates.fill('0.001, 0.01');
    await rates.press('Enter');
    await expect(page.getByRole('alert').filter({ hasText: 'learning rates' })).toHaveCount(0);
    await expect(page.getByRole('button', { name: /Build table runs/ })).toContainText('(6)'); // the three default rows x two rates
  });
});
