import { expect, test, type Page } from '@playwright/test';
import { DEMO_ACCOUNTS, mainNavigation, signIn, signOut } from './support';

// Plotly is a large chunk loaded on first use: allow it time on a busy machine.
const PLOT_TIMEOUT = { timeout: 45_000 };
test.setTimeout(240_000);

/** Records every request the page makes to a host other than the app's own. */
function watchOutsideRequests(page: Page, appOrigin: string): string[] {
  const outside: string[] = [];
  page.on('request', (request) => {
    const url = new URL(request.url());
    if (url.protocol === 'data:' || url.protocol === 'blob:') return;
    if (url.origin !== appOrigin) outside.push(request.url());
  });
  return outside;
}

/** Waits for the plot to be drawn, then checks it offers nothing that leaves the app. */
async function expectPlotStaysInside(page: Page, name: RegExp) {
  const plot = page.getByRole('group', { name });
  await expect(plot.locator('.main-svg').first()).toBeVisible(PLOT_TIMEOUT);
  await plot.hover();
  const origin = new URL(page.url()).origin;
  const hrefs = await plot.locator('a[href]').evaluateAll((anchors) => anchors.map((a) => (a as HTMLAnchorElement).href));
  expect(hrefs.filter((href) => new URL(href).origin !== origin)).toEqual([]);
  await expect(plot.locator('[data-title*="Share" i], [data-title*="Cloud" i], [data-title*="Chart Studio" i], .plotlyjsicon')).toHaveCount(
    0,
  );
}

test('the study results, a run and the control chart draw their plots without asking any outside host', async ({ page, baseURL }) => {
  const outside = watchOutsideRequests(page, new URL(baseURL!).origin);

  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  const studies = page.getByRole('table', { name: 'Validation studies' });
  // Other specs add studies before this one: filter as an analyst would, so the study is on the first page.
  await page.getByLabel('Status', { exact: true }).selectOption('approved');
  await studies.getByRole('row').filter({ hasText: 'Approved' }).first().getByRole('link').first().click();
  await expectPlotStaysInside(page, /^Calibration plot/);
  await expectPlotStaysInside(page, /^Residual plot/);

  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  await page.getByRole('searchbox', { name: 'Title contains' }).fill('accuracy profile and uncertainty');
  await studies.getByRole('link', { name: 'Resume Tartrazine in soft drinks: accuracy profile and uncertainty' }).click();
  await page
    .getByRole('navigation', { name: 'Study steps' })
    .getByRole('link', { name: /Results/ })
    .click();
  await expectPlotStaysInside(page, /^Accuracy profile/);

  await mainNavigation(page).getByRole('link', { name: 'Routine batches' }).click();
  const runs = page.getByRole('table', { name: 'Routine runs' });
  await runs.getByRole('row').filter({ hasText: 'Accepted' }).first().getByRole('link').first().click();
  await expectPlotStaysInside(page, /^Run calibration/);

  await page.getByRole('link', { name: 'control charts of this version' }).click();
  await expectPlotStaysInside(page, /^Calibration slope control chart/);

  expect(outside).toEqual([]);
});

test("every page of every role's navigation loads and links without reaching an outside host", async ({ page, baseURL }) => {
  const origin = new URL(baseURL!).origin;
  const outside = watchOutsideRequests(page, origin);
  const outsideLinks: string[] = [];

  for (const account of DEMO_ACCOUNTS) {
    await signIn(page, account.email);
    for (const entry of account.entries) {
      await mainNavigation(page).getByRole('link', { name: entry, exact: true }).click();
      await expect(page.getByRole('main')).toBeVisible();
      await page.waitForLoadState('networkidle');
      const hrefs = await page
        .locator('a[href], link[href], [src]')
        .evaluateAll((nodes) => nodes.map((node) => (node as HTMLAnchorElement).href || (node as HTMLImageElement).src).filter(Boolean));
      outsideLinks.push(
        ...hrefs.filter((href) => /^https?:/.test(href) && new URL(href).origin !== origin).map((href) => `${entry}: ${href}`),
      );
    }
    await signOut(page);
  }

  expect(outsideLinks).toEqual([]);
  expect(outside).toEqual([]);
});
