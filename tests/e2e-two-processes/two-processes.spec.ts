/**
 * Two app processes on one PostgreSQL database, seen as people see them: the builder works through
 * one process, the reviewer through the other, and each sees the other's work; every notice either
 * process queued reaches the mail server once. Run by `npm run test:e2e:two-processes`.
 */
import { expect, test, type Browser, type Page } from '@playwright/test';
import { DEMO, signIn } from '../e2e/support/session.ts';

const processA = `http://localhost:${process.env.E2E_PORT_A ?? 3410}`;
const processB = `http://localhost:${process.env.E2E_PORT_B ?? 3411}`;
const plan = 'Pellow farm flatbed';

const grid = (page: Page) => page.getByRole('grid', { name: 'Pins' });
const cell = (page: Page, pin: string, column: string) =>
  grid(page).locator(`[role="row"][data-pin="${pin}"] [role="gridcell"][data-column="${column}"]`);

/** A person signed in through one process only: every request of the page goes to it. */
async function signedInOn(browser: Browser, baseURL: string, email: string) {
  const context = await browser.newContext({ baseURL });
  const page = await context.newPage();
  await signIn(page, email);
  return page;
}

const TABS = { 'Pin map': 'pins', Revisions: 'revisions' } as const;

/** Each move is waited for by its address: a page shows the old screen until the new one loads. */
async function openPlan(page: Page, tab: keyof typeof TABS) {
  await page.getByRole('link', { name: 'Conversions', exact: true }).click();
  await expect(page).toHaveURL(/\/conversions$/);
  await page.getByRole('link', { name: plan }).click();
  await expect(page).toHaveURL(/\/conversions\/\d+$/);
  await expect(page.getByRole('heading', { name: plan, level: 1 })).toBeVisible();
  await page.getByRole('link', { name: tab, exact: true }).click();
  await expect(page).toHaveURL(new RegExp(`/conversions/\\d+/${TABS[tab]}$`));
}

async function setFunction(page: Page, pin: string, text: string) {
  await cell(page, pin, 'function').click();
  await page.keyboard.type(text);
  await page.keyboard.press('Enter');
  await expect(cell(page, pin, 'function')).toHaveText(text);
  await expect(page.getByText('All changes saved')).toBeVisible();
}

async function submit(page: Page, note: string, number: number) {
  await openPlan(page, 'Revisions');
  await page.getByLabel('Note for the reviewer (optional)').fill(note);
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page).toHaveURL(new RegExp(`/revisions/${number}$`));
  await expect(page.getByRole('heading', { name: new RegExp(`Revision ${number}`) })).toBeVisible();
}

/** Read afresh, as from the notice's link: an open page keeps what it read for half a minute. */
async function openRevisions(page: Page) {
  await openPlan(page, 'Revisions');
  await page.reload();
  await expect(page.getByRole('columnheader', { name: /Content hash/ })).toBeVisible();
}

async function openRevision(page: Page, number: number) {
  await openRevisions(page);
  await page.getByRole('link', { name: `Revision ${number}`, exact: true }).click();
  await expect(page).toHaveURL(new RegExp(`/revisions/${number}$`));
  await expect(page.getByRole('heading', { name: new RegExp(`Revision ${number}`) })).toBeVisible();
}

test('builder on one process, reviewer on the other: each sees the other’s work; each notice is sent once', async ({
  browser,
}) => {
  const builder = await signedInOn(browser, processA, DEMO.builder);
  const reviewer = await signedInOn(browser, processB, DEMO.reviewer);

  // The builder renames a pin's function in the pin grid, through process A.
  await openPlan(builder, 'Pin map');
  await setFunction(builder, 'E1-1', 'Injector 1 drive, new sealed pin');

  // Process B reads the same database: the reviewer's pin map already shows it.
  await openPlan(reviewer, 'Pin map');
  await expect(cell(reviewer, 'E1-1', 'function')).toHaveText('Injector 1 drive, new sealed pin');
  await grid(reviewer)
    .locator('[role="row"][data-pin="E1-1"]')
    .screenshot({ path: 'test-results/screens/two-processes-pin-map-b.png' });

  // Submitted through A; the reviewer sends it back through B.
  await submit(builder, 'E1-1 re-terminated.', 2);
  await openRevision(reviewer, 2);
  await expect(
    reviewer
      .getByRole('region', { name: 'Changes since revision 1' })
      .getByText('Injector 1 drive, new sealed pin', { exact: true }),
  ).toBeVisible();
  await reviewer.getByLabel('Send back with a comment').fill('Name the seal kit in the function.');
  await reviewer.getByRole('button', { name: 'Send back for changes' }).click();
  await expect(reviewer.getByText('Changes requested').first()).toBeVisible();

  // The builder, on A, sees the decision and the comment made on B.
  await builder.reload();
  await expect(builder.getByText('Changes requested').first()).toBeVisible();
  await expect(builder.getByText('Name the seal kit in the function.')).toBeVisible();
  await builder.screenshot({
    path: 'test-results/screens/two-processes-sent-back-a.png',
    fullPage: true,
  });

  // Fixed and submitted again through A; signed off through B.
  await openPlan(builder, 'Pin map');
  await setFunction(builder, 'E1-1', 'Injector 1 drive, seal kit SK-4');
  await submit(builder, 'Seal kit named.', 3);
  await openRevision(reviewer, 3);
  await reviewer.getByRole('button', { name: 'Sign off revision 3' }).click();
  await reviewer.getByRole('button', { name: 'Confirm sign-off' }).click();
  await expect(reviewer.getByText('Signed off').first()).toBeVisible();
  await reviewer.screenshot({
    path: 'test-results/screens/two-processes-signed-off-b.png',
    fullPage: true,
  });

  // On A: the bench works from revision 3, and B's seal checks out with the key both share.
  await openRevisions(builder);
  await expect(builder.getByText('The bench works from revision 3')).toBeVisible();
  await builder.getByRole('link', { name: 'Revision 3', exact: true }).click();
  await builder.getByRole('button', { name: 'Verify hash and seal' }).click();
  await expect(
    builder.getByText('The stored content still hashes to this value and matches its seal.'),
  ).toBeVisible();

  // Notices queued on A (the review requests) and on B (the decisions), both processes sending
  // from the one outbox to A's demo mail server: each arrives once.
  const admin = await signedInOn(browser, processA, DEMO.admin);
  await admin.getByRole('link', { name: 'Mail' }).click();
  // On the page before reloading it: a reload during the move would load the list again.
  await expect(admin.getByRole('heading', { name: 'Mail', level: 1 })).toBeVisible();
  const subjects = [
    `Review requested: ${plan}, revision 2`,
    `Revision 2 of ${plan} sent back for changes`,
    `Review requested: ${plan}, revision 3`,
    `Revision 3 of ${plan} signed off`,
    `For the bench: ${plan}, revision 3 signed off`,
  ];
  const queued = admin.locator('section', {
    has: admin.getByRole('heading', { name: 'Notices queued' }),
  });
  const received = admin.locator('section', {
    has: admin.getByRole('heading', { name: 'Received by the demo mail server' }),
  });
  // The outbox is sent every half second by each process; the page reads it when opened.
  await expect(async () => {
    await admin.reload();
    for (const subject of subjects) {
      await expect(queued.getByRole('row').filter({ hasText: subject })).toContainText('✓ Sent', {
        timeout: 1000,
      });
    }
  }).toPass();
  await admin.reload();
  for (const subject of subjects) {
    await expect(queued.getByRole('row').filter({ hasText: subject })).toHaveCount(1);
    await expect(received.getByText(subject, { exact: true })).toHaveCount(1);
  }
  // Nothing else either: as many messages arrived as notices were queued.
  await expect(received.getByRole('listitem')).toHaveCount(
    await queued.locator('tbody tr').count(),
  );
  await admin.screenshot({ path: 'test-results/screens/two-processes-mail-a.png', fullPage: true });
});
