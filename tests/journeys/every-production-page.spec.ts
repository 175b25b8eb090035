import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, it } from 'vitest';
import { DEMO_PASSWORD, openFromNav, signIn } from './demo-steps';
import { type JourneyHarness, startJourneyHarness } from './journey-harness';

describe('journey: every production and recall page of the demo workshop at three widths', () => {
  let h: JourneyHarness;

  beforeAll(async () => {
    h = await startJourneyHarness();
    await h.seedDemo(DEMO_PASSWORD);
  });

  afterAll(async () => {
    await h?.close();
  });

  /** Opens the first link of `table` and waits for `heading`. */
  async function openFirst(page: Page, table: string, heading: RegExp) {
    await page.getByRole('table', { name: table }).getByRole('link').first().click();
    await page.getByRole('heading', { name: heading }).first().waitFor();
  }

  // About 20 pages at three widths each.
  it('lays out batches, deliveries, customers, traces, recalls, complaints and the audit log with nothing sticking out or clipped', async () => {
    const page = await h.newPage();
    await signIn(h, page, 'owner@hollowmere.example');

    // The home page lists the curing batch, the draft awaiting release and the low lots.
    await page
      .getByText(/awaiting release|curing/i)
      .first()
      .waitFor();
    await h.screenshot(page, 'every-production-01-home');

    // Production: the list, a released batch with its weigh sheet, the draft, a new batch.
    await openFromNav(page, 'Production');
    await page.getByRole('heading', { name: 'Production', level: 1 }).waitFor();
    await page.getByRole('table').getByRole('link').first().waitFor();
    await h.screenshot(page, 'every-production-02-batches');
    const codes = page.getByRole('table').getByRole('link');
    await codes.last().click();
    await page
      .getByRole('table', { name: /Weigh sheet/ })
      .first()
      .waitFor();
    await h.screenshot(page, 'every-production-03-batch-released');
    await page.goBack();
    await codes.first().click();
    await page
      .getByRole('table', { name: /Weigh sheet/ })
      .first()
      .waitFor();
    await h.screenshot(page, 'every-production-04-batch');
    await page.goto('/production/new');
    await page.getByRole('heading', { name: 'Start a batch' }).waitFor();
    await h.screenshot(page, 'every-production-05-batch-new');

    // Deliveries, one delivery, a new one, the import, customers and one customer.
    await openFromNav(page, 'Deliveries');
    await page.getByRole('table', { name: 'Deliveries' }).getByRole('link').first().waitFor();
    await h.screenshot(page, 'every-production-06-deliveries');
    await openFirst(page, 'Deliveries', /Delivery/);
    await h.screenshot(page, 'every-production-07-delivery');
    await page.goto('/deliveries/new');
    await page.getByLabel('Lot code (line 1)').waitFor();
    await h.screenshot(page, 'every-production-08-delivery-new');
    await page.goto('/deliveries/import');
    await page.getByRole('heading', { level: 1 }).waitFor();
    await h.screenshot(page, 'every-production-09-delivery-import');
    await page.goto('/deliveries/customers');
    await page.getByRole('link', { name: 'Saltmarsh Gift House' }).first().waitFor();
    await h.screenshot(page, 'every-production-10-customers');
    await page.getByRole('link', { name: 'Saltmarsh Gift House' }).first().click();
    await page.getByRole('heading', { name: 'Saltmarsh Gift House' }).waitFor();
    await h.screenshot(page, 'every-production-11-customer');

    // Trace: the search, forward from the drill's citric acid lot, backward from its first batch.
    await openFromNav(page, 'Trace');
    await page.getByRole('heading', { name: 'Trace', exact: true }).waitFor();
    await page.getByRole('searchbox').fill('FB-CA-0612');
    await page
      .getByRole('link', { name: /FB-CA-0612/ })
      .first()
      .waitFor();
    await h.screenshot(page, 'every-production-12-trace-search');
    await page
      .getByRole('link', { name: /FB-CA-0612/ })
      .first()
      .click();
    await page.waitForURL(/\/trace\/supplier-lots\//);
    await page.getByRole('table').first().waitFor();
    // The graph is drawn (ngx-graph's SVG) beside the tables.
    await page.locator('bp-trace-graph svg').first().waitFor();
    await h.screenshot(page, 'every-production-13-trace-forward');
    await page.getByRole('table').first().getByRole('link').first().click();
    await page.waitForURL(/\/production\/|\/trace\/finished-lots\//);
    await page.goto(page.url().replace('/production/', '/trace/finished-lots/'));
    await page.getByRole('table').first().waitFor();
    await h.screenshot(page, 'every-production-14-trace-backward');

    // Recalls: the list and the finished drill with its report.
    await openFromNav(page, 'Recalls');
    await page.getByRole('heading', { name: 'Recalls', level: 1 }).waitFor();
    await page.getByRole('table').getByRole('link').first().waitFor();
    await h.screenshot(page, 'every-production-15-recalls');
    // The demo's drill (another journey may have opened a real recall in the same workshop).
    const token = await h.apiSignIn('owner@hollowmere.example', DEMO_PASSWORD);
    const drills = await fetch(`${h.baseUrl}/api/recalls?drill=true`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    const { items } = (await drills.json()) as { items: { id: string }[] };
    await page.goto(`/recalls/${items[0]!.id}`);
    await page.getByRole('heading', { name: 'Drill report' }).waitFor();
    await h.screenshot(page, 'every-production-16-recall-drill');

    // Complaints: the list and a new one; the audit log; a lot's stock movements.
    await openFromNav(page, 'Complaints');
    await page.getByRole('heading', { name: 'Complaints', level: 1 }).waitFor();
    await h.screenshot(page, 'every-production-17-complaints');
    await page.goto('/complaints/new');
    await page.getByRole('heading', { name: 'Log a complaint' }).waitFor();
    await h.screenshot(page, 'every-production-18-complaint-new');
    await page.goto('/audit-log');
    await page.getByRole('table').first().waitFor();
    await h.screenshot(page, 'every-production-19-audit-log');
    await page.goto('/lots?q=FB-CA-0612');
    await page
      .getByRole('link', { name: /FB-CA-0612/ })
      .first()
      .click();
    await page
      .getByText(/Stock movements/)
      .first()
      .waitFor();
    await h.screenshot(page, 'every-production-20-lot-movements');
  }, 180_000);
});
