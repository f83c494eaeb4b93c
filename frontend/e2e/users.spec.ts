import { expect, test } from '@playwright/test';
import { DEMO_PASSWORD, mainNavigation, signIn, signOut } from './support';

test('an administrator deactivates an account after confirming, and reactivates it', async ({ page }) => {
  await signIn(page, 'admin@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  const row = page.getByRole('row', { name: /Tomasz Weber/ });

  await row.getByRole('button', { name: 'Deactivate Tomasz Weber' }).click();
  const confirm = page.getByRole('alertdialog', { name: 'Deactivate Tomasz Weber?' });
  await confirm.getByRole('button', { name: 'Deactivate' }).click();
  await expect(confirm).toBeHidden();
  await expect(row).toContainText('Deactivated');

  // Their own row offers no way to lock themselves out.
  await expect(page.getByRole('row', { name: /Sam Okafor/ }).getByRole('button', { name: /Deactivate/ })).toBeDisabled();

  await signOut(page);
  await signIn(page, 'analyst2@meritline.test', DEMO_PASSWORD);
  await expect(page.getByRole('alert')).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in$/);

  await signIn(page, 'admin@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  await page
    .getByRole('row', { name: /Tomasz Weber/ })
    .getByRole('button', { name: 'Reactivate Tomasz Weber' })
    .click();
  await expect(page.getByRole('row', { name: /Tomasz Weber/ })).toContainText('Active');
});

test('the colours switch to dark and stay so after a reload', async ({ page }) => {
  await signIn(page, 'admin@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  await page.getByRole('button', { name: 'Use dark colours' }).click();
  await expect(page.locator('html')).toHaveClass(/dark/);
  await page.reload();
  await expect(page.locator('html')).toHaveClass(/dark/);
  await expect(page.getByRole('table', { name: 'Users' })).toBeVisible();
  await page.screenshot({ path: 'test-output/screenshots/users-dark.png' });
  await page.getByRole('button', { name: 'Use light colours' }).click();
  await expect(page.locator('html')).not.toHaveClass(/dark/);
});

test('an administrator gives each role with the mouse and the saved roles are the ones clicked', async ({ page }) => {
  await signIn(page, 'admin@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  const row = page.getByRole('row', { name: /Tomasz Weber/ });
  const dialog = page.getByRole('dialog', { name: 'Edit Tomasz Weber' });
  const added = ['Reviewer', 'Quality manager', 'Administrator'];

  await row.getByRole('button', { name: 'Edit Tomasz Weber' }).click();
  for (const label of added) {
    await dialog.getByText(label, { exact: true }).click();
    await expect(dialog.getByRole('checkbox', { name: new RegExp(`^${label}`) })).toBeChecked();
  }
  await expect(dialog.getByRole('checkbox', { name: /^Analyst/ })).toBeChecked();
  await dialog.getByRole('button', { name: 'Save' }).click();
  await expect(dialog).toBeHidden();
  for (const label of ['Analyst', ...added]) await expect(row.getByText(label, { exact: true })).toBeVisible();

  // Back to an analyst only, again with the mouse, so the account is as the demo seeded it.
  await row.getByRole('button', { name: 'Edit Tomasz Weber' }).click();
  for (const label of added) await dialog.getByText(label, { exact: true }).click();
  await dialog.getByRole('button', { name: 'Save' }).click();
  await expect(dialog).toBeHidden();
  await expect(row.getByText('Analyst', { exact: true })).toBeVisible();
  for (const label of added) await expect(row.getByText(label, { exact: true })).toHaveCount(0);
});
