import type { Locator, Page } from 'playwright-core';
import { expect } from 'vitest';
import type { MaterialCreate } from '@batchproof/shared';
import type { JourneyHarness } from './journey-harness';

/** Creates a material through the API as the signed-in owner (faster than the form); its id. */
export async function createMaterial(
  h: JourneyHarness,
  token: string,
  body: MaterialCreate,
): Promise<string> {
  const res = await fetch(`${h.baseUrl}/api/materials`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });
  expect(res.status, await res.clone().text()).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

/** Adds a line in the editor: picks the material by typing part of its name, then its grams. */
export async function addLine(page: Page, search: string, option: string, grams: string) {
  // Count the lines before adding one: counting after the click can run before the new line
  // renders, and then the previous line would be overwritten.
  const lines = page.getByRole('list', { name: 'Formula lines' }).locator(':scope > li.line');
  const n = (await lines.count()) + 1;
  await page.getByRole('button', { name: 'Add line', exact: true }).click();
  const material = page.getByRole('combobox', { name: `Material, line ${n}`, exact: true });
  await material.fill(search);
  await page.getByRole('option', { name: new RegExp(option) }).click();
  await page.getByLabel(`Grams, line ${n}`).fill(grams);
}

/** The live findings listed under one market, e.g. `US · United States`. */
export function marketFindings(page: Page, title: string): Locator {
  return page.getByRole('region', { name: `${title} findings` });
}

/** The live ingredient declaration printed for a market. */
export function declaration(page: Page, market: string): Locator {
  return page.locator(`.declarations [data-market="${market}"] dd`);
}
