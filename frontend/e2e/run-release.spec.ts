import { expect as baseExpect, test, type APIRequestContext, type Page } from '@playwright/test';
import { DEMO_PASSWORD, signIn, signOut } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(180_000);

async function signInAs(page: Page, email: string) {
  await signIn(page, email);
  await expect(page.getByTestId('user-menu')).toBeVisible();
}

const shot = (page: Page, name: string) => page.screenshot({ path: `test-output/screenshots/run-release-${name}.png` });

/** A fresh run by the demo analyst, made from the data of one of the seeded accepted runs. */
async function freshRun(request: APIRequestContext): Promise<{ id: string; title: string }> {
  const login = await request.post('/api/auth/login', { data: { email: 'analyst@meritline.test', password: DEMO_PASSWORD } });
  const headers = { Authorization: `Bearer ${(await login.json()).accessToken}` };
  const list = await (await request.get('/api/runs?status=accepted&pageSize=100', { headers })).json();
  const answers: string[] = [];
  // Some seeded runs are on versions no longer usable for new runs; the first that takes a copy serves.
  for (const item of list.items as { id: string }[]) {
    const source = await (await request.get(`/api/runs/${item.id}`, { headers })).json();
    // The stored data carry what the server filled in; a new run takes only the analyst's input.
    const { units: _units, confidence: _confidence, ...input } = source.data;
    const created = await request.post('/api/runs', {
      headers,
      data: { methodVersionId: source.methodVersionId, title: 'Release check batch', data: input },
    });
    if (created.status() === 201) return created.json();
    answers.push(await created.text());
  }
  throw new Error(`No seeded run could be copied: ${answers.join(' | ')}`);
}

test('an analyst submits a run with a signature and the demo reviewer releases it', async ({ page, request }) => {
  const run = await freshRun(request);

  await signInAs(page, 'analyst@meritline.test');
  await page.goto(`/runs/${run.id}`);
  await expect(page.getByText('Calculated', { exact: true }).first()).toBeVisible();
  await page.getByRole('button', { name: 'Submit for release' }).click();
  const dialog = page.getByRole('dialog');
  await expect(dialog.getByText('Performed: you carried out this run')).toBeVisible();
  await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
  await dialog.getByRole('button', { name: 'Sign and submit' }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByText('Submitted for review', { exact: true }).first()).toBeVisible();
  await expect(page.getByRole('table', { name: 'Signatures' })).toContainText('Alma Ruiz');
  await expect(page.getByRole('button', { name: 'Release' })).toHaveCount(0);
  await shot(page, '1-submitted');
  await signOut(page);

  await signInAs(page, 'reviewer@meritline.test');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Review queue' }).click();
  await page.getByRole('button', { name: 'Routine runs' }).click();
  await shot(page, '2-queue');
  await page.getByRole('link', { name: run.title }).click();
  await expect(page).toHaveURL(new RegExp(`/runs/${run.id}$`));
  await page.getByRole('button', { name: 'Release', exact: true }).click();
  const release = page.getByRole('dialog');
  await expect(release.getByText('Reviewed and released: you checked this run')).toBeVisible();
  await release.getByLabel('Your password').fill(DEMO_PASSWORD);
  await release.getByRole('button', { name: 'Sign and release' }).click();
  await expect(release).toBeHidden();
  await expect(page.getByText('Reviewed and released', { exact: true }).first()).toBeVisible();
  const signatures = page.getByRole('table', { name: 'Signatures' });
  await expect(signatures).toContainText('Priya Nair');
  await expect(signatures).toContainText('Performed');
  await expect(signatures.getByRole('row')).toHaveCount(3);
  await shot(page, '3-released');
});
