import { expect, test, type Page } from '@playwright/test';
import { DEMO, signIn, signOut } from './support/session.ts';
import { createSmallPlan } from './support/small-plan.ts';

const rowOf = (page: Page, name: string) =>
  page.getByRole('row').filter({ has: page.getByRole('link', { name, exact: true }) });

// The demo conversions are shared with later specs: this one only reads them, and does its
// writing on a conversion of its own.
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

  const plan = await createSmallPlan(page.request, 'Penrose hay wagon');
  await page.reload();
  const penrose = rowOf(page, 'Penrose hay wagon');
  await expect(penrose.getByText('Draft', { exact: true })).toBeVisible();
  const before = await penrose.locator('time').getAttribute('datetime');

  // A pin note changes and revision 1 goes to review: the last change moves with them.
  const pins = (await (await page.request.get(`/api/conversions/${plan.conversionId}/pins`)).json())
    .pins as Array<{ id: number; version: number }>;
  const pin = pins[1]!;
  expect(
    (
      await page.request.patch(`/api/pins/${pin.id}`, {
        data: { notes: 'Checked against the donor loom', version: pin.version },
      })
    ).status(),
  ).toBe(200);
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/revisions`, { data: {} })
    ).status(),
  ).toBe(201);
  await page.reload();
  await expect(penrose.getByText('In review', { exact: true })).toBeVisible();
  await expect(penrose.getByRole('link', { name: 'Revision 1', exact: true })).toBeVisible();
  const after = await penrose.locator('time').getAttribute('datetime');
  expect(Date.parse(after!)).toBeGreaterThan(Date.parse(before!));

  // Search by a word of the name, then by state.
  await page.getByLabel('Search conversions').fill('ashby');
  await expect(ashby).toBeVisible();
  await expect(pellow).toHaveCount(0);
  await expect(page.getByText(/^Showing 1 of \d+$/)).toBeVisible();
  await page.getByLabel('Search conversions').fill('');
  await page.getByLabel('State').selectOption('in_review');
  await expect(penrose).toBeVisible();
  await expect(ashby).toHaveCount(0);
  await expect(pellow).toHaveCount(0);
  await page.getByLabel('State').selectOption('draft');
  await expect(ashby).toBeVisible();
  await expect(penrose).toHaveCount(0);
  await page.screenshot({ path: 'test-results/screens/conversions-filtered.png', fullPage: true });
  await page.getByLabel('State').selectOption('');
  await signOut(page);

  // The reviewer finds it first, marked as waiting for them.
  await signIn(page, DEMO.reviewer);
  await expect(
    page.getByText(/^\d+ conversions? (is|are) waiting for your review\.$/),
  ).toBeVisible();
  const firstRow = page.getByRole('row').nth(1);
  await expect(firstRow.getByRole('link', { name: 'Penrose hay wagon' })).toBeVisible();
  await expect(firstRow.getByText('Waiting for your review')).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/conversions-reviewer.png', fullPage: true });
});
