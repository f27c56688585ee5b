import { expect, type Page } from '@playwright/test';

/** The sections of a conversion, as its tab row names them. */
export type Section =
  'Overview' | 'Pin map' | 'Feeds' | 'Wires' | 'Box' | 'Checks' | 'Revisions' | 'Bench';

/** Opens a conversion from the list and one of its sections, as a person clicks there. */
export async function openSection(page: Page, conversion: string, section: Section) {
  await page.getByRole('link', { name: 'Conversions', exact: true }).click();
  await page.getByRole('link', { name: conversion }).click();
  await expect(page.getByRole('heading', { name: conversion, level: 1 })).toBeVisible();
  await page
    .getByRole('navigation', { name: 'Conversion sections' })
    .getByRole('link', { name: section, exact: true })
    .click();
}

/** The wire list's grid. */
export const wiresGrid = (page: Page) =>
  page.getByRole('grid', { name: 'Wires of this conversion' });
