import { expect as baseExpect, test, type APIRequestContext, type Page } from '@playwright/test';
import { DEMO_PASSWORD, signIn, signOut } from './support';

// The study page draws Plotly charts; on a busy two-core machine a page can take a while to settle.
const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(480_000);

async function signInAs(page: Page, email: string) {
  await signIn(page, email);
  await expect(page.getByTestId('user-menu')).toBeVisible();
}

const shot = (page: Page, name: string) => page.screenshot({ path: `test-output/screenshots/review-${name}.png` });

async function tokenFor(request: APIRequestContext, email: string): Promise<string> {
  const res = await request.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD } });
  expect(res.ok()).toBe(true);
  return (await res.json()).accessToken;
}

/** A complete draft for the demo analyst: a new study started from an approved one of the seeded laboratory. */
async function completeDraft(
  request: APIRequestContext,
): Promise<{ id: string; title: string; methodVersion: { settings: { requiresQualityRelease: boolean } } }> {
  const headers = { Authorization: `Bearer ${await tokenFor(request, 'analyst@meritline.test')}` };
  const approved = await (await request.get('/api/studies?status=approved', { headers })).json();
  const source = approved.items.find((study: { methodVersion: { status: string } }) => study.methodVersion.status !== 'retired');
  const copy = await request.post(`/api/studies/${source.id}/copy`, { headers });
  expect(copy.status()).toBe(201);
  return copy.json();
}

test('an analyst submits, a reviewer returns, the analyst corrects and resubmits, the reviewer approves (and a quality manager releases where required)', async ({
  page,
  request,
}) => {
  const study = await completeDraft(request);
  const studyPage = `/studies/${study.id}`;
  const status = page.getByTestId('study-status');

  // The analyst signs and submits; a wrong password is refused and nothing is signed.
  await signInAs(page, 'analyst@meritline.test');
  await page.goto(studyPage);
  await expect(status).toHaveText('Draft');
  await shot(page, '1-draft');
  await page.getByRole('button', { name: 'Submit for review' }).click();
  const dialog = page.getByRole('dialog');
  await expect(dialog.getByText('By signing you confirm that you performed this study')).toBeVisible();
  await dialog.getByLabel('Your password').fill('not-my-password');
  await dialog.getByRole('button', { name: 'Sign and submit' }).click();
  await expect(dialog.getByRole('alert')).toContainText('Password not correct; nothing was signed.');
  await shot(page, '2-wrong-password');
  await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
  await dialog.getByLabel('Comment (optional)').fill('Copied from the approved study; ready for a second check.');
  await dialog.getByRole('button', { name: 'Sign and submit' }).click();
  await expect(status).toHaveText('Awaiting review');
  await signOut(page);

  // The reviewer finds it in the queue and returns it with a comment.
  await signInAs(page, 'reviewer@meritline.test');
  await expect(page.getByTestId('notifications-unread')).toBeVisible();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Review queue' }).click();
  // Other journeys may queue copies with the same title: this study is the one its link leads to.
  const queued = page.getByRole('link', { name: study.title }).and(page.locator(`[href="${studyPage}"]`));
  await expect(queued).toBeVisible();
  await shot(page, '3-queue');
  await queued.click();
  await expect(status).toHaveText('Awaiting review');
  await shot(page, '4-under-review');
  await page.getByRole('button', { name: 'Return for changes' }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Return the study' }).click();
  await expect(page.getByRole('dialog').getByText('Say what the author should change before resubmitting.')).toBeVisible();
  await page.getByRole('dialog').getByLabel('What should the author change?').fill('Re-inject the top standard: its duplicate reads high.');
  await page.getByRole('dialog').getByRole('button', { name: 'Return the study' }).click();
  await expect(status).toHaveText('Returned for changes');
  await signOut(page);

  // The analyst corrects the data (with a reason) and resubmits.
  const headers = { Authorization: `Bearer ${await tokenFor(request, 'analyst@meritline.test')}` };
  const current = await (await request.get(`/api/studies/${study.id}`, { headers })).json();
  const standards = current.data.standards.map((point: { y: number }, i: number, all: unknown[]) =>
    i === all.length - 1 ? { ...point, y: Number((point.y * 0.995).toPrecision(6)) } : point,
  );
  const patched = await request.patch(`/api/studies/${study.id}`, {
    headers,
    data: { data: { ...current.data, standards }, lockVersion: current.lockVersion, reason: 'Top standard re-injected after the review.' },
  });
  expect(patched.status()).toBe(200);
  await signInAs(page, 'analyst@meritline.test');
  await page.goto(studyPage);
  await expect(page.getByRole('main').getByText('Re-inject the top standard: its duplicate reads high.')).toBeVisible();
  await shot(page, '5-returned');
  await page.getByRole('button', { name: 'Resubmit for review' }).click();
  await page.getByRole('dialog').getByLabel('Your password').fill(DEMO_PASSWORD);
  await page.getByRole('dialog').getByRole('button', { name: 'Sign and submit' }).click();
  await expect(status).toHaveText('Awaiting review');
  await signOut(page);

  // The reviewer sees what changed and approves with a signature.
  await signInAs(page, 'reviewer@meritline.test');
  await page.goto(studyPage);
  await expect(page.getByRole('table', { name: 'Changes between submissions' })).toContainText('Response');
  await shot(page, '6-changes');
  await page.getByRole('button', { name: 'Approve' }).click();
  await expect(page.getByRole('dialog').getByText('By signing you confirm you reviewed this study and approve its results')).toBeVisible();
  await shot(page, '7-approve-dialog');
  await page.getByRole('dialog').getByLabel('Your password').fill(DEMO_PASSWORD);
  await page.getByRole('dialog').getByRole('button', { name: 'Sign and approve' }).click();
  const releaseRequired = study.methodVersion.settings.requiresQualityRelease;
  if (releaseRequired) {
    // This method version asks a quality manager to release what the reviewer approved.
    await expect(status).toHaveText('Awaiting release');
    await shot(page, '8-awaiting-release');
    await signOut(page);
    await signInAs(page, 'quality@meritline.test');
    await page.goto(studyPage);
    await page.getByRole('button', { name: 'Release' }).click();
    await expect(page.getByRole('dialog').getByText('you release it')).toBeVisible();
    await page.getByRole('dialog').getByLabel('Your password').fill(DEMO_PASSWORD);
    await page.getByRole('dialog').getByRole('button', { name: 'Sign and release' }).click();
  }
  await expect(status).toHaveText('Approved');
  await page.getByRole('tab', { name: 'Signatures' }).click();
  await expect(page.getByTestId('signature')).toHaveCount(releaseRequired ? 4 : 3);
  await expect(page.getByTestId('broken-signature-warning')).toHaveCount(0);
  await shot(page, '9-approved-signatures');
  await page.getByRole('tab', { name: 'History' }).click();
  await expect(page.getByText('Returned to the author for changes')).toBeVisible();
  await shot(page, '10-history');
});
