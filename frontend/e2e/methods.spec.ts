import { expect as baseExpect, test, type Page } from '@playwright/test';
import { mainNavigation, signIn } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(240_000);

// A method of the invented demo laboratory, created here so that the seeded methods stay as they are.
const METHOD = 'Sulfate in groundwater by ion chromatography';

async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `test-output/screenshots/methods-${name}.png`, fullPage: true });
}

const versionCard = (page: Page, number: number) => page.getByRole('article', { name: `Version ${number}` });

test('a quality manager creates a method, edits the criteria of a draft, activates it, then a new version', async ({ page }) => {
  await signIn(page, 'quality@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Methods' }).click();
  const methods = page.getByRole('table', { name: 'Methods' });
  await expect(methods.getByRole('link', { name: 'Nitrate in drinking water by ion chromatography' })).toBeVisible();
  await shot(page, 'list');

  // A new method starts from a set of criteria and is a draft.
  await page.getByRole('button', { name: 'New method' }).click();
  const create = page.getByRole('dialog');
  await create.getByLabel('Method name').fill(METHOD);
  await create.getByLabel('Analyte').fill('Sulfate');
  await create.getByLabel('Matrix').fill('Groundwater');
  await create.getByLabel('Technique').fill('ion chromatography');
  await create.getByLabel('Concentration unit (x)').fill('mg/L');
  await create.getByLabel('Response unit (y)').fill('µS·min');
  await create.getByLabel('Starting acceptance criteria').selectOption({ label: 'Environmental trace analysis (water)' });
  await expect(create.getByRole('table', { name: /^Criteria of/ })).toContainText('Mean recovery, all levelsRecoveryfrom 80 to 120 %');
  await shot(page, 'new-method');
  await create.getByRole('button', { name: 'Create the method' }).click();

  await expect(page.getByRole('heading', { level: 1, name: METHOD })).toBeVisible();
  const first = versionCard(page, 1);
  await expect(first).toContainText('Draft');

  // Edit the draft's criteria: a tighter R² and a detection limit.
  await first.getByRole('button', { name: 'Edit criteria and settings' }).click();
  const edit = page.getByRole('dialog');
  const r2 = edit.getByRole('group', { name: 'Criterion 1' });
  await expect(r2.getByLabel('Figure')).toHaveValue('calibration.r2');
  await r2.getByLabel('Limit').fill('0,998');
  await expect(r2.getByTestId('criterion-1-words')).toHaveText('Coefficient of determination R² at least 0.998');
  await edit.getByRole('button', { name: 'Add a criterion' }).click();
  const mdl = edit.getByRole('group', { name: 'Criterion 4' });
  await mdl.getByLabel('Figure').selectOption({ label: 'Method detection limit (40 CFR 136)' });
  await mdl.getByLabel('Comparison').selectOption({ label: 'at most' });
  await mdl.getByLabel('Limit').fill('0.5');
  await edit.getByLabel('Check standard tolerance (± %)').fill('8');
  await shot(page, 'edit-criteria');
  await edit.getByRole('button', { name: 'Save the draft' }).click();
  await expect(edit).toBeHidden();
  const criteria = first.getByRole('table', { name: 'Acceptance criteria of version 1' });
  await expect(criteria).toContainText('Coefficient of determination R²');
  await expect(criteria).toContainText('at least 0.998');
  await expect(criteria).toContainText('Method detection limit (40 CFR 136)');
  await expect(criteria).toContainText('at most 0.5 mg/L');
  await expect(criteria).not.toContainText('calibration.r2');
  await expect(first).toContainText('± 8 %');

  // Activate version 1: it can no longer be edited.
  await first.getByRole('button', { name: 'Activate version 1' }).click();
  await page.getByRole('alertdialog').getByRole('button', { name: 'Activate' }).click();
  await expect(first).toContainText('Active');
  await expect(first.getByRole('button', { name: 'Edit criteria and settings' })).toHaveCount(0);

  // A new version copies the criteria; activating it retires version 1.
  await page.getByRole('button', { name: 'New version' }).click();
  const next = page.getByRole('dialog');
  await next.getByLabel('What changes, and why').fill('Range extended to 100 mg/L with a 1:10 dilution of the upper samples.');
  await expect(next.getByRole('group', { name: 'Criterion 4' }).getByLabel('Figure')).toHaveValue('detection.epaMdl.mdl');
  await next.getByRole('button', { name: 'Create the draft' }).click();
  await expect(next).toBeHidden();
  const second = versionCard(page, 2);
  await expect(second).toContainText('Draft');
  await expect(second).toContainText('Range extended to 100 mg/L');
  await second.getByRole('button', { name: 'Activate version 2' }).click();
  const confirm = page.getByRole('alertdialog');
  await expect(confirm).toContainText('Version 1, active until now, will be retired.');
  await confirm.getByRole('button', { name: 'Activate' }).click();
  await expect(second).toContainText('Active');
  await expect(first).toContainText('Retired');
  await shot(page, 'detail');
});
