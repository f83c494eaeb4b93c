import { expect, test } from '@playwright/test';
import { signIn } from './support';

test.use({ viewport: { width: 390, height: 800 } });

test('on a phone the navigation opens from the menu button and closes after choosing', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Good');
  await expect(page.getByRole('navigation', { name: 'Main' })).toBeHidden();
  await page.screenshot({ path: 'test-output/screenshots/phone-overview.png', fullPage: true });

  await page.getByRole('button', { name: 'Open the navigation' }).click();
  const navigation = page.getByRole('dialog').getByRole('navigation', { name: 'Main' });
  await expect(navigation).toBeVisible();
  await page.screenshot({ path: 'test-output/screenshots/phone-navigation.png' });
  await navigation.getByRole('link', { name: 'Routine batches' }).click();

  await expect(page.getByRole('dialog')).toBeHidden();
  await expect(page).toHaveURL(/\/runs$/);
});
