import fc from 'fast-check';
import { all, create } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  A4_MM,
  BUILT_IN_LABEL_STOCKS,
  calibrationPage,
  inchesToMm,
  labelPositions,
  labelStockSchema,
  pageSizeMm,
  US_LETTER_MM,
  type LabelStock,
  type LabelStockInput,
} from './label-stock';

const math = create(all);
const EPSILON_MM = 1e-6;

function fieldMessages(input: unknown): Record<string, string[]> {
  const result = labelStockSchema.safeParse(input);
  if (result.success) return {};
  const byField: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.join('.');
    (byField[key] ??= []).push(issue.message);
  }
  return byField;
}

function expectInsidePage(stock: LabelStock): void {
  const page = pageSizeMm(stock);
  for (const box of labelPositions(stock)) {
    expect(box.xMm).toBeGreaterThanOrEqual(0);
    expect(box.yMm).toBeGreaterThanOrEqual(0);
    expect(box.xMm + box.widthMm).toBeLessThanOrEqual(page.widthMm + EPSILON_MM);
    expect(box.yMm + box.heightMm).toBeLessThanOrEqual(page.heightMm + EPSILON_MM);
  }
}

function expectedCount(stock: LabelStock): number {
  return stock.kind === 'sheet' ? stock.across * stock.down : 1;
}

const letter30: LabelStockInput = {
  kind: 'sheet',
  name: 'Test sheet',
  pageWidthMm: 215.9,
  pageHeightMm: 279.4,
  topMarginMm: 12.7,
  leftMarginMm: 4.7625,
  labelWidthMm: 66.675,
  labelHeightMm: 25.4,
  shape: { kind: 'rectangle' },
  horizontalPitchMm: 69.85,
  verticalPitchMm: 25.4,
  across: 3,
  down: 10,
};

describe('inchesToMm', () => {
  it('uses 25.4 mm to the inch, as mathjs does', () => {
    // International yard and pound agreement (1959): 1 inch = 25.4 mm exactly
    for (const inches of [1, 2.625, 8.5, 11, 10 / 3, 0.125]) {
      expect(inchesToMm(inches)).toBeCloseTo(math.unit(inches, 'inch').toNumber('mm'), 6);
    }
    expect(inchesToMm(2.625)).toBe(66.675);
  });
});

describe('page sizes', () => {
  it('US Letter is 215.9 × 279.4 mm', () => {
    // NIST/ANSI (ANSI/ASME Y14.1 size A): US Letter is 8.5 × 11 in exactly
    expect(US_LETTER_MM.widthMm).toBe(215.9);
    expect(US_LETTER_MM.heightMm).toBe(279.4);
    expect(US_LETTER_MM.widthMm).toBeCloseTo(math.unit('8.5 inch').toNumber('mm'), 9);
  });

  it('A4 is 210 × 297 mm', () => {
    // ISO 216: A4 is 210 × 297 mm
    expect(A4_MM).toEqual({ widthMm: 210, heightMm: 297 });
  });
});

describe('built-in label stocks', () => {
  it('all parse, unchanged, under unique keys and names', () => {
    for (const { key, ...stock } of BUILT_IN_LABEL_STOCKS) {
      expect(labelStockSchema.parse(stock), key).toEqual(stock);
    }
    const keys = BUILT_IN_LABEL_STOCKS.map((s) => s.key);
    const names = BUILT_IN_LABEL_STOCKS.map((s) => s.name);
    expect(new Set(keys).size).toBe(keys.length);
    expect(new Set(names).size).toBe(names.length);
  });

  it('cover the sizes and counts the labels feature lists', () => {
    const summary = BUILT_IN_LABEL_STOCKS.map((s) => [
      s.kind,
      s.labelWidthMm,
      s.labelHeightMm,
      s.shape.kind,
      expectedCount(s),
    ]);
    expect(summary).toEqual([
      ['sheet', 66.675, 25.4, 'rounded-rectangle', 30],
      ['sheet', 101.6, 50.8, 'rounded-rectangle', 10],
      ['sheet', 101.6, inchesToMm(10 / 3), 'rounded-rectangle', 6],
      ['sheet', 50.8, 50.8, 'circle', 20],
      ['sheet', 76.2, 50.8, 'oval', 8],
      ['sheet', 63.5, 38.1, 'rounded-rectangle', 21],
      ['sheet', 99.1, 67.7, 'rounded-rectangle', 8],
      ['roll', 50.8, 25.4, 'rectangle', 1],
      ['roll', 57.15, 31.75, 'rectangle', 1],
      ['roll', 101.6, 152.4, 'rectangle', 1],
    ]);
    for (const stock of BUILT_IN_LABEL_STOCKS) {
      if (stock.kind !== 'sheet') continue;
      const page = [stock.pageWidthMm, stock.pageHeightMm];
      expect([
        [215.9, 279.4],
        [210, 297],
      ]).toContainEqual(page);
    }
  });

  it('never name a vendor product code', () => {
    for (const { name } of BUILT_IN_LABEL_STOCKS) {
      expect(name).not.toMatch(/\b[A-Z]{1,3}\d{4,}\b|\b\d{4,5}\b/);
    }
  });

  it('place every label inside the page, one box per label', () => {
    for (const stock of BUILT_IN_LABEL_STOCKS) {
      expectInsidePage(stock);
      expect(labelPositions(stock)).toHaveLength(expectedCount(stock));
    }
  });

  it('lay a 30-up Letter sheet out row by row', () => {
    // common practice, no published source: the 30-up sheet's margins and pitches
    const stock = BUILT_IN_LABEL_STOCKS[0]!;
    const boxes = labelPositions(stock);
    expect(boxes[0]).toEqual({
      index: 0,
      row: 0,
      column: 0,
      xMm: 4.7625,
      yMm: 12.7,
      widthMm: 66.675,
      heightMm: 25.4,
    });
    expect(boxes[6]).toMatchObject({ index: 6, row: 2, column: 0, yMm: 12.7 + 2 * 25.4 });
    expect(boxes[29]).toMatchObject({ row: 9, column: 2 });
    expect(boxes[29]!.xMm).toBeCloseTo(4.7625 + 2 * 69.85, 9);
  });
});

describe('pageSizeMm', () => {
  it('is the sheet, or one label of a roll', () => {
    expect(pageSizeMm(labelStockSchema.parse(letter30))).toEqual({
      widthMm: 215.9,
      heightMm: 279.4,
    });
    const roll = BUILT_IN_LABEL_STOCKS.find((s) => s.key === 'roll-4x6in')!;
    expect(pageSizeMm(roll)).toEqual({ widthMm: 101.6, heightMm: 152.4 });
    expect(labelPositions(roll)).toEqual([
      { index: 0, row: 0, column: 0, xMm: 0, yMm: 0, widthMm: 101.6, heightMm: 152.4 },
    ]);
  });
});

describe('labelStockSchema refusals', () => {
  it('refuses overlapping labels, naming the pitch', () => {
    const messages = fieldMessages({ ...letter30, horizontalPitchMm: 60, verticalPitchMm: 20 });
    expect(messages['horizontalPitchMm']).toEqual([
      'The horizontal pitch (60 mm) is less than the label width (66.675 mm), so the labels would overlap',
    ]);
    expect(messages['verticalPitchMm']).toEqual([
      'The vertical pitch (20 mm) is less than the label height (25.4 mm), so the labels would overlap',
    ]);
  });

  it('refuses labels that run off the page, naming the count and the sizes', () => {
    const messages = fieldMessages({ ...letter30, leftMarginMm: 10, down: 11 });
    expect(messages['across']).toEqual([
      '3 labels across do not fit the page width: left margin + (across − 1) × horizontal pitch + label width is 216.375 mm, more than the page width of 215.9 mm',
    ]);
    expect(messages['down']).toEqual([
      '11 labels down do not fit the page height: top margin + (down − 1) × vertical pitch + label height is 292.1 mm, more than the page height of 279.4 mm',
    ]);
  });

  it('accepts labels that fill the page exactly', () => {
    const exact = { ...letter30, topMarginMm: 0, verticalPitchMm: 27.94 };
    expect(labelStockSchema.safeParse({ ...exact, labelHeightMm: 27.94 }).success).toBe(true);
  });

  it('refuses a circle whose height differs from its width', () => {
    expect(fieldMessages({ ...letter30, shape: { kind: 'circle' } })).toEqual({
      labelHeightMm: ["A circle's label height (25.4 mm) must equal its label width (66.675 mm)"],
    });
  });

  it('refuses a corner radius larger than half the shorter side', () => {
    const messages = fieldMessages({
      ...letter30,
      shape: { kind: 'rounded-rectangle', cornerRadiusMm: 13 },
    });
    expect(messages['shape.cornerRadiusMm']).toEqual([
      "The corner radius (13 mm) can be at most half the label's shorter side (12.7 mm)",
    ]);
  });

  it('refuses empty, negative and oversized measures with the field named', () => {
    const messages = fieldMessages({
      ...letter30,
      pageWidthMm: 0,
      leftMarginMm: -1,
      labelHeightMm: 1001,
      across: 2.5,
      name: '  ',
    });
    expect(messages['pageWidthMm']).toEqual(['The page width must be more than 0 mm']);
    expect(messages['leftMarginMm']).toEqual(['The left margin cannot be negative']);
    expect(messages['labelHeightMm']).toEqual(['The label height must be 1000 mm at most']);
    expect(messages['across']).toEqual(['The number of labels across must be a whole number']);
    expect(messages['name']).toEqual(['Enter a name for the label stock']);
    expect(fieldMessages({ ...letter30, verticalPitchMm: undefined })['verticalPitchMm']).toEqual([
      'Enter the vertical pitch in millimetres',
    ]);
  });

  it('refuses more than 1,000 labels a sheet', () => {
    const messages = fieldMessages({
      ...letter30,
      pageWidthMm: 1000,
      pageHeightMm: 1000,
      topMarginMm: 0,
      leftMarginMm: 0,
      labelWidthMm: 10,
      labelHeightMm: 10,
      horizontalPitchMm: 10,
      verticalPitchMm: 10,
      across: 50,
      down: 21,
    });
    expect(messages['down']).toEqual([
      'A sheet can hold at most 1,000 labels: 50 across × 21 down is 1,050',
    ]);
  });

  it('refuses an unknown kind or shape', () => {
    expect(fieldMessages({ ...letter30, kind: 'fan-fold' })['kind']).toEqual([
      'Choose whether the labels come on sheets or on a roll',
    ]);
    expect(fieldMessages({ ...letter30, shape: { kind: 'star' } })['shape.kind']).toEqual([
      'Choose a label shape: rectangle, rounded rectangle, circle or oval',
    ]);
  });
});

/** Random sheets built to fit: the far edge plus some slack makes the page. */
const validSheet = fc
  .record({
    across: fc.integer({ min: 1, max: 12 }),
    down: fc.integer({ min: 1, max: 20 }),
    labelWidthMm: fc.double({ min: 1, max: 80, noNaN: true }),
    labelHeightMm: fc.double({ min: 1, max: 80, noNaN: true }),
    gapXMm: fc.double({ min: 0, max: 10, noNaN: true }),
    gapYMm: fc.double({ min: 0, max: 10, noNaN: true }),
    leftMarginMm: fc.double({ min: 0, max: 30, noNaN: true }),
    topMarginMm: fc.double({ min: 0, max: 30, noNaN: true }),
    slackXMm: fc.double({ min: 0, max: 30, noNaN: true }),
    slackYMm: fc.double({ min: 0, max: 30, noNaN: true }),
  })
  .map((g): LabelStockInput => {
    const horizontalPitchMm = g.labelWidthMm + g.gapXMm;
    const verticalPitchMm = g.labelHeightMm + g.gapYMm;
    return {
      kind: 'sheet',
      name: 'Random sheet',
      pageWidthMm:
        g.leftMarginMm + (g.across - 1) * horizontalPitchMm + g.labelWidthMm + g.slackXMm,
      pageHeightMm: g.topMarginMm + (g.down - 1) * verticalPitchMm + g.labelHeightMm + g.slackYMm,
      topMarginMm: g.topMarginMm,
      leftMarginMm: g.leftMarginMm,
      labelWidthMm: g.labelWidthMm,
      labelHeightMm: g.labelHeightMm,
      shape: { kind: 'oval' },
      horizontalPitchMm,
      verticalPitchMm,
      across: g.across,
      down: g.down,
    };
  })
  .filter((s) => s.kind === 'sheet' && s.pageWidthMm <= 1000 && s.pageHeightMm <= 1000);

const validRoll = fc
  .record({
    labelWidthMm: fc.double({ min: 1, max: 200, noNaN: true }),
    labelHeightMm: fc.double({ min: 1, max: 300, noNaN: true }),
    gapMm: fc.double({ min: 0, max: 10, noNaN: true }),
  })
  .map((g): LabelStockInput => ({
    kind: 'roll',
    name: 'Random roll',
    ...g,
    shape: { kind: 'rectangle' },
  }));

describe('labelPositions over random valid stocks', () => {
  it('keeps every box inside the page, one per label, never overlapping', () => {
    fc.assert(
      fc.property(fc.oneof(validSheet, validRoll), (input) => {
        const stock = labelStockSchema.parse(input);
        const boxes = labelPositions(stock);
        expect(boxes).toHaveLength(expectedCount(stock));
        expectInsidePage(stock);
        for (const [i, box] of boxes.entries()) {
          expect(box.index).toBe(i);
          const right = boxes[i + 1];
          if (right && right.row === box.row) {
            expect(right.xMm).toBeGreaterThanOrEqual(box.xMm + box.widthMm - EPSILON_MM);
          }
        }
      }),
    );
  });

  it('refuses a sheet made one label too many across', () => {
    fc.assert(
      fc.property(validSheet, (input) => {
        if (input.kind !== 'sheet') return;
        // One more column needs a full pitch; shrink the page to just short of it.
        const widened = { ...input, across: input.across + 1 };
        const needed =
          widened.leftMarginMm + input.across * widened.horizontalPitchMm + widened.labelWidthMm;
        fc.pre(needed - 0.01 <= 1000 && widened.across <= 100);
        const result = labelStockSchema.safeParse({ ...widened, pageWidthMm: needed - 0.01 });
        expect(result.success).toBe(false);
        expect(result.error?.issues.map((i) => i.path.join('.'))).toContain('across');
      }),
    );
  });
});

describe('calibrationPage', () => {
  it('outlines every label and ticks both rulers every 10 mm', () => {
    const a4 = BUILT_IN_LABEL_STOCKS.find((s) => s.key === 'a4-63.5x38.1mm-21')!;
    const page = calibrationPage(a4);
    expect(page.title).toBe('Calibration: A4 · 63.5 × 38.1 mm · 21 per sheet');
    expect([page.pageWidthMm, page.pageHeightMm]).toEqual([210, 297]);
    expect(page.shape).toEqual(a4.shape);
    expect(page.boxes).toEqual(labelPositions(a4));
    expect(page.rulers.top.map((t) => t.positionMm)).toEqual(
      Array.from({ length: 22 }, (_, i) => i * 10),
    );
    expect(page.rulers.left).toHaveLength(30);
    expect(page.rulers.left.at(-1)).toEqual({ positionMm: 290, lengthMm: 3, label: '290' });
    expect(page.rulers.top[5]).toEqual({ positionMm: 50, lengthMm: 6, label: '50' });
  });

  it('keeps every tick on the page for every built-in', () => {
    for (const stock of BUILT_IN_LABEL_STOCKS) {
      const page = calibrationPage(stock);
      expect(page.rulers.top.every((t) => t.positionMm <= page.pageWidthMm)).toBe(true);
      expect(page.rulers.left.every((t) => t.positionMm <= page.pageHeightMm)).toBe(true);
      expect(page.rulers.top[0]?.positionMm).toBe(0);
    }
  });
});
