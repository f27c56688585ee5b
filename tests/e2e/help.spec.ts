import { expect, test } from '@playwright/test';
import { DEMO, signIn } from './support/session.ts';

test('Help is one click from every screen and holds the tour, the keys, the words and every rule with its source', async ({
  page,
}) => {
  await signIn(page, DEMO.technician);
  await page.getByRole('link', { name: 'Pellow farm flatbed' }).click();
  await page.getByRole('link', { name: 'Pin map', exact: true }).click();
  await page
    .getByRole('navigation')
    .getByRole('link', { name: 'Help' })
    .or(page.getByRole('link', { name: 'Help', exact: true }))
    .first()
    .click();
  await expect(page.getByRole('heading', { name: 'Help', level: 1 })).toBeVisible();

  const tour = page.getByRole('region', { name: 'A tour' });
  await expect(tour.getByRole('listitem').first()).toContainText('Pin map');
  // As many steps as the README's tour has (it grows with the product).
  expect(await tour.getByRole('listitem').count()).toBeGreaterThanOrEqual(6);

  const keys = page.getByRole('region', { name: 'Keyboard shortcuts in the pin grid' });
  await expect(keys.getByRole('row', { name: /Ctrl\+D/ })).toContainText('Fill down');
  await expect(keys.getByRole('row', { name: /Type a letter/ })).toContainText('one undo step');

  const dispositions = page.getByRole('region', { name: /Dispositions/ });
  await expect(dispositions.getByText('Cut and insulate')).toBeVisible();
  await expect(
    page.getByRole('region', { name: /Signal classes/ }).getByText('Sensor ground'),
  ).toBeVisible();

  const rules = page.getByRole('region', { name: 'What the checks check, and on what authority' });
  await expect(rules.getByRole('row').nth(10)).toBeVisible();
  await expect(
    rules.getByRole('row', { name: /No extra ground on a sensor ground/ }),
  ).toContainText('common practice, no source');
  await expect(rules.getByRole('row', { name: /The fuse protects the wire/ })).toContainText(
    '33 CFR 183.425',
  );
  await page.screenshot({ path: 'test-results/screens/help.png', fullPage: true });
});

test('Help is open from the sign-in page before signing in, and leads back to it', async ({
  page,
}) => {
  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'Read the help' }).click();
  await expect(page.getByRole('heading', { name: 'Help', level: 1 })).toBeVisible();
  await expect(page.getByRole('region', { name: 'A tour' })).toBeVisible();
  await expect(page.getByText('SAE J1962').first()).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/help-signed-out.png' });
  await page.getByRole('link', { name: 'Sign in' }).click();
  await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible();
});
