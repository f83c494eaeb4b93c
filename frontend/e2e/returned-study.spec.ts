import { expect as baseExpect, test, type APIRequestContext, type Page } from '@playwright/test';
import { DEMO_PASSWORD, signIn, signOut } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(480_000);

const shot = (page: Page, name: string) => page.screenshot({ path: `test-output/screenshots/returned-${name}.png`, fullPage: true });

async function headersFor(request: APIRequestContext, email: string) {
  const res = await request.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD } });
  expect(res.ok()).toBe(true);
  return { Authorization: `Bearer ${(await res.json()).accessToken}` };
}

/** A new draft of the demo analyst, started from an approved study of the seeded laboratory. */
async function draftOfAnalyst(request: APIRequestContext): Promise<{ id: string; title: string; lockVersion: number }> {
  const headers = await headersFor(request, 'analyst@meritline.test');
  const approved = await (await request.get('/api/studies?status=approved', { headers })).json();
  const source = approved.items.find((study: { methodVersion: { status: string } }) => study.methodVersion.status !== 'retired');
  const copy = await request.post(`/api/studies/${source.id}/copy`, { headers });
  expect(copy.status()).toBe(201);
  // A title of its own, so that other browser tests on the same server never meet two studies of one name.
  const draft = await copy.json();
  const renamed = await request.patch(`/api/studies/${draft.id}`, {
    headers,
    data: { lockVersion: draft.lockVersion, title: `Returned-study check ${draft.id.slice(0, 8)}` },
  });
  expect(renamed.status()).toBe(200);
  return renamed.json();
}

async function signInAs(page: Page, email: string) {
  await signIn(page, email);
  await expect(page.getByTestId('user-menu')).toBeVisible();
}

test('a returned study: the author sees the remarks, changes the conclusion with a reason, the reviewer sees the change in words', async ({
  page,
  request,
}) => {
  const draft = await draftOfAnalyst(request);
  const analyst = await headersFor(request, 'analyst@meritline.test');
  const reviewer = await headersFor(request, 'reviewer@meritline.test');
  expect((await request.post(`/api/studies/${draft.id}/submit`, { headers: analyst, data: { password: DEMO_PASSWORD } })).status()).toBe(
    200,
  );
  const comment = await request.post(`/api/studies/${draft.id}/comments`, {
    headers: reviewer,
    data: { section: 'conclusion', body: 'Say for which range and matrix the method is fit.' },
  });
  expect(comment.status()).toBe(201);
  const returned = await request.post(`/api/studies/${draft.id}/return`, {
    headers: reviewer,
    data: { comment: 'The conclusion does not state the working range.' },
  });
  expect(returned.status()).toBe(200);

  await signInAs(page, 'analyst@meritline.test');
  await page.goto(`/studies/${draft.id}/edit?step=8`);
  const remarks = page.getByTestId('reviewer-remarks');
  await expect(remarks).toContainText('The conclusion does not state the working range.');
  await expect(remarks).toContainText('One comment is still open');
  await expect(remarks).toContainText('Say for which range and matrix the method is fit.');
  const conclusion = page.getByRole('textbox', { name: /Your conclusion/ });
  await conclusion.fill('Fit for nitrate in drinking water from 0.5 to 50 mg/L.');
  await expect(page.getByText('Your change is not saved yet: say why the study changes, then it is saved.')).toBeVisible();
  await shot(page, '1-reason-asked');
  await page.getByRole('textbox', { name: /Why the study changes now/ }).fill('Working range stated, as the reviewer asked.');
  await expect(page.getByTestId('save-status')).toHaveText(/^Saved/);
  await shot(page, '2-saved');
  await page.goto(`/studies/${draft.id}`);
  await page.getByRole('button', { name: 'Resubmit for review' }).click();
  await page.getByRole('dialog').getByLabel('Your password').fill(DEMO_PASSWORD);
  await page.getByRole('dialog').getByRole('button', { name: 'Sign and submit' }).click();
  await expect(page.getByTestId('study-status')).toHaveText('Awaiting review');
  await signOut(page);

  await signInAs(page, 'reviewer@meritline.test');
  await page.goto(`/studies/${draft.id}`);
  const changes = page.getByRole('table', { name: 'Changes between submissions' });
  await expect(changes).toContainText('Conclusion');
  await expect(changes).toContainText('Fit for nitrate in drinking water from 0.5 to 50 mg/L.');
  await shot(page, '3-changes');
  await page.getByRole('tab', { name: 'History' }).click();
  await expect(page.getByTestId('history-changes').filter({ hasText: 'Conclusion:' }).first()).toBeVisible();
  await expect(page.getByText('Reason: Working range stated, as the reviewer asked.')).toBeVisible();
  await shot(page, '4-history');
  await page.getByRole('tab', { name: 'Results' }).click();
  await expect(page.getByRole('heading', { name: 'Points to check' })).toBeVisible();
  await page.getByRole('button', { name: 'Approve' }).click();
  await expect(page.getByTestId('open-comments-note')).toContainText('One comment is still open.');
  await expect(page.getByTestId('open-comments-note')).toContainText('Say for which range and matrix the method is fit.');
  await page.screenshot({ path: 'test-output/screenshots/returned-5-approve-dialog.png' });
  await page.getByRole('dialog').getByRole('button', { name: 'Cancel' }).click();
});

test('an administrator gives a draft to another analyst; the first author can then only read it', async ({ page, request }) => {
  const draft = await draftOfAnalyst(request);

  await signInAs(page, 'admin@meritline.test');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Validation studies' }).click();
  await expect(page.getByRole('link', { name: 'New study' })).toHaveCount(0);
  await page.getByRole('link', { name: draft.title }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: draft.title })).toBeVisible();
  await page.getByRole('button', { name: 'Give to another analyst…' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByRole('button', { name: 'Give the draft' }).click();
  await expect(dialog.getByText('Choose the analyst who takes the study over.')).toBeVisible();
  await dialog.getByLabel('New author').selectOption({ label: 'Tomasz Weber' });
  await dialog.getByLabel('Why the draft changes hands').fill('Alma is on leave until March; Tomasz finishes the study.');
  await shot(page, '6-reassign');
  await dialog.getByRole('button', { name: 'Give the draft' }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByRole('main')).toContainText('by Tomasz Weber');
  await page.getByRole('tab', { name: 'History' }).click();
  await expect(page.getByText('Author: “Alma Ruiz” → “Tomasz Weber”')).toBeVisible();
  await shot(page, '7-reassigned');
  await signOut(page);

  await signInAs(page, 'analyst@meritline.test');
  await page.goto(`/studies/${draft.id}/edit?step=2`);
  await expect(page.getByTestId('read-only-reason')).toContainText(
    'Only its author, Tomasz Weber, may change this study; you can read it.',
  );
  await expect(page.getByRole('button', { name: 'Paste from a spreadsheet' }).first()).toBeDisabled();
  await shot(page, '8-read-only');
});
