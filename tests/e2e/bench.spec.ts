import { expect, test } from '@playwright/test';
import { DEMO, signIn } from './support/session.ts';

test.use({ viewport: { width: 1024, height: 1366 } });

test('the technician works through the bench checklist on a tablet; ticks and readings survive a reload', async ({
  page,
}) => {
  await signIn(page, DEMO.technician);
  await page.getByRole('link', { name: 'Pellow farm flatbed' }).click();
  await page.getByRole('link', { name: 'Bench', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Bench checklist, revision 1' })).toBeVisible();
  await expect(page.getByText(/14 of \d+ pins done · 6 tested/)).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/bench-tablet.png' });

  const firstOpen = page
    .locator('li[data-pin]')
    .filter({ has: page.getByRole('checkbox', { name: 'Done', checked: false }) })
    .first();
  const name = await firstOpen.getAttribute('data-pin');
  // Pin the row by its name: once ticked it no longer matches the filter above.
  const row = page.locator(`li[data-pin="${name}"]`);
  await row.getByRole('checkbox', { name: 'Done' }).click();
  await expect(row.getByRole('checkbox', { name: 'Done' })).toHaveAttribute('aria-checked', 'true');
  await row.getByLabel('Reading, Ω').fill('0.6');
  await row.getByLabel('Reading, Ω').press('Enter');
  await expect(row.getByText(/0.6 Ω is higher than expected/)).toBeVisible();
  await expect(page.getByText(/15 of \d+ pins done · 7 tested/)).toBeVisible();

  await page.reload();
  await page.getByRole('radio', { name: 'Every pin' }).click();
  const same = page.locator(`li[data-pin="${name}"]`);
  await expect(same.getByRole('checkbox', { name: 'Done' })).toHaveAttribute(
    'aria-checked',
    'true',
  );
  await expect(same.getByRole('checkbox', { name: 'Tested' })).toHaveAttribute(
    'aria-checked',
    'true',
  );
  await expect(same.getByLabel('Reading, Ω')).toHaveValue('0.6');
});

test('the builder sees the checklist but cannot tick it', async ({ page }) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('link', { name: 'Pellow farm flatbed' }).click();
  await page.getByRole('link', { name: 'Bench', exact: true }).click();
  await expect(page.getByRole('checkbox', { name: 'Done' }).first()).toBeDisabled();
});
