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
  await expect(page.getByText(/20 of \d+ done · 6 tested/)).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/bench-tablet.png' });

  // A de-pinned cavity offers "Terminal out" and "Cavity sealed/plugged", never a reading.
  await page.getByRole('radio', { name: 'Everything' }).click();
  const depin = page.locator('li[data-pin]').first();
  await expect(depin).toContainText('De-pin');
  await expect(depin.getByRole('checkbox', { name: 'Cavity sealed/plugged' })).toBeVisible();
  await expect(depin.getByLabel('Reading, Ω')).toHaveCount(0);
  await page.getByRole('radio', { name: 'Still to do' }).click();

  const firstOpen = page
    .locator('li[data-pin]')
    .filter({ has: page.getByLabel('Reading, Ω') })
    .filter({ has: page.getByRole('checkbox', { name: 'Tested', checked: false }) })
    .first();
  const name = await firstOpen.getAttribute('data-pin');
  // Pin the row by its name: once ticked it no longer matches the filter above.
  const row = page.locator(`li[data-pin="${name}"]`);
  const work = row.getByRole('checkbox').first();
  if ((await work.getAttribute('aria-checked')) !== 'true') await work.click();
  await expect(work).toHaveAttribute('aria-checked', 'true');
  await row.getByLabel('Reading, Ω').fill('0.6');
  await row.getByLabel('Reading, Ω').press('Enter');
  await expect(row.getByText(/Fail: 0.6 Ω is above the limit/)).toBeVisible();
  await expect(row.getByLabel('What was found')).toBeVisible();
  await expect(page.getByText(/\d+ of \d+ done · 7 tested/)).toBeVisible();
  await expect(page.getByText('All saved')).toBeVisible();

  await page.reload();
  await page.getByRole('radio', { name: 'Everything' }).click();
  const same = page.locator(`li[data-pin="${name}"]`);
  await expect(same.getByRole('checkbox').first()).toHaveAttribute('aria-checked', 'true');
  await expect(same.getByRole('checkbox', { name: 'Tested' })).toHaveAttribute(
    'aria-checked',
    'true',
  );
  await expect(same.getByLabel('Reading, Ω')).toHaveValue('0.6');

  // The whole build: a wire is terminated, labelled and tested; a ground point cleaned and
  // torqued; a box position has its fuse fitted.
  const wire = page.getByRole('listitem').filter({ hasText: 'W-001' }).first();
  await expect(wire).toContainText('Wire');
  await expect(wire.getByRole('checkbox', { name: 'Labelled at both ends' })).toBeVisible();
  await expect(wire.getByLabel('Reading, Ω')).toBeVisible();
  const ground = page
    .getByRole('listitem')
    .filter({ hasText: 'G-1' })
    .filter({ hasText: 'Ground point' });
  await expect(ground.getByRole('checkbox', { name: 'Fastened and torqued' })).toBeVisible();
  const fuse = page.getByRole('listitem').filter({ hasText: 'Fuse and relay box F1' });
  await expect(fuse.getByRole('checkbox', { name: /Fuse fitted, 15 A/ })).toBeVisible();
  await wire.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/screens/bench-harness.png' });
});

test('the builder sees the checklist but cannot tick it', async ({ page }) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('link', { name: 'Pellow farm flatbed' }).click();
  await page.getByRole('link', { name: 'Bench', exact: true }).click();
  await expect(page.getByRole('checkbox').first()).toBeDisabled();
  await page.screenshot({ path: 'test-results/screens/bench-builder.png' });
});
