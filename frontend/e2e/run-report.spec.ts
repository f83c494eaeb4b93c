import { expect as baseExpect, test, type Page } from '@playwright/test';
import { spawnSync } from 'node:child_process';
import { DEMO_PASSWORD, signIn, signOut } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(240_000);

const NITRATE = 'Nitrate in drinking water by ion chromatography';
const OUT = 'test-output/screenshots';

// An invented export on the demo nitrate line (about 0.0031 + 0.1523 µS·min per mg/L), in a column layout Meritline has not seen.
const EXPORT = [
  'Inj;Sample Name;Type;Amount;Dil.;Area;Operator',
  '1;Cal 1;Std;1;;0,1552;AR',
  '2;Cal 50;Std;50;;7,619;AR',
  '3;CCV 10;CCV;10;;1,527;AR',
  '4;MB-1;Blank;;;0,0035;AR',
  '5;QC 20;QC;20;;3,052;AR',
  '6;W-3101 tap water, Riverside;Sample;;;1,893;AR',
  '7;W-3101 tap water, Riverside;Sample;;;1,897;AR',
  '8;W-3102 well, Oak Farm;Sample;;2;4,709;AR',
].join('\n');

async function signInAs(page: Page, email: string) {
  await signIn(page, email);
  await expect(page.getByTestId('user-menu')).toBeVisible();
}

async function shot(page: Page, name: string) {
  const viewport = page.viewportSize()!;
  const height = await page.evaluate(() => document.documentElement.scrollHeight);
  await page.setViewportSize({ width: viewport.width, height: Math.min(4000, Math.max(viewport.height, height)) });
  await page.waitForTimeout(300);
  await page.screenshot({ path: `${OUT}/run-report-${name}.png` });
  await page.setViewportSize(viewport);
}

async function sign(page: Page, button: string, confirm: string) {
  await page.getByRole('button', { name: button, exact: true }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Your password').fill(DEMO_PASSWORD);
  await dialog.getByRole('button', { name: confirm }).click();
  await expect(dialog).toBeHidden();
}

test('an analyst imports an instrument export with a new layout, the reviewer releases the run, the signed results report is valid and the trend page shows the drift', async ({
  page,
}) => {
  await signInAs(page, 'analyst@meritline.test');
  await page.goto('/runs/new');
  const select = page.getByLabel('Method version');
  await select.selectOption((await select.locator('option', { hasText: `${NITRATE}, version 2` }).getAttribute('value'))!);
  await page.getByLabel('Title').fill('Nitrate, batch from the instrument export');
  await page.getByText('Two points', { exact: true }).click();

  await page
    .getByLabel('Instrument export (CSV or XLSX)')
    .setInputFiles({ name: 'export.csv', mimeType: 'text/csv', buffer: Buffer.from(EXPORT) });
  const importer = page.getByRole('region', { name: 'Instrument export' });
  await expect(importer.getByText('Which column of this file holds what?')).toBeVisible();
  await expect(importer.getByLabel('Response')).toHaveValue('Area');
  await expect(importer.getByLabel('Sample name')).toHaveValue('Sample Name');
  await shot(page, '1-mapping');
  await importer.getByRole('button', { name: 'Save the mapping and read the file' }).click();
  await expect(
    importer.getByText(/Read 8 rows: 2 standard readings, 1 check standard, 2 samples, 1 method blank and 1 QC sample/),
  ).toBeVisible();
  await expect(page.getByRole('textbox', { name: 'Samples', exact: true })).toHaveValue(/W-3102 well, Oak Farm\t2\t4\.709/);

  const preview = page.getByRole('region', { name: 'Preview' });
  await expect(preview.getByText('The run would be accepted')).toBeVisible();
  await expect(preview.getByRole('table', { name: 'Method blanks' })).toContainText('Below the limit');
  await expect(preview.getByRole('table', { name: 'QC samples' })).toContainText('Within the window');
  await shot(page, '2-imported');
  await page.getByRole('button', { name: 'Save run' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Nitrate, batch from the instrument export' })).toBeVisible();
  const runUrl = page.url();
  await sign(page, 'Submit for release', 'Sign and submit');
  await expect(page.getByText('Submitted for review', { exact: true }).first()).toBeVisible();
  await signOut(page);

  await signInAs(page, 'reviewer@meritline.test');
  await page.goto(runUrl);
  await sign(page, 'Release', 'Sign and release');
  await expect(page.getByText('Reviewed and released', { exact: true }).first()).toBeVisible();
  await shot(page, '3-released');
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Signed results report' }).click();
  const file = `${OUT}/run-results-report.pdf`;
  await (await download).saveAs(file);
  const pdfsig = spawnSync('pdfsig', [file], { encoding: 'utf8' });
  expect(`${pdfsig.stdout}${pdfsig.stderr}`).toContain('Signature is Valid.');
  const text = spawnSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).stdout;
  expect(text).toContain('W-3102 well, Oak Farm');
  expect(text).toMatch(/Priya Nair\s+Reviewer\s+Reviewed the run and released its results/);
  spawnSync('pdftoppm', ['-png', '-r', '70', file, `${OUT}/run-report-pdf`]);

  await page.getByRole('link', { name: 'control charts of this version' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Control charts' })).toBeVisible();
  const signals = page.getByRole('table', { name: 'Signals' });
  await expect(signals).toContainText('seven points in a row on one side of the mean');
  await expect(
    page
      .getByRole('group', { name: /^Calibration slope control chart/ })
      .locator('.main-svg')
      .first(),
  ).toBeVisible({ timeout: 45_000 });
  await shot(page, '4-trend');
  const trendUrl = page.url();
  await signOut(page);

  // The quality manager narrows the baseline; the choice is saved (and audited) and the limits follow it.
  await signInAs(page, 'quality@meritline.test');
  await page.goto(trendUrl);
  await page.getByRole('button', { name: 'Change the baseline' }).click();
  const picker = page.getByRole('region', { name: 'Choose the baseline' });
  await expect(picker.getByRole('checkbox')).not.toHaveCount(0);
  await picker.getByRole('checkbox').first().uncheck({ force: true });
  await picker.getByLabel('Why these runs').fill('The first run was made before the suppressor was replaced.');
  await shot(page, '5-baseline');
  await picker.getByRole('button', { name: /^Save the baseline/ }).click();
  await expect(page.getByText('Baseline saved')).toBeVisible();
  await expect(page.getByText(/The first run was made before the suppressor was replaced/)).toBeVisible();
});
