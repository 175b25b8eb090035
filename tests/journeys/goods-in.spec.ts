import { randomBytes } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';
import { shownDay } from './material-and-certificate-steps';

/** Creates a material through the API as the signed-in owner; returns its id. */
async function createMaterial(
  h: JourneyHarness,
  token: string,
  body: { tradeName: string; inci: string; category: string },
): Promise<string> {
  const res = await fetch(`${h.baseUrl}/api/materials`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

/** The text of each cell of the lots table, row by row, keyed by its column's heading. */
async function lotRows(page: Page): Promise<Record<string, string>[]> {
  return page.getByRole('table', { name: 'Lots' }).evaluate((table) => {
    const text = (el: Element) => (el.textContent ?? '').replace(/\s+/g, ' ').trim();
    const headings = Array.from(table.querySelectorAll('thead th')).map(text);
    return Array.from(table.querySelectorAll('tbody tr')).map((row) =>
      Object.fromEntries(
        Array.from(row.querySelectorAll('td')).map((td, i) => [headings[i] ?? String(i), text(td)]),
      ),
    );
  });
}

describe('journey: goods-in', () => {
  let h: JourneyHarness;
  const run = `${Date.now().toString(36)}${randomBytes(3).toString('hex')}`;
  const owner = {
    name: 'Ada Marsh',
    email: `goods-in-${run}@journey.example`,
    password: 'owner-password-123',
  };

  beforeAll(async () => {
    h = await startJourneyHarness();
  });

  afterAll(async () => {
    await h?.close();
  });

  it('records a delivery, refuses an expiry before the day received, and finds the lot in the list', async () => {
    const page = await h.newPage();

    // A fresh workshop, signed up in the browser; data is then arranged over the API.
    await h.signUpWorkshop(page, { ...owner, workshop: `Hollowmere Bathworks ${run}` });
    const accessToken = await h.apiSignIn(owner.email, owner.password);

    // Two materials through the API.
    const citric = await createMaterial(h, accessToken, {
      tradeName: 'Citric acid, fine',
      inci: 'Citric Acid',
      category: 'acid',
    });
    await createMaterial(h, accessToken, {
      tradeName: 'Shea butter, refined',
      inci: 'Butyrospermum Parkii Butter',
      category: 'butter',
    });

    // The empty list says what to do.
    await page.getByRole('link', { name: 'Lots' }).click();
    await page.waitForURL('**/lots');
    await page.getByText('No goods-in recorded yet.').waitFor();
    await h.screenshot(page, 'goods-in-01-lots-empty');

    // Record goods-in: pick the material by typing part of its name.
    await page.getByRole('link', { name: 'Record goods-in' }).first().click();
    await page.waitForURL('**/lots/new');
    await page.getByRole('heading', { name: 'Record goods-in' }).waitFor();
    await page.getByRole('combobox', { name: 'Material' }).fill('shea');
    await page.getByRole('option', { name: /Shea butter, refined/ }).click();
    await page.getByLabel('Supplier lot number').fill('SB-2231');
    await page.getByLabel('Quantity received').fill('5000');
    await page.getByLabel('Received on').fill('2026-03-01');
    await page.getByLabel('Expiry date').fill('2026-02-01');
    await page.getByLabel('Cost per g').fill('0.018');
    await page.getByLabel('Notes').fill('Two tubs, seals intact.');

    // An expiry before the day received is refused beside the field; nothing typed is lost.
    await page.getByRole('button', { name: 'Record lot' }).click();
    await page.getByText('The expiry date cannot be before the day it was received').waitFor();
    expect(await page.getByRole('combobox', { name: 'Material' }).inputValue()).toBe(
      'Shea butter, refined',
    );
    expect(await page.getByLabel('Supplier lot number').inputValue()).toBe('SB-2231');
    expect(await page.getByLabel('Quantity received').inputValue()).toBe('5000');
    // Typed as 2026-02-01, the day is shown back the way the app writes dates.
    expect(await page.getByLabel('Expiry date').inputValue()).toBe(
      await shownDay(page, '2026-02-01'),
    );
    expect(await page.getByLabel('Notes').inputValue()).toBe('Two tubs, seals intact.');
    await page.waitForTimeout(300); // let the message finish fading in for the screenshot
    await h.screenshot(page, 'goods-in-02-expiry-before-received');

    // Corrected, the lot is recorded and opens with its stock on hand.
    await page.getByLabel('Expiry date').fill('2027-09-01');
    await page.getByRole('button', { name: 'Record lot' }).click();
    await page.getByRole('heading', { name: 'Lot SB-2231' }).waitFor();
    expect(page.url()).toMatch(/\/lots\/[0-9a-f-]{36}$/);
    await page.getByText('Lot SB-2231 of Shea butter, refined is recorded.').waitFor();
    expect(await page.locator('.stock-figure').textContent()).toMatch(/5,000\s*g/);
    await page.getByRole('heading', { name: 'Supplier documents' }).waitFor();
    await h.screenshot(page, 'goods-in-03-lot-recorded');

    // A second delivery, through the API, so the list has something to filter out.
    const res = await fetch(`${h.baseUrl}/api/lots`, {
      method: 'POST',
      headers: { authorization: `Bearer ${accessToken}`, 'content-type': 'application/json' },
      body: JSON.stringify({
        materialId: citric,
        supplierLotNumber: 'CA-77',
        quantity: 2,
        unit: 'kg',
        receivedOn: '2026-02-10',
        expiresOn: '2026-02-20',
      }),
    });
    expect(res.status).toBe(201);

    // Both lots in the list, with stock on hand and units; the expired one says so.
    await page.getByRole('link', { name: 'Lots' }).first().click();
    await page.waitForURL('**/lots');
    await page.getByRole('table', { name: 'Lots' }).getByText('CA-77').waitFor();
    const rows = await lotRows(page);
    expect(rows.map((r) => [r['Material'], r['Supplier lot'], r['Stock on hand']])).toEqual([
      ['Shea butter, refined', 'SB-2231', '5,000 g'],
      ['Citric acid, fine', 'CA-77', '2 kg'],
    ]);
    expect(rows[1]!['Expiry']).toContain('Expired');
    await h.screenshot(page, 'goods-in-04-lots-list');

    // Filtering by lot number goes through the URL to the server.
    await page.getByLabel('Filter by lot number or material').fill('SB-');
    await page.waitForURL('**/lots?q=SB-');
    await expect
      .poll(() => lotRows(page).then((r) => r.map((row) => row['Supplier lot'])))
      .toEqual(['SB-2231']);
    await h.screenshot(page, 'goods-in-05-lots-filtered');

    // Filtering for expired lots finds none of these, and says how to see them all.
    await page.getByRole('combobox', { name: 'Expiry' }).click();
    await page.getByRole('option', { name: 'Already expired' }).click();
    await page.waitForURL(/expiry=expired/);
    await page.getByText('No lots match these filters.').waitFor();
    await page.getByRole('button', { name: 'Clear the filters' }).click();
    await expect.poll(() => lotRows(page).then((r) => r.length)).toBe(2);

    expect(h.problems).toEqual([]);
  });
});
