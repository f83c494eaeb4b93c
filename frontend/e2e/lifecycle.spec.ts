import { expect as baseExpect, test, type Page } from '@playwright/test';
import { DEMO_PASSWORD, mainNavigation, signIn } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(240_000);

// A method of the invented demo laboratory, created here so that the seeded methods stay as they are.
const METHOD = 'Chloride in surface water by titration';
const JUSTIFICATION = 'The new burette was calibrated against the old one on 20 samples; linearity and recovery follow next month.';

const versionCard = (page: Page, number: number) => page.getByRole('article', { name: `Version ${number}` });

test('a quality manager records a change with its revalidation scope and activates it with a signed justification', async ({
  page,
  request,
}) => {
  const login = await request.post('/api/auth/login', { data: { email: 'quality@meritline.test', password: DEMO_PASSWORD } });
  const headers = { Authorization: `Bearer ${(await login.json()).accessToken}` };
  const method = await (
    await request.post('/api/methods', {
      headers,
      data: {
        name: METHOD,
        analyte: 'Chloride',
        matrix: 'Surface water',
        technique: 'Argentometric titration',
        xUnit: 'mg/L',
        yUnit: 'mL',
        purpose: 'assay',
      },
    })
  ).json();
  const [first] = method.versions;
  await request.patch(`/api/method-versions/${first.id}`, { headers, data: { lockVersion: first.lockVersion, status: 'active' } });

  await signIn(page, 'quality@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Methods' }).click();
  await page.getByRole('table', { name: 'Methods' }).getByRole('link', { name: METHOD }).click();
  await expect(page.getByRole('heading', { level: 1, name: METHOD })).toBeVisible();

  await page.getByRole('button', { name: 'New version' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('What changes, and why').fill('Motorised burette instead of the manual one.');
  await dialog.getByLabel('Kind of change').selectOption({ label: 'Instrument' });
  // Each checkbox has its own id: clicking one label must tick that box only.
  await dialog.getByText('Linearity', { exact: true }).click();
  await dialog.getByText('Recovery', { exact: true }).click();
  await expect(dialog.getByRole('checkbox', { name: 'Linearity' })).toBeChecked();
  await expect(dialog.getByRole('checkbox', { name: 'Recovery' })).toBeChecked();
  await expect(dialog.getByRole('checkbox', { name: 'Precision' })).not.toBeChecked();
  await expect(dialog.getByRole('checkbox', { name: 'Detection limits' })).not.toBeChecked();
  const margin = dialog.getByLabel('Recovery equivalence margin (percentage points)');
  await margin.fill('0');
  await dialog.getByRole('button', { name: 'Create the draft' }).click();
  await expect(dialog.getByText('The margin must be more than 0 percentage points.')).toBeVisible();
  await margin.fill('4');
  await dialog.getByRole('button', { name: 'Create the draft' }).click();
  await expect(dialog).toBeHidden();

  const second = versionCard(page, 2);
  await expect(second).toContainText('Instrument');
  await expect(second).toContainText('Linearity, Recovery (missing: linearity, recovery)');
  await expect(second).toContainText('± 4 percentage points');

  await second.getByRole('button', { name: 'Activate version 2' }).click();
  const confirm = page.getByRole('alertdialog');
  await expect(confirm).toContainText('Not yet shown again');
  await expect(confirm.getByRole('listitem')).toHaveText(['Linearity', 'Recovery']);
  const signButton = confirm.getByRole('button', { name: 'Sign and activate with justification' });
  await expect(signButton).toBeDisabled();
  await confirm.getByLabel('Justification for activating without coverage').fill(JUSTIFICATION);
  await confirm.getByLabel('Your password').fill('not-my-password');
  await signButton.click();
  await expect(confirm).toContainText('Password not correct; the version was not activated.');
  await confirm.getByLabel('Your password').fill(DEMO_PASSWORD);
  await signButton.click();
  await expect(confirm).toBeHidden();
  await expect(second).toContainText('Active');
  await expect(second).toContainText(JUSTIFICATION);
  await expect(versionCard(page, 1)).toContainText('Retired');
  await page.screenshot({ path: 'test-output/screenshots/lifecycle-activated.png', fullPage: true });
});
