import { expect as baseExpect, test, type APIRequestContext, type Page } from '@playwright/test';
import { DEMO_PASSWORD, mainNavigation, signIn } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(300_000);

const shot = (page: Page, name: string) => page.screenshot({ path: `test-output/screenshots/list-paging-${name}.png`, fullPage: true });

async function headersFor(request: APIRequestContext, email: string) {
  const res = await request.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD } });
  expect(res.ok()).toBe(true);
  return { Authorization: `Bearer ${(await res.json()).accessToken}` };
}

/** Enough drafts that the list needs a second page of 20: copies of an approved study of the seeded laboratory. */
async function fillStudyList(request: APIRequestContext) {
  const headers = await headersFor(request, 'analyst@meritline.test');
  const list = await (await request.get('/api/studies?pageSize=100', { headers })).json();
  const approved = list.items.find(
    (study: { status: string; methodVersion: { status: string } }) =>
      study.status === 'approved' && study.methodVersion.status !== 'retired',
  );
  for (let i = list.total; i < 25; i++) expect((await request.post(`/api/studies/${approved.id}/copy`, { headers })).status()).toBe(201);
  return (await (await request.get('/api/studies?pageSize=100', { headers })).json()).total as number;
}

const titlesOf = (page: Page) => page.getByRole('table', { name: 'Validation studies' }).locator('tbody tr td:first-child').allInnerTexts();

test('an analyst pages through the studies with Next and Previous, sorted and filtered, and the runs and queue page the same way', async ({
  page,
  request,
}) => {
  const total = await fillStudyList(request);
  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  const range = page.getByText(/^Studies \d+–\d+ of/);
  await expect(range).toHaveText(`Studies 1–20 of ${total}`);
  const previous = page.getByRole('button', { name: 'Previous' });
  const next = page.getByRole('button', { name: 'Next' });
  await expect(previous).toBeDisabled();
  const firstPage = await titlesOf(page);
  await shot(page, '1-studies-first');

  await next.click();
  await expect(range).toHaveText(`Studies 21–${total} of ${total}`);
  await expect(next).toBeDisabled();
  const secondPage = await titlesOf(page);
  expect(secondPage).toHaveLength(total - 20);
  await shot(page, '2-studies-second');

  await previous.click();
  await expect(range).toHaveText(`Studies 1–20 of ${total}`);
  expect(await titlesOf(page)).toEqual(firstPage);

  // A new sort starts again at the first page, in the new order.
  await page.getByRole('button', { name: /^Title, .*sort by title/ }).click();
  await expect(range).toHaveText(`Studies 1–20 of ${total}`);
  await expect(previous).toBeDisabled();
  await next.click();
  await expect(range).toHaveText(`Studies 21–${total} of ${total}`);
  const byTitle = [...(await titlesOf(page))];
  await shot(page, '3-studies-by-title-second');
  await previous.click();
  await expect(range).toHaveText(`Studies 1–20 of ${total}`);
  const allByTitle = [...(await titlesOf(page)), ...byTitle];
  expect(allByTitle).toHaveLength(total);

  // A filter starts again at the first page too.
  await next.click();
  await page.getByLabel('Status', { exact: true }).selectOption('draft');
  await expect(range).toHaveText(/^Studies 1–\d+ of \d+$/);
  await expect(previous).toBeDisabled();
  await shot(page, '4-studies-drafts');

  await mainNavigation(page).getByRole('link', { name: 'Routine batches' }).click();
  await expect(page.getByText(/^Runs 1–\d+ of \d+$/)).toBeVisible();
  await shot(page, '5-runs');
  await page.getByLabel('Status', { exact: true }).selectOption({ label: 'Rejected' });
  const rejected = page.getByRole('table', { name: 'Routine runs' }).getByRole('row');
  await expect(rejected.nth(1)).toContainText('Rejected');
  for (const row of (await rejected.all()).slice(1)) await expect(row).toContainText('Rejected');
});

test('a reviewer steps through the review queue page by page', async ({ page, request }) => {
  const analyst = await headersFor(request, 'analyst@meritline.test');
  const drafts = (await (await request.get('/api/studies?status=draft&mine=true&pageSize=100', { headers: analyst })).json()).items;
  for (const draft of drafts.slice(0, 3)) {
    await request.post(`/api/studies/${draft.id}/submit`, { headers: analyst, data: { password: DEMO_PASSWORD } });
  }
  await signIn(page, 'reviewer@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Review queue' }).click();
  await expect(page.getByText(/^Items 1–\d+$/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Previous' })).toBeDisabled();
  await shot(page, '6-queue');
});
