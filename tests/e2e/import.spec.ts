/**
 * Issue 6, "done when": as the builder, upload a messy pinout, see every error in the preview, fix
 * the file, import it, export it, and get the same pins back.
 */
import { readFile } from 'node:fs/promises';
import { expect, test, type Locator, type Page } from '@playwright/test';
import Papa from 'papaparse';
import { DEMO, signIn } from './support/session.ts';

const HEADERS = [
  'Cavity',
  'Function',
  'Colour',
  'Size_mm2',
  'Disposition',
  'Destination',
  'Remarks',
];

/** BOM, semicolons, quoted delimiters and quotes, CRLF, blank lines, an extra column, a bad colour
 * (line 5), a bad disposition (line 6) and a duplicate cavity (line 8). */
const MESSY =
  '\uFEFF' +
  [
    HEADERS.join(';'),
    '1;"Main relay; coil control";BU/GN;0,5;Join to vehicle circuit;Relay R1 terminal 85;checked',
    '',
    '2;"ECU feed ""A""";RD;1,5;keep;;',
    '3;Tacho out;PU;0,5;join;V1-3;colour?',
    '4;Spare;;;remove;;',
    '',
    '2;Duplicate;BK;0,5;keep;;copied twice',
    '5;"Notes with\r\ntwo lines";BK;0,5;Cut and insulate;;',
  ].join('\r\n') +
  '\r\n';

const FIXED = MESSY.replace('3;Tacho out;PU', '3;Tacho out;GN')
  .replace('4;Spare;;;remove', '4;Spare;;;De-pin')
  .replace('2;Duplicate;BK;0,5;keep;;copied twice\r\n', '');

/** The pins the fixed file describes, as the export writes them. */
const EXPECTED = [
  ['1', 'Main relay; coil control', 'BU/GN', '0.5', 'join', 'Relay R1 terminal 85'],
  ['2', 'ECU feed "A"', 'RD', '1.5', 'keep', ''],
  ['3', 'Tacho out', 'GN', '0.5', 'join', 'V1-3'],
  ['4', 'Spare', '', '', 'depin', ''],
  ['5', 'Notes with\ntwo lines', 'BK', '0.5', 'cut', ''],
];

const csvFile = (name: string, text: string) => ({
  name,
  mimeType: 'text/csv',
  buffer: Buffer.from(text, 'utf8'),
});

function previewTable(page: Page): Locator {
  return page.getByRole('table', { name: /The file as read/ });
}

/** The cell of a file line (its row header) under a file column. */
function cellAt(page: Page, line: number, header: string): Locator {
  const row = previewTable(page)
    .locator('tbody tr')
    .filter({ has: page.getByRole('rowheader', { name: String(line), exact: true }) });
  // The row header is the line number; the first cell says what the import does with the line.
  return row.locator('td').nth(HEADERS.indexOf(header) + 1);
}

test('the builder imports a messy pinout, fixes it, exports it and gets the same pins back', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('link', { name: 'Ashby yard truck' }).click();
  await page.getByRole('link', { name: 'Import & files' }).click();

  // A new connector to import into.
  await page.getByLabel('Connector', { exact: true }).selectOption({ label: 'New connector…' });
  const newConnector = page.getByRole('form', { name: 'New connector' });
  await newConnector.getByLabel('Connector label').fill('E9');
  await newConnector.getByLabel('Side').selectOption('ecu');
  await newConnector.getByRole('button', { name: 'Create connector' }).click();
  await expect(page.getByLabel('Connector', { exact: true })).toHaveValue(/^\d+$/);
  await expect(page.getByLabel('Connector', { exact: true }).locator('option:checked')).toHaveText(
    /^E9 — ECU side, 1 cavity$/,
  );

  // The messy file: every problem in its cell, nothing can be applied.
  await page.getByLabel('Pinout file (CSV)').setInputFiles(csvFile('e9-pinout.csv', MESSY));
  await expect(page.getByText('3 problems — fix them in the file')).toBeVisible();
  await expect(cellAt(page, 5, 'Colour')).toContainText('PU');
  await expect(cellAt(page, 5, 'Colour')).toContainText(
    'Problem: "PU" is not a wire colour: use IEC 60757 codes',
  );
  await expect(cellAt(page, 6, 'Disposition')).toContainText(
    'Problem: "remove" is not a disposition: use one of',
  );
  await expect(cellAt(page, 8, 'Cavity')).toContainText('Problem: cavity "2" is already on line 4');
  // Clean cells carry no problem, and the extra column is shown as not imported.
  await expect(cellAt(page, 4, 'Function')).toHaveText('ECU feed "A"');
  await expect(page.getByLabel('Use column “Remarks” as')).toHaveValue('ignore');
  await expect(page.getByText('"Remarks" is not imported')).toBeVisible();
  await expect(page.getByText('2 blank lines were skipped.')).toBeVisible();
  await expect(
    page.getByRole('button', { name: /^Import 6 rows into connector E9/ }),
  ).toBeDisabled();
  await page.screenshot({ path: 'test-results/screens/import-preview.png', fullPage: true });

  // The fixed file: no problems, the changes listed, then applied in one go.
  await page.getByLabel('Pinout file (CSV)').setInputFiles(csvFile('e9-pinout.csv', FIXED));
  await expect(page.getByText('No problems found')).toBeVisible();
  await expect(page.getByText('What the import would change in connector E9')).toBeVisible();
  await expect(page.getByText('4 cavities added')).toBeVisible();
  // E9 was made with one cavity: the four the file adds are asked about, not slipped in.
  await expect(
    page.getByText('E9: adds cavities 2, 3, 4, 5 to a 1-cavity connector'),
  ).toBeVisible();
  const importButton = page.getByRole('button', { name: 'Import 5 rows into connector E9' });
  await expect(importButton).toBeDisabled();
  await page.screenshot({ path: 'test-results/screens/import-growth.png', fullPage: true });
  await page.getByLabel('Add these cavities').check();
  // The preview just shown is applied by its id: the file is not sent a second time.
  const applied = page.waitForRequest(
    (r) => r.method() === 'POST' && /\/import\?/.test(r.url()) && !r.url().includes('dryRun'),
  );
  await importButton.click();
  const applyRequest = await applied;
  expect(applyRequest.url()).toMatch(/[?&]preview=[0-9a-f-]{36}/);
  expect(applyRequest.postDataBuffer()).toBeNull();
  await expect(page.getByText('Imported 5 rows into connector E9')).toBeVisible();
  await expect(page.getByLabel('Connector', { exact: true }).locator('option:checked')).toHaveText(
    /^E9 — ECU side, 5 cavities/,
  );

  // A scan of the original sheet goes to the demo server's S3 fake and comes back unchanged.
  const scan = Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    Buffer.from('not really an image, but a PNG by its first bytes'),
  ]);
  await page
    .getByLabel('Add a scan of E9')
    .setInputFiles({ name: 'e9-sheet.png', mimeType: 'image/png', buffer: scan });
  const scanLink = page.getByRole('link', { name: 'e9-sheet.png' });
  await expect(scanLink).toBeVisible();
  const scanDownload = page.waitForEvent('download');
  await scanLink.click();
  expect((await readFile(await (await scanDownload).path())).equals(scan)).toBe(true);

  // Export and read the pins back.
  const download = page.waitForEvent('download');
  await page.getByRole('link', { name: 'All pins of this conversion (CSV)' }).click();
  const file = await (await download).path();
  const text = await readFile(file, 'utf8');
  expect(text.charCodeAt(0)).toBe(0xfeff);
  const parsed = Papa.parse<Record<string, string>>(text.slice(1), {
    header: true,
    skipEmptyLines: true,
  });
  expect(parsed.errors).toEqual([]);
  const e9 = parsed.data
    .filter((r) => r.connector === 'E9')
    .map((r) => [r.cavity, r.function, r.colour, r.size_mm2, r.disposition, r.destination]);
  expect(e9).toEqual(EXPECTED);

  await page.getByRole('link', { name: 'Open the pin map' }).click();
  await expect(page).toHaveURL(/\/conversions\/\d+\/pins$/);
});

test('the pinout library lists the built-in diagnostic connector and saves a connector', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('link', { name: 'Pinout library' }).click();
  await expect(page.getByRole('heading', { name: 'Pinout library' })).toBeVisible();
  const builtIn = page.getByRole('listitem', { name: '16-pin diagnostic connector (SAE J1962)' });
  await expect(builtIn.getByText('Built-in, read-only')).toBeVisible();
  await expect(builtIn.getByRole('button', { name: 'Delete' })).toHaveCount(0);

  await page.getByLabel('From conversion').selectOption({ label: 'Ashby yard truck' });
  await page.getByLabel('Connector to save').selectOption({ label: 'E2 — ECU side, 28 cavities' });
  await page.getByLabel('Template name').fill('KT-20 ECU connector 2');
  await page.getByRole('button', { name: 'Save to the library' }).click();
  await expect(page.getByText('Saved “KT-20 ECU connector 2” to the library')).toBeVisible();
  const saved = page.getByRole('listitem', { name: 'KT-20 ECU connector 2' });
  await expect(saved.getByText('Saved by Ivo Brandt')).toBeVisible();

  await builtIn.getByRole('button', { name: 'Show pins' }).click();
  const pins = builtIn.getByRole('table', { name: /Pins of 16-pin diagnostic connector/ });
  await expect(pins.getByRole('row', { name: /^6 CAN high/ })).toBeVisible();
  await expect(pins.getByRole('row', { name: /^16 Battery \+ \(unswitched\)/ })).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/library.png', fullPage: true });
});

test('a long file is previewed a page at a time, with a way straight to the page of a problem', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await page.getByRole('link', { name: 'Ashby yard truck' }).click();
  await page.getByRole('link', { name: 'Import & files' }).click();
  await page.getByLabel('Connector', { exact: true }).selectOption({ label: 'New connector…' });
  const newConnector = page.getByRole('form', { name: 'New connector' });
  await newConnector.getByLabel('Connector label').fill('L7');
  await newConnector.getByLabel('Side').selectOption('engine');
  await newConnector.getByRole('button', { name: 'Create connector' }).click();
  await expect(page.getByLabel('Connector', { exact: true }).locator('option:checked')).toHaveText(
    /^L7 — /,
  );
  const lines = Array.from(
    { length: 350 },
    (_, i) => `${i + 1},Pin ${i + 1},${i === 299 ? 'NOT A COLOUR' : 'BK'}`,
  );
  await page
    .getByLabel('Pinout file (CSV)')
    .setInputFiles(csvFile('long.csv', ['Cavity,Function,Colour', ...lines].join('\n') + '\n'));
  const pager = page.getByRole('navigation', { name: 'Pages of the file' });
  await expect(pager).toContainText('Rows 1–200 of 350 rows (page 1 of 2)');
  await expect(page.getByText('1 problem — fix it in the file')).toBeVisible();
  await expect(previewTable(page).locator('tbody tr')).toHaveCount(200);
  await pager.getByRole('button', { name: '2', exact: true }).click();
  await expect(pager).toContainText('Rows 201–350 of 350 rows (page 2 of 2)');
  await expect(previewTable(page).locator('tbody tr')).toHaveCount(150);
  await expect(page.getByText('Problem: "NOT A COLOUR"')).toBeVisible();
  await page.screenshot({ path: 'test-results/screens/import-pages.png' });
});
