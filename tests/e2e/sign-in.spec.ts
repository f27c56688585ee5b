import { expect, test } from '@playwright/test';
import { DEMO, signIn, signOut } from './support/session.ts';

test('the builder signs in, sees both demo conversions and signs out', async ({ page }) => {
  await page.goto('/');
  await expect(page).toHaveURL(/\/sign-in/);
  await signIn(page, DEMO.builder);
  const table = page.getByRole('table', { name: 'Conversions in this workshop' });
  await expect(table.getByRole('link', { name: 'Pellow farm flatbed' })).toBeVisible();
  await expect(table.getByRole('link', { name: 'Ashby yard truck' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Ivo Brandt Builder' })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/builder-conversions.png', fullPage: true });

  await table.getByRole('link', { name: 'Ashby yard truck' }).click();
  await expect(page.getByRole('heading', { name: 'Ashby yard truck' })).toBeVisible();

  await signOut(page);
  // The session is gone: protected pages send the visitor back to sign-in.
  await page.goto('/conversions');
  await expect(page).toHaveURL(/\/sign-in/);
});

test('a wrong password is refused with a clear message', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(DEMO.builder);
  await page.getByLabel('Password').fill('not the password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByText('E-mail or password is not right.')).toBeVisible();
});

for (const [role, email] of Object.entries(DEMO)) {
  test(`the demo ${role} can sign in`, async ({ page }) => {
    await signIn(page, email);
    await expect(page.getByRole('link', { name: 'Ashby yard truck' })).toBeVisible();
    const mayCreate = role === 'builder' || role === 'admin';
    await expect(page.getByRole('button', { name: 'New conversion' })).toHaveCount(
      mayCreate ? 1 : 0,
    );
    await expect(page.getByRole('link', { name: 'People' })).toHaveCount(role === 'admin' ? 1 : 0);
  });
}

test('the admin adds a person and changes a role on the people page', async ({ page }) => {
  await signIn(page, DEMO.admin);
  await page.getByRole('link', { name: 'People' }).click();
  await expect(page.getByRole('table', { name: 'People in this workshop' })).toBeVisible();
  await page.getByLabel('Name', { exact: true }).fill('Tamsin Reedy');
  await page.getByLabel('E-mail').fill('tamsin@example.com');
  await page.getByLabel('Role', { exact: true }).selectOption('technician');
  await page.getByLabel('First password').fill('crimp and solder twice');
  await page.getByRole('button', { name: 'Add person' }).click();
  await expect(page.getByText('Tamsin Reedy can now sign in as technician.')).toBeVisible();
  const row = page.getByRole('row', { name: /Tamsin Reedy/ });
  await row.getByLabel('Role of Tamsin Reedy').selectOption('reviewer');
  await expect(row.getByLabel('Role of Tamsin Reedy')).toHaveValue('reviewer');
  await page.screenshot({ path: 'test-results/screens/admin-people.png', fullPage: true });
});
