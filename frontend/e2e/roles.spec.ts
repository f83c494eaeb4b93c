import { expect, test } from '@playwright/test';
import { DEMO_ACCOUNTS, mainNavigation, ROLE_ENTRIES, signIn, signOut } from './support';

for (const account of DEMO_ACCOUNTS) {
  test(`the ${account.role} sees their own navigation and no one else's`, async ({ page }) => {
    await signIn(page, account.email);

    const navigation = mainNavigation(page);
    await expect(navigation.getByRole('link', { name: 'Overview' })).toBeVisible();
    await expect(navigation.getByRole('link', { name: 'Verify a report' })).toBeVisible();
    for (const entry of account.entries) {
      await expect(navigation.getByRole('link', { name: entry, exact: true })).toBeVisible();
    }
    for (const entry of ROLE_ENTRIES.filter((name) => !(account.entries as readonly string[]).includes(name))) {
      await expect(navigation.getByRole('link', { name: entry, exact: true })).toHaveCount(0);
    }

    await expect(page.getByRole('heading', { level: 1 })).toContainText('Good');
    await page.screenshot({ path: `test-output/screenshots/${account.role}.png`, fullPage: true });

    const firstEntry = account.entries[0];
    await navigation.getByRole('link', { name: firstEntry, exact: true }).click();
    await expect(page.getByRole('heading', { level: 1, name: firstEntry })).toBeVisible();

    await signOut(page);
  });
}

test('a page of another role is refused, not shown', async ({ page }) => {
  await signIn(page, 'reviewer@meritline.test');
  await expect(mainNavigation(page)).toBeVisible();
  await page.goto('/admin/users');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('This page is for the role Administrator');
});

test('a signed-out visitor is brought back to the page they asked for', async ({ page }) => {
  await page.goto('/methods/compare');
  await expect(page).toHaveURL(/\/sign-in\?redirectTo=%2Fmethods%2Fcompare$/);
  await page.getByLabel('E-mail').fill('quality@meritline.test');
  await page.getByLabel('Password').fill('meritline-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/methods\/compare$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Version comparison' })).toBeVisible();
});

test('a wrong password is refused with a message that does not say which part was wrong', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test', 'not-the-demo-password');
  await expect(page.getByRole('alert')).toHaveText('E-mail or password is incorrect.');
  await expect(page).toHaveURL(/\/sign-in$/);
  await page.screenshot({ path: 'test-output/screenshots/sign-in-refused.png' });
});

test('the session lives in a cookie no page script can read, and signing out ends it on the server', async ({ page, context }) => {
  await signIn(page, 'analyst@meritline.test');
  await expect(mainNavigation(page)).toBeVisible();
  const [session] = (await context.cookies()).filter((c) => c.name === 'meritline_session');
  expect(session).toMatchObject({ httpOnly: true, sameSite: 'Strict', path: '/api' });
  const visible = await page.evaluate(() => ({ cookies: document.cookie, storage: JSON.stringify({ ...localStorage }) }));
  expect(visible.cookies).not.toContain('meritline_session');
  expect(visible.storage).not.toContain(session.value);

  await signOut(page);
  expect((await context.cookies()).filter((c) => c.name === 'meritline_session')).toHaveLength(0);
  // The token of the ended session is refused even when sent again by hand.
  const me = await page.request.get('/api/auth/me', { headers: { Authorization: `Bearer ${session.value}` } });
  expect(me.status()).toBe(401);
});
