import type { Page } from 'playwright-core';

/**
 * On the Propose screen: the rationale, then item 1 as "Replace a value" of a species' phase,
 * picked from the species search as a curator does (`species` typed, `option` the entry chosen).
 */
export async function startReplacingValue(
  page: Page,
  rationale: string,
  item: { species: string; option: RegExp; phase: string },
): Promise<void> {
  await page.getByRole('heading', { name: 'Propose' }).waitFor();
  await page.getByLabel('Rationale').fill(rationale);
  await page.getByRole('combobox', { name: 'Item 1 kind' }).click();
  await page.getByRole('option', { name: 'Replace a value' }).click();
  await page.getByLabel('Item 1 species').fill(item.species);
  await page.getByRole('option', { name: item.option }).first().click();
  await page.getByRole('combobox', { name: 'Item 1 phase' }).click();
  await page.getByRole('option', { name: item.phase, exact: true }).click();
}
