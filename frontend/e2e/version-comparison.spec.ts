import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { DEMO_PASSWORD, mainNavigation, signIn } from './support';

const CAFFEINE = 'Caffeine in energy drinks by HPLC-UV';
// Plotly is a large chunk loaded on first use: allow it time on a busy machine.
const PLOT_TIMEOUT = { timeout: 45_000 };
test.setTimeout(240_000);

/** The whole page in one frame: a tall viewport instead of a stitched full-page capture, which repeats the fixed shell. */
async function shot(page: Page, name: string) {
  const viewport = page.viewportSize()!;
  const height = await page.evaluate(() => document.documentElement.scrollHeight);
  await page.setViewportSize({ width: viewport.width, height: Math.max(viewport.height, height) });
  await page.waitForTimeout(300);
  await page.screenshot({ path: `test-output/screenshots/version-comparison-${name}.png` });
  await page.setViewportSize(viewport);
}

const testCard = (page: Page, title: string) =>
  page.getByTestId('comparison-test').filter({ has: page.getByRole('heading', { name: title }) });

test('the quality manager compares the last two versions of the demo caffeine method and reads the verdicts', async ({ page, baseURL }) => {
  const outside: string[] = [];
  const origin = new URL(baseURL!).origin;
  page.on('request', (request) => {
    const url = new URL(request.url());
    if (!['data:', 'blob:'].includes(url.protocol) && url.origin !== origin) outside.push(request.url());
  });

  await signIn(page, 'quality@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Methods' }).click();
  await page.getByRole('link', { name: CAFFEINE }).click();
  await expect(page.getByRole('heading', { name: CAFFEINE })).toBeVisible();
  await page.getByRole('link', { name: 'Compare versions' }).click();

  await expect(page.getByLabel('Method')).toHaveValue(/.+/);
  await expect(page.getByLabel('Earlier version').locator('option:checked')).toHaveText('Version 2 (retired)');
  await expect(page.getByLabel('Later version').locator('option:checked')).toHaveText('Version 3 (active)');

  const changes = page.getByRole('table', { name: 'What changed between the versions' });
  await expect(changes.getByRole('row').filter({ hasText: 'Kind of change' })).toContainText('Instrument');
  await expect(changes.getByRole('row').filter({ hasText: 'Instrument' }).last()).toContainText('diode-array detector');

  await expect(testCard(page, 'Slope (sensitivity)')).toContainText('significantly different');
  await expect(testCard(page, 'Slope (sensitivity)')).toContainText('% sensitivity');
  await expect(testCard(page, 'Mean recovery, equivalence (two one-sided tests)')).toContainText('equivalent within the margin');
  await expect(testCard(page, 'Intermediate precision standard deviation')).toContainText(/Satterthwaite/);
  await expect(page.getByRole('region', { name: 'Statistical tests' })).not.toContainText(/calibration\.|precision\.|no-difference/);

  const figures = page.getByRole('table', { name: 'Figures of both versions' });
  await expect(figures.getByRole('row').filter({ hasText: 'Mean recovery, all levels' })).toContainText('from 98 to 102 %');

  await expect(
    page
      .getByRole('group', { name: /^Slope of every version/ })
      .locator('.main-svg')
      .first(),
  ).toBeVisible(PLOT_TIMEOUT);
  await expect(
    page
      .getByRole('group', { name: /^Mean recovery of every version/ })
      .locator('.main-svg')
      .first(),
  ).toBeVisible(PLOT_TIMEOUT);
  await page.screenshot({ path: 'test-output/screenshots/version-comparison-top.png' });
  await shot(page, 'last-two');
  for (const section of ['What changed', 'Statistical tests', 'Figures', 'Over every version']) {
    await page
      .getByRole('region', { name: section })
      .screenshot({ path: `test-output/screenshots/version-comparison-${section.toLowerCase().replaceAll(' ', '-')}.png` });
  }

  await page.getByRole('button', { name: 'Sign the change assessment' }).click();
  const dialog = page.getByRole('dialog');
  await expect(dialog).toContainText('Change assessed');
  await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
  await dialog.getByLabel('Your assessment').fill('Short.');
  await dialog.getByRole('button', { name: 'Sign and download' }).click();
  await expect(dialog).toContainText('at least 20 characters');
  await dialog
    .getByLabel('Your assessment')
    .fill('The new detector is about 15 % more sensitive; recovery stays equivalent and precision unchanged. Fit for use.');
  await page.screenshot({ path: 'test-output/screenshots/version-comparison-sign.png' });
  const [download] = await Promise.all([page.waitForEvent('download'), dialog.getByRole('button', { name: 'Sign and download' }).click()]);
  await expect(dialog).toBeHidden();
  const pdf = 'test-output/screenshots/version-comparison-assessment.pdf';
  await download.saveAs(pdf);
  expect(readFileSync(pdf).subarray(0, 5).toString()).toBe('%PDF-');

  await page.getByLabel('Earlier version').selectOption({ label: 'Version 1 (retired)' });
  await page.getByLabel('Later version').selectOption({ label: 'Version 2 (retired)' });
  await expect(testCard(page, 'Slope (sensitivity)')).toContainText('no significant difference');
  await shot(page, 'first-two');
  await page
    .getByRole('region', { name: 'Statistical tests' })
    .screenshot({ path: 'test-output/screenshots/version-comparison-first-two-tests.png' });

  await page.goto('/verify');
  await page.getByLabel('Report to verify (PDF)').setInputFiles(pdf);
  await expect(page.getByText(/^Valid:/)).toBeVisible();
  await expect(page.getByText('Change assessment of version 3 against version 2')).toBeVisible();
  await page.screenshot({ path: 'test-output/screenshots/version-comparison-verified.png' });
  expect(outside).toEqual([]);
});
