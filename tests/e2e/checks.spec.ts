import { expect, test, type Page } from '@playwright/test';
import { openSection } from './support/navigation.ts';
import { DEMO, signIn } from './support/session.ts';

const SCREENS = 'test-results/screens';

/** One finding of the checks page, found by words of its message. */
const findingWith = (page: Page, text: string) =>
  page.getByRole('list', { name: 'Findings' }).getByRole('listitem').filter({ hasText: text });

test('the builder sees the draft’s planted problems, fixes the cooling fan wire and the finding goes', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await openSection(page, 'Ashby yard truck', 'Checks');
  await expect(page.getByRole('heading', { name: 'Circuit checks' })).toBeVisible();
  await expect(
    page.getByText('Local codes and licensed practice prevail over these checks'),
  ).toBeVisible();
  await expect(page.getByText(/Test before first power-up/)).toBeVisible();

  // The cooling fan: a 30 A fuse over 1 mm² in the engine bay, rated 17 A (18 AWG row × 0.85).
  const fan = findingWith(page, 'The 30 A fuse of "Cooling fan"');
  await expect(fan).toHaveCount(1);
  await expect(fan).toContainText('Error');
  await expect(fan).toContainText('Fuse does not protect the wire');
  await expect(fan).toContainText('1 mm² wire can carry in the engine bay (17 A)');
  await expect(fan).toContainText('Use at least 4 mm² wire');
  await expect(fan).toContainText(
    'Source: Allowable amperage of conductors · Fuse protects the wire',
  );

  // The fuel pump: 14 A over 4 m of 0.75 mm², chassis return, against the 3 % critical limit.
  // The wire runs at 74 °C (¶11-66) and drops 1.56 V; its fuse, relay contacts, terminals and the
  // chassis return add 0.19 V: 1.75 V from source to load.
  const pump = findingWith(page, '"Fuel pump" loses');
  await expect(pump).toContainText('Error');
  await expect(pump).toContainText('Voltage drop too high');
  await expect(pump).toContainText('1.75 V (14.6 % of 12 V) from its source to its loads at 14 A');
  await expect(pump).toContainText('1.56 V of it in 4 m of 0.75 mm²');
  await expect(pump).toContainText('the limit for a critical circuit is 3 %');
  await expect(pump).toContainText('Voltage-drop limits');

  // The extra chassis ground on sensor ground E1-19: a warning, linked to its pin.
  const ground = findingWith(page, 'Sensor ground E1-19');
  await expect(ground).toContainText('Warning');
  await expect(ground).toContainText('Extra ground on a sensor ground');
  await expect(ground).toContainText('Source: Common practice');
  await expect(ground.getByRole('link', { name: 'Pin E1-19' })).toHaveAttribute(
    'href',
    /\/pins\?pin=\d+$/,
  );

  // The two undecided pins, each linked.
  const undecided = findingWith(page, '2 pins undecided');
  await expect(undecided).toContainText('Error');
  await expect(undecided).toContainText('E3-13, E3-14');
  await expect(undecided.getByRole('link', { name: 'Pin E3-13' })).toBeVisible();
  await expect(undecided.getByRole('link', { name: 'Pin E3-14' })).toBeVisible();

  // Open the fan's finding: the working, the numbers and the sources.
  await fan.getByRole('button', { name: /Show working/ }).click();
  const working = fan.getByRole('region', { name: 'Working: Fuse does not protect the wire' });
  await expect(working).toContainText('In the engine bay × 0.85 (Table 5 note 1) → 17 A');
  await expect(working).toContainText('30 A > 17 A: the fuse does not protect the wire.');
  const numbers = working.getByRole('table', { name: 'The numbers' });
  await expect(numbers.getByRole('row', { name: 'Fuse 30 A' })).toBeVisible();
  await expect(numbers.getByRole('row', { name: 'Wire ampacity, derated 17 A' })).toBeVisible();
  await expect(numbers.getByRole('row', { name: 'Table 5 row 18 AWG' })).toBeVisible();
  await expect(working).toContainText('NEC 240.4');
  await expect(working).toContainText('33 CFR 183.425 Table 5');
  await page.screenshot({ path: `${SCREENS}/checks.png`, fullPage: true });

  // From the finding to the feed, opened for editing, with live results beside it.
  await fan.getByRole('link', { name: 'Feed “Cooling fan”' }).click();
  await expect(page).toHaveURL(/\/feeds\?feed=\d+$/);
  await expect(page.getByRole('heading', { name: 'Edit feed “Cooling fan”' })).toBeVisible();
  const live = page.getByRole('complementary', { name: 'Live results' });
  await expect(live).toContainText('30 A (green) > 17 A');
  await expect(live).toContainText('Allowable amperage of conductors');

  await page.getByLabel('Size (mm²)').fill('4');
  // 4 mm² is rated as 12 AWG: 45 A × 0.85 = 38.25 A in the engine bay.
  await expect(live).toContainText('30 A (green) ≤ 38.3 A');
  await expect(live).toContainText('within the 10 % limit');
  await page.screenshot({ path: `${SCREENS}/feed-form.png`, fullPage: true });

  await page.getByRole('button', { name: 'Save feed' }).click();
  await expect(page.getByText('Saved the feed “Cooling fan”')).toBeVisible();
  const row = page.getByRole('row').filter({ hasText: 'Cooling fan' });
  await expect(row).toContainText('4 mm²');
  await expect(row).toContainText('30 A (green)');
  // The save ran the checks again: nothing left on the fan.
  await expect(row).toContainText('No findings');
  await expect(page.getByRole('row').filter({ hasText: 'Fuel pump' })).toContainText(
    'Voltage drop too high',
  );
  await page.screenshot({ path: `${SCREENS}/feeds.png`, fullPage: true });

  // Re-run the checks: the fan's finding is gone, the others remain.
  await page
    .getByRole('navigation', { name: 'Conversion sections' })
    .getByRole('link', { name: 'Checks' })
    .click();
  await page.getByRole('button', { name: 'Run checks' }).click();
  await expect(page.getByRole('status').filter({ hasText: /^Checked / })).toBeVisible();
  await expect(findingWith(page, '"Fuel pump" loses')).toHaveCount(1);
  await expect(findingWith(page, '2 pins undecided')).toHaveCount(1);
  await expect(findingWith(page, 'Cooling fan')).toHaveCount(0);

  // Put the demo back as it was for the specs that follow.
  const conversionId = Number(/conversions\/(\d+)/.exec(page.url())![1]);
  const feeds = (await (await page.request.get(`/api/conversions/${conversionId}/feeds`)).json())
    .feeds as Array<{ id: number; name: string; version: number; wire: Record<string, unknown> }>;
  const saved = feeds.find((f) => f.name === 'Cooling fan')!;
  const restore = await page.request.patch(`/api/conversions/${conversionId}/feeds/${saved.id}`, {
    data: { version: saved.version, wire: { ...saved.wire, sizeMm2: 1 } },
  });
  expect(restore.status()).toBe(200);
});

test('a technician sees the feeds read-only', async ({ page }) => {
  await signIn(page, DEMO.technician);
  await openSection(page, 'Ashby yard truck', 'Feeds');
  const table = page.getByRole('table', { name: 'Feeds of this conversion' });
  await expect(table.getByRole('link', { name: 'Cooling fan', exact: true })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add a feed' })).toHaveCount(0);
  await expect(table.getByRole('link', { name: /^Edit/ })).toHaveCount(0);

  await table.getByRole('link', { name: 'Fuel pump', exact: true }).click();
  await expect(page.getByRole('heading', { name: 'Feed “Fuel pump”' })).toBeVisible();
  await expect(page.getByText('Read only: your role cannot change feeds.')).toBeVisible();
  await expect(page.getByLabel('Name')).toBeDisabled();
  await expect(page.getByRole('button', { name: 'Save feed' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: /Delete/ })).toHaveCount(0);
  // The live results still show what the checks will say.
  await expect(page.getByRole('complementary', { name: 'Live results' })).toContainText(
    'over the 3 % limit',
  );
});

test('the calculator answers a what-if, in either unit, and marks a bad size', async ({ page }) => {
  await signIn(page, DEMO.technician);
  await page.getByRole('link', { name: 'Calculator' }).click();
  await expect(page.getByRole('heading', { name: 'Circuit calculator' })).toBeVisible();

  // The demo fuel pump's run: 14 A, 4 m of 0.75 mm², chassis return, a measured conductor at
  // 30 °C (left empty, the calculator estimates it from the load as the checks do).
  await page.getByLabel('Current (A)').fill('14');
  await page.getByLabel('One-way length (m)').fill('4');
  await page.getByLabel('Wire size (mm²)').fill('0.75');
  await page.getByLabel('Return path').selectOption('chassis');
  await page.getByLabel('Conductor temperature (°C)').fill('30');
  await page.getByLabel('Fuse (A)').fill('20');
  await page.getByLabel('Drop limit (%)').fill('3');
  const result = page.getByRole('region', { name: 'Result' });
  // [C] 0.017241 × 4 / 0.75 × 1.0393 = 0.0956 Ω × 14 A = 1.338 V, 11.15 % of 12 V.
  await expect(result).toContainText('1.338 V · 11.15 %');
  await expect(result).toContainText('over the 3 % limit');
  await expect(result).toContainText(/3 mm²\s*·\s*12 AWG/);
  await expect(result).toContainText('20 A (yellow) > 18.2 A');
  await expect(result).toContainText('Voltage-drop limits');

  // A size that is not in the ISO 6722 series is marked beside the field.
  await page.getByLabel('Wire size (mm²)').fill('1.1');
  await expect(page.getByText(/must be an ISO 6722 size/)).toBeVisible();
  await expect(result).toContainText('Correct the marked inputs');

  // The same run in 12 AWG.
  await page.getByRole('radio', { name: 'AWG' }).check();
  await page.getByLabel('Wire size (AWG)').fill('12');
  await expect(result).toContainText('12 AWG');
  await expect(result).toContainText('within the 3 % limit');
  await page.screenshot({ path: `${SCREENS}/calculator.png`, fullPage: true });
});

test('a finding’s pin link opens the pin map on that pin', async ({ page }) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('link', { name: 'Ashby yard truck' }).click();
  await page.getByRole('link', { name: 'Checks', exact: true }).click();
  await page.getByRole('link', { name: 'Pin E3-13' }).click();
  await expect(page).toHaveURL(/\/pins\?pin=\d+/);
  const grid = page.getByRole('grid');
  await expect(grid).toBeFocused();
  // The grid's active cell is in the row of E3-13.
  const active = await grid.getAttribute('aria-activedescendant');
  expect(active).toBeTruthy();
  await expect(page.locator(`[role="row"][data-pin="E3-13"] [id="${active}"]`)).toHaveCount(1);
});
