import { mkdirSync } from 'node:fs';
import { expect, test, type Locator, type Page } from '@playwright/test';
import { WIRE_COLUMNS } from '../../src/features/harness/lib/wire-cells.ts';
import {
  openSection as openConversionSection,
  wiresGrid,
  type Section,
} from './support/navigation.ts';
import { DEMO, signIn } from './support/session.ts';

/** Where a column's cell sits in a wire's row. */
const cellAt = (column: (typeof WIRE_COLUMNS)[number]) => WIRE_COLUMNS.indexOf(column);

const SCREENS = 'test-results/screens';

const openSection = (page: Page, section: Section) =>
  openConversionSection(page, 'Ashby yard truck', section);

const grid = wiresGrid;
const wireRow = (page: Page, label: string) =>
  grid(page)
    .getByRole('row')
    .filter({ has: page.getByText(label, { exact: true }) });

/** Picks an end the way a person does: types part of its name and takes the highlighted choice. */
async function pickEnd(box: Locator, typed: string, expected: RegExp) {
  await box.click();
  await box.pressSequentially(typed);
  const listbox = box.page().getByRole('listbox');
  await expect(listbox.getByRole('option', { selected: true })).toHaveText(expected);
  await box.press('Enter');
}

/** Adds a wire between two places from the "Add a wire" form and answers its new label. */
async function addWire(page: Page, a: [string, RegExp], b: [string, RegExp], colour: string) {
  const form = page.getByRole('form', { name: 'Add a wire' });
  await pickEnd(form.getByRole('combobox', { name: 'End A' }), ...a);
  await pickEnd(form.getByRole('combobox', { name: 'End B' }), ...b);
  await form.getByLabel('Colour').fill(colour);
  return saveWire(page);
}

/** Saves the wire in the form; the form empties for the next one and the message names it. */
async function saveWire(page: Page) {
  const form = page.getByRole('form', { name: 'Add a wire' });
  await form.getByRole('button', { name: 'Add wire' }).click();
  await expect(form.getByRole('combobox', { name: 'End A' })).toHaveValue('');
  const added = page.getByRole('status').filter({ hasText: /Added W-\d+/ });
  const label = /W-\d+/.exec((await added.textContent()) ?? '')?.[0] ?? '';
  await expect(wireRow(page, label)).toBeVisible();
  return label;
}

test('a builder wires the cooling fan circuit from the type-ahead and reads its drawing', async ({
  page,
}) => {
  mkdirSync(SCREENS, { recursive: true });
  page.on('dialog', (d) => void d.accept());
  await signIn(page, DEMO.builder);
  await openSection(page, 'Wires');
  await expect(wireRow(page, 'W-012')).toContainText('F4 fuse · out');
  await page.screenshot({ path: `${SCREENS}/wires-grid.png`, fullPage: true });

  // Take the demo's fan wires out, so the circuit is built fresh from the screen.
  // W-012, W-014 and W-015 run F4 → R4 → fan; the fan motor's own ground wire leaves M1-2.
  const fanGround = (
    await grid(page)
      .getByRole('row')
      .filter({ hasText: 'M1-2' })
      .getByRole('gridcell')
      .first()
      .textContent()
  )?.trim();
  expect(fanGround).toMatch(/^W-\d{3}$/);
  for (const label of ['W-012', 'W-014', 'W-015', fanGround!]) {
    await grid(page)
      .getByRole('button', { name: `Delete ${label}` })
      .click();
    await expect(wireRow(page, label)).toHaveCount(0);
  }

  // A new ground point for the fan, on the chassis beside the radiator.
  await page.getByRole('button', { name: 'Add a ground point' }).click();
  const groundForm = page.getByRole('form', { name: 'Add a ground point' });
  await groundForm.getByLabel('Location').selectOption('chassis');
  await groundForm.getByLabel('Strap size (mm²)').fill('6');
  await page.screenshot({ path: `${SCREENS}/wires-ground-form.png`, fullPage: true });
  await groundForm.getByRole('button', { name: 'Add ground point' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'Added ground point G-5' }),
  ).toBeVisible();

  await page.getByRole('button', { name: 'Add a wire' }).click();
  const w1 = await addWire(page, ['F4 out', /^F4 fuse · out/], ['R4 30', /^R4 relay · 30/], 'RD');
  const w2 = await addWire(page, ['R4 87', /^R4 relay · 87(?!a)/], ['M1-1', /^M1-1/], 'RD/BU');
  const w3 = await addWire(page, ['M1-2', /^M1-2/], ['G-5', /^G-5 chassis/], 'BK');
  const form = page.getByRole('form', { name: 'Add a wire' });
  await form.getByRole('combobox', { name: 'End A' }).click();
  await form.getByRole('combobox', { name: 'End A' }).pressSequentially('R4 85');
  await page.screenshot({ path: `${SCREENS}/wires-type-ahead.png`, fullPage: true });
  await form.getByRole('combobox', { name: 'End A' }).press('Enter');
  await pickEnd(form.getByRole('combobox', { name: 'End B' }), 'E2-10', /^E2-10 Cooling fan relay/);
  const w4 = await saveWire(page);

  await expect(wireRow(page, w1)).toContainText('R4 relay · 30');
  await expect(wireRow(page, w3)).toContainText('G-5 chassis');
  await expect(wireRow(page, w4)).toContainText('E2-10 Cooling fan relay coil control');
  await page.getByText(/^Splices \(\d+\) and ground points/).click();
  const grounds = page.getByRole('table', { name: 'Ground points' });
  await expect(grounds.getByRole('row').filter({ hasText: 'G-5' })).toContainText('6 mm²');
  await page.screenshot({ path: `${SCREENS}/wires-splices-grounds.png`, fullPage: true });

  // The strap turns out heavier than planned: G-5 is changed in place.
  await page.getByRole('button', { name: 'Change G-5' }).click();
  const changeGround = page.getByRole('form', { name: 'Change ground point G-5' });
  await expect(changeGround.getByLabel('Strap size (mm²)')).toHaveValue('6');
  await changeGround.getByLabel('Strap size (mm²)').fill('10');
  await changeGround.getByLabel('Notes').fill('Radiator support, left');
  await page.screenshot({ path: `${SCREENS}/wires-change-ground.png`, fullPage: true });
  await changeGround.getByRole('button', { name: 'Save ground point' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'Saved ground point G-5' }),
  ).toBeVisible();
  await expect(grounds.getByRole('row').filter({ hasText: 'G-5' })).toContainText('10 mm²');
  await expect(grounds.getByRole('row').filter({ hasText: 'G-5' })).toContainText(
    'Radiator support, left',
  );

  // A splice added by mistake is removed; a ground point that holds wires offers no Remove.
  await page.getByRole('button', { name: 'Add a splice' }).click();
  await page
    .getByRole('form', { name: 'Add a splice' })
    .getByRole('button', { name: 'Add splice' })
    .click();
  const addedSplice = page.getByRole('status').filter({ hasText: /Added splice S-\d+/ });
  await expect(addedSplice).toBeVisible();
  const spliceLabel = /S-\d+/.exec((await addedSplice.textContent())!)![0];
  const splices = page.getByRole('table', { name: 'Splices' });
  await expect(splices.getByRole('row').filter({ hasText: spliceLabel })).toHaveCount(1);
  await expect(page.getByRole('button', { name: 'Remove G-5' })).toHaveCount(0);
  await page.getByRole('button', { name: `Remove ${spliceLabel}` }).click();
  await expect(
    page.getByRole('status').filter({ hasText: `Removed ${spliceLabel}` }),
  ).toBeVisible();
  await expect(splices.getByRole('row').filter({ hasText: spliceLabel })).toHaveCount(0);

  // Keyboard: the new wire's length typed into its cell, Enter saves.
  const lengthCell = wireRow(page, w2).getByRole('gridcell').nth(cellAt('length'));
  await lengthCell.click();
  await page.keyboard.type('1.4');
  await page.keyboard.press('Enter');
  await expect(page.getByRole('status').filter({ hasText: `Saved ${w2}` })).toBeVisible();
  await expect(lengthCell).toHaveText('1.4');
  // The cursor went down a row: Ctrl+D fills the length down, Ctrl+Z takes it back.
  const belowLength = wireRow(page, w3).getByRole('gridcell').nth(cellAt('length'));
  await expect(belowLength).toBeFocused();
  await page.keyboard.press('Control+d');
  await expect(belowLength).toHaveText('1.4');
  await expect(page.getByRole('status').filter({ hasText: `Saved ${w3}` })).toBeVisible();
  await page.keyboard.press('Control+z');
  await expect(
    page.getByRole('status').filter({ hasText: `Undid the last change to ${w3}` }),
  ).toBeVisible();
  await expect(belowLength).toHaveText('—');
  // Two lines pasted into the notes go down the column, one wire each.
  const w3Notes = wireRow(page, w3).getByRole('gridcell').nth(cellAt('notes'));
  await w3Notes.click();
  await w3Notes.evaluate((cell) => {
    // The browser's own classes; the node typecheck of this file has no DOM library.
    const page = globalThis as unknown as {
      DataTransfer: new () => { setData: (type: string, value: string) => void };
      ClipboardEvent: new (type: string, init: object) => Event;
    };
    const data = new page.DataTransfer();
    data.setData('text/plain', 'Fan ground, short run\nCoil wire in the loom\n');
    cell.dispatchEvent(new page.ClipboardEvent('paste', { clipboardData: data, bubbles: true }));
  });
  await expect(w3Notes).toHaveText('Fan ground, short run');
  await expect(wireRow(page, w4).getByRole('gridcell').nth(cellAt('notes'))).toHaveText(
    'Coil wire in the loom',
  );

  // Someone else changes the wire meanwhile: the grid's next edit is refused and shows their row.
  const wires = (await (await page.request.get('/api/conversions/2/wires')).json()) as {
    wires: Array<{ id: number; label: string; version: number }>;
  };
  const other = wires.wires.find((w) => w.label === w2)!;
  const patched = await page.request.patch(`/api/wires/${other.id}`, {
    data: { notes: 'Routed behind the radiator', version: other.version },
  });
  expect(patched.ok()).toBe(true);
  const notesCell = wireRow(page, w2).getByRole('gridcell').nth(cellAt('notes'));
  await notesCell.click();
  await page.keyboard.type('Along the top rail');
  await page.keyboard.press('Enter');
  await expect(
    page.getByRole('status').filter({ hasText: `${w2} was changed by someone else` }),
  ).toBeVisible();
  await expect(notesCell).toHaveText('Routed behind the radiator');
  await page.screenshot({ path: `${SCREENS}/wires-conflict.png`, fullPage: true });

  // The fan feed's drawing, opened from the feeds table.
  await openSection(page, 'Feeds');
  await page.getByRole('link', { name: 'Show circuit of Cooling fan' }).click();
  await expect(page.getByRole('heading', { name: 'Feed “Cooling fan”' })).toBeVisible();
  const named = page.getByRole('list', { name: 'Named in the drawing' });
  await expect(named).toContainText('30 A');
  await expect(named).toContainText('30→87');
  for (const label of [w1, w2, w3, w4]) await expect(named).toContainText(label);
  await expect(named).toContainText('G-5');
  await expect(page.getByRole('img', { name: /Feed “Cooling fan”/ })).toBeVisible();
  await page.screenshot({ path: `${SCREENS}/circuit-fan.png`, fullPage: true });
});

test('a wire list CSV is checked first, row by row, and applied only when clean', async ({
  page,
}) => {
  mkdirSync(SCREENS, { recursive: true });
  await signIn(page, DEMO.builder);
  await openSection(page, 'Wires');
  await expect(wireRow(page, 'W-001')).toBeVisible();
  await page.getByRole('button', { name: 'Import CSV' }).click();
  const panel = page.getByRole('region', { name: 'Import wires from CSV' });
  const header = 'label,colour,size_mm2,length_m,zone,end_a,end_b,notes';
  // Row 2 names a relay terminal the box does not have (R4 has no terminal 99).
  const bad = `${header}\nW-090,BK,1,0.5,engine_bay,M1-2,G-2,\nW-091,BK,1,0.5,engine_bay,R4:99,G-2,\n`;
  await panel.getByLabel('CSV file').setInputFiles({
    name: 'wires.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(bad),
  });
  const problems = panel.getByRole('table', { name: 'Problems in the file' });
  await expect(problems).toBeVisible();
  await expect(problems.getByRole('row').nth(1)).toContainText('end_a');
  await expect(panel.getByRole('button', { name: 'Apply the file' })).toBeDisabled();
  await page.screenshot({ path: `${SCREENS}/wires-import-problems.png`, fullPage: true });

  const good = `${header}\nW-090,BK,1,0.5,engine_bay,M1-2,G-2,Second fan ground\n`;
  await panel.getByLabel('CSV file').setInputFiles({
    name: 'wires.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(good),
  });
  await expect(panel.getByText('1 row(s) read without a problem')).toBeVisible();
  await panel.getByRole('button', { name: 'Apply the file' }).click();
  await expect(panel.getByText('Imported 1 wire(s)')).toBeVisible();
  await expect(wireRow(page, 'W-090')).toContainText('G-2 chassis');
  await expect(page.getByRole('link', { name: 'Export CSV' })).toHaveAttribute(
    'href',
    '/api/conversions/2/wires.csv',
  );
});

test('the box screen draws each position with what its terminals are wired to, and takes a new fuse', async ({
  page,
}) => {
  mkdirSync(SCREENS, { recursive: true });
  await signIn(page, DEMO.builder);
  await openSection(page, 'Box');
  const box = page.getByRole('region', { name: 'Box Fuse and relay box' });
  const r1 = box.getByRole('listitem', { name: 'Relay R1' });
  await expect(r1).toContainText('contacts 30 A');
  // W-002 runs from F1's output to R1's terminal 30 in the demo.
  const r1Supply = r1.getByRole('group', { name: 'R1 terminal 30' });
  await expect(r1Supply).toContainText('W-002');
  await expect(r1Supply).toContainText('F1 fuse · out');
  await expect(box.getByRole('listitem', { name: 'Fuse F1' })).toContainText('15 A');
  await page.screenshot({ path: `${SCREENS}/box.png`, fullPage: true });

  await page.getByRole('button', { name: 'Edit positions of Fuse and relay box' }).click();
  const form = page.getByRole('form', { name: 'Positions of Fuse and relay box' });
  await form.getByRole('button', { name: 'Add a fuse' }).click();
  await expect(form.getByLabel('Fuse rating of F6')).toBeVisible();
  await form.getByLabel('Fuse rating of F6').fill('7.5');
  await form.getByLabel('Fuse family of F6').selectOption('mini_blade');
  await page.screenshot({ path: `${SCREENS}/box-edit.png`, fullPage: true });
  await form.getByRole('button', { name: 'Save positions' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'Saved the positions of Fuse and relay box' }),
  ).toBeVisible();
  const f6 = box.getByRole('listitem', { name: 'Fuse F6' });
  await expect(f6).toContainText('7.5 A');
  await expect(f6).toContainText('Mini blade fuse');
  // The positions kept their ids: R1 is still wired.
  await expect(r1Supply).toContainText('W-002');

  // A second box, by the cab, with one relay.
  await page.getByRole('button', { name: 'Add a box' }).click();
  const boxForm = page.getByRole('form', { name: 'Add a box' });
  await boxForm.getByLabel('Name').fill('Cab box');
  await boxForm.getByLabel('Where it sits').fill('Behind the passenger kick panel');
  await boxForm.getByRole('button', { name: 'Add box' }).click();
  const cabForm = page.getByRole('form', { name: 'Positions of Cab box' });
  await cabForm.getByRole('button', { name: 'Add a relay' }).click();
  await cabForm.getByLabel('Contact rating of R1').fill('20');
  await cabForm.getByRole('button', { name: 'Save positions' }).click();
  const cab = page.getByRole('region', { name: 'Box Cab box' });
  await expect(cab.getByRole('listitem', { name: 'Relay R1' })).toContainText('contacts 20 A');
  await page.screenshot({ path: `${SCREENS}/box-second.png`, fullPage: true });
});

test('a pin of the pin map opens its circuit', async ({ page }) => {
  mkdirSync(SCREENS, { recursive: true });
  await signIn(page, DEMO.builder);
  await openSection(page, 'Pin map');
  // The fuel pump relay's coil control pin, reached from its connector's face.
  await page.getByRole('button', { name: /^Cavity E2-9;/ }).click();
  await page.getByRole('link', { name: /^Show circuit of E2-9/ }).click();
  await expect(page.getByRole('heading', { name: /E2-9/ })).toBeVisible();
  const named = page.getByRole('list', { name: 'Named in the drawing' });
  await expect(named).toContainText('R3 relay');
  await expect(named).toContainText('W-009');
  await page.screenshot({ path: `${SCREENS}/circuit-pin.png`, fullPage: true });
});

test('a technician reads the wires and the box without the controls that change them', async ({
  page,
}) => {
  await signIn(page, DEMO.technician);
  await openSection(page, 'Wires');
  await expect(wireRow(page, 'W-001')).toContainText('Battery +');
  await expect(page.getByText('Read only: your role cannot change wires.')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add a wire' })).toHaveCount(0);
  await expect(grid(page).getByRole('button', { name: 'Delete W-001' })).toHaveCount(0);
  await page.getByText(/^Splices \(\d+\) and ground points/).click();
  await expect(page.getByRole('table', { name: 'Ground points' })).toContainText('G-1');
  await expect(page.getByRole('button', { name: 'Change G-1' })).toHaveCount(0);

  // Sorting by a column is for reading, open to every role: by end B, then the other way.
  const endB = grid(page).getByRole('columnheader', { name: 'End B' });
  await endB.getByRole('button').click();
  await expect(endB).toHaveAttribute('aria-sort', 'ascending');
  const endBTexts = async () =>
    grid(page)
      .locator('tbody tr')
      .evaluateAll(
        (rows, at) => rows.map((r) => r.children[at]?.textContent ?? ''),
        cellAt('endB'),
      );
  const ascending = await endBTexts();
  expect(ascending[0]!.localeCompare(ascending.at(-1)!, undefined, { numeric: true })).toBeLessThan(
    0,
  );
  await endB.getByRole('button').click();
  await expect(endB).toHaveAttribute('aria-sort', 'descending');
  expect((await endBTexts())[0]).toBe(ascending.at(-1));
  await expect(page.getByRole('link', { name: 'Export CSV' })).toBeVisible();
  await page
    .getByRole('navigation', { name: 'Conversion sections' })
    .getByRole('link', { name: 'Box', exact: true })
    .click();
  await expect(page.getByRole('region', { name: 'Box Fuse and relay box' })).toBeVisible();
  await expect(page.getByRole('button', { name: /Edit positions/ })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Add a box' })).toHaveCount(0);
});
