import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { openSection } from './support/navigation.ts';
import { DEMO, signIn } from './support/session.ts';

const SCREENS = 'test-results/screens';

const findingWith = (page: Page, text: string) =>
  page.getByRole('list', { name: 'Findings' }).getByRole('listitem').filter({ hasText: text });

async function runChecks(page: Page) {
  await page
    .getByRole('navigation', { name: 'Conversion sections' })
    .getByRole('link', { name: 'Checks' })
    .click();
  await page.getByRole('button', { name: 'Run checks' }).click();
  await expect(page.getByRole('status').filter({ hasText: /^Checked / })).toBeVisible();
}

test('the builder records how far the fuse sits from its source and the checks hold it to 178 mm', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await openSection(page, 'Ashby yard truck', 'Feeds');
  const table = page.getByRole('table', { name: 'Feeds of this conversion' });
  await table.getByRole('link', { name: 'Edit Ignition coils' }).click();
  await expect(page.getByRole('heading', { name: 'Edit feed “Ignition coils”' })).toBeVisible();
  await expect(page.getByLabel('Fuse type')).toHaveValue('standard_blade');
  await page.getByLabel('Unfused wire from the source (mm)').fill('300');
  await page.screenshot({ path: `${SCREENS}/feed-form-electrical.png`, fullPage: true });
  await page.getByRole('button', { name: 'Save feed' }).click();
  await expect(page.getByText('Saved the feed “Ignition coils”')).toBeVisible();
  await expect(page.getByRole('row').filter({ hasText: 'Ignition coils' })).toContainText(
    '300 mm from source',
  );

  await runChecks(page);
  const placed = findingWith(page, 'Fuse too far from its source');
  await expect(placed).toHaveCount(1);
  await expect(placed).toContainText('300 mm of wire from its source; at most 178 mm');
  await placed.getByRole('button', { name: 'Show working' }).click();
  await expect(placed).toContainText('33 CFR 183.455(b)');
  await expect(placed).toContainText('borrowed for vehicles by analogy');
  await page.screenshot({ path: `${SCREENS}/checks-fuse-placement.png`, fullPage: true });

  // Moved to 150 mm: the finding goes.
  await page
    .getByRole('navigation', { name: 'Conversion sections' })
    .getByRole('link', { name: 'Feeds' })
    .click();
  await page
    .getByRole('table', { name: 'Feeds of this conversion' })
    .getByRole('link', { name: 'Edit Ignition coils' })
    .click();
  await page.getByLabel('Unfused wire from the source (mm)').fill('150');
  await page.getByRole('button', { name: 'Save feed' }).click();
  await expect(page.getByText('Saved the feed “Ignition coils”')).toBeVisible();
  await runChecks(page);
  await expect(findingWith(page, 'Fuse too far from its source')).toHaveCount(0);
});

test('an ECU output wired straight to a fan is an error that says to drive a relay instead', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await openSection(page, 'Ashby yard truck', 'Pin map');
  await expect(page.getByRole('grid')).toBeVisible();
  // The cautions that concern these pins sit beside the grid.
  await page.getByText(/cautions? appl/).click();
  await expect(page.getByText(/Never probe ECU pins with a test lamp/)).toBeVisible();

  // E2-10 drives the fan relay's coil; give it its stage and rating, and wire a fan straight to it.
  const conversionId = Number(/conversions\/(\d+)/.exec(page.url())![1]);
  const pins = (await (await page.request.get(`/api/conversions/${conversionId}/pins`)).json())
    .pins as Array<{ id: number; cavity: string; connectorId: number; version: number }>;
  const connectors = (
    await (await page.request.get(`/api/conversions/${conversionId}/connectors`)).json()
  ).connectors as Array<{ id: number; label: string }>;
  const e2 = connectors.find((c) => c.label === 'E2')!;
  const pin = pins.find((p) => p.connectorId === e2.id && p.cavity === '10')!;
  const patched = await page.request.patch(`/api/pins/${pin.id}`, {
    data: { version: pin.version, driverType: 'low_side', driverRatedA: 0.5, loadCurrentA: 8 },
  });
  expect(patched.status()).toBe(200);

  // Opened on that pin, as a finding's link opens it.
  await page.goto(`/conversions/${conversionId}/pins?pin=${pin.id}`);
  const row = page.locator('[role="row"][data-pin="E2-10"]');
  await expect(row).toContainText('Low side');
  await expect(row).toContainText('0.5');
  await page.setViewportSize({ width: 2200, height: 900 });
  await page.getByRole('grid').evaluate((el) => {
    el.scrollLeft = el.scrollWidth;
  });
  await page.screenshot({ path: `${SCREENS}/pin-map-outputs.png`, fullPage: false });
  await page.setViewportSize({ width: 1280, height: 720 });

  await runChecks(page);
  const overload = findingWith(page, 'ECU output wired to a load above its rating');
  await expect(overload).toHaveCount(1);
  await expect(overload).toContainText('drive a relay coil instead');
  // The fan relay's coil (0.2 A recorded) on the same 0.5 A output is fine.
  await expect(findingWith(page, 'Relay coil draws more than its ECU output')).toHaveCount(0);

  // Put the pin back for the specs that follow.
  const again = (await (await page.request.get(`/api/conversions/${conversionId}/pins`)).json())
    .pins as Array<{ id: number; version: number }>;
  const current = again.find((p) => p.id === pin.id)!;
  const restore = await page.request.patch(`/api/pins/${pin.id}`, {
    data: { version: current.version, driverType: null, driverRatedA: null, loadCurrentA: null },
  });
  expect(restore.status()).toBe(200);
});

test('the calculator rates thick cable by its own row and estimates the conductor from the load', async ({
  page,
}) => {
  await signIn(page, DEMO.technician);
  await page.getByRole('link', { name: 'Calculator' }).click();
  await page.getByRole('radio', { name: 'AWG' }).check();
  await page.getByLabel('Wire size (AWG)').fill('2');
  await page.getByLabel('Current (A)').fill('120');
  await page.getByLabel('One-way length (m)').fill('1');
  await page.getByLabel('Zone').selectOption('engine_bay');
  await page.getByLabel('Fuse type').selectOption('bolt_down');
  await page.getByLabel('Fuse (A)').fill('150');
  const result = page.getByRole('region', { name: 'Result' });
  // [C] Table 5, 2 AWG, 105 °C: 210 A × 0.85 = 178.5 A in the engine bay.
  await expect(result).toContainText('178.5 A');
  await expect(result).toContainText('estimated from the load in 50 °C air');
  await expect(result).not.toContainText('≈');
  await page.screenshot({ path: `${SCREENS}/calculator-2awg.png`, fullPage: true });
});

test('the admin sets the drop budget, and the draft worksheet prints the cautions', async ({
  page,
}) => {
  await signIn(page, DEMO.admin);
  await page.getByRole('link', { name: 'Workshop settings' }).click();
  const chassis = page.getByLabel('Chassis return path (V)');
  await expect(chassis).toHaveValue('0.05');
  await page.screenshot({ path: `${SCREENS}/settings-drop-budget.png`, fullPage: true });
  await chassis.fill('0.05');
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByText('Settings saved')).toBeVisible();

  const list = (await (await page.request.get('/api/conversions')).json()).conversions as Array<{
    id: number;
    name: string;
  }>;
  const draft = list.find((c) => c.name === 'Ashby yard truck')!;
  const pdf = await page.request.get(`/api/conversions/${draft.id}/worksheet.pdf`);
  expect(pdf.status()).toBe(200);
  mkdirSync(SCREENS, { recursive: true });
  const file = `${SCREENS}/worksheet-draft.pdf`;
  writeFileSync(file, await pdf.body());
  const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
  expect(text).toMatch(/Never probe ECU pins with a test lamp/);
  expect(text).toMatch(/crash or inertia cut-off/);
  expect(text).toMatch(/Emissions and anti-theft circuits/);
  expect(text).not.toMatch(/≈\s*\d+\s*AWG/);
});
