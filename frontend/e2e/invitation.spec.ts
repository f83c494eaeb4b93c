import { expect, test } from '@playwright/test';
import { mainNavigation, signIn, signOut } from './support';

const invitee = { email: 'noor.haddad@riverbend-lab.test', name: 'Noor Haddad', password: 'titration at dawn 42' };

test('an administrator invites an analyst, who sets up the account from the e-mailed link', async ({ page }) => {
  test.slow();
  await signIn(page, 'admin@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  await expect(page.getByRole('table', { name: 'Users' })).toBeVisible();

  await page.getByRole('button', { name: 'Invite a user' }).click();
  const dialog = page.getByRole('dialog', { name: 'Invite a user' });
  await dialog.getByLabel('E-mail').fill(invitee.email);
  await dialog.getByLabel('Full name').fill(invitee.name);
  await dialog.getByText('Analyst', { exact: true }).click();
  await page.screenshot({ path: 'test-output/screenshots/invite-user.png' });
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await expect(dialog).toBeHidden();

  const row = page.getByRole('row', { name: new RegExp(invitee.name) });
  await expect(row).toContainText('Invitation sent');
  await page.screenshot({ path: 'test-output/screenshots/users.png', fullPage: true });

  await mainNavigation(page).getByRole('link', { name: 'Outbox' }).click();
  const messageRow = page.getByRole('row').filter({ hasText: invitee.email });
  await messageRow.getByRole('link').first().click();
  const text = page.getByTestId('message-text');
  await expect(text).toContainText(`Hello ${invitee.name}`);
  await page.screenshot({ path: 'test-output/screenshots/outbox.png', fullPage: true });

  const link = (await text.innerText()).match(/https?:\/\/\S+\/accept-invitation\?token=\S+/)?.[0];
  expect(link, 'the invitation e-mail carries a set-up link').toBeTruthy();

  await signOut(page);
  await page.goto(link!);
  await expect(page.getByRole('heading', { level: 1, name: 'Set up your account' })).toBeVisible();
  await page.getByLabel('Full name').fill(invitee.name);
  await page.getByRole('textbox', { name: 'Password', exact: true }).fill(invitee.password);
  await page.getByLabel('Repeat the password').fill(invitee.password);
  await page.screenshot({ path: 'test-output/screenshots/accept-invitation.png' });
  await page.getByRole('button', { name: 'Create my account' }).click();

  await expect(page.getByTestId('user-menu')).toContainText(invitee.name);
  await expect(page.getByTestId('user-roles')).toHaveText('Analyst');
  await expect(mainNavigation(page).getByRole('link', { name: 'Validation studies' })).toBeVisible();
  await expect(mainNavigation(page).getByRole('link', { name: 'Users' })).toHaveCount(0);

  // The link works once.
  await signOut(page);
  await page.goto(link!);
  await page.getByLabel('Full name').fill(invitee.name);
  await page.getByRole('textbox', { name: 'Password', exact: true }).fill(invitee.password);
  await page.getByLabel('Repeat the password').fill(invitee.password);
  await page.getByRole('button', { name: 'Create my account' }).click();
  await expect(page.getByRole('alert')).toBeVisible();
  await expect(page).toHaveURL(/\/accept-invitation/);
});
