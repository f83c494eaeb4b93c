import { expect, test, type Locator, type Page } from '@playwright/test';
import { apiGet, mainNavigation, signIn } from './support';

// Every dialog opens from its button with its title as its accessible name, gets the focus, shows its words and
// closes on Escape without changing anything; a screenshot of each lands in test-output/screenshots/dialog-*.png.
test.setTimeout(300_000);

interface Listed {
  items: { id: string; title: string; status: string; author: { name: string } }[];
}

/** Opens a dialog, checks its name and focus, takes its picture and closes it with Escape. */
async function look(page: Page, opener: Locator, name: string | RegExp, shot: string, role: 'dialog' | 'alertdialog' = 'dialog') {
  await opener.click();
  const dialog = page.getByRole(role, { name });
  await expect(dialog).toBeVisible();
  await expect(dialog.locator(':focus')).toHaveCount(1);
  await page.waitForLoadState('networkidle');
  await page.screenshot({ path: `test-output/screenshots/dialog-${shot}.png` });
  await page.keyboard.press('Escape');
  await expect(dialog).toBeHidden();
  await expect(opener).toBeFocused();
  return dialog;
}

test('the administrator’s dialogs: invite, edit, deactivate, give a draft to another analyst', async ({ page }) => {
  await signIn(page, 'admin@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Users' }).click();
  const invite = page.getByRole('button', { name: 'Invite a user' });
  await look(page, invite, 'Invite a user', 'invite-user');

  // Submitting empty shows the refusals on their fields, and the dialog stays open.
  await invite.click();
  const dialog = page.getByRole('dialog', { name: 'Invite a user' });
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await expect(dialog.getByText('Enter the e-mail address.')).toBeVisible();
  await page.screenshot({ path: 'test-output/screenshots/dialog-invite-user-refused.png' });
  await dialog.getByRole('button', { name: 'Cancel' }).click();
  await expect(dialog).toBeHidden();

  const row = page.getByRole('row', { name: /Tomasz Weber/ });
  await look(page, row.getByRole('button', { name: 'Edit Tomasz Weber' }), 'Edit Tomasz Weber', 'edit-user');
  await look(
    page,
    row.getByRole('button', { name: 'Deactivate Tomasz Weber' }),
    'Deactivate Tomasz Weber?',
    'deactivate-user',
    'alertdialog',
  );

  const studies = await apiGet<Listed>(page, '/studies?pageSize=50');
  const draft = studies.items.find((s) => s.status === 'draft')!;
  await page.goto(`/studies/${draft.id}`);
  await look(page, page.getByRole('button', { name: 'Give to another analyst…' }), 'Give the draft to another analyst', 'reassign');
});

test('the analyst’s dialogs: paste, upload, preparation, exclusion, delete, submit', async ({ page }) => {
  await signIn(page, 'analyst@meritline.test');
  await expect(page.locator('main h1').first()).toBeVisible();
  const studies = await apiGet<Listed>(page, '/studies?mine=true&status=draft');
  const draft = studies.items[0];
  await page.goto(`/studies/${draft.id}/edit?step=2`);
  await look(page, page.getByRole('button', { name: 'Paste from a spreadsheet' }).first(), /^Paste /, 'paste');
  await look(page, page.getByRole('button', { name: 'Upload CSV or Excel' }).first(), /^Upload /, 'import');
  await look(
    page,
    page.getByRole('button', { name: 'Take concentrations from a preparation' }),
    'Take concentrations from a preparation',
    'preparation',
  );
  const standards = page.getByRole('table', { name: 'Calibration standards' });
  const exclude = standards.getByRole('button', { name: 'Exclude…' }).first();
  await exclude.click();
  const exclusion = page.getByRole('dialog', { name: /^Exclude the standard/ });
  await expect(exclusion.getByLabel('Reason')).toBeFocused();
  await exclusion.getByRole('button', { name: 'Exclude the standard' }).click();
  await expect(exclusion.getByText('Say why the standard is excluded (at least 3 characters).')).toBeVisible();
  await page.screenshot({ path: 'test-output/screenshots/dialog-exclusion-refused.png' });
  await page.keyboard.press('Escape');
  await expect(exclusion).toBeHidden();
  await expect(standards.getByText(/^Excluded:/)).toHaveCount(0);

  await page.goto(`/studies/${draft.id}/edit?step=1`);
  await look(page, page.getByRole('button', { name: 'Delete this draft' }), /^Delete the draft/, 'delete-draft', 'alertdialog');

  await page.goto(`/studies/${draft.id}`);
  const submit = page.getByRole('button', { name: 'Submit for review' });
  if (await submit.isVisible()) await look(page, submit, 'Submit the study for review', 'submit-study');
});

test('the reviewer’s dialogs: return and approve', async ({ page }) => {
  await signIn(page, 'reviewer@meritline.test');
  await expect(page.locator('main h1').first()).toBeVisible();
  const studies = await apiGet<Listed>(page, '/studies?pageSize=50');
  const submitted = studies.items.find((s) => s.status === 'submitted')!;
  await page.goto(`/studies/${submitted.id}`);
  await look(page, page.getByRole('button', { name: 'Return for changes' }), /^Return the study to /, 'return-study');
  const approve = await look(page, page.getByRole('button', { name: 'Approve', exact: true }), 'Approve the study', 'approve-study');
  await expect(approve).toBeHidden();
});

test('the quality manager’s dialogs: methods, versions, reference materials', async ({ page }) => {
  await signIn(page, 'quality@meritline.test');
  await mainNavigation(page).getByRole('link', { name: 'Methods' }).click();
  await look(page, page.getByRole('button', { name: 'New method' }), 'New method', 'new-method');
  await page.getByRole('link', { name: 'Nitrate in drinking water by ion chromatography' }).click();
  await look(page, page.getByRole('button', { name: 'New version' }), /^Create version \d+$/, 'new-version');
  const statusAction = page.getByRole('button', { name: /^(Activate|Retire) version \d+$/ }).first();
  await look(page, statusAction, /^(Activate|Retire) version \d+\?$/, 'version-status', 'alertdialog');

  await mainNavigation(page).getByRole('link', { name: 'Reference materials' }).click();
  await look(page, page.getByRole('button', { name: 'Register a material' }), 'Register a reference material', 'register-material');
  await look(page, page.getByRole('button', { name: /^Withdraw / }).first(), /^Withdraw .*\?$/, 'withdraw-material', 'alertdialog');
});
