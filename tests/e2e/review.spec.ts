import { expect, test, type Page } from '@playwright/test';
import { DEMO, signIn, signOut } from './support/session.ts';

async function openConversion(page: Page, name: string) {
  await page.getByRole('link', { name: 'Conversions', exact: true }).click();
  await page.getByRole('link', { name }).click();
  await expect(page.getByRole('heading', { name, level: 1 })).toBeVisible();
}

test('builder submits, reviewer sees the differences and signs off, technician prints; every notice arrives', async ({
  page,
}) => {
  // The builder changes the signed-off plan (a pin note), as they would in the pin map.
  await signIn(page, DEMO.builder);
  await openConversion(page, 'Pellow farm flatbed');
  const conversionId = Number(/conversions\/(\d+)/.exec(page.url())![1]);
  const pins = (await (await page.request.get(`/api/conversions/${conversionId}/pins`)).json())
    .pins as Array<{ id: number; version: number; cavity: string; connectorId: number }>;
  const pin = pins[20]!;
  const edit = await page.request.patch(`/api/pins/${pin.id}`, {
    data: { notes: 'Re-terminated with a new sealed pin', version: pin.version },
  });
  expect(edit.status()).toBe(200);

  await page.getByRole('link', { name: 'Revisions' }).click();
  await expect(page.getByText('The bench works from revision 1')).toBeVisible();
  await page.getByLabel('Note for the reviewer (optional)').fill('One pin re-terminated.');
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByRole('heading', { name: /Revision 2/ })).toBeVisible();
  await expect(page.getByText('In review').first()).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/revision-submitted.png', fullPage: true });
  await signOut(page);

  // The reviewer opens revision 2, sees what changed since revision 1, comments and signs off.
  await signIn(page, DEMO.reviewer);
  await openConversion(page, 'Pellow farm flatbed');
  await page.getByRole('link', { name: 'Revisions' }).click();
  await page.getByRole('link', { name: 'Revision 2' }).click();
  await expect(page.getByRole('heading', { name: 'Changes since revision 1' })).toBeVisible();
  // The change itself, in the differences (the frozen plan below lists the same pin again).
  await expect(
    page
      .getByRole('region', { name: 'Changes since revision 1' })
      .getByRole('cell', { name: 'Re-terminated with a new sealed pin' }),
  ).toBeVisible();
  await page.getByLabel('Comment', { exact: true }).fill('Fine. Use the sealed pin from the kit.');
  await page.getByRole('button', { name: 'Add comment' }).click();
  await expect(page.getByText('Fine. Use the sealed pin from the kit.')).toBeVisible();
  await page.getByRole('button', { name: 'Verify content hash' }).click();
  await expect(page.getByText('The stored content still hashes to this value.')).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/revision-review.png', fullPage: true });
  await page.getByRole('button', { name: 'Sign off revision 2' }).click();
  await page.getByRole('button', { name: 'Confirm sign-off' }).click();
  await expect(page.getByText('Signed off').first()).toBeVisible();
  await expect(page.getByText(/Sealed by this server.s Ed25519 key/)).toBeVisible();
  await signOut(page);

  // The technician sees revision 2 as the one the bench works from, and prints it.
  await signIn(page, DEMO.technician);
  await openConversion(page, 'Pellow farm flatbed');
  await page.getByRole('link', { name: 'Revisions' }).click();
  await expect(page.getByText('The bench works from revision 2')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Submit for review' })).toHaveCount(0);
  const print = page.getByRole('link', { name: 'Print bench worksheet (revision 2)' });
  const href = await print.getAttribute('href');
  const pdf = await page.request.get(href!);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()['content-type']).toContain('application/pdf');
  expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
  await page.screenshot({ path: 'test-results/screens/revisions-technician.png', fullPage: true });
  await signOut(page);

  // Every notice reached the demo mail server.
  await signIn(page, DEMO.admin);
  await page.getByRole('link', { name: 'Mail' }).click();
  await expect(
    page.getByText('Review requested: Pellow farm flatbed, revision 2').first(),
  ).toBeVisible();
  await expect(
    page.getByText('Revision 2 of Pellow farm flatbed signed off').first(),
  ).toBeVisible();
  await expect(
    page.getByRole('heading', { name: 'Received by the demo mail server' }),
  ).toBeVisible();
  const received = page.locator('section', {
    has: page.getByRole('heading', { name: 'Received by the demo mail server' }),
  });
  await expect(received.getByText('Review requested: Pellow farm flatbed, revision 2')).toBeVisible(
    { timeout: 15_000 },
  );
  await expect(received.getByText('Revision 2 of Pellow farm flatbed signed off')).toBeVisible({
    timeout: 15_000,
  });
  await page.screenshot({ path: 'test-results/screens/admin-mail.png', fullPage: true });
});
