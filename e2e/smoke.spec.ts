import { test, expect } from '@playwright/test';

test('the built page opens in Chromium', async ({ page }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { name: 'Fall Line' })).toBeVisible();
});
