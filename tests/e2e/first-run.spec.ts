import { expect, test } from '@playwright/test';
import { DEMO, signIn, signOut } from './support/session.ts';

test('a new conversion opens on a first-run pin map and takes a connector from the pinout library', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('button', { name: 'New conversion' }).click();
  await page.getByLabel('Name').fill('Kenver gritter');
  await page.getByLabel('Donor engine').fill('KT-20 2.0 L turbo I4');
  await page.getByLabel('Receiving vehicle').fill('Corran 100, 1979');
  await page.getByRole('button', { name: /Create|Start/ }).click();
  await expect(page.getByRole('heading', { name: 'Kenver gritter', level: 1 })).toBeVisible();
  await expect(page.getByText('on 0 connectors')).toBeVisible();

  await page.getByRole('link', { name: 'Pin map', exact: true }).click();
  const firstRun = page.getByRole('region', {
    name: 'Add the donor’s ECU connectors: from the library, by CSV, or by hand',
  });
  await expect(firstRun).toBeVisible();
  await expect(page.getByText('No pins match the filters')).toHaveCount(0);
  await expect(firstRun.getByRole('link', { name: 'Import a CSV' })).toHaveAttribute(
    'href',
    /\/files$/,
  );
  await page.screenshot({ path: 'test-results/screens/pin-map-first-run.png', fullPage: true });

  await firstRun.getByRole('button', { name: 'From the pinout library' }).click();
  const library = page.getByRole('region', { name: 'Add a connector from the pinout library' });
  const template = library.getByLabel('Template', { exact: true });
  const j1962 = await template.locator('option', { hasText: 'J1962' }).getAttribute('value');
  await template.selectOption(j1962!);
  await library.getByLabel('New connector label').fill('DLC');
  await page.screenshot({ path: 'test-results/screens/pin-map-from-library.png', fullPage: true });
  await library.getByRole('button', { name: 'Add connector from template' }).click();
  await expect(library).toHaveCount(0);
  await expect(page.getByRole('article', { name: 'Connector DLC' })).toContainText('16 cavities');
  await expect(page.getByText(/^Showing 16 of 16 pins$/)).toBeVisible();
  // Beside "Add connector" the library stays on offer.
  await expect(page.getByRole('button', { name: 'Add from the pinout library' })).toBeVisible();

  await page.getByRole('link', { name: 'Overview', exact: true }).click();
  await expect(page.getByText('on 1 connector', { exact: false })).toBeVisible();
  await expect(page.getByText('0 feeds')).toBeVisible();
  await signOut(page);
});

test('an invited person shows as Invited until they set a password', async ({ page }) => {
  await signIn(page, DEMO.admin);
  await page.goto('/admin/users');
  await page.getByLabel('Name').fill('Tegen Roe');
  await page.getByLabel('E-mail').fill('tegen@example.com');
  await page.getByRole('button', { name: /Add|Invite/ }).click();
  const row = page.getByRole('row').filter({ hasText: 'tegen@example.com' });
  await expect(row.getByText('Invited')).toBeVisible();
  await expect(
    page.getByRole('row').filter({ hasText: DEMO.builder }).getByText('Active'),
  ).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/users-invited.png', fullPage: true });
});
