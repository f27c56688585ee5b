import { expect, test, type Page } from '@playwright/test';
import { DEMO, signIn, signOut } from './support/session.ts';

const rowOf = (page: Page, name: string) =>
  page.getByRole('row').filter({ has: page.getByRole('link', { name, exact: true }) });

test('the list shows where each conversion stands, searches and filters by state, and puts a submission first for the reviewer', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const pellow = rowOf(page, 'Pellow farm flatbed');
  await expect(pellow.getByText('Signed off', { exact: true })).toBeVisible();
  await expect(pellow.getByRole('link', { name: 'Revision 1', exact: true })).toBeVisible();
  await expect(pellow.getByRole('link', { name: /Revision 1 signed off/ })).toBeVisible();
  await expect(pellow.getByText(/^\d+ % done, \d+ % tested$/)).toBeVisible();
  const ashby = rowOf(page, 'Ashby yard truck');
  await expect(ashby.getByText('Draft', { exact: true })).toBeVisible();
  await expect(ashby.getByText('None yet')).toBeVisible();
  const before = await pellow.locator('time').getAttribute('datetime');

  // A pin note changes and revision 2 goes to review: the last change moves with them.
  const conversions = (await (await page.request.get('/api/conversions')).json())
    .conversions as Array<{
    id: number;
    name: string;
  }>;
  const id = conversions.find((c) => c.name === 'Pellow farm flatbed')!.id;
  const pins = (await (await page.request.get(`/api/conversions/${id}/pins`)).json())
    .pins as Array<{
    id: number;
    version: number;
  }>;
  const pin = pins[5]!;
  expect(
    (
      await page.request.patch(`/api/pins/${pin.id}`, {
        data: { notes: 'Checked against the donor loom', version: pin.version },
      })
    ).status(),
  ).toBe(200);
  expect((await page.request.post(`/api/conversions/${id}/revisions`, { data: {} })).status()).toBe(
    201,
  );
  await page.reload();
  await expect(pellow.getByText('In review', { exact: true })).toBeVisible();
  await expect(pellow.getByRole('link', { name: 'Revision 2', exact: true })).toBeVisible();
  const after = await pellow.locator('time').getAttribute('datetime');
  expect(Date.parse(after!)).toBeGreaterThan(Date.parse(before!));

  // Search by a word of the name, then by state.
  await page.getByLabel('Search conversions').fill('ashby');
  await expect(ashby).toBeVisible();
  await expect(pellow).toHaveCount(0);
  await expect(page.getByText('Showing 1 of 2')).toBeVisible();
  await page.getByLabel('Search conversions').fill('');
  await page.getByLabel('State').selectOption({ label: 'In review (1)' });
  await expect(pellow).toBeVisible();
  await expect(ashby).toHaveCount(0);
  await page.getByLabel('State').selectOption({ label: 'Draft (1)' });
  await expect(ashby).toBeVisible();
  await expect(pellow).toHaveCount(0);
  await page.screenshot({ path: 'test-results/screens/conversions-filtered.png', fullPage: true });
  await page.getByLabel('State').selectOption({ label: 'Every state (2)' });
  await signOut(page);

  // The reviewer finds it first, marked as waiting for them.
  await signIn(page, DEMO.reviewer);
  await expect(page.getByText('1 conversion is waiting for your review.')).toBeVisible();
  const firstRow = page.getByRole('row').nth(1);
  await expect(firstRow.getByRole('link', { name: 'Pellow farm flatbed' })).toBeVisible();
  await expect(firstRow.getByText('Waiting for your review')).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/conversions-reviewer.png', fullPage: true });
});
