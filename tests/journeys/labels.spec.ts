import { mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { BUILT_IN_LABEL_STOCKS, labelPositions } from '@batchproof/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decodeBarcodes, readPdf, textIn } from '../support/label-pdf-reader';
import { DEMO_PASSWORD, openFromNav, signIn } from './demo-steps';
import { type JourneyHarness, OUTPUT_DIR, startJourneyHarness } from './journey-harness';

const STOCK = BUILT_IN_LABEL_STOCKS.find((s) => s.name.startsWith('US Letter · 2⅝ × 1 in'))!;
const LOT = 'RF-2612';

describe('journey: printing the demo foaming fizzer on a part-used 30-up sheet', () => {
  let h: JourneyHarness;

  beforeAll(async () => {
    h = await startJourneyHarness();
    await h.seedDemo(DEMO_PASSWORD);
  });

  afterAll(async () => {
    await h?.close();
  });

  it('prints US and EU small-item labels from position 7, previews them and opens the QR code page at phone width', async () => {
    const page = await h.newPage();
    await signIn(h, page, 'owner@hollowmere.example');

    // From the formula's released version to the print page.
    await openFromNav(page, 'Formulas');
    await page.getByRole('link', { name: 'Rainfall Foaming Fizzer' }).click();
    await page
      .getByRole('heading', { name: /Rainfall Foaming Fizzer/ })
      .first()
      .waitFor();
    await page.getByRole('link', { name: 'Print labels' }).first().click();
    await page.getByRole('heading', { name: 'Print labels: Rainfall Foaming Fizzer' }).waitFor();

    // The US and the EU only.
    for (const [market, wanted] of [
      ['US', true],
      ['EU', true],
      ['UK', false],
    ] as const) {
      const box = page.getByRole('checkbox', { name: new RegExp(`^${market} ·`) });
      if ((await box.isChecked()) !== wanted) await box.click();
      expect(await box.isChecked()).toBe(wanted);
    }

    await page.getByRole('combobox', { name: 'Label stock' }).click();
    await page.getByRole('option', { name: STOCK.name }).click();
    await page.getByRole('radio', { name: 'Small item with QR code' }).click();
    await page.getByRole('checkbox', { name: /The outer pack, a tag or a card carries/ }).click();
    await page.getByRole('radio', { name: /^Position 7,/ }).click();
    // The page redraws after the click has returned: wait for it rather than read at once.
    await expect
      .poll(() => page.getByRole('radio', { name: /^Position 7,/ }).getAttribute('aria-checked'))
      .toBe('true');
    await page.getByLabel('Copies per market').fill('3');
    await page.getByLabel('Lot code').fill(LOT);
    await h.screenshot(page, 'labels-01-print-form');

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Make the labels PDF' }).click();
    await page.getByText('Print at actual size (100 %).').waitFor({ timeout: 30_000 });
    await page.getByRole('heading', { name: '6 labels on 1 page' }).waitFor();
    await page.locator('iframe.pdf').waitFor();
    await h.screenshot(page, 'labels-02-preview');

    // Save the preview's PDF, as a maker would before printing.
    await page.getByRole('link', { name: 'Download the PDF' }).click();
    const saved = path.join(OUTPUT_DIR, 'labels-rainfall-fizzer.pdf');
    mkdirSync(OUTPUT_DIR, { recursive: true });
    await (await download).saveAs(saved);
    const pdf = readFileSync(saved);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');

    // Positions 1–6 stay empty; the six labels fill positions 7 to 12, US first, then EU.
    const [sheet] = await readPdf(pdf);
    const boxes = labelPositions(STOCK);
    for (const box of boxes.slice(0, 6)) expect(textIn(sheet!, box)).toBe('');
    const texts = boxes.slice(6, 12).map((box) => textIn(sheet!, box));
    for (const text of texts) {
      expect(text).toContain('Rainfall Foaming Bath Fizzer');
      expect(text).toContain(LOT);
    }
    expect(texts.slice(0, 3).every((t) => /Net Wt\. [\d.]+ oz \(\d+ g\)/.test(t))).toBe(true);
    expect(textIn(sheet!, boxes[12]!)).toBe('');

    // Each label's QR code leads to the public ingredients page.
    const urls = new Set<string>();
    for (const image of sheet!.images) {
      for (const result of await decodeBarcodes(image)) {
        if (result.format === 'QRCode') urls.add(result.text);
      }
    }
    // One page per run; each market's labels open it on that market's label.
    expect([...urls].map((u) => new URL(u).searchParams.get('market')).sort()).toEqual([
      'EU',
      'US',
    ]);
    const paths = new Set([...urls].map((u) => u.replace(/\?.*$/, '')));
    expect(paths.size).toBe(1);
    for (const url of urls) expect(url.startsWith(`${h.baseUrl}/p/`)).toBe(true);
    const euUrl = [...urls].find((u) => u.endsWith('market=EU'))!;

    // The public page, without signing in, on a phone.
    const phone = await h.newPage({ width: 360, height: 740 });
    await phone.goto(euUrl);
    await phone.getByRole('heading', { name: 'Rainfall Foaming Bath Fizzer' }).waitFor();
    const body = (await phone.locator('body').innerText()).replace(/\s+/g, ' ');
    // The EU label's declaration, with "Parfum" for the fragrance (Annex VII glossary name).
    expect(body).toMatch(/Ingredients: Sodium Bicarbonate, Citric Acid, .*Parfum/);
    expect(body).toContain(LOT);
    expect(body).not.toContain('owner@hollowmere.example');
    expect(body).not.toContain('Orchard Fog Fizzer');
    expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      360,
    );
    await h.screenshot(phone, 'labels-03-public-page');
    expect(h.problems).toEqual([]);
  });
});
