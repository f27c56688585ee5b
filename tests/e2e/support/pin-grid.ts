import { expect, type Page } from '@playwright/test';

/** The pin map's grid. */
export const pinGrid = (page: Page) => page.getByRole('grid', { name: 'Pins' });

/** One cell of the pin grid: the pin by its name ("E5-1"), the column by its field. */
export const pinCell = (page: Page, pin: string, column: string) =>
  pinGrid(page).locator(
    `[role="row"][data-pin="${pin}"] [role="gridcell"][data-column="${column}"]`,
  );

/** Waits until every edit made in the grid has reached the server. */
export async function allSaved(page: Page) {
  await expect(page.getByText('All changes saved')).toBeVisible();
}
