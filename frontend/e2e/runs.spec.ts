import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { DEMO_PASSWORD, mainNavigation, signIn } from './support';

/** Results leave the laboratory only from a released run: the analyst submits it and the demo reviewer releases it. */
async function release(request: APIRequestContext, runId: string) {
  const sign = async (email: string, action: 'submit' | 'release') => {
    const login = await request.post('/api/auth/login', { data: { email, password: DEMO_PASSWORD } });
    const headers = { Authorization: `Bearer ${(await login.json()).accessToken}` };
    const review = await (await request.get(`/api/runs/${runId}/review`, { headers })).json();
    const answer = await request.post(`/api/runs/${runId}/${action}`, {
      headers,
      data: { password: DEMO_PASSWORD, version: review.lockVersion },
    });
    expect(answer.status(), await answer.text()).toBeLessThan(300);
  };
  await sign('analyst@meritline.test', 'submit');
  await sign('reviewer@meritline.test', 'release');
}

const NITRATE = 'Nitrate in drinking water by ion chromatography';
/** The whole page in one frame: a tall viewport instead of a stitched full-page capture, which repeats the fixed shell. */
async function shot(page: Page, name: string) {
  const viewport = page.viewportSize()!;
  const height = await page.evaluate(() => document.documentElement.scrollHeight);
  await page.setViewportSize({ width: viewport.width, height: Math.max(viewport.height, height) });
  await page.waitForTimeout(300);
  await page.screenshot({ path: `test-output/screenshots/run-${name}.png` });
  await page.setViewportSize(viewport);
}

// Invented responses on the demo nitrate line (about 0.0031 + 0.1523 µS·min per mg/L).
const STANDARDS = 'Concentration\tResponse\n1\t0.1552\n50\t7.619';
const CHECKS = 'CCV 10 mg/L\t10\t1.527\nLow check 1 mg/L\t1\t0.1549';
const SAMPLES = [
  'W-2811 tap water, Riverside\t1\t1.893\t1.897',
  'W-2812 well, Oak Farm\t\t4.252\t4.247',
  'W-2813 tap water, Hill Road\t1\t0.0489\t0.0502',
  'W-2814 well, Marsh Lane\t2\t4.709\t4.716',
].join('\n');

async function chooseVersion(page: Page) {
  const select = page.getByLabel('Method version');
  const value = await select.locator('option', { hasText: `${NITRATE}, version 2` }).getAttribute('value');
  await select.selectOption(value!);
}

const plot = (page: Page) => page.getByRole('group', { name: /^Run calibration/ });
// Plotly is a large chunk loaded on first use: allow it time on a busy machine.
const PLOT_TIMEOUT = { timeout: 45_000 };

test('an analyst calibrates a run with two points, then with one point, and exports the results', async ({ page, request }) => {
  test.slow();
  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Routine batches' }).click();
  const runs = page.getByRole('table', { name: 'Routine runs' });
  await expect(runs.getByRole('row').filter({ hasText: 'Rejected' })).toHaveCount(1);
  await shot(page, 'list');

  // The preview runs the shared calculation in the browser: typing sends no run to the server.
  const previewRequests: string[] = [];
  page.on('request', (request) => {
    if (request.url().includes('/api/runs/preview')) previewRequests.push(request.url());
  });
  await page.getByRole('link', { name: 'New run' }).click();
  await chooseVersion(page);
  await expect(page.getByTestId('validation-summary')).toContainText('Nitrate by IC after the column change');
  await page.getByLabel('Title').fill('Nitrate in drinking water, two-point batch');
  await page.getByText('Two points', { exact: true }).click();
  await page.getByRole('textbox', { name: 'Standards', exact: true }).fill(STANDARDS);
  await page.getByRole('textbox', { name: 'Check standards', exact: true }).fill(CHECKS);
  await page.getByRole('textbox', { name: 'Samples', exact: true }).fill(SAMPLES);

  const preview = page.getByRole('region', { name: 'Preview' });
  await expect(preview.getByText('The run would be accepted')).toBeVisible();
  await expect(plot(page).locator('.main-svg').first()).toBeVisible(PLOT_TIMEOUT);
  const samples = preview.getByRole('table', { name: 'Sample results' });
  await expect(samples.getByRole('row', { name: /W-2811/ })).toContainText('mg/L');
  await expect(samples.getByRole('row', { name: /W-2813/ })).toContainText('below the LOQ');
  await shot(page, 'new-two-point');
  expect(previewRequests).toEqual([]);

  await page.getByRole('button', { name: 'Save run' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Nitrate in drinking water, two-point batch' })).toBeVisible();
  await expect(page.getByText('The run is accepted')).toBeVisible();
  await expect(plot(page).locator('.main-svg').first()).toBeVisible(PLOT_TIMEOUT);
  // Each sample is drawn where the table reads it: one diamond per sample on the line.
  await expect(plot(page).locator('.scatterlayer .trace').last().locator('.point')).toHaveCount(4);
  await shot(page, 'detail-two-point');
  // Every column of the results, remarks included, fits the page: nothing to scroll sideways for.
  const results = page.getByRole('table', { name: 'Sample results' });
  await expect(results.getByRole('cell', { name: /below the LOQ/ })).toBeVisible();
  expect(await results.evaluate((table) => table.parentElement!.scrollWidth <= table.parentElement!.clientWidth)).toBe(true);

  await page.getByRole('link', { name: 'New run from this one' }).click();
  await expect(page.getByRole('textbox', { name: 'Samples', exact: true })).toHaveValue(/W-2814/);
  await page.getByLabel('Title').fill('Nitrate in drinking water, one-point batch');
  await page.getByText('One point', { exact: true }).click();
  const bias = page.getByTestId('one-point-bias');
  await expect(bias).toBeVisible();
  await expect(bias.getByRole('row', { name: /W-2811/ })).toBeVisible();
  await expect(plot(page).getByText('Validation line through the same standard')).toBeVisible();
  await shot(page, 'new-one-point');

  await page.getByRole('button', { name: 'Save run' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Nitrate in drinking water, one-point batch' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'What the one-point line costs' })).toBeVisible();
  await shot(page, 'detail-one-point');

  await release(request, page.url().split('/').pop()!);
  await page.reload();
  await page.getByRole('button', { name: 'Export' }).click();
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('menuitem', { name: 'Results as CSV' }).click()]);
  const csv = readFileSync((await download.path())!, 'utf8');
  expect(csv).toContain('One-point bias (mg/L)');
  expect(csv).toMatch(/W-2811 tap water, Riverside/);
  expect(download.suggestedFilename()).toMatch(/\.csv$/);

  await page.getByRole('link', { name: 'control charts of this version' }).click();
  await expect(
    page
      .getByRole('group', { name: /^Calibration slope control chart/ })
      .locator('.main-svg')
      .first(),
  ).toBeVisible(PLOT_TIMEOUT);
  await expect(page.getByRole('table', { name: 'Signals' })).toBeVisible();
  await shot(page, 'control-chart');
});

test('calibrations the validation does not justify are shown disabled, with the reason', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  await expect(page.getByTestId('user-menu')).toBeVisible();
  await page.goto('/runs/new');
  // The retired first nitrate version cannot take runs, so it is not offered at all.
  await expect(page.getByLabel('Method version').locator('option', { hasText: `${NITRATE}, version 1` })).toHaveCount(0);
  await chooseVersion(page);
  await expect(page.getByText('Straight-line regression', { exact: true })).toBeVisible();
  await expect(page.getByTestId('model-reason-quadratic')).toContainText('quadratic calibration was not validated');
  await shot(page, 'model-choices');
});
