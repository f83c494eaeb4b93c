import { evaluateStudy, formatNumber } from '@meritline/shared';
import { expect as baseExpect, test, type Page } from '@playwright/test';
import { mainNavigation, signIn } from './support';

const expect = baseExpect.configure({ timeout: 30_000 });
test.setTimeout(300_000);

const DYE = 'Tartrazine in soft drinks by UV-Vis spectrophotometry';
const TITLE = 'Tartrazine by UV-Vis: method detection limit with one spike excluded';
const REASON = 'Spiked twice: the pipette was refilled without emptying';

// Invented results of the demo laboratory: a short calibration, then nine low-level spikes and seven method blanks
// (mg/L, decimal commas as a spreadsheet copies them). The fourth spike is the one spiked twice.
const STANDARDS = ['Concentration (mg/L)\tAbsorbance', '1\t0,0551', '2\t0,1086', '4\t0,2150', '6\t0,3213', '8\t0,4281'].join('\n');
const SPIKED = [0.21, 0.18, 0.24, 0.43, 0.2, 0.17, 0.22, 0.19, 0.23];
const BLANKS = ['0,02', 'ND', '0,03', '0,01', 'ND', '0,02', '0,04'];
const LOW_SPIKES = [
  'Spiked (mg/L)\tBlank (mg/L)',
  ...SPIKED.map((value, i) => `${String(value).replace('.', ',')}\t${BLANKS[i] ?? ''}`),
].join('\n');
const BLANK_VALUES = BLANKS.map((b) => (b === 'ND' ? null : Number(b.replace(',', '.'))));

// The figure the live panel must show, from the same engine: all nine spikes, then the eight left.
const mdlText = (spiked: number[]) =>
  `${formatNumber(evaluateStudy({ lowSpikes: { spiked, blanks: BLANK_VALUES } }).detection!.epaMdl!.mdl, 4)} mg/L`;
const MDL_ALL = mdlText(SPIKED);
const MDL_KEPT = mdlText(SPIKED.filter((_, i) => i !== 3));

const saveStatus = (page: Page) => page.getByTestId('save-status');
async function openStep(page: Page, name: string, number: number) {
  await page
    .getByRole('navigation', { name: 'Study steps' })
    .getByRole('link', { name: new RegExp(name) })
    .click();
  await expect(page.getByText(`Validation study · step ${number} of 8: ${name}`)).toBeVisible();
}
async function pasteInto(page: Page, which: number, text: string, rows: number) {
  await page.getByRole('button', { name: 'Paste from a spreadsheet' }).nth(which).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Cells to paste').fill(text);
  await dialog.getByRole('button', { name: `Put ${rows} rows in the grid` }).click();
  await expect(dialog).toBeHidden();
}

test('an analyst excludes a low-level spike with a reason and sees the method detection limit change', async ({ page }) => {
  baseExpect(MDL_KEPT).not.toBe(MDL_ALL);
  await signIn(page, 'analyst@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Validation studies' }).click();
  await expect(page.getByRole('table', { name: 'Validation studies' })).toBeVisible();
  await page.getByRole('link', { name: 'New study', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'New validation study' })).toBeVisible();
  await page.getByLabel('Method', { exact: true }).selectOption({ label: DYE });
  await page.getByLabel('Title').fill(TITLE);
  await page.getByRole('button', { name: 'Create the study' }).click();
  await expect(page.getByRole('heading', { level: 1, name: TITLE })).toBeVisible();
  await pasteInto(page, 0, STANDARDS, 5);

  await openStep(page, 'Blanks and low-level spikes', 3);
  await pasteInto(page, 1, LOW_SPIKES, 9);
  const spikes = page.getByRole('table', { name: 'Low-level spikes' });
  await expect(spikes.getByRole('textbox', { name: 'Low-level spike result, row 4' })).toHaveValue('0,43');
  const live = page.getByRole('complementary', { name: 'Detection limits as you type' });
  await expect(live).toContainText(`Method detection limit${MDL_ALL}`);
  await expect(live).toContainText('9 / 7');

  // The row holds a spike and a blank: only the spike is excluded, with a reason.
  const row4 = spikes.getByRole('row').filter({ has: page.getByRole('textbox', { name: 'Low-level spike result, row 4' }) });
  const dialog = page.getByRole('dialog');
  const spikeItem = page.getByRole('menuitem', { name: 'Exclude the spike 0,43…' });
  // A click that lands while the menu is still opening selects nothing; a person would click again, so the test does.
  await expect(async () => {
    if (!(await spikeItem.isVisible())) await row4.getByRole('button', { name: 'Exclude…' }).click();
    await spikeItem.click();
    await expect(dialog).toContainText('Exclude the low-level spike result 0,43?', { timeout: 3_000 });
  }).toPass({ timeout: 30_000 });
  await dialog.getByRole('button', { name: 'Exclude the low-level spike result' }).click();
  await expect(dialog.getByText('Say why the low-level spike result is excluded')).toBeVisible();
  await dialog.getByLabel('Reason').fill(REASON);
  await dialog.getByRole('button', { name: 'Exclude the low-level spike result' }).click();
  await expect(dialog).toBeHidden();
  await expect(spikes.getByText(`Low-level spike result excluded: ${REASON}`)).toBeVisible();
  await expect(spikes.getByRole('textbox', { name: 'Low-level spike result, row 4' })).toHaveCSS('text-decoration-line', 'line-through');
  await expect(spikes.getByRole('textbox', { name: 'Method blank result, row 4' })).not.toHaveCSS('text-decoration-line', 'line-through');
  await expect(live).toContainText(`Method detection limit${MDL_KEPT}`);
  await expect(live).toContainText('8 (1 excluded) / 7');
  await expect(page.getByText('9 rows, 1 excluded')).toBeVisible();
  await expect(saveStatus(page)).toContainText('Saved', { timeout: 20_000 });
  // From the top, so that the sticky header does not cover the page in the full-page image.
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: 'test-output/screenshots/low-spike-excluded.png', fullPage: true });

  // The result screen, computed by the server, lists the spike left out and why.
  await openStep(page, 'Results', 7);
  const limits = page.getByRole('table', { name: 'Detection and quantitation limits' });
  await expect(limits).toContainText('From 8 low-level spikes (1 more excluded)');
  const excluded = page.getByRole('table', { name: 'Results excluded from the detection limits' });
  await expect(excluded).toContainText('Low-level spike, row 4');
  await expect(excluded).toContainText('0.43 mg/L');
  await expect(excluded).toContainText(REASON);
  await expect(page.getByTestId('server-agrees')).toBeVisible();
  await excluded.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-output/screenshots/low-spike-excluded-results.png' });

  // Stored: after a reload the grid shows the exclusion again, and it can be undone.
  await page.reload();
  await openStep(page, 'Blanks and low-level spikes', 3);
  await expect(spikes.getByText(`Low-level spike result excluded: ${REASON}`)).toBeVisible();
  await row4.getByRole('button', { name: 'Include again…' }).click();
  // Read back from the server, the values show as stored numbers.
  await expect(page.getByRole('menuitem', { name: 'Exclude the blank 0.01…' })).toBeVisible();
  await page.getByRole('menuitem', { name: 'Include the spike 0.43 again' }).click();
  await expect(spikes.getByText(`Low-level spike result excluded: ${REASON}`)).toBeHidden();
  await expect(live).toContainText(`Method detection limit${MDL_ALL}`);
});
