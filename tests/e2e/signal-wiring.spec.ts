import { mkdirSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { WIRE_COLUMNS } from '../../src/features/harness/lib/wire-cells.ts';
import {
  openSection as openConversionSection,
  wiresGrid,
  type Section,
} from './support/navigation.ts';
import { DEMO, signIn } from './support/session.ts';

const SCREENS = 'test-results/screens';

const openSection = (page: Page, section: Section) =>
  openConversionSection(page, 'Ashby yard truck', section);

const grid = wiresGrid;
/** The CAN wire that runs to a cavity of the diagnostic connector. */
const wireTo = (page: Page, cavity: string) =>
  grid(page).getByRole('row').filter({ hasText: cavity });
const twistCell = (page: Page, cavity: string) =>
  wireTo(page, cavity).getByRole('gridcell').nth(WIRE_COLUMNS.indexOf('twist'));
const pairFinding = (page: Page) =>
  page
    .getByRole('list', { name: 'Findings' })
    .getByRole('listitem')
    .filter({ hasText: 'CAN wires not run as a twisted pair' });

test.beforeAll(() => mkdirSync(SCREENS, { recursive: true }));

test('the builder twists the draft’s CAN pair on the wire list and the checks stop asking for it', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  await openSection(page, 'Checks');
  await expect(pairFinding(page)).toContainText('Warning');
  await expect(pairFinding(page)).toContainText('give both wires the same twist group');
  await expect(pairFinding(page)).toContainText('High-speed CAN bus');
  await page.screenshot({ path: `${SCREENS}/checks-can-pair.png`, fullPage: true });

  await openSection(page, 'Wires');
  for (const cavity of ['DLC-6', 'DLC-14']) {
    await expect(wireTo(page, cavity)).toHaveCount(1);
    await twistCell(page, cavity).click();
    await page.keyboard.type('T1');
    await page.keyboard.press('Enter');
    await expect(twistCell(page, cavity)).toHaveText('T1');
  }
  await page.screenshot({ path: `${SCREENS}/wires-twist-group.png`, fullPage: true });

  await openSection(page, 'Checks');
  await expect(page.getByRole('heading', { name: 'Circuit checks' })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Findings' })).toBeVisible();
  await expect(pairFinding(page)).toHaveCount(0);

  // Leave the demo draft as it was found: both wires loose again.
  await openSection(page, 'Wires');
  for (const cavity of ['DLC-6', 'DLC-14']) {
    await twistCell(page, cavity).click();
    await page.keyboard.press('Delete');
    await expect(twistCell(page, cavity)).toHaveText('—');
  }
});
