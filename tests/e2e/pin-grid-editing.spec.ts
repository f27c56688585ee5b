import { expect, test } from '@playwright/test';
import { allSaved, pinCell, pinGrid } from './support/pin-grid.ts';
import { DEMO, signIn } from './support/session.ts';
import { createSmallPlan } from './support/small-plan.ts';

const grid = pinGrid;
const cell = pinCell;

test('Enter takes the highlighted destination; free text only as typed on purpose or when nothing matches', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Orrin tow tractor', { joined: false });
  await page.goto(`/conversions/${plan.conversionId}/pins`);
  await expect(grid(page)).toBeVisible();

  await cell(page, 'E5-1', 'destination').click();
  await page.keyboard.type('ECU');
  const options = page.getByRole('listbox').getByRole('option');
  await expect(options).toHaveText([/Feed: ECU supply/, /Use “ECU” as typed/]);
  await expect(options.first()).toHaveAttribute('aria-selected', 'true');
  await page.screenshot({ path: 'test-results/screens/destination-typeahead.png' });
  await page.keyboard.press('Enter');
  await expect(cell(page, 'E5-1', 'destination')).toContainText('→ Feed: ECU supply');
  await allSaved(page);

  // "Use as typed" keeps the letters.
  await cell(page, 'E5-2', 'destination').click();
  await page.keyboard.type('ECU');
  await page.keyboard.press('ArrowDown');
  await expect(options.last()).toHaveAttribute('aria-selected', 'true');
  await page.keyboard.press('Enter');
  await expect(cell(page, 'E5-2', 'destination')).toHaveText('ECU');

  // Nothing matches: the text goes in as it is.
  await cell(page, 'E5-3', 'destination').click();
  await page.keyboard.type('Dash lamp');
  await expect(options).toHaveText([/Use “Dash lamp” as typed/]);
  await page.keyboard.press('Enter');
  await expect(cell(page, 'E5-3', 'destination')).toHaveText('Dash lamp');
  await allSaved(page);

  const pins = (await (await page.request.get(`/api/conversions/${plan.conversionId}/pins`)).json())
    .pins as Array<{
    id: number;
    cavity: string;
    destination: string;
    destinationFeedId: number | null;
  }>;
  const byCavity = new Map(pins.map((p) => [p.cavity, p]));
  expect(byCavity.get('1')!.destinationFeedId).toBe(plan.feedId);
  expect(byCavity.get('2')).toMatchObject({ destination: 'ECU', destinationFeedId: null });
  expect(byCavity.get('3')).toMatchObject({ destination: 'Dash lamp', destinationFeedId: null });
  // One fact: the pin joined to the feed is now one of the feed's loads.
  const feeds = (
    await (await page.request.get(`/api/conversions/${plan.conversionId}/feeds`)).json()
  ).feeds as Array<{ id: number; loads: Array<{ pinId: number | null }> }>;
  expect(feeds.find((f) => f.id === plan.feedId)!.loads.map((l) => l.pinId)).toEqual([
    byCavity.get('1')!.id,
  ]);
});

test('adding a pin as a feed load joins the pin to the feed, and the unfused power pin finding clears', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Wenna hay loader', { joined: false });
  await page.goto(`/conversions/${plan.conversionId}/checks`);
  await expect(page.getByText('Power pin joined without a fuse upstream').first()).toBeVisible();

  await page.getByRole('link', { name: 'Feeds', exact: true }).click();
  await page
    .getByRole('button', { name: 'Edit ECU supply' })
    .or(page.getByRole('link', { name: 'Edit ECU supply' }))
    .click();
  await page.getByRole('button', { name: 'Add a load' }).click();
  const pinChoice = page.getByLabel('Load 1 pin');
  const label = await pinChoice.locator('option', { hasText: 'E5-1' }).textContent();
  await pinChoice.selectOption({ label: label! });
  await page.getByLabel('Load 1 device').fill('ECU');
  await page.getByLabel('Load 1 current (A)').fill('4');
  await page.getByRole('button', { name: 'Save feed' }).click();
  await expect(page.getByRole('button', { name: 'Save feed' })).toHaveCount(0);

  await page.getByRole('link', { name: 'Pin map', exact: true }).click();
  await expect(cell(page, 'E5-1', 'destination')).toContainText('→ Feed: ECU supply');
  await page.screenshot({ path: 'test-results/screens/feed-load-joins-pin.png' });
  await page.getByRole('link', { name: 'Checks', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Circuit checks' })).toBeVisible();
  await expect(page.getByText('0 errors')).toBeVisible();
  await expect(page.getByText('Power pin joined without a fuse upstream')).toHaveCount(0);
  await page.screenshot({ path: 'test-results/screens/feed-load-checks.png', fullPage: true });
});

test('typing over a three-cell selection fills the selection, and one undo puts all three back', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Pascoe milk float');
  await page.goto(`/conversions/${plan.conversionId}/pins`);
  await expect(grid(page)).toBeVisible();

  await cell(page, 'E5-2', 'function').click();
  await cell(page, 'E5-4', 'function').click({ modifiers: ['Shift'] });
  await page.keyboard.type('Spare, taped back');
  await page.screenshot({ path: 'test-results/screens/type-over-selection.png' });
  await page.keyboard.press('Enter');
  for (const pin of ['E5-2', 'E5-3', 'E5-4'])
    await expect(cell(page, pin, 'function')).toHaveText('Spare, taped back');
  await expect(cell(page, 'E5-1', 'function')).toHaveText('ECU battery supply');
  await allSaved(page);

  // A choice column too: "cut" over two dispositions.
  await cell(page, 'E5-2', 'disposition').click();
  await cell(page, 'E5-3', 'disposition').click({ modifiers: ['Shift'] });
  await page.keyboard.type('cut');
  await page.keyboard.press('Enter');
  for (const pin of ['E5-2', 'E5-3'])
    await expect(cell(page, pin, 'disposition')).toContainText('Cut and insulate');
  await allSaved(page);

  // Each fill is one undo step.
  await page.keyboard.press('ControlOrMeta+Z');
  for (const pin of ['E5-2', 'E5-3'])
    await expect(cell(page, pin, 'disposition')).toContainText('Keep as is');
  await expect(cell(page, 'E5-2', 'function')).toHaveText('Spare, taped back');
  await page.keyboard.press('ControlOrMeta+Z');
  await expect(cell(page, 'E5-2', 'function')).toHaveText('Coolant temperature signal');
  await expect(cell(page, 'E5-3', 'function')).toHaveText('Sensor ground');
  await expect(cell(page, 'E5-4', 'function')).toHaveText('—');
  await allSaved(page);
  await page.screenshot({ path: 'test-results/screens/type-over-selection-undone.png' });
});
