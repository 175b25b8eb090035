import { describe, expect, it } from 'vitest';
import {
  gs1ElementString,
  labelPositions,
  netQuantityStatement,
  type ComplianceMarket,
  type LabelBox,
  type LabelFieldKey,
} from '@batchproof/shared';
import {
  checkLabelFit,
  countLabels,
  renderCalibrationPdf,
  renderLabelSheet,
  type LabelSheetRequest,
} from '../../apps/api/src/labels/pdf';
import {
  builtInStock,
  fizzerContent,
  EXPIRY,
  fizzerElementString,
  fizzerEvaluation,
  LOT,
} from '../support/label-pdf-samples';
import {
  decodeBarcodes,
  readPdf,
  textIn,
  type PdfPage,
  type PdfShape,
} from '../support/label-pdf-reader';

/** How close every drawn label must be to its template geometry. */
const TOLERANCE_MM = 0.2;
const PUBLIC_URL = 'https://batchproof.example/p/7bq2JxW9tLm4aRk8VfZ3nC';

/** A request for the US and EU fizzer labels, their content built for the stock and layout. */
function request(
  overrides: Partial<LabelSheetRequest>,
  markets: ComplianceMarket[] = ['US', 'EU'],
): LabelSheetRequest {
  const stock = overrides.stock ?? builtInStock('letter-4x2in-10');
  const layout = overrides.layout ?? 'panels';
  return {
    stock,
    startPosition: 1,
    layout,
    placement: {},
    barcode: 'gs1-datamatrix',
    contents: markets.map((m) => fizzerContent(m, stock, layout)),
    copies: 1,
    publicUrl: null,
    ...overrides,
  };
}

/** The white label outlines the renderer draws under each label, in drawing order. */
const labelOutlines = (page: PdfPage) => page.shapes.filter((s) => s.fill === '#ffffff');

/** Fails when a text run's box (cap height to descenders) overlaps a drawn code. */
function expectNoTextOnCodes(page: PdfPage) {
  for (const image of page.images) {
    for (const t of page.texts) {
      const overlaps =
        t.xMm < image.xMm + image.widthMm &&
        t.xMm + t.widthMm > image.xMm &&
        t.baselineMm - 0.7 * t.sizeMm < image.yMm + image.heightMm &&
        t.baselineMm + 0.25 * t.sizeMm > image.yMm;
      expect(overlaps, `${t.str} clear of the code`).toBe(false);
    }
  }
}

function expectAt(shape: PdfShape | undefined, box: Omit<LabelBox, 'index' | 'row' | 'column'>) {
  expect(shape).toBeDefined();
  expect(Math.abs(shape!.xMm - box.xMm)).toBeLessThanOrEqual(TOLERANCE_MM);
  expect(Math.abs(shape!.yMm - box.yMm)).toBeLessThanOrEqual(TOLERANCE_MM);
  expect(Math.abs(shape!.widthMm - box.widthMm)).toBeLessThanOrEqual(TOLERANCE_MM);
  expect(Math.abs(shape!.heightMm - box.heightMm)).toBeLessThanOrEqual(TOLERANCE_MM);
}

const normalise = (s: string) => s.replace(/\s+/g, ' ').trim();
const fieldOf = (req: LabelSheetRequest, market: ComplianceMarket, key: LabelFieldKey) =>
  req.contents.find((c) => c.market === market)!.fields.find((f) => f.key === key)!;
const textOf = (req: LabelSheetRequest, market: ComplianceMarket, key: LabelFieldKey) =>
  normalise(fieldOf(req, market, key).text);

describe('renderLabelSheet on a part-used 30-up Letter sheet (small-item labels)', () => {
  const stock = builtInStock('letter-2.625x1in-30');
  const req = request({
    stock,
    startPosition: 7,
    layout: 'small',
    copies: 3,
    publicUrl: PUBLIC_URL,
  });

  it('fits, and counts 6 labels on one page', () => {
    expect(checkLabelFit(req)).toEqual([]);
    expect(countLabels(req)).toEqual({ labelCount: 6, pageCount: 1 });
  });

  it('puts every label within 0.2 mm of positions 7 to 12, with its net quantity and a QR code of the public page', async () => {
    const pdf = await renderLabelSheet(req);
    const [page, ...rest] = await readPdf(pdf);
    expect(rest).toHaveLength(0);
    // 100 % scale: the page is US Letter, 215.9 × 279.4 mm.
    expect(page!.widthMm).toBeCloseTo(215.9, 1);
    expect(page!.heightMm).toBeCloseTo(279.4, 1);
    const boxes = labelPositions(stock).slice(6, 12);
    const outlines = labelOutlines(page!);
    expect(outlines).toHaveLength(6);
    boxes.forEach((box, i) => expectAt(outlines[i], box));
    // Positions 7–9 are the US copies, 10–12 the EU ones.
    for (const [i, box] of boxes.entries()) {
      const market = i < 3 ? 'US' : 'EU';
      expect(textIn(page!, box)).toContain(textOf(req, market, 'netQuantity'));
    }
    // Nothing printed before position 7.
    const first = labelPositions(stock)[0]!;
    expect(textIn(page!, { ...first, heightMm: boxes[0]!.yMm - first.yMm })).toBe('');
    expect(page!.images).toHaveLength(6);
    expectNoTextOnCodes(page!);
    // Each label's QR code opens the public page on its own market's label.
    const [usQr] = await decodeBarcodes(page!.images[0]!);
    expect(usQr).toMatchObject({ format: 'QRCode', text: `${PUBLIC_URL}?market=US` });
    const [euQr] = await decodeBarcodes(page!.images[5]!);
    expect(euQr).toMatchObject({ format: 'QRCode', text: `${PUBLIC_URL}?market=EU` });
    // Source Sans 3 is embedded, no other font is used.
    expect(page!.fonts.length).toBeGreaterThan(0);
    for (const t of page!.texts)
      expect(t.fontName).toMatch(/^[A-Z]{6}\+SourceSans3-(Regular|Bold)$/);
  });
});

describe('renderLabelSheet with front and back labels on 4 × 2 in sheets (GS1 DataMatrix)', () => {
  const stock = builtInStock('letter-4x2in-10');

  it('prints the exact declaration, warning and net quantity texts in their labels, and a DataMatrix carrying GTIN, expiry and lot', async () => {
    const req = request({ stock, startPosition: 3, copies: 1 });
    expect(checkLabelFit(req)).toEqual([]);
    const pages = await readPdf(await renderLabelSheet(req));
    expect(pages).toHaveLength(1);
    const page = pages[0]!;
    const boxes = labelPositions(stock);
    labelOutlines(page).forEach((shape, i) => expectAt(shape, boxes[2 + i]!));
    const [usFront, usBack, euFront, euBack] = boxes.slice(2, 6) as [
      LabelBox,
      LabelBox,
      LabelBox,
      LabelBox,
    ];

    expect(textIn(page, usFront)).toContain(textOf(req, 'US', 'netQuantity'));
    expect(textIn(page, usBack)).toContain(normalise(fizzerEvaluation.declarations.US!.text));
    expect(textIn(page, usBack)).toContain(normalise(fizzerEvaluation.warnings.US!.join(' ')));
    expect(textIn(page, euBack)).toContain(normalise(fizzerEvaluation.declarations.EU!.text));
    expect(textIn(page, euFront)).toContain(textOf(req, 'EU', 'netQuantity'));

    // 21 CFR 701.13: the net quantity's baseline sits in the bottom 30 % of the front label.
    const net = page.texts.filter(
      (t) =>
        t.str.includes('Net') &&
        t.baselineMm > usFront.yMm &&
        t.baselineMm < usFront.yMm + usFront.heightMm,
    );
    expect(net.length).toBeGreaterThan(0);
    for (const t of net) expect(t.baselineMm).toBeGreaterThan(usFront.yMm + 0.7 * usFront.heightMm);

    // 21 CFR 740.2(a): warnings bold, lower-case letters at least 1/16 in (x-height 486/1000 of the
    // size for Source Sans 3 Regular, 496/1000 for Bold).
    const warning = page.texts.find((t) => t.str.startsWith('Caution'));
    expect(warning).toBeDefined();
    const warnings = fieldOf(req, 'US', 'warnings');
    expect(warnings.minimum).toMatchObject({ inches: 1 / 16, source: '21 CFR 740.2(a)' });
    expect(warning!.sizeMm * 0.496).toBeGreaterThanOrEqual(warnings.minimum.mm - 1e-3);
    expect(warning!.fontName).toMatch(/\+SourceSans3-Bold$/);
    expect(page.texts.find((t) => t.str.startsWith('Ingredients'))?.fontName).toMatch(
      /\+SourceSans3-Regular$/,
    );

    // Every text run lies inside the label it belongs to.
    for (const t of page.texts) {
      const inside = boxes.some(
        (b) =>
          t.xMm >= b.xMm &&
          t.xMm + t.widthMm <= b.xMm + b.widthMm + 1e-6 &&
          t.baselineMm > b.yMm &&
          t.baselineMm < b.yMm + b.heightMm,
      );
      expect(inside, `${t.str} lies inside a label`).toBe(true);
    }

    expectNoTextOnCodes(page);
    // One DataMatrix per market, on the back label, decoding to the engine's element string.
    expect(page.images).toHaveLength(2);
    for (const image of page.images) {
      expect(image.xMm).toBeGreaterThanOrEqual(usBack.xMm);
      const [code] = await decodeBarcodes(image);
      expect(code).toMatchObject({ format: 'DataMatrix', text: fizzerElementString.hri });
      expect(code!.text).toBe('(01)09521234543213(17)270131(10)RF-0412');
    }
  });

  it('draws the lot code of a product without a GTIN as an internal code: (17) expiry and (10) lot', async () => {
    const req = request({ stock, copies: 1 }, ['EU']);
    const element = gs1ElementString({ expiry: EXPIRY, lot: LOT });
    expect(element.warnings[0]).toMatch(/internal code/);
    req.contents = req.contents.map((c) => ({
      ...c,
      barcode: { hri: element.hri, warnings: element.warnings },
    }));
    expect(checkLabelFit(req)).toEqual([]);
    const [page] = await readPdf(await renderLabelSheet(req));
    const [code] = await decodeBarcodes(page!.images[0]!);
    expect(code).toMatchObject({ format: 'DataMatrix', text: '(17)270131(10)RF-0412' });
  });

  it('reports progress in labels up to the total', async () => {
    const seen: [number, number][] = [];
    await renderLabelSheet(request({ stock, copies: 5 }), (done, total) =>
      seen.push([done, total]),
    );
    expect(seen.at(-1)).toEqual([20, 20]);
    for (let i = 1; i < seen.length; i++)
      expect(seen[i]![0]).toBeGreaterThanOrEqual(seen[i - 1]![0]);
  });

  it('continues on the next sheet: 2 markets × 15 copies × 2 labels from position 7 take 7 pages', async () => {
    const req = request({ stock, startPosition: 7, copies: 15 });
    expect(countLabels(req)).toEqual({ labelCount: 60, pageCount: 7 });
    const pages = await readPdf(await renderLabelSheet(req));
    expect(pages).toHaveLength(7);
    expect(labelOutlines(pages[0]!)).toHaveLength(4);
    expect(labelOutlines(pages[1]!)).toHaveLength(10);
    expect(labelOutlines(pages[6]!)).toHaveLength(6);
    labelOutlines(pages[1]!).forEach((shape, i) => expectAt(shape, labelPositions(stock)[i]!));
  });
});

describe('renderLabelSheet on a roll (GS1-128)', () => {
  const stock = builtInStock('roll-4x6in');

  it('prints one label per page the size of the label, with a GS1-128 code and its human-readable line', async () => {
    const req = request({ stock, layout: 'single', barcode: 'gs1-128', copies: 2 }, ['US']);
    expect(checkLabelFit(req)).toEqual([]);
    expect(countLabels(req)).toEqual({ labelCount: 2, pageCount: 2 });
    const pages = await readPdf(await renderLabelSheet(req));
    expect(pages).toHaveLength(2);
    for (const page of pages) {
      expect(page.widthMm).toBeCloseTo(101.6, 1);
      expect(page.heightMm).toBeCloseTo(152.4, 1);
      expectAt(labelOutlines(page)[0], { xMm: 0, yMm: 0, widthMm: 101.6, heightMm: 152.4 });
      const all = textIn(page, { xMm: 0, yMm: 0, widthMm: 101.6, heightMm: 152.4 });
      expect(all).toContain(normalise(fizzerEvaluation.declarations.US!.text));
      expect(all).toContain(fizzerElementString.hri);
      expectNoTextOnCodes(page);
      const [code] = await decodeBarcodes(page.images[0]!);
      expect(code).toMatchObject({
        format: 'Code128',
        text: '(01)09521234543213(17)270131(10)RF-0412',
      });
    }
  });
});

describe('renderLabelSheet on oval labels', () => {
  it('keeps every text run and the QR code inside each oval, drawn as an ellipse where the template puts it', async () => {
    const stock = builtInStock('letter-3x2in-oval-8');
    const req = request({ stock, layout: 'small', copies: 2, publicUrl: PUBLIC_URL });
    expect(checkLabelFit(req)).toEqual([]);
    const [page] = await readPdf(await renderLabelSheet(req));
    const boxes = labelPositions(stock).slice(0, 4);
    const outlines = labelOutlines(page!);
    boxes.forEach((box, i) => expectAt(outlines[i], box));
    for (const o of outlines) expect(o.curves).toBe(4);
    const inside = (x: number, y: number) =>
      boxes.some((b) => {
        const [a, c] = [b.widthMm / 2, b.heightMm / 2];
        return ((x - b.xMm - a) / a) ** 2 + ((y - b.yMm - c) / c) ** 2 <= 1;
      });
    for (const t of page!.texts) {
      // The run's box: from its cap height above the baseline to its descenders below.
      const top = t.baselineMm - 0.7 * t.sizeMm;
      const bottom = t.baselineMm + 0.25 * t.sizeMm;
      for (const [x, y] of [
        [t.xMm, top],
        [t.xMm + t.widthMm, top],
        [t.xMm, bottom],
        [t.xMm + t.widthMm, bottom],
      ] as const) {
        expect(inside(x, y), `${t.str} stays inside its oval`).toBe(true);
      }
    }
    for (const image of page!.images) {
      expect(inside(image.xMm, image.yMm)).toBe(true);
      expect(inside(image.xMm + image.widthMm, image.yMm + image.heightMm)).toBe(true);
    }
  });
});

describe('renderLabelSheet on 2 in circles (small-item labels)', () => {
  it('moves the QR code to the top when that leaves the net quantity the whole bottom of the circle', async () => {
    const stock = builtInStock('letter-2in-circle-20');
    const req = request({ stock, layout: 'small', publicUrl: PUBLIC_URL }, ['US']);
    expect(checkLabelFit(req)).toEqual([]);
    const [page] = await readPdf(await renderLabelSheet(req));
    const box = labelPositions(stock)[0]!;
    const [qr] = page!.images;
    expect(qr!.yMm + qr!.heightMm).toBeLessThan(box.yMm + box.heightMm / 2);
    expectNoTextOnCodes(page!);
    expect(textIn(page!, box)).toContain(textOf(req, 'US', 'netQuantity'));
    // 21 CFR 701.13: in the bottom 30 % of the label.
    const net = page!.texts.filter((t) => t.str.startsWith('Net'));
    for (const t of net) expect(t.baselineMm).toBeGreaterThan(box.yMm + 0.7 * box.heightMm);
  });
});

describe('checkLabelFit', () => {
  it('refuses US warnings on a 2 5/8 × 1 in label at their legal minimum of 1/16 in, naming the field and the label', async () => {
    const req = request({ stock: builtInStock('letter-2.625x1in-30'), layout: 'single' }, ['US']);
    const problems = checkLabelFit(req);
    expect(problems).toContainEqual({
      market: 'US',
      label: 'label (66.7 × 25.4 mm)',
      field: 'warnings',
      fieldName: 'Warnings',
      message: expect.stringContaining('1/16 in'),
      minimumMm: 1.5875,
      source: '21 CFR 740.2(a)',
    });
    // Never silently shrunk: the sheet is not drawn at all.
    await expect(renderLabelSheet(req)).rejects.toThrow(/Warnings does not fit/);
  });

  it('refuses a net quantity that cannot sit in the bottom 30 % of the front label (21 CFR 701.13)', () => {
    // A 10 sq in panel asks for 1/8 in letters (21 CFR 701.13(i)); a 1 in tall label's bottom 30 % is 7.6 mm.
    expect(
      netQuantityStatement({ amount: 113, unit: 'g', pdpAreaSqIn: 10 }).minimumTypeHeight?.inches,
    ).toBe(1 / 8);
    const stock = builtInStock('roll-2x1in');
    const content = fizzerContent('US', stock, 'small', {
      areas: { pdpAreaSqIn: 10, labellingAreaSqIn: 10 },
    });
    expect(content.fields.find((f) => f.key === 'netQuantity')?.minimum.inches).toBe(1 / 8);
    const req = request({ stock, layout: 'small', contents: [content], publicUrl: PUBLIC_URL });
    expect(checkLabelFit(req)).toContainEqual(
      expect.objectContaining({
        field: 'netQuantity',
        label: 'small-item label (50.8 × 25.4 mm)',
        source: '21 CFR 701.13',
        message: expect.stringContaining('bottom 30 %'),
      }),
    );
  });

  it('refuses a GS1-128 code wider than the label', () => {
    const req = request(
      { stock: builtInStock('letter-2.625x1in-30'), layout: 'panels', barcode: 'gs1-128' },
      ['EU'],
    );
    expect(checkLabelFit(req)).toContainEqual(
      expect.objectContaining({
        field: 'lot',
        label: 'back label (66.7 × 25.4 mm)',
        message: expect.stringContaining('GS1-128'),
      }),
    );
  });

  it('answers a problem, not an error, for a code its symbology cannot hold', () => {
    const req = request({
      stock: builtInStock('letter-2.625x1in-30'),
      layout: 'small',
      publicUrl: `https://batchproof.example/p/${'x'.repeat(5000)}`,
    });
    expect(checkLabelFit(req)).toContainEqual(
      expect.objectContaining({
        field: 'lot',
        message: expect.stringContaining('QR code cannot be drawn'),
      }),
    );
  });

  it('refuses a field moved to a panel the rules do not allow', () => {
    const req = request({ placement: { netQuantity: 'back' } });
    expect(checkLabelFit(req)).toContainEqual(
      expect.objectContaining({ field: 'netQuantity', label: 'back label (101.6 × 50.8 mm)' }),
    );
  });

  it('answers 400 for a start position beyond the sheet', () => {
    expect(() => checkLabelFit(request({ startPosition: 11 }))).toThrow(
      expect.objectContaining({
        status: 400,
        fieldErrors: { startPosition: ['This sheet has positions 1 to 10'] },
      }),
    );
  });
});

describe('renderCalibrationPdf', () => {
  it.each(['letter-2.625x1in-30', 'letter-3x2in-oval-8', 'roll-2x1in'])(
    'draws %s: every outline within 0.2 mm, rulers every 10 mm and the actual-size reminder',
    async (key) => {
      const stock = builtInStock(key);
      const [page, ...rest] = await readPdf(await renderCalibrationPdf(stock));
      expect(rest).toHaveLength(0);
      const boxes = labelPositions(stock);
      const outlines = page!.shapes.filter((s) => s.stroked && s.widthMm > 5 && s.heightMm > 5);
      expect(outlines).toHaveLength(boxes.length);
      boxes.forEach((box, i) => expectAt(outlines[i], box));
      if (stock.shape.kind === 'oval') for (const o of outlines) expect(o.curves).toBe(4);
      const text = textIn(page!, {
        xMm: 0,
        yMm: 0,
        widthMm: page!.widthMm,
        heightMm: page!.heightMm,
      });
      expect(text).toContain(`Calibration: ${stock.name}`);
      expect(text).toContain("Print at actual size (100 %), not 'fit to page'");
      // Ruler numbers every 10 mm along the top edge, each at its tick.
      const top = page!.texts.filter((t) => /^\d+$/.test(t.str) && t.baselineMm < 7);
      const expected = Math.floor(page!.widthMm / 10) + 1;
      expect(top.map((t) => Number(t.str))).toEqual(
        Array.from({ length: expected }, (_, i) => i * 10),
      );
      for (const t of top) expect(Math.abs(t.xMm - Number(t.str))).toBeLessThan(3);
      // The ticks themselves: vertical strokes from the top edge, 10 mm apart, to 0.2 mm.
      const ticks = page!.shapes.filter((s) => s.stroked && s.widthMm < 0.01 && s.yMm < 0.01);
      expect(ticks).toHaveLength(expected);
      ticks.forEach((tick, i) =>
        expect(Math.abs(tick.xMm - i * 10)).toBeLessThanOrEqual(TOLERANCE_MM),
      );
    },
  );
});
