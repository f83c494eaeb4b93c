import { expect as baseExpect, test, type Page } from '@playwright/test';
import { mainNavigation, openStep, signIn } from './support';

// Plotly and the first evaluation can take a while on a busy machine.
const expect = baseExpect.configure({ timeout: 30_000 });

const TITLE = 'Tartrazine in soft drinks: accuracy profile and uncertainty';

async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `test-output/screenshots/accuracy-${name}.png`, fullPage: true });
}

const plot = (page: Page, name: RegExp) => page.getByRole('group', { name }).locator('.main-svg').first();

test('the demo analyst reads the accuracy profile, trueness and uncertainty of the seeded study, and changes β', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  await page.getByLabel('Title contains').fill('accuracy profile');
  const row = page.getByRole('table', { name: 'Validation studies' }).getByRole('row', { name: new RegExp(TITLE) });
  await expect(row).toContainText('Draft');
  await expect(page.getByText('Studies 1–1 of 1')).toBeVisible();
  await row.getByRole('link', { name: `Resume ${TITLE}` }).click();
  await expect(page.getByRole('heading', { level: 1, name: TITLE })).toBeVisible();

  // The design as seeded: 3 levels × 3 series × 3 replicates, the reference material and the method version's options.
  await openStep(page, 'Accuracy and uncertainty', 6);
  const grid = page.getByRole('table', { name: 'Accuracy results' });
  await expect(grid.getByRole('textbox', { name: 'Level, row 27' })).toHaveValue('L3');
  await expect(page.getByLabel(/^Certified value/)).toHaveValue('7.5');
  const live = page.getByRole('complementary', { name: 'Accuracy and uncertainty as you type' });
  await expect(live).toContainText('Valid from 2.249 to 10.00 mg/L');
  await expect(live).toContainText('β = 80 %');
  await expect(plot(page, /^Accuracy profile: relative bias/)).toBeVisible({ timeout: 120_000 });
  await shot(page, 'step-6');

  // A replicate removed leaves series of unequal size: the step says why, and nothing is saved until the row is back.
  await grid.getByRole('button', { name: 'Remove row 27' }).click();
  const problems = page.getByTestId('accuracy-design-problems');
  await expect(problems).toContainText('Level L3: every series must have the same number of replicates');
  await expect(page.getByTestId('save-status')).toContainText('Not saved: complete the accuracy design', { timeout: 20_000 });
  await problems.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-output/screenshots/accuracy-step-6-incomplete.png' });
  await grid.getByRole('textbox', { name: 'Level, row 27' }).fill('L3');
  await grid.getByRole('textbox', { name: 'Series (day, analyst, instrument), row 27' }).fill('day 3');
  await grid.getByRole('textbox', { name: 'Nominal, row 27' }).fill('10');
  await grid.getByRole('textbox', { name: 'Found, row 27' }).fill('9,96');
  await expect(problems).toBeHidden();
  await expect(live).toContainText('Valid from');

  // β = 95 % widens the tolerance limits: the validity domain shrinks, at once in the browser.
  await page.getByLabel('β, expected proportion of results inside the tolerance limits').selectOption('0.95');
  await expect(live).toContainText('β = 95 %');
  await expect(live).not.toContainText('Valid from 2.249 to 10.00 mg/L');
  // A λ of 0 is refused beside the field and never sent.
  await page.getByLabel('Acceptance limits ±λ (%)').fill('0');
  await expect(page.getByText('λ lies above 0 and at most 100 %')).toBeVisible();
  await page.getByLabel('Acceptance limits ±λ (%)').fill('15');
  await expect(live).toContainText('λ = ±15 %');
  await expect(page.getByTestId('save-status')).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 'step-6-beta-95');

  // The results step: plot, validity domain, trueness in words and the uncertainty by level, confirmed by the server.
  await openStep(page, 'Results', 7);
  await expect(plot(page, /^Accuracy profile: relative bias/)).toBeVisible({ timeout: 120_000 });
  await expect(page.getByRole('table', { name: 'Accuracy profile by level' })).toContainText('L1');
  await expect(page.getByRole('table', { name: 'Validity domain of the accuracy profile' })).toContainText(
    'Lower limit of quantitation (accuracy profile)',
  );
  await expect(page.getByTestId('trueness-words')).toContainText('no bias is shown on this material');
  const uncertainty = page.getByRole('table', { name: 'Measurement uncertainty by level' });
  await expect(uncertainty).toContainText('Absolute (mg/L)');
  await expect(uncertainty).toContainText('Relative (%)');
  await expect(uncertainty).toContainText('U (k = 2)');
  await expect(page.getByRole('table', { name: 'Uncertainty of the samples read off the calibration' })).toContainText(
    'S-3140 orange soda',
  );
  await expect(page.getByTestId('server-agrees')).toBeVisible();
  await page.locator('#fig-accuracy-profile-title').scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-output/screenshots/accuracy-results-profile.png' });
  await page.locator('#fig-uncertainty-title').scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-output/screenshots/accuracy-results-uncertainty.png' });
  await shot(page, 'step-7');
  await expect(page.getByText(/accuracyProfile\.|uncertainty\.byLevel|trueness\./)).toHaveCount(0);

  // The review page shares the result displays, and lists the design as entered.
  const studyId = /\/studies\/([^/]+)\/edit/.exec(page.url())![1];
  await page.goto(`/studies/${studyId}`);
  await expect(plot(page, /^Accuracy profile: relative bias and 95 %/)).toBeVisible({ timeout: 120_000 });
  await expect(page.getByRole('table', { name: 'Measurement uncertainty by level' })).toContainText('L3');
  await expect(page.getByTestId('trueness-words')).toContainText('certified 7.5 mg/L');
  await page.getByRole('tab', { name: 'Data' }).click();
  await expect(page.getByRole('table', { name: 'Accuracy design' })).toContainText('day 3');
  await expect(page.getByRole('table', { name: 'Reference material' })).toContainText('7.5');
  await expect(page.getByText('Accuracy profile: β 95 %, acceptance limits ±15 %')).toBeVisible();
  await shot(page, 'review-data');
});
