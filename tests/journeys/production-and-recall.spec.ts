import type { Batch, Recall } from '@batchproof/shared';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, openFromNav, signIn } from './demo-steps';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';

const OWNER = 'owner@hollowmere.example';
const TAPIOCA_LOT = 'FB-TS-0441';
const CUSTOMERS = [
  { name: 'Wrenfield Corner Pantry', email: 'orders@cornerpantry.example', units: 6 },
  { name: 'Saltmarsh Gift House', email: 'buying@saltmarshgifts.example', units: 4 },
];

describe('journey: a batch from the weigh sheet to a recall', () => {
  let h: JourneyHarness;
  let token: string;

  beforeAll(async () => {
    h = await startJourneyHarness();
    await h.seedDemo(DEMO_PASSWORD);
    token = await h.apiSignIn(OWNER, DEMO_PASSWORD);
  });

  afterAll(async () => {
    await h?.close();
  });

  /** Reads a record as the owner, to check what the screens did. */
  async function read<T>(path: string): Promise<T> {
    const res = await fetch(`${h.baseUrl}${path}`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    expect(res.status).toBe(200);
    return (await res.json()) as T;
  }

  /** Picks `option` in the Material select called `label`. */
  async function choose(page: Page, label: string | RegExp, option: string | RegExp) {
    await page.getByRole('combobox', { name: label }).click();
    await page.getByRole('option', { name: option }).click();
  }

  it('makes the fizzer with tapioca starch, delivers it to two shops, traces the citric acid lot, recalls it by e-mail and starts a complaint clock', async () => {
    const page = await h.newPage();
    await signIn(h, page, OWNER);

    // Start a batch of the demo fizzer: 12 units at the profile's 150 g.
    await openFromNav(page, 'Production');
    await page.getByRole('heading', { name: 'Production' }).waitFor();
    await h.screenshot(page, 'production-01-batches');
    await page.getByRole('link', { name: 'Start a batch' }).first().click();
    await choose(page, 'Product', /^Orchard Fog Fizzer/);
    await page.getByLabel('Units to make').fill('12');
    await h.screenshot(page, 'production-02-start');
    await page.getByRole('button', { name: /Start the batch/ }).click();
    await page.waitForURL(/\/production\/[0-9a-f-]{36}$/);
    const batchId = page.url().split('/').pop()!;
    const started = await read<Batch>(`/api/batches/${batchId}`);
    const starch = started.lines.find((l) => l.materialName === 'Cornstarch')!;
    expect(starch.substitutes.map((s) => s.materialName)).toEqual(['Tapioca Starch']);

    // Weigh every line from its suggested lots; the starch line from tapioca instead.
    for (const line of started.lines) {
      if (line === starch) continue;
      await page
        .getByRole('button', { name: `Use suggestion for line ${line.lineNumber}` })
        .click();
    }
    const n = starch.lineNumber;
    await choose(page, `Material for line ${n}`, /^Tapioca Starch/);
    await page.getByRole('button', { name: `Add a lot to line ${n}` }).click();
    const row = page
      .getByRole('row')
      .filter({ has: page.getByRole('rowheader', { name: String(n), exact: true }) });
    await row.getByRole('combobox', { name: 'Lot' }).click();
    await page.getByRole('option', { name: new RegExp(TAPIOCA_LOT) }).click();
    await row.getByLabel('Grams').fill(String(starch.weighGrams));
    await page.getByLabel(`Weighed, line ${n}`).fill(String(starch.weighGrams));
    await page.getByLabel('Units made').fill('12');
    await h.screenshot(page, 'production-03-weigh-sheet');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText(/saved/i).first().waitFor();
    await page.getByRole('button', { name: 'Release' }).click();
    await page.getByText(new RegExp(`Batch ${started.batchCode} is released`)).waitFor();
    const released = await read<Batch>(`/api/batches/${batchId}`);
    expect(released.state).toBe('released');
    const usedStarch = released.lines.find((l) => l.lineNumber === n)!;
    expect(usedStarch.usedMaterialName).toBe('Tapioca Starch');
    expect(usedStarch.lotPicks.map((p) => p.supplierLotNumber)).toEqual([TAPIOCA_LOT]);
    const citricLine = released.lines.find((l) => l.materialName.startsWith('Citric Acid'))!;
    // The first-expiring citric acid lot with enough stock (the earlier one, on a fresh demo).
    expect(citricLine.lotPicks).toHaveLength(1);
    const CITRIC_LOT = citricLine.lotPicks[0]!.supplierLotNumber;
    await h.screenshot(page, 'production-04-released');

    // Deliver it to two shops.
    for (const customer of CUSTOMERS) {
      await openFromNav(page, 'Deliveries');
      await page.getByRole('link', { name: 'New delivery' }).click();
      await choose(page, 'Customer', customer.name);
      await page.getByLabel('Lot code (line 1)').fill(released.batchCode);
      await page.getByLabel('Units (line 1)').fill(String(customer.units));
      await page.getByRole('button', { name: 'Record delivery' }).click();
      await page.waitForURL(/\/deliveries\/[0-9a-f-]{36}$/);
    }
    await openFromNav(page, 'Deliveries');
    await page
      .getByRole('table', { name: 'Deliveries' })
      .getByText(CUSTOMERS[1]!.name)
      .first()
      .waitFor();
    await h.screenshot(page, 'production-05-deliveries');

    // Trace the citric acid lot forward: the new batch and both shops are in it.
    await openFromNav(page, 'Trace');
    await page.getByRole('heading', { name: 'Trace', exact: true }).waitFor();
    await page.getByRole('searchbox').fill(CITRIC_LOT);
    await page
      .getByRole('link', { name: new RegExp(CITRIC_LOT) })
      .first()
      .click();
    await page.waitForURL(/\/trace\/supplier-lots\/[0-9a-f-]{36}$/);
    const traceTable = page.getByRole('table').first();
    await traceTable.getByText(released.batchCode).first().waitFor();
    for (const customer of CUSTOMERS) await page.getByText(customer.name).first().waitFor();
    await h.screenshot(page, 'production-06-trace-forward');

    // Open a recall from the trace and send the notices.
    await page.getByRole('link', { name: /Open a recall/ }).click();
    await page.getByRole('heading', { name: 'Open a recall' }).waitFor();
    await page.getByText(CUSTOMERS[0]!.name).first().waitFor();
    await page
      .getByLabel('Reason')
      .fill(`The supplier reports lot ${CITRIC_LOT} of citric acid may hold glass fragments.`);
    await page.getByRole('radio', { name: /serious harm/i }).click();
    await h.screenshot(page, 'production-07-open-recall');
    await page.getByRole('button', { name: 'Open the recall' }).click();
    await page.waitForURL(/\/recalls\/[0-9a-f-]{36}$/);
    const recallId = page.url().split('/').pop()!;
    await page.getByRole('button', { name: /^Send notices/ }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Send notices' }).click();
    const mails = await Promise.all(CUSTOMERS.map((c) => h.mail.waitFor(c.email)));
    for (const mail of mails) {
      expect(mail.subject).toContain(released.batchCode);
      expect(mail.text).toContain(released.batchCode);
      expect(mail.text).toContain('Stop selling');
    }
    // The notices' statuses are saved with the sending, once the mail server has taken each one.
    await page.getByRole('table', { name: 'Notices' }).getByText(CUSTOMERS[0]!.email).waitFor();
    const recall = await read<Recall>(`/api/recalls/${recallId}`);
    const sentTo = recall.notices.filter((x) => x.status === 'sent').map((x) => x.to);
    for (const c of CUSTOMERS) expect(sentTo).toContain(c.email);
    await h.screenshot(page, 'production-08-notices-sent');

    // A shop reports a rash: a serious complaint against the batch; its clock shows at home.
    await openFromNav(page, 'Complaints');
    await page
      .getByRole('link', { name: /Log a complaint/ })
      .first()
      .click();
    await choose(page, 'Product', 'Orchard Fog Fizzer');
    await choose(page, 'Batch', new RegExp(released.batchCode));
    await page
      .getByLabel('What happened')
      .fill('A customer of the pantry had a spreading rash after one bath.');
    await page.getByRole('checkbox', { name: 'Serious adverse event' }).check();
    await page.getByRole('button', { name: 'Log the complaint' }).click();
    await page.getByRole('region', { name: 'US reporting clock' }).waitFor();
    await h.screenshot(page, 'production-09-complaint');
    await openFromNav(page, 'Home');
    const home = page.getByText(new RegExp(`batch ${released.batchCode}\\), received`));
    await home.waitFor();
    expect(await home.textContent()).toMatch(/business days? left|Report to FDA by/i);
    await h.screenshot(page, 'production-10-home');
  }, 180_000);
});
