import { expect, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'loomwright-demo';

export const DEMO = {
  admin: 'admin@example.com',
  builder: 'builder@example.com',
  technician: 'tech@example.com',
  reviewer: 'reviewer@example.com',
} as const;

/** Signs in through the sign-in page, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'Conversions' })).toBeVisible();
}

export async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible();
}
