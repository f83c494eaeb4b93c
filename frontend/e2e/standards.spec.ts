import { expect as baseExpect, test, type Page } from '@playwright/test';
import { apiGet, mainNavigation, signIn, signOut } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(240_000);

async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: `test-output/screenshots/standards-${name}.png`, fullPage: true });
}

/** The smallest file that begins as a PDF does; the server checks the signature. */
const CERTIFICATE = Buffer.from('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n', 'latin1');

test('the analyst prepares a stock and two dilutions from a seeded material and saves them', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  // The overview warns of the demo material that expires soon.
  await expect(page.getByText('Reference materials expiring within 30 days')).toBeVisible();
  await expect(page.getByText(/Sodium nitrate, dried, lot CRM-NO3-2207: expires in \d+ days/)).toBeVisible();
  await shot(page, 'overview');

  await mainNavigation(page).getByRole('link', { name: 'Standard preparations' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Standard preparations' })).toBeVisible();
  await page.getByRole('link', { name: 'Prepare standards' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Prepare standards' })).toBeVisible();

  await page.getByLabel('Name of the preparation').fill('Cadmium stock and two working standards');
  await page.getByLabel('Reference material weighed').selectOption({ label: 'Cadmium granules, 99.99 %, lot NF-CD-0917' });
  // Only materials in use and certified for purity are offered.
  await expect(page.getByLabel('Reference material weighed').locator('option')).toHaveText([
    'Choose a material…',
    'Cadmium granules, 99.99 %, lot NF-CD-0917',
    'Sodium nitrate, dried, lot CRM-NO3-2207',
  ]);

  const stock = page.getByRole('group', { name: 'Stock solution' });
  await stock.getByLabel('Mass weighed (mg)').fill('100.28');
  await stock.getByLabel('u of the mass (mg)').fill('0.05');
  await stock.getByLabel('Volume of the flask (mL)').fill('0');
  await stock.getByLabel('Flask tolerance ± (mL)').fill('0.1');
  await stock.getByLabel('Filling SD (mL)').fill('0.02');
  await stock.getByLabel('Temperature ± (°C)').fill('4');

  const first = page.getByRole('group', { name: 'Dilution 1' });
  await first.getByLabel('Aliquot (mL)').fill('1');
  await first.getByLabel('Pipette tolerance ± (mL)').fill('0.008');
  await first.getByLabel('Final volume (mL)').fill('100');
  await first.getByLabel('Flask tolerance ± (mL)').fill('0.1');

  // A flask of 0 mL is refused with the field in words.
  await expect(page.getByRole('alert')).toContainText('Volume of the flask must be greater than zero');
  await stock.getByLabel('Volume of the flask (mL)').fill('100');

  await page.getByRole('button', { name: 'Add a dilution' }).click();
  const second = page.getByRole('group', { name: 'Dilution 2' });
  await second.getByLabel('Aliquot (mL)').fill('5');
  await second.getByLabel('Pipette tolerance ± (mL)').fill('0.015');
  await second.getByLabel('Final volume (mL)').fill('50');
  await second.getByLabel('Flask tolerance ± (mL)').fill('0.06');

  const solutions = page.getByRole('table', { name: 'Concentrations of the solutions' });
  await expect(solutions.getByRole('row', { name: /^Dilution 2/ })).toBeVisible();
  // 1000 · 100.28 mg · 0.99992 / 100 mL, the stock; then 1/100 and 5/50 of it.
  await expect(solutions.getByRole('row', { name: /^Stock/ })).toContainText('1002.72 mg/L, u = 0.84 mg/L');
  await expect(solutions.getByRole('row', { name: /^Dilution 1/ })).toContainText('10.027');
  await expect(solutions.getByRole('row', { name: /^Dilution 2/ })).toContainText('1.0027');
  const budget = page.getByRole('table', { name: 'Uncertainty budget of the stock solution' });
  await expect(budget).toContainText('Mass weighed');
  await expect(budget).toContainText('Volume: temperature');
  await shot(page, 'preparation');

  await page.getByRole('button', { name: 'Save the preparation' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Standard preparations' })).toBeVisible();
  const saved = page
    .getByRole('table', { name: 'Standard preparations' })
    .getByRole('row', { name: /Cadmium stock and two working standards/ });
  await expect(saved).toContainText('Cadmium granules, 99.99 %, lot NF-CD-0917');
  await expect(saved).toContainText('1002.72 mg/L, u = 0.84 mg/L');
  await expect(saved).toContainText('Alma Ruiz');
  await shot(page, 'preparations');
  await signOut(page);
});

test("the analyst takes a draft study's standards from the saved preparation with the mouse", async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  await page.getByRole('link', { name: 'New study', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'New validation study' })).toBeVisible();
  await page.getByLabel('Method', { exact: true }).selectOption({ label: 'Nitrate in drinking water by ion chromatography' });
  await page.getByLabel('Title').fill('Nitrate line from the prepared working standards');
  await page.getByRole('button', { name: 'Create the study' }).click();
  await expect(page).toHaveURL(/\/edit\?step=2$/);

  await page.getByRole('button', { name: 'Take concentrations from a preparation' }).click();
  const dialog = page.getByRole('dialog');
  const offered = dialog.getByRole('table', { name: 'Saved preparations' });
  const cadmium = offered.getByRole('row', { name: /Cadmium stock and two working standards/ });
  await expect(cadmium).toContainText('Cadmium granules, 99.99 %, lot NF-CD-0917');
  await expect(cadmium).toContainText('10.027');
  await cadmium.getByRole('button', { name: 'Choose Cadmium stock and two working standards' }).click();
  await shot(page, 'take-from-preparation');
  await dialog.getByRole('button', { name: 'Put 2 standards in the grid' }).click();
  await expect(dialog).toBeHidden();

  const standards = page.getByRole('table', { name: 'Calibration standards' });
  await expect(standards.getByRole('textbox', { name: 'Concentration, row 1' })).toHaveValue(/^10\.027/);
  await expect(standards.getByRole('textbox', { name: 'Concentration, row 2' })).toHaveValue(/^1\.0027/);
  await expect(standards.getByText('From Cadmium stock and two working standards')).toHaveCount(2);
  await standards.getByRole('textbox', { name: 'Response, row 1' }).fill('0.8123');
  await standards.getByRole('textbox', { name: 'Response, row 2' }).fill('0.0815');
  await expect(page.getByTestId('save-status')).toContainText('Saved', { timeout: 20_000 });
  await shot(page, 'standards-from-preparation');

  const studyId = /\/studies\/([^/]+)\/edit/.exec(page.url())?.[1];
  const study = await apiGet<{ data: { standards: { x: number; y: number; preparationId?: string }[] } }>(page, `/studies/${studyId}`);
  const preparations = await apiGet<{ id: string; name: string }[]>(page, '/preparations');
  const preparationId = preparations.find((p) => p.name === 'Cadmium stock and two working standards')?.id;
  expect(preparationId).toBeTruthy();
  expect(study.data.standards).toHaveLength(2);
  expect(study.data.standards.map((s) => s.preparationId)).toEqual([preparationId, preparationId]);
  expect(study.data.standards.map((s) => s.y)).toEqual([0.8123, 0.0815]);
  await signOut(page);
});

test('the quality manager registers a material and stores its certificate', async ({ page }) => {
  await signIn(page, 'quality@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Reference materials' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Reference materials' })).toBeVisible();
  const table = page.getByRole('table', { name: 'Reference materials' });
  await expect(table.getByRole('row', { name: /Sodium nitrate, dried/ })).toContainText('Expires soon');
  await expect(table.getByRole('row', { name: /Lead solution/ })).toContainText('1001.4 ± 2.6 mg/L (k\u00a0=\u00a02)');
  await shot(page, 'register');

  await page.getByRole('button', { name: 'Register a material' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Material', { exact: false }).first().fill('Potassium dihydrogen phosphate, dried');
  await dialog.getByLabel('Analyte').fill('Phosphate');
  await dialog.getByLabel('Supplier').fill('Northfield Fine Chemicals');
  await dialog.getByLabel('Lot').fill('NF-KP-5521');
  await dialog.getByLabel('Certificate number').fill('NFC-23/0912');
  await expect(dialog.getByLabel('The certificate states').locator('option')).toHaveText([
    'An expanded uncertainty U with a coverage factor k',
    'A standard uncertainty u',
  ]);
  await dialog.getByLabel('The certificate states').selectOption({ label: 'A standard uncertainty u' });
  await expect(dialog.getByLabel('Standard uncertainty u (g/g)')).toBeVisible();
  await dialog.screenshot({ path: 'test-output/screenshots/standards-register-dialog-certificate.png' });
  await dialog.getByLabel('The certificate states').selectOption({ label: 'An expanded uncertainty U with a coverage factor k' });
  await dialog.getByLabel('Purity (mass fraction, g/g)').fill('99.95');
  await dialog.getByLabel('Expanded uncertainty U (g/g)').fill('0.0003');
  await dialog.getByLabel('Received').fill('2026-10-01');
  await dialog.getByLabel('Use until').fill('2028-09-30');
  await dialog.getByLabel('Storage').fill('Desiccator, room temperature');
  await dialog.getByRole('button', { name: 'Register' }).click();
  // A percentage typed as a purity is caught before anything is sent.
  await expect(dialog.getByText('A purity is a mass fraction: above 0 and at most 1 (e.g. 0.9995).')).toBeVisible();
  await shot(page, 'register-dialog');
  await dialog.getByLabel('Purity (mass fraction, g/g)').fill('0.9995');
  await dialog.getByRole('button', { name: 'Register' }).click();
  await expect(page.getByRole('dialog')).toHaveCount(0);

  const row = table.getByRole('row', { name: /Potassium dihydrogen phosphate/ });
  await expect(row).toContainText('In use');
  await expect(row).toContainText('0.99950 ± 0.00030 g/g (k\u00a0=\u00a02)');
  await row.getByLabel('Upload the certificate of Potassium dihydrogen phosphate, dried, lot NF-KP-5521').setInputFiles({
    name: 'NFC-23-0912.pdf',
    mimeType: 'application/pdf',
    buffer: CERTIFICATE,
  });
  await expect(row.getByRole('button', { name: /^Certificate of Potassium/ })).toBeVisible();
  await shot(page, 'registered');

  // The bottle is opened: the date goes in through the edit dialog.
  await row.getByRole('button', { name: /^Edit Potassium/ }).click();
  const edit = page.getByRole('dialog');
  await edit.getByLabel('Opened').fill('2026-11-15');
  await edit.getByRole('button', { name: 'Save the changes' }).click();
  await expect(page.getByRole('dialog')).toHaveCount(0);

  // Withdrawal asks for a reason and leaves the material in the register, marked in words.
  await row.getByRole('button', { name: /^Withdraw Potassium/ }).click();
  const withdraw = page.getByRole('alertdialog');
  await withdraw.getByRole('button', { name: 'Withdraw' }).click();
  await expect(withdraw.getByText('Say why the material is withdrawn.')).toBeVisible();
  await withdraw.getByLabel('Reason').fill('Lid cracked on receipt of the second bottle; contents possibly wet.');
  await withdraw.getByRole('button', { name: 'Withdraw' }).click();
  await expect(row).toContainText('Withdrawn');
  await expect(row).toContainText('Lid cracked on receipt');
  await expect(row.getByRole('button', { name: /^Edit Potassium/ })).toHaveCount(0);
  await shot(page, 'withdrawn');
});
