/**
 * A technician's day at the bench: work that survives a new revision, ticks made on shaky Wi-Fi,
 * the generated test plan and a photo for the reviewer. The specs share one demo server, so each
 * test reads the revision the bench works from instead of assuming one.
 */
import { expect, test, type Page } from '@playwright/test';
import type { BenchSheet } from '#shared/schemas/bench.schema.ts';
import type { TestPlanResponse } from '#shared/schemas/test-plan.schema.ts';
import { DEMO, signIn, signOut } from './support/session.ts';

test.use({ viewport: { width: 1024, height: 1366 } });
// Each test signs in as two or three people in turn: give them room on a busy machine.
test.setTimeout(180_000);

const CONVERSION = 'Pellow farm flatbed';

async function openBench(page: Page): Promise<number> {
  await page.getByRole('link', { name: 'Conversions', exact: true }).click();
  await page.getByRole('link', { name: CONVERSION }).click();
  await page.getByRole('link', { name: 'Bench', exact: true }).click();
  await expect(page.getByRole('heading', { name: /Bench checklist, revision \d+/ })).toBeVisible();
  return Number(/conversions\/(\d+)/.exec(page.url())![1]);
}

const sheetOf = async (page: Page, id: number) =>
  (await (await page.request.get(`/api/conversions/${id}/bench`)).json()) as BenchSheet;

/** Kept pins not yet ticked: their one work tick reads "In place". */
const openKeptPins = (sheet: BenchSheet) =>
  sheet.items.filter((i) => i.pin?.disposition === 'keep' && !i.record?.ticks.done);

test('bench work survives a new revision: unchanged pins stay done, the changed one is rework', async ({
  page,
}) => {
  await signIn(page, DEMO.technician);
  const id = await openBench(page);
  const before = await sheetOf(page, id);
  const n = before.revision!.number;
  const picked = openKeptPins(before).slice(0, 3);
  expect(picked).toHaveLength(3);
  for (const item of picked) {
    const tick = page.locator(`li[data-item="${item.key}"]`).getByRole('checkbox', {
      name: 'In place',
    });
    await tick.click();
    await expect(tick).toHaveAttribute('aria-checked', 'true');
  }
  await expect(page.getByText('All saved')).toBeVisible();
  await expect
    .poll(async () =>
      openKeptPins(await sheetOf(page, id)).filter((i) => picked.some((p) => p.key === i.key)),
    )
    .toHaveLength(0);
  await signOut(page);

  // The builder cuts one of them in the plan and submits the next revision.
  const changed = picked[1]!;
  await signIn(page, DEMO.builder);
  const pins = (await (await page.request.get(`/api/conversions/${id}/pins`)).json())
    .pins as Array<{
    id: number;
    version: number;
  }>;
  const pin = pins.find((p) => p.id === changed.pin!.id)!;
  const edit = await page.request.patch(`/api/pins/${pin.id}`, {
    data: { disposition: 'cut', version: pin.version },
  });
  expect(edit.status()).toBe(200);
  await page.getByRole('link', { name: 'Conversions', exact: true }).click();
  await page.getByRole('link', { name: CONVERSION }).click();
  await page.getByRole('link', { name: 'Revisions' }).click();
  await page.getByLabel('Note for the reviewer (optional)').fill(`${changed.name} is not needed.`);
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByRole('heading', { name: new RegExp(`Revision ${n + 1}`) })).toBeVisible();
  await signOut(page);

  // The reviewer signs it off.
  await signIn(page, DEMO.reviewer);
  await page.getByRole('link', { name: CONVERSION }).click();
  await page.getByRole('link', { name: 'Revisions' }).click();
  await page.getByRole('link', { name: `Revision ${n + 1}` }).click();
  await page.getByRole('button', { name: `Sign off revision ${n + 1}` }).click();
  await page.getByRole('button', { name: 'Confirm sign-off' }).click();
  await expect(page.getByText('Signed off').first()).toBeVisible();
  await signOut(page);

  // The technician sees the notice on the conversions list, then the checklist.
  await signIn(page, DEMO.technician);
  const row = page.getByRole('row', { name: new RegExp(CONVERSION) });
  await expect(row.getByText(`Revision ${n + 1} signed off`)).toBeVisible();
  await expect(row.getByText('1 to rework')).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/conversions-bench-notice.png' });
  await openBench(page);
  await expect(
    page.getByRole('heading', { name: `Bench checklist, revision ${n + 1}` }),
  ).toBeVisible();
  const rework = page.getByRole('region', { name: 'Rework: changed since the work was done' });
  const reworked = rework.locator(`li[data-item="${changed.key}"]`);
  await expect(reworked).toContainText(`Rework: changed since revision ${n}`);
  await expect(reworked).toContainText('Was: Keep as is');
  await expect(reworked).toContainText('(in place)');
  await expect(reworked).toContainText('Now: Cut and insulate');
  await expect(reworked.getByRole('checkbox', { name: 'Cut back' })).toHaveAttribute(
    'aria-checked',
    'false',
  );
  await expect(reworked.getByLabel('Reading, Ω')).toHaveCount(0);
  await page.screenshot({ path: 'test-results/screens/bench-rework.png', fullPage: false });
  await page.getByRole('radio', { name: 'Everything' }).click();
  for (const item of [picked[0]!, picked[2]!]) {
    const kept = page
      .getByRole('list', { name: 'Checklist' })
      .locator(`li[data-item="${item.key}"]`);
    await expect(kept.getByRole('checkbox', { name: 'In place' })).toHaveAttribute(
      'aria-checked',
      'true',
    );
    await expect(kept).toContainText(`carried from revision ${n}`);
  }
  await signOut(page);

  // The notice reached the bench by e-mail.
  await signIn(page, DEMO.admin);
  await page.getByRole('link', { name: 'Mail' }).click();
  await expect(
    page.getByText(`For the bench: ${CONVERSION}, revision ${n + 1} signed off`).first(),
  ).toBeVisible();
});

test('ticks made offline wait on the tablet, are counted, and reach the server when it returns', async ({
  page,
  context,
}) => {
  await signIn(page, DEMO.technician);
  const id = await openBench(page);
  const picked = openKeptPins(await sheetOf(page, id)).slice(0, 3);
  expect(picked).toHaveLength(3);

  await context.setOffline(true);
  for (const item of picked) {
    await page
      .locator(`li[data-item="${item.key}"]`)
      .getByRole('checkbox', { name: 'In place' })
      .click();
  }
  await expect(page.getByText('3 waiting to send · offline')).toBeVisible();
  // Queued writes are kept in the browser's storage, so a reload would not lose them.
  await expect
    .poll(() =>
      page.evaluate(
        () =>
          (
            globalThis as unknown as { localStorage: { getItem: (k: string) => string | null } }
          ).localStorage.getItem('loomwright-queued-writes') ?? '',
      ),
    )
    .toContain(picked[2]!.key);
  await page.screenshot({ path: 'test-results/screens/bench-offline.png' });

  // Signing out now would throw the queue away: the tablet asks first, and "Cancel" keeps it.
  let asked = '';
  page.once('dialog', (dialog) => {
    asked = dialog.message();
    void dialog.dismiss();
  });
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect.poll(() => asked).toContain('3 changes made offline have not reached the server');
  await expect(page.getByText('3 waiting to send · offline')).toBeVisible();

  await context.setOffline(false);
  await expect(page.getByText('All saved')).toBeVisible();
  await expect(page.getByText(/waiting to send/)).toHaveCount(0);
  const sheet = await sheetOf(page, id);
  for (const item of picked) {
    const now = [...sheet.items, ...sheet.rework].find((i) => i.key === item.key)!;
    expect(now.record?.ticks.done).toBe(true);
  }
});

test('the test plan judges each reading at once; a photo from the bench reaches the reviewer', async ({
  page,
}) => {
  await signIn(page, DEMO.technician);
  const id = await openBench(page);
  const sheet = await sheetOf(page, id);
  const n = sheet.revision!.number;
  const plan = (await (
    await page.request.get(`/api/conversions/${id}/revisions/${n}/test-plan`)
  ).json()) as TestPlanResponse;
  const wire = plan.plan.steps.find(
    (s) => s.phase === 'unplugged' && s.unit === 'Ω' && s.expected != null,
  )!;
  const power = plan.plan.steps.find((s) => s.key.startsWith('test:volts:'))!;

  await page.getByRole('tab', { name: 'Test plan' }).click();
  await expect(
    page.getByRole('heading', { name: 'ECU unplugged, battery disconnected' }),
  ).toBeVisible();
  const wireRow = page.locator(`li[data-step="${wire.key}"]`);
  await expect(wireRow).toContainText(`Pass: ${wire.limitText}`);
  await wireRow.getByLabel('Reading, Ω').fill('0.05');
  await wireRow.getByLabel('Reading, Ω').press('Enter');
  await expect(wireRow.getByRole('status', { name: 'Verdict: Pass' })).toBeVisible();

  await page.locator('li[data-step="test:battery"]').getByLabel('Reading, V').fill('12.6');
  await page.locator('li[data-step="test:battery"]').getByLabel('Reading, V').press('Enter');
  const powerRow = page.locator(`li[data-step="${power.key}"]`);
  await powerRow.getByLabel('Reading, V').fill('11.8');
  await powerRow.getByLabel('Reading, V').press('Enter');
  await expect(powerRow.getByRole('status', { name: 'Verdict: Fail' })).toBeVisible();
  await powerRow.getByLabel('What was found').fill('Main relay contact burnt; relay replaced.');
  await powerRow.getByLabel('What was found').blur();
  await expect(page.getByText('All saved')).toBeVisible();
  await powerRow.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/screens/bench-test-plan.png' });
  await expect
    .poll(async () => {
      const again = (await (
        await page.request.get(`/api/conversions/${id}/revisions/${n}/test-plan`)
      ).json()) as TestPlanResponse;
      return again.results[power.key]?.verdict;
    })
    .toBe('fail');

  // A photo of a pin, taken with the tablet's camera (here, a PNG picked as a file).
  await page.getByRole('tab', { name: 'Checklist' }).click();
  await page.getByRole('radio', { name: 'Everything' }).click();
  const item = sheet.items.find((i) => i.kind === 'pin' && i.reading)!;
  const photo = await page.screenshot({ clip: { x: 0, y: 0, width: 64, height: 48 } });
  await page
    .getByLabel(`Photo of ${item.name}`, { exact: true })
    .setInputFiles({ name: 'crimp.png', mimeType: 'image/png', buffer: photo });
  await expect(
    page.getByRole('img', { name: new RegExp(`Photo of ${item.name} by`) }),
  ).toBeVisible();
  await signOut(page);

  await signIn(page, DEMO.reviewer);
  await page.getByRole('link', { name: CONVERSION }).click();
  await page.getByRole('link', { name: 'Revisions' }).click();
  await page.getByRole('link', { name: `Revision ${n}`, exact: true }).click();
  const atBench = page.getByRole('region', { name: 'At the bench' });
  await expect(atBench.getByRole('img', { name: `Bench photo of ${item.name}` })).toBeVisible();
  await atBench.scrollIntoViewIfNeeded();
  await page.screenshot({ path: 'test-results/screens/revision-bench-photos.png' });
});
