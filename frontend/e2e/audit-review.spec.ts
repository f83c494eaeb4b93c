import { expect as baseExpect, test, type Page } from '@playwright/test';
import { readFile } from 'node:fs/promises';
import { DEMO_PASSWORD, mainNavigation, signIn } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(300_000);

const shot = (page: Page, name: string) => page.screenshot({ path: `test-output/screenshots/audit-review-${name}.png`, fullPage: true });

test('the quality manager reviews a study’s trail, then runs the self-qualification and verifies its report', async ({ page, request }) => {
  const login = await request.post('/api/auth/login', { data: { email: 'quality@meritline.test', password: DEMO_PASSWORD } });
  const headers = { Authorization: `Bearer ${(await login.json()).accessToken}` };
  const studies = (await (await request.get('/api/studies?status=approved', { headers })).json()) as {
    items: { id: string; title: string }[];
  };
  const study = studies.items[0];

  await signIn(page, 'quality@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Audit trail', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Audit trail' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Audit trail' }).getByRole('row').nth(1)).toBeVisible();
  await expect(page.getByText(/study\.|signature\.|auth\./)).toHaveCount(0);
  await shot(page, 'whole-trail');
  await page.getByLabel('Action', { exact: true }).selectOption({ label: 'Study submitted for review' });
  const submissions = page.getByRole('table', { name: 'Audit trail' }).getByRole('row');
  await expect(submissions.nth(1)).toContainText('Study submitted for review');
  for (const row of (await submissions.all()).slice(1)) await expect(row).toContainText('Study submitted for review');
  await page.getByLabel('Action', { exact: true }).selectOption({ label: 'Every action' });

  await page.goto(`/studies/${study.id}`);
  await expect(page.getByRole('heading', { level: 1, name: study.title })).toBeVisible();
  await page.getByRole('main').getByRole('link', { name: 'Audit trail' }).click();
  await expect(page.getByTestId('record-filter')).toContainText(study.title);
  const table = page.getByRole('table', { name: 'Audit trail' });
  await expect(table.getByText('Study submitted for review', { exact: true }).first()).toBeVisible();

  await page.getByRole('button', { name: 'Verify the chain' }).click();
  await expect(page.getByTestId('chain-answer')).toContainText(/The chain is intact over \d+ entries/);

  await page.getByRole('button', { name: 'Mark as reviewed' }).click();
  const dialog = page.getByRole('dialog');
  await expect(dialog).toContainText('the whole trail of Validation study');
  await dialog.getByLabel('Your password').fill('not-my-password');
  await dialog.getByRole('button', { name: 'Sign the review' }).click();
  await expect(dialog).toContainText('Password not correct');
  await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
  await dialog.getByLabel('Remarks (optional)').fill('Approval trail checked against the signed report.');
  await dialog.getByRole('button', { name: 'Sign the review' }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByTestId('latest-review')).toContainText(`Validation study “${study.title}” reviewed by Jonas Lindqvist`);
  await expect(table.getByText('Audit trail marked as reviewed')).toHaveCount(0);
  await shot(page, 'study-reviewed');

  const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()]);
  expect(csv.suggestedFilename()).toMatch(/^meritline-audit-trail-.*\.csv$/);
  const [pdf] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export signed PDF' }).click()]);
  expect(pdf.suggestedFilename()).toMatch(/\.pdf$/);

  await mainNavigation(page).getByRole('link', { name: 'Self-qualification', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Self-qualification' })).toBeVisible();
  await page.getByRole('button', { name: 'Run the self-qualification' }).click();
  await expect(page.getByTestId('qualification-answer')).toContainText(/All \d+ checks passed/);
  const runs = page.getByRole('table', { name: 'Self-qualification runs' });
  await expect(runs.getByText('All checks passed')).toBeVisible();
  await shot(page, 'qualification');
  const [report] = await Promise.all([page.waitForEvent('download'), runs.getByRole('button', { name: 'Signed report' }).first().click()]);
  expect(report.suggestedFilename()).toMatch(/^meritline-self-qualification-[0-9a-f]{8}\.pdf$/);
  const saved = await report.path();

  await page.goto('/verify');
  await page
    .getByLabel('Report to verify (PDF)')
    .setInputFiles({ name: 'self-qualification.pdf', mimeType: 'application/pdf', buffer: await readFile(saved) });
  await expect(page.getByText(/is an authentic report, unchanged since it was signed/)).toBeVisible();
  await expect(page.getByText('Self-qualification of the calculations')).toBeVisible();
  await shot(page, 'qualification-verified');

  await page.goto('/');
  await expect(page.getByRole('heading', { level: 2, name: 'Waiting for you' })).toBeVisible();
  await expect(page.getByRole('region', { name: 'Last review of the audit trail' })).toContainText(study.title);
  await expect(page.getByRole('region', { name: 'Waiting for your review' })).toBeVisible();
  await shot(page, 'overview');
});
