import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'meritline-demo';

export const DEMO_ACCOUNTS = [
  { role: 'analyst', email: 'analyst@meritline.test', entries: ['Validation studies', 'Routine batches', 'Standard preparations'] },
  { role: 'reviewer', email: 'reviewer@meritline.test', entries: ['Review queue'] },
  // The demo quality manager also reviews.
  {
    role: 'quality_manager',
    email: 'quality@meritline.test',
    entries: ['Methods', 'Version comparison', 'Audit trail', 'Self-qualification', 'Review queue'],
  },
  { role: 'admin', email: 'admin@meritline.test', entries: ['Validation studies', 'Users', 'Outbox', 'Audit trail', 'Self-qualification'] },
] as const;

export const ROLE_ENTRIES = [...new Set(DEMO_ACCOUNTS.flatMap((account) => account.entries))];

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function signOut(page: Page) {
  const item = page.getByRole('menuitem', { name: 'Sign out' });
  // A click that lands while the menu is still opening selects nothing; a person would click again, so the test does.
  await expect(async () => {
    if (!(await item.isVisible())) await page.getByTestId('user-menu').click();
    await item.click();
    await expect(page).toHaveURL(/\/sign-in$/, { timeout: 3_000 });
  }).toPass({ timeout: 20_000 });
}

export const mainNavigation = (page: Page) => page.getByRole('navigation', { name: 'Main' });

/** Opens a step of the study wizard and waits until it is on screen (the old step stays visible while the new one renders). */
export async function openStep(page: Page, name: string, number: number) {
  await page
    .getByRole('navigation', { name: 'Study steps' })
    .getByRole('link', { name: new RegExp(name) })
    .click();
  // The first evaluation and Plotly can take a while on a busy machine.
  await expect(page.getByText(`Validation study · step ${number} of 8: ${name}`)).toBeVisible({ timeout: 30_000 });
}

/** GET on the API in the signed-in page (its session cookie goes along), for the ids of seeded records. */
export async function apiGet<T>(page: Page, path: string): Promise<T> {
  return page.evaluate(async (path) => (await fetch(`/api${path}`)).json(), path) as Promise<T>;
}
