import { expect, test, type Page } from '@playwright/test';
import { allSaved, pinCell, pinGrid } from './support/pin-grid.ts';
import { DEMO, signIn } from './support/session.ts';
import { createSmallPlan } from './support/small-plan.ts';

const wireOf = (page: Page, pin: string) =>
  page
    .getByRole('grid', { name: 'Wires of this conversion' })
    .getByRole('row')
    .filter({ hasText: pin });

async function destination(page: Page, pin: string, typed: string, option: RegExp) {
  await pinCell(page, pin, 'destination').click();
  await page.keyboard.type(typed);
  await expect(page.getByRole('listbox').getByRole('option').first()).toHaveText(option);
  await page.keyboard.press('Enter');
  await allSaved(page);
}

test('a pin’s destination set and moved in the pin map is the wire in the wire list', async ({
  page,
}) => {
  await signIn(page, DEMO.builder);
  const plan = await createSmallPlan(page.request, 'Brede hay elevator', { joined: false });
  const made = await page.request.post(`/api/conversions/${plan.conversionId}/connectors`, {
    data: { label: 'V7', side: 'vehicle', cavityCount: 4 },
  });
  expect(made.ok()).toBe(true);

  await page.goto(`/conversions/${plan.conversionId}/pins`);
  await expect(pinGrid(page)).toBeVisible();
  await destination(page, 'E5-2', 'V7-2', /^V7-2/);
  await expect(pinCell(page, 'E5-2', 'destination')).toContainText('V7-2');

  await page.goto(`/conversions/${plan.conversionId}/wires`);
  await expect(wireOf(page, 'E5-2')).toHaveCount(1);
  await expect(wireOf(page, 'E5-2')).toContainText('V7-2');
  const label = (await wireOf(page, 'E5-2').getByRole('gridcell').first().textContent())!.trim();
  expect(label).toBe('W-001');

  // Moved to another cavity: the same wire follows, no second wire appears.
  await page.goto(`/conversions/${plan.conversionId}/pins`);
  await destination(page, 'E5-2', 'V7-4', /^V7-4/);
  await page
    .getByRole('navigation', { name: 'Conversion sections' })
    .getByRole('link', { name: 'Wires', exact: true })
    .click();
  await expect(wireOf(page, 'E5-2')).toHaveCount(1);
  await expect(wireOf(page, 'E5-2')).toContainText('V7-4');
  await expect(wireOf(page, 'E5-2')).toContainText('W-001');
  await page.screenshot({ path: 'test-results/screens/wire-follows-pin.png', fullPage: true });
});
