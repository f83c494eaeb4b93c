import { expect as baseExpect, test, type Page } from '@playwright/test';
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { mainNavigation, openStep, signIn } from './support';

// Plotly is a large chunk loaded on first use, and the machine is shared: allow time.
const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(480_000);

const DYE = 'Tartrazine in soft drinks by UV-Vis spectrophotometry';
const NITRATE = 'Nitrate in drinking water by ion chromatography';
const TITLE = 'Tartrazine by UV-Vis: validation of the 1–12 mg/L range';

// Invented absorbances of the demo laboratory (about 0.0021 + 0.0532 AU per mg/L), pasted as a
// spreadsheet copies them: tab-separated, a header row, decimal commas. The second 8 mg/L reading
// (0,4512) is the one the analyst excludes: a bubble in the cell.
const STANDARDS = [
  'Concentration (mg/L)\tAbsorbance',
  '1\t0,0551',
  '1\t0,0556',
  '2\t0,1086',
  '2\t0,1079',
  '4\t0,2150',
  '4\t0,2147',
  '6\t0,3213',
  '6\t0,3220',
  '8\t0,4281',
  '8\t0,4512',
  '10\t0,5343',
  '10\t0,5352',
  '12\t0,6410',
  '12\t0,6399',
].join('\n');

const BLANKS_CSV = ['Vial,Blank (AU)', 'B1,0.0012', 'B2,0.0018', 'B3,0.0009', 'B4,0.0015', 'B5,0.0021', 'B6,0.0011', 'B7,0.0016'].join(
  '\r\n',
);

const RECOVERY = [
  'Spike\tLevel\tAdded\tFound',
  'R1\tlow\t2\t1,982',
  'R2\tlow\t2\t2,011',
  'R3\tlow\t2\t1,995',
  'R4\tmid\t6\t5,987',
  'R5\tmid\t6\t6,042',
  'R6\tmid\t6\t5,978',
  'R7\thigh\t10\t10,05',
  'R8\thigh\t10\t9,962',
  'R9\thigh\t10\t10,013',
].join('\n');

const PRECISION = [
  'Series\tResult',
  'day 1\t5,02',
  'day 1\t4,97',
  'day 1\t5,05',
  'day 2\t5,08',
  'day 2\t5,01',
  'day 2\t5,04',
  'day 3\t4,95',
  'day 3\t5,00',
  'day 3\t4,98',
].join('\n');

async function shot(page: Page, step: number) {
  // From the top, so that the sticky header does not cover the page in the full-page image.
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `test-output/screenshots/wizard-step-${step}.png`, fullPage: true });
}
const saveStatus = (page: Page) => page.getByTestId('save-status');

async function pasteInto(page: Page, text: string, rows: number) {
  await page.getByRole('button', { name: 'Paste from a spreadsheet' }).first().click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Cells to paste').fill(text);
  await dialog.getByRole('button', { name: `Put ${rows} rows in the grid` }).click();
  await expect(dialog).toBeHidden();
}

test('an analyst runs a validation study through the wizard, from paste and upload to the conclusion', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  await expect(page.getByRole('table', { name: 'Validation studies' })).toBeVisible();

  // Step 1: the method and version; a retired version would be shown, not selectable.
  await page.getByRole('link', { name: 'New study', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'New validation study' })).toBeVisible();
  const method = page.getByLabel('Method', { exact: true });
  await method.selectOption({ label: NITRATE });
  await expect(page.getByRole('radio', { name: /Version 1.*Retired/ })).toBeDisabled();
  await expect(page.getByRole('radio', { name: /Version 2.*Active/ })).toBeChecked();
  await method.selectOption({ label: DYE });
  await expect(page.getByRole('radio', { name: /Version 1/ })).toBeChecked();
  await page.getByLabel('Title').fill(TITLE);
  await page.getByLabel('Instrument').fill('UV-2 spectrophotometer, 1 cm cell');
  await shot(page, 1);
  await page.getByRole('button', { name: 'Create the study' }).click();

  // Step 2: standards pasted from a spreadsheet; the live plot follows.
  await expect(page.getByRole('heading', { level: 1, name: TITLE })).toBeVisible();
  await expect(page).toHaveURL(/\/edit\?step=2$/);
  await pasteInto(page, STANDARDS, 14);
  const standards = page.getByRole('table', { name: 'Calibration standards' });
  await expect(standards.getByRole('textbox', { name: 'Response, row 10' })).toHaveValue('0,4512');
  await expect(page.locator('aside .main-svg').first()).toBeVisible({ timeout: 120_000 });

  // A cell that is not a number is marked at the cell and not sent.
  const cell = standards.getByRole('textbox', { name: 'Concentration, row 15' });
  await cell.fill('12a');
  await expect(cell).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByText('“12a” is not a number')).toBeVisible();
  await standards.getByRole('button', { name: 'Remove row 15' }).click();

  // Exclude the 8 mg/L reading with a reason; it stays in the data.
  await standards
    .getByRole('row')
    .filter({ has: page.getByRole('textbox', { name: 'Response, row 10' }) })
    .getByRole('button', { name: 'Exclude…' })
    .click();
  const exclusion = page.getByRole('dialog');
  await exclusion.getByRole('button', { name: 'Exclude the standard' }).click();
  await expect(exclusion.getByText('Say why the standard is excluded')).toBeVisible();
  await exclusion.getByLabel('Reason').fill('Bubble in the cell, seen after the reading');
  await exclusion.getByRole('button', { name: 'Exclude the standard' }).click();
  await expect(standards.getByText('Excluded: Bubble in the cell, seen after the reading')).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Calibration as you type' })).toContainText('13 (1 excluded)');
  await expect(saveStatus(page)).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 2);

  // Step 3: blanks uploaded as CSV, previewed and mapped by the server, then imported.
  await openStep(page, 'Blanks and low-level spikes', 3);
  const folder = join(tmpdir(), `meritline-wizard-${Date.now()}`);
  mkdirSync(folder, { recursive: true });
  const csv = join(folder, 'blanks-uv2.csv');
  writeFileSync(csv, BLANKS_CSV);
  await page.getByRole('button', { name: 'Upload CSV or Excel' }).first().click();
  const upload = page.getByRole('dialog');
  await upload.getByLabel('File to upload').setInputFiles(csv);
  await expect(upload.getByLabel('Blank response')).toHaveValue('Blank (AU)');
  await expect(upload.getByText('7 rows read')).toBeVisible();
  await expect(upload.getByRole('table', { name: 'Rows found in the file' })).toContainText('0.0021');
  await upload.getByRole('button', { name: 'Import 7 rows' }).click();
  await expect(upload).toBeHidden();
  const blanks = page.getByRole('table', { name: 'Blanks' });
  await expect(blanks.getByRole('textbox', { name: 'Blank response, row 7' })).toHaveValue('0.0016');
  await expect(page.getByRole('complementary', { name: 'Detection limits as you type' })).toContainText('LOD / LOQ from the blank SD');
  // A blank read after a top standard is excluded with a reason, the same way as a standard.
  await blanks
    .getByRole('row')
    .filter({ has: page.getByRole('textbox', { name: 'Blank response, row 7' }) })
    .getByRole('button', { name: 'Exclude…' })
    .click();
  const blankExclusion = page.getByRole('dialog');
  await blankExclusion.getByLabel('Reason').fill('Carry-over from the top standard');
  await blankExclusion.getByRole('button', { name: 'Exclude the blank' }).click();
  await expect(blanks.getByText('Excluded: Carry-over from the top standard')).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Detection limits as you type' })).toContainText('6 (1 excluded)');
  await expect(saveStatus(page)).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 3);

  // Steps 4 and 5: recovery and precision, pasted.
  await openStep(page, 'Recovery', 4);
  await pasteInto(page, RECOVERY, 9);
  await expect(page.getByRole('complementary', { name: 'Recovery as you type' })).toContainText('All levels · 9 spikes');
  await shot(page, 4);
  await openStep(page, 'Precision', 5);
  await pasteInto(page, PRECISION, 9);
  await expect(page.getByRole('complementary', { name: 'Precision as you type' })).toContainText('3 / 9');
  await expect(saveStatus(page)).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 5);

  // Step 7: every figure, the plots, the verdict; the server confirms the browser's figures.
  await openStep(page, 'Results', 7);
  await expect(page.getByTestId('verdict-summary')).toContainText('acceptance criteria');
  await expect(
    page
      .getByRole('group', { name: /^Calibration plot/ })
      .locator('.main-svg')
      .first(),
  ).toBeVisible({ timeout: 120_000 });
  await expect(
    page
      .getByRole('group', { name: /^Residual plot/ })
      .locator('.main-svg')
      .first(),
  ).toBeVisible();
  await expect(page.getByRole('table', { name: 'Detection and quantitation limits' })).toContainText('ICH Q2(R2), SD of the blanks');
  await expect(page.getByRole('table', { name: 'Recovery by level' })).toContainText('All levels');
  await expect(page.getByRole('table', { name: 'One-way analysis of variance' })).toContainText('Between series');
  await expect(page.getByRole('table', { name: 'Standards and their back-calculated concentrations' })).toContainText(
    'Excluded: Bubble in the cell, seen after the reading',
  );
  await expect(page.getByTestId('server-agrees')).toBeVisible();
  // Switching the weighting recomputes in the browser at once.
  await page.getByLabel('Weighting').selectOption('1/x');
  await expect(page.getByRole('table', { name: 'Calibration line' })).toContainText('Weighting 1/x');
  await page.getByLabel('Weighting').selectOption('none');
  await expect(saveStatus(page)).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 6);

  // Step 8: the conclusion, with the caution; the draft saves itself.
  await openStep(page, 'Conclusion', 8);
  await page
    .getByLabel('Your conclusion')
    .fill('Linear from 1 to 12 mg/L after excluding one reading with a bubble; recovery and precision meet the assay criteria.');
  await expect(page.getByText('does not replace')).toBeVisible();
  await expect(saveStatus(page)).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 7);

  // The study can be resumed from the list, with everything saved.
  await page.getByRole('link', { name: '← All studies' }).click();
  await page.getByLabel('Title contains').fill('Tartrazine by UV-Vis');
  const row = page.getByRole('table', { name: 'Validation studies' }).getByRole('row', { name: new RegExp(TITLE) });
  await expect(row).toContainText('Draft');
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: 'test-output/screenshots/studies-list.png', fullPage: true });
  await row.getByRole('link', { name: `Resume ${TITLE}` }).click();
  await expect(
    page.getByRole('table', { name: 'Calibration standards' }).getByText('Excluded: Bubble in the cell, seen after the reading'),
  ).toBeVisible();
  await openStep(page, 'Conclusion', 8);
  await expect(page.getByLabel('Your conclusion')).toHaveValue(/Linear from 1 to 12 mg\/L/);
});
