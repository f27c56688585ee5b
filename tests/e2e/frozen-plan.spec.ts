import { expect, test } from '@playwright/test';
import { DEMO, signIn, signOut } from './support/session.ts';
import { createSmallPlan } from './support/small-plan.ts';

test('a first revision shows the plan as frozen, not the draft edited since', async ({ page }) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Tamsin shop van');
  // A wire from the signal pin to the dash (an end still to be named: a warning, not an error),
  // so the frozen plan has a wire list to show.
  const wire = await page.request.post(`/api/conversions/${plan.conversionId}/wires`, {
    data: {
      label: 'W-001',
      colour: 'GN',
      sizeMm2: 0.5,
      lengthM: 1.2,
      ends: [
        { kind: 'pin', refId: plan.pins.find((p) => p.cavity === '2')!.id },
        { kind: 'unresolved', text: 'Dash gauge' },
      ],
    },
  });
  expect(wire.status(), await wire.text()).toBe(201);
  await page.goto(`/conversions/${plan.conversionId}/revisions`);
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByRole('heading', { name: /Revision 1/ })).toBeVisible();

  // The draft moves on after submission: the revision must not follow it.
  const signal = plan.pins.find((p) => p.cavity === '2')!;
  const pins = (await (await page.request.get(`/api/conversions/${plan.conversionId}/pins`)).json())
    .pins as Array<{ id: number; version: number }>;
  const now = pins.find((p) => p.id === signal.id)!;
  expect(
    (
      await page.request.patch(`/api/pins/${signal.id}`, {
        data: { function: 'Oil pressure signal', version: now.version },
      })
    ).status(),
  ).toBe(200);
  await signOut(page);

  await signIn(page, DEMO.reviewer);
  await page.goto(`/conversions/${plan.conversionId}/revisions/1`);
  await expect(page.getByText('review the whole plan, as frozen below')).toBeVisible();
  const frozen = page.getByRole('region', { name: 'The plan as frozen in revision 1' });
  await expect(frozen.getByRole('tab', { name: 'Pin map (4 pins)' })).toHaveAttribute(
    'aria-selected',
    'true',
  );
  const row = frozen.getByRole('row', { name: /E5-2/ });
  await expect(row.getByRole('cell', { name: 'Coolant temperature signal' })).toBeVisible();
  await expect(frozen.getByText('Oil pressure signal')).toHaveCount(0);
  await expect(
    frozen.getByRole('row', { name: /E5-1/ }).getByRole('cell', { name: 'Feed: ECU supply' }),
  ).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/frozen-plan-pins.png', fullPage: true });

  await frozen.getByRole('tab', { name: 'Feeds (1)' }).click();
  const feed = frozen.getByRole('row', { name: /ECU supply/ });
  await expect(feed.getByRole('cell', { name: '10 A' })).toBeVisible();
  await expect(feed.getByText('E5-1')).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/frozen-plan-feeds.png', fullPage: true });

  await frozen.getByRole('tab', { name: 'Wires (1)' }).click();
  const w = frozen.getByRole('row', { name: /W-001/ });
  await expect(w.getByRole('cell', { name: 'E5-2' })).toBeVisible();
  await expect(w.getByRole('cell', { name: '? Dash gauge' })).toBeVisible();
  await expect(w.getByRole('cell', { name: '1.2 m' })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/frozen-plan-wires.png', fullPage: true });
});

test('differences name each pin with its function and connector, grouped added, removed and changed', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Bolitho cattle truck');
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/revisions`, { data: {} })
    ).status(),
  ).toBe(201);
  await signOut(page);
  await signIn(page, DEMO.reviewer);
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/revisions/1/sign-off`, {
        data: {},
      })
    ).status(),
  ).toBe(200);
  await signOut(page);

  await signIn(page, DEMO.builder);
  const pins = (await (await page.request.get(`/api/conversions/${plan.conversionId}/pins`)).json())
    .pins as Array<{ id: number; cavity: string; version: number }>;
  const signal = pins.find((p) => p.cavity === '2')!;
  expect(
    (
      await page.request.patch(`/api/pins/${signal.id}`, {
        data: { function: 'Oil pressure signal', version: signal.version },
      })
    ).status(),
  ).toBe(200);
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/connectors`, {
        data: { label: 'V9', side: 'vehicle', cavityCount: 2 },
      })
    ).status(),
  ).toBe(201);
  // The new cavities must be decided before the plan can go to review.
  const fresh = (
    await (await page.request.get(`/api/conversions/${plan.conversionId}/pins`)).json()
  ).pins as Array<{ id: number; connectorId: number; cavity: string; version: number }>;
  const added = fresh.filter((p) => !pins.some((q) => q.id === p.id));
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/pins/batch`, {
        data: {
          changes: added.map((p) => ({
            id: p.id,
            version: p.version,
            set: { disposition: 'empty', function: p.cavity === '1' ? 'Tachometer input' : '' },
          })),
        },
      })
    ).status(),
  ).toBe(200);
  await page.goto(`/conversions/${plan.conversionId}/revisions`);
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByRole('heading', { name: /Revision 2/ })).toBeVisible();

  const changes = page.getByRole('region', { name: 'Changes since revision 1' });
  const addedList = changes.getByRole('region', { name: /Added/ });
  await expect(addedList.getByRole('heading', { name: 'Added (3)' })).toBeVisible();
  await expect(addedList.getByText('Connector V9', { exact: true })).toBeVisible();
  await expect(addedList.getByRole('listitem').filter({ hasText: 'V9-1' })).toContainText(
    'Tachometer input · connector V9, vehicle side',
  );
  await expect(changes.getByRole('region', { name: /Removed/ })).toHaveCount(0);
  const changed = changes.getByRole('region', { name: /Changed/ });
  const row = changed.getByRole('row', { name: /E5-2/ });
  await expect(row).toContainText('Oil pressure signal · connector E5, ECU side');
  await expect(row.getByRole('cell', { name: 'Coolant temperature signal' })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/revision-differences.png', fullPage: true });
});

test('a comment on revision 1 stays on its pin in revision 2, marked with its revision, until the builder marks it answered', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Trewin seed drill');
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/revisions`, { data: {} })
    ).status(),
  ).toBe(201);
  await signOut(page);

  await signIn(page, DEMO.reviewer);
  const signal = plan.pins.find((p) => p.cavity === '2')!;
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/revisions/1/comments`, {
        data: { body: 'Run this in a shielded pair.', pinId: signal.id },
      })
    ).status(),
  ).toBe(201);
  expect(
    (
      await page.request.post(`/api/conversions/${plan.conversionId}/revisions/1/send-back`, {
        data: { comment: 'See the pin comment.' },
      })
    ).status(),
  ).toBe(200);
  await signOut(page);

  await signIn(page, DEMO.builder);
  const now = (await (await page.request.get(`/api/conversions/${plan.conversionId}/pins`)).json())
    .pins as Array<{ id: number; version: number }>;
  const pin = now.find((p) => p.id === signal.id)!;
  expect(
    (
      await page.request.patch(`/api/pins/${pin.id}`, {
        data: { notes: 'Shielded pair, drain at the ECU end', version: pin.version },
      })
    ).status(),
  ).toBe(200);
  await page.goto(`/conversions/${plan.conversionId}/revisions`);
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect(page.getByRole('heading', { name: /Revision 2/ })).toBeVisible();

  const earlier = page.getByRole('region', { name: 'Earlier comments on pins and feeds' });
  await expect(
    earlier.getByText('1 comment from earlier revisions not yet marked answered.'),
  ).toBeVisible();
  const onPin = earlier.getByRole('listitem', { name: 'E5-2' });
  await expect(onPin).toContainText('Coolant temperature signal');
  await expect(onPin).toContainText('Revision 1');
  await expect(onPin).toContainText('Run this in a shielded pair.');
  await page.screenshot({ path: 'test-results/screens/earlier-comments.png', fullPage: true });
  await onPin.getByRole('button', { name: 'Mark answered' }).click();
  await expect(onPin.getByText(/Answered by Ivo Brandt/)).toBeVisible();
  await expect(
    earlier.getByText('Every comment from earlier revisions is marked answered.'),
  ).toBeVisible();
  await signOut(page);

  // The reviewer sees it answered, and cannot mark anything.
  await signIn(page, DEMO.reviewer);
  await page.goto(`/conversions/${plan.conversionId}/revisions/2`);
  const seen = page.getByRole('region', { name: 'Earlier comments on pins and feeds' });
  await expect(seen.getByText(/Answered by Ivo Brandt/)).toBeVisible();
  await expect(seen.getByRole('button', { name: 'Mark answered' })).toHaveCount(0);
});
