import { expect as baseExpect, test, type Page } from '@playwright/test';
import { apiGet, DEMO_ACCOUNTS, signIn } from './support';

// A phone held upright: 390 × 844 CSS pixels. Nothing may make the page wider than the screen;
// wide tables scroll inside their own box.
const WIDTH = 390;
test.use({ viewport: { width: WIDTH, height: 844 } });
test.setTimeout(600_000);
const expect = baseExpect.configure({ timeout: 30_000 });

/** The widths of the page and of any element sticking out past the right edge, for the failure message. */
async function overflow(page: Page) {
  return page.evaluate((width) => {
    const wide = [...document.querySelectorAll('body *')]
      .filter((el) => {
        const box = el.getBoundingClientRect();
        if (box.width === 0 || box.right <= width + 1) return false;
        // Inside a box that scrolls sideways is fine: that is where wide tables belong.
        for (let parent = el.parentElement; parent; parent = parent.parentElement) {
          const style = getComputedStyle(parent);
          if (['auto', 'scroll', 'hidden', 'clip'].includes(style.overflowX) && parent.getBoundingClientRect().right <= width + 1)
            return false;
        }
        return true;
      })
      .slice(0, 5)
      .map(
        (el) =>
          `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}.${[...el.classList].slice(0, 2).join('.')} "${(el.textContent ?? '').trim().slice(0, 40)}"`,
      );
    return { scrollWidth: document.documentElement.scrollWidth, wide };
  }, WIDTH);
}

async function check(page: Page, role: string, name: string, path?: string) {
  if (path) await page.goto(path);
  await expect(page.locator('main h1').first()).toBeVisible();
  await page.waitForLoadState('networkidle');
  await page.screenshot({ path: `test-output/screenshots/phone-${role}-${name}.png`, fullPage: true });
  const measured = await overflow(page);
  expect
    .soft(measured.scrollWidth, `${role} · ${name}: wider than the phone; sticking out: ${measured.wide.join(' | ')}`)
    .toBeLessThanOrEqual(WIDTH);
}

interface Listed {
  items: { id: string; title: string; status: string; author: { name: string } }[];
}

for (const account of DEMO_ACCOUNTS) {
  test(`every main page fits a phone for the demo ${account.role}`, async ({ page }) => {
    await signIn(page, account.email);
    await expect(page.locator('main h1').first()).toBeVisible();
    const role = account.role;
    await check(page, role, 'overview');
    await check(page, role, 'verify', '/verify');
    await check(page, role, 'change-password', '/account/password');
    const studies = await apiGet<Listed>(page, '/studies?pageSize=50');
    const approved = studies.items.find((s) => s.status === 'approved')!;
    const draft = studies.items.find((s) => s.status === 'draft')!;

    if (role === 'analyst') {
      await check(page, role, 'studies', '/studies');
      await check(page, role, 'new-study', '/studies/new');
      const mine = studies.items.find((s) => s.status === 'draft' && s.author.name !== draft.author.name) ?? draft;
      for (let step = 1; step <= 7; step++) await check(page, role, `wizard-step-${step}`, `/studies/${mine.id}/edit?step=${step}`);
      const returned = studies.items.find((s) => s.status === 'returned')!;
      await check(page, role, 'wizard-returned-by-other', `/studies/${returned.id}/edit?step=2`);
      await check(page, role, 'study-view', `/studies/${approved.id}`);
      await check(page, role, 'runs', '/runs');
      await check(page, role, 'new-run', '/runs/new');
      const runs = await apiGet<{ items: { id: string }[] }>(page, '/runs');
      if (runs.items[0]) await check(page, role, 'run', `/runs/${runs.items[0].id}`);
      await check(page, role, 'methods', '/methods');
    }
    if (role === 'reviewer' || role === 'quality_manager') {
      await check(page, role, 'review-queue', '/reviews');
      const submitted = studies.items.find((s) => s.status === 'submitted');
      if (submitted) {
        await check(page, role, 'study-to-review', `/studies/${submitted.id}`);
        for (const tab of ['Data', 'Comments', 'History']) {
          await page.getByRole('tab', { name: new RegExp(`^${tab}`) }).click();
          await check(page, role, `study-to-review-${tab.toLowerCase()}`);
        }
      }
    }
    if (role === 'quality_manager') {
      await check(page, role, 'methods', '/methods');
      const methods = await apiGet<{ id: string }[]>(page, '/methods');
      await check(page, role, 'method', `/methods/${methods[0].id}`);
      await check(page, role, 'version-comparison', '/methods/compare');
    }
    if (role === 'admin') {
      await check(page, role, 'users', '/admin/users');
      await check(page, role, 'outbox', '/admin/outbox');
      await check(page, role, 'studies', '/studies');
      await check(page, role, 'draft', `/studies/${draft.id}`);
      await page.getByRole('button', { name: 'Give to another analyst…' }).click();
      await expect(page.getByRole('dialog')).toBeVisible();
      await page.screenshot({ path: `test-output/screenshots/phone-admin-reassign-dialog.png` });
      await page.getByRole('dialog').getByRole('button', { name: 'Cancel' }).click();
    }
  });
}

test('an exclusion on a phone leaves the row actions and the reason readable', async ({ page }) => {
  test.setTimeout(180_000);
  await signIn(page, 'analyst@meritline.test');
  await expect(page.locator('main h1').first()).toBeVisible();
  const studies = await apiGet<Listed>(page, '/studies?mine=true&status=draft');
  const draft = studies.items[0];
  await page.goto(`/studies/${draft.id}/edit?step=2`);
  const standards = page.getByRole('table', { name: 'Calibration standards' });
  await standards.getByRole('button', { name: 'Exclude…' }).first().click();
  const dialog = page.getByRole('dialog');
  const reason = 'Autosampler needle partly blocked: the peak area of this injection is low, seen on the chromatogram';
  await dialog.getByLabel('Reason').fill(reason);
  await dialog.getByRole('button', { name: 'Exclude the standard' }).click();
  const note = standards.getByText(`Excluded: ${reason}`);
  await expect(note).toBeVisible();
  await expect(page.getByTestId('save-status')).toHaveText(/^Saved/);

  const include = standards.getByRole('button', { name: 'Include again' });
  await include.scrollIntoViewIfNeeded();
  const button = (await include.boundingBox())!;
  // The grid's own scrolling box: the button must be inside what it shows, not cut off by it.
  const box = await standards.evaluate((table) => {
    for (let parent = table.parentElement; parent; parent = parent.parentElement) {
      if (getComputedStyle(parent).overflowX !== 'visible') {
        const rect = parent.getBoundingClientRect();
        return { x: rect.x, width: rect.width };
      }
    }
    return { x: 0, width: window.innerWidth };
  });
  expect(button.x).toBeGreaterThanOrEqual(Math.max(0, box.x) - 1);
  expect(button.x + button.width).toBeLessThanOrEqual(Math.min(WIDTH, box.x + box.width) + 1);
  const text = (await note.boundingBox())!;
  expect(text.x).toBeGreaterThanOrEqual(0);
  expect(text.x + text.width, 'the reason wraps inside the screen').toBeLessThanOrEqual(WIDTH + 1);
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: 'test-output/screenshots/phone-analyst-exclusion.png', fullPage: true });
  const measured = await overflow(page);
  expect(measured.scrollWidth, measured.wide.join(' | ')).toBeLessThanOrEqual(WIDTH);

  // Leave the demo draft as it was for the other journeys.
  await include.click();
  await expect(note).toBeHidden();
  await expect(page.getByTestId('save-status')).toHaveText(/^Saved/);
});
