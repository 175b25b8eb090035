import * as z from 'zod';

/**
 * Label stock: the geometry of the sheets or rolls a workshop prints its labels on. Everything is
 * in millimetres, measured from the page's top-left corner; inch sizes are converted once, on the
 * way in, with {@link inchesToMm}.
 */

/** Millimetres in one inch, exactly (international inch, 1959). */
export const MM_PER_INCH = 25.4;

/** Converts inches to millimetres, rounded to the nanometre so 8.5 in reads back as 215.9 mm. */
export function inchesToMm(inches: number): number {
  return Math.round(inches * MM_PER_INCH * 1e6) / 1e6;
}

/** Largest page or label side accepted, in millimetres. */
export const MAX_LABEL_STOCK_MM = 1000;
/** Most labels across or down a sheet. */
export const MAX_LABELS_PER_LINE = 100;
/** Most labels on one sheet. */
export const MAX_LABELS_PER_SHEET = 1000;
/** Largest gap between labels on a roll, in millimetres. */
export const MAX_ROLL_GAP_MM = 100;
/** Slack allowed when comparing sums of millimetres (one nanometre). */
const TOLERANCE_MM = 1e-6;

/** A length for a message, to the micrometre at most: 215.9 mm, 66.675 mm, 12 mm. */
function mmText(value: number): string {
  return `${Math.round(value * 1000) / 1000} mm`;
}

/** A positive length in millimetres, no longer than {@link MAX_LABEL_STOCK_MM}. */
function lengthMm(field: string) {
  return z
    .number({ error: `Enter the ${field} in millimetres` })
    .gt(0, { error: `The ${field} must be more than 0 mm` })
    .max(MAX_LABEL_STOCK_MM, { error: `The ${field} must be ${MAX_LABEL_STOCK_MM} mm at most` });
}

/** A length in millimetres that may be 0 (a margin, a gap). */
function offsetMm(field: string, max: number) {
  return z
    .number({ error: `Enter the ${field} in millimetres` })
    .min(0, { error: `The ${field} cannot be negative` })
    .max(max, { error: `The ${field} must be ${max} mm at most` });
}

function labelCount(field: string) {
  return z
    .number({ error: `Enter how many labels ${field}` })
    .int({ error: `The number of labels ${field} must be a whole number` })
    .min(1, { error: `There must be at least 1 label ${field}` })
    .max(MAX_LABELS_PER_LINE, {
      error: `There can be at most ${MAX_LABELS_PER_LINE} labels ${field}`,
    });
}

/** The outline of each label; a rounded rectangle carries its corner radius. */
export const labelShapeSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('rectangle') }),
    z.object({
      kind: z.literal('rounded-rectangle'),
      cornerRadiusMm: z
        .number({ error: 'Enter the corner radius in millimetres' })
        .gt(0, { error: 'The corner radius must be more than 0 mm' })
        .max(MAX_LABEL_STOCK_MM / 2, {
          error: `The corner radius must be ${MAX_LABEL_STOCK_MM / 2} mm at most`,
        }),
    }),
    z.object({ kind: z.literal('circle') }),
    z.object({ kind: z.literal('oval') }),
  ],
  { error: 'Choose a label shape: rectangle, rounded rectangle, circle or oval' },
);
export type LabelShape = z.infer<typeof labelShapeSchema>;

const stockName = z
  .string({ error: 'Enter a name for the label stock' })
  .trim()
  .min(1, { error: 'Enter a name for the label stock' })
  .max(120, { error: 'The name must be 120 characters at most' });

/** A sheet of labels in a grid: page size, margins, label size, pitch and count. */
export const sheetLabelStockSchema = z.object({
  kind: z.literal('sheet'),
  name: stockName,
  pageWidthMm: lengthMm('page width'),
  pageHeightMm: lengthMm('page height'),
  topMarginMm: offsetMm('top margin', MAX_LABEL_STOCK_MM),
  leftMarginMm: offsetMm('left margin', MAX_LABEL_STOCK_MM),
  labelWidthMm: lengthMm('label width'),
  labelHeightMm: lengthMm('label height'),
  shape: labelShapeSchema,
  /** Distance from one label's left edge to the next label's left edge. */
  horizontalPitchMm: lengthMm('horizontal pitch'),
  /** Distance from one label's top edge to the next label's top edge. */
  verticalPitchMm: lengthMm('vertical pitch'),
  across: labelCount('across'),
  down: labelCount('down'),
});

/** A roll for a label printer: one label per page, separated by a gap. */
export const rollLabelStockSchema = z.object({
  kind: z.literal('roll'),
  name: stockName,
  labelWidthMm: lengthMm('label width'),
  labelHeightMm: lengthMm('label height'),
  gapMm: offsetMm('gap between labels', MAX_ROLL_GAP_MM),
  shape: labelShapeSchema,
});

type ShapedStock = {
  labelWidthMm: number;
  labelHeightMm: number;
  shape: LabelShape;
};

function checkShape(stock: ShapedStock, ctx: z.RefinementCtx): void {
  const { labelWidthMm: width, labelHeightMm: height, shape } = stock;
  if (shape.kind === 'circle' && Math.abs(width - height) > TOLERANCE_MM) {
    ctx.addIssue({
      code: 'custom',
      path: ['labelHeightMm'],
      message: `A circle's label height (${mmText(height)}) must equal its label width (${mmText(width)})`,
    });
  }
  if (shape.kind === 'rounded-rectangle') {
    const limit = Math.min(width, height) / 2;
    if (shape.cornerRadiusMm > limit + TOLERANCE_MM) {
      ctx.addIssue({
        code: 'custom',
        path: ['shape', 'cornerRadiusMm'],
        message: `The corner radius (${mmText(shape.cornerRadiusMm)}) can be at most half the label's shorter side (${mmText(limit)})`,
      });
    }
  }
}

/** Where the last label of a row or column ends: margin + (count − 1) × pitch + size. */
function farEdgeMm(marginMm: number, count: number, pitchMm: number, sizeMm: number): number {
  return marginMm + (count - 1) * pitchMm + sizeMm;
}

function checkSheet(stock: z.infer<typeof sheetLabelStockSchema>, ctx: z.RefinementCtx): void {
  checkShape(stock, ctx);
  const total = stock.across * stock.down;
  if (total > MAX_LABELS_PER_SHEET) {
    ctx.addIssue({
      code: 'custom',
      path: ['down'],
      message: `A sheet can hold at most ${MAX_LABELS_PER_SHEET.toLocaleString('en-US')} labels: ${stock.across} across × ${stock.down} down is ${total.toLocaleString('en-US')}`,
    });
  }
  if (stock.horizontalPitchMm < stock.labelWidthMm - TOLERANCE_MM) {
    ctx.addIssue({
      code: 'custom',
      path: ['horizontalPitchMm'],
      message: `The horizontal pitch (${mmText(stock.horizontalPitchMm)}) is less than the label width (${mmText(stock.labelWidthMm)}), so the labels would overlap`,
    });
  }
  if (stock.verticalPitchMm < stock.labelHeightMm - TOLERANCE_MM) {
    ctx.addIssue({
      code: 'custom',
      path: ['verticalPitchMm'],
      message: `The vertical pitch (${mmText(stock.verticalPitchMm)}) is less than the label height (${mmText(stock.labelHeightMm)}), so the labels would overlap`,
    });
  }
  const right = farEdgeMm(
    stock.leftMarginMm,
    stock.across,
    stock.horizontalPitchMm,
    stock.labelWidthMm,
  );
  if (right > stock.pageWidthMm + TOLERANCE_MM) {
    ctx.addIssue({
      code: 'custom',
      path: ['across'],
      message: `${stock.across} ${stock.across === 1 ? 'label' : 'labels'} across do not fit the page width: left margin + (across − 1) × horizontal pitch + label width is ${mmText(right)}, more than the page width of ${mmText(stock.pageWidthMm)}`,
    });
  }
  const bottom = farEdgeMm(
    stock.topMarginMm,
    stock.down,
    stock.verticalPitchMm,
    stock.labelHeightMm,
  );
  if (bottom > stock.pageHeightMm + TOLERANCE_MM) {
    ctx.addIssue({
      code: 'custom',
      path: ['down'],
      message: `${stock.down} ${stock.down === 1 ? 'label' : 'labels'} down do not fit the page height: top margin + (down − 1) × vertical pitch + label height is ${mmText(bottom)}, more than the page height of ${mmText(stock.pageHeightMm)}`,
    });
  }
}

/** A label stock template, defined by geometry only; every check names the field at fault. */
export const labelStockSchema = z
  .discriminatedUnion('kind', [sheetLabelStockSchema, rollLabelStockSchema], {
    error: 'Choose whether the labels come on sheets or on a roll',
  })
  .superRefine((stock, ctx) => {
    if (stock.kind === 'sheet') checkSheet(stock, ctx);
    else checkShape(stock, ctx);
  });
export type LabelStock = z.infer<typeof labelStockSchema>;
export type LabelStockInput = z.input<typeof labelStockSchema>;
export type SheetLabelStock = z.infer<typeof sheetLabelStockSchema>;
export type RollLabelStock = z.infer<typeof rollLabelStockSchema>;

/** US Letter, 8.5 × 11 in (ANSI/ASME Y14.1 "A" size), in millimetres. */
export const US_LETTER_MM = { widthMm: inchesToMm(8.5), heightMm: inchesToMm(11) } as const;
/** A4, 210 × 297 mm (ISO 216). */
export const A4_MM = { widthMm: 210, heightMm: 297 } as const;

/** A built-in stock: a template plus a stable key that stored choices can refer to. */
export type BuiltInLabelStock = LabelStock & { readonly key: string };

const letterPage = { pageWidthMm: US_LETTER_MM.widthMm, pageHeightMm: US_LETTER_MM.heightMm };
const a4Page = { pageWidthMm: A4_MM.widthMm, pageHeightMm: A4_MM.heightMm };

/**
 * The stocks every workshop can choose from, named by their geometry only. The sheet layouts are
 * the de-facto industry ones; their margins, pitches and corner radii carry no published source.
 */
export const BUILT_IN_LABEL_STOCKS: readonly BuiltInLabelStock[] = [
  {
    key: 'letter-2.625x1in-30',
    kind: 'sheet',
    name: 'US Letter · 2⅝ × 1 in · 30 per sheet',
    ...letterPage,
    topMarginMm: inchesToMm(0.5), // common practice, no published source
    leftMarginMm: inchesToMm(3 / 16), // common practice, no published source
    labelWidthMm: inchesToMm(2.625),
    labelHeightMm: inchesToMm(1),
    shape: { kind: 'rounded-rectangle', cornerRadiusMm: inchesToMm(1 / 16) }, // common practice, no published source
    horizontalPitchMm: inchesToMm(2.75), // common practice, no published source
    verticalPitchMm: inchesToMm(1), // common practice, no published source
    across: 3,
    down: 10,
  },
  {
    key: 'letter-4x2in-10',
    kind: 'sheet',
    name: 'US Letter · 4 × 2 in · 10 per sheet',
    ...letterPage,
    topMarginMm: inchesToMm(0.5), // common practice, no published source
    leftMarginMm: inchesToMm(5 / 32), // common practice, no published source
    labelWidthMm: inchesToMm(4),
    labelHeightMm: inchesToMm(2),
    shape: { kind: 'rounded-rectangle', cornerRadiusMm: inchesToMm(1 / 16) }, // common practice, no published source
    horizontalPitchMm: inchesToMm(4 + 3 / 16), // common practice, no published source
    verticalPitchMm: inchesToMm(2), // common practice, no published source
    across: 2,
    down: 5,
  },
  {
    key: 'letter-4x3.333in-6',
    kind: 'sheet',
    name: 'US Letter · 4 × 3⅓ in · 6 per sheet',
    ...letterPage,
    topMarginMm: inchesToMm(0.5), // common practice, no published source
    leftMarginMm: inchesToMm(5 / 32), // common practice, no published source
    labelWidthMm: inchesToMm(4),
    labelHeightMm: inchesToMm(10 / 3),
    shape: { kind: 'rounded-rectangle', cornerRadiusMm: inchesToMm(1 / 16) }, // common practice, no published source
    horizontalPitchMm: inchesToMm(4 + 3 / 16), // common practice, no published source
    verticalPitchMm: inchesToMm(10 / 3), // common practice, no published source
    across: 2,
    down: 3,
  },
  {
    key: 'letter-2in-circle-20',
    kind: 'sheet',
    name: 'US Letter · 2 in circles · 20 per sheet',
    ...letterPage,
    topMarginMm: inchesToMm(0.5), // common practice, no published source
    leftMarginMm: inchesToMm(5 / 32), // common practice, no published source
    labelWidthMm: inchesToMm(2),
    labelHeightMm: inchesToMm(2),
    shape: { kind: 'circle' },
    horizontalPitchMm: inchesToMm(2 + 1 / 16), // common practice, no published source
    verticalPitchMm: inchesToMm(2), // common practice, no published source
    across: 4,
    down: 5,
  },
  {
    key: 'letter-3x2in-oval-8',
    kind: 'sheet',
    name: 'US Letter · 3 × 2 in ovals · 8 per sheet',
    ...letterPage,
    topMarginMm: inchesToMm(0.75), // common practice, no published source
    leftMarginMm: inchesToMm(1), // common practice, no published source
    labelWidthMm: inchesToMm(3),
    labelHeightMm: inchesToMm(2),
    shape: { kind: 'oval' },
    horizontalPitchMm: inchesToMm(3.5), // common practice, no published source
    verticalPitchMm: inchesToMm(2.5), // common practice, no published source
    across: 2,
    down: 4,
  },
  {
    key: 'a4-63.5x38.1mm-21',
    kind: 'sheet',
    name: 'A4 · 63.5 × 38.1 mm · 21 per sheet',
    ...a4Page,
    topMarginMm: 15.15, // common practice, no published source
    leftMarginMm: 7.25, // common practice, no published source
    labelWidthMm: 63.5,
    labelHeightMm: 38.1,
    shape: { kind: 'rounded-rectangle', cornerRadiusMm: 2.5 }, // common practice, no published source
    horizontalPitchMm: 66.04, // common practice, no published source
    verticalPitchMm: 38.1, // common practice, no published source
    across: 3,
    down: 7,
  },
  {
    key: 'a4-99.1x67.7mm-8',
    kind: 'sheet',
    name: 'A4 · 99.1 × 67.7 mm · 8 per sheet',
    ...a4Page,
    topMarginMm: 13.1, // common practice, no published source
    leftMarginMm: 4.65, // common practice, no published source
    labelWidthMm: 99.1,
    labelHeightMm: 67.7,
    shape: { kind: 'rounded-rectangle', cornerRadiusMm: 2.5 }, // common practice, no published source
    horizontalPitchMm: 101.6, // common practice, no published source
    verticalPitchMm: 67.7, // common practice, no published source
    across: 2,
    down: 4,
  },
  {
    key: 'roll-2x1in',
    kind: 'roll',
    name: 'Roll · 2 × 1 in',
    labelWidthMm: inchesToMm(2),
    labelHeightMm: inchesToMm(1),
    gapMm: inchesToMm(0.125), // common practice, no published source
    shape: { kind: 'rectangle' },
  },
  {
    key: 'roll-2.25x1.25in',
    kind: 'roll',
    name: 'Roll · 2¼ × 1¼ in',
    labelWidthMm: inchesToMm(2.25),
    labelHeightMm: inchesToMm(1.25),
    gapMm: inchesToMm(0.125), // common practice, no published source
    shape: { kind: 'rectangle' },
  },
  {
    key: 'roll-4x6in',
    kind: 'roll',
    name: 'Roll · 4 × 6 in',
    labelWidthMm: inchesToMm(4),
    labelHeightMm: inchesToMm(6),
    gapMm: inchesToMm(0.125), // common practice, no published source
    shape: { kind: 'rectangle' },
  },
];

/** The size of one printed page: the sheet, or a single label of a roll. */
export function pageSizeMm(stock: LabelStock): { widthMm: number; heightMm: number } {
  return stock.kind === 'sheet'
    ? { widthMm: stock.pageWidthMm, heightMm: stock.pageHeightMm }
    : { widthMm: stock.labelWidthMm, heightMm: stock.labelHeightMm };
}

/** One label's box on a page, in millimetres from the page's top-left corner. */
export interface LabelBox {
  /** Position on the page in reading order (left to right, then top to bottom), from 0. */
  readonly index: number;
  /** Row from the top, from 0. */
  readonly row: number;
  /** Column from the left, from 0. */
  readonly column: number;
  readonly xMm: number;
  readonly yMm: number;
  readonly widthMm: number;
  readonly heightMm: number;
}

/** Every label's box on one page, in reading order; a roll has one label per page. */
export function labelPositions(stock: LabelStock): LabelBox[] {
  const widthMm = stock.labelWidthMm;
  const heightMm = stock.labelHeightMm;
  if (stock.kind === 'roll') {
    return [{ index: 0, row: 0, column: 0, xMm: 0, yMm: 0, widthMm, heightMm }];
  }
  const boxes: LabelBox[] = [];
  for (let row = 0; row < stock.down; row++) {
    for (let column = 0; column < stock.across; column++) {
      boxes.push({
        index: row * stock.across + column,
        row,
        column,
        xMm: stock.leftMarginMm + column * stock.horizontalPitchMm,
        yMm: stock.topMarginMm + row * stock.verticalPitchMm,
        widthMm,
        heightMm,
      });
    }
  }
  return boxes;
}

/** Spacing of the calibration page's ruler ticks. */
export const CALIBRATION_TICK_SPACING_MM = 10;

/** One ruler tick, measured along its edge from the page's top-left corner. */
export interface RulerTick {
  readonly positionMm: number;
  /** How far the tick reaches into the page: longer every 50 mm. */
  readonly lengthMm: number;
  /** The distance printed beside the tick, in millimetres. */
  readonly label: string;
}

/** What a calibration page shows; a later step draws it, at 100 % scale. */
export interface CalibrationPage {
  readonly title: string;
  readonly pageWidthMm: number;
  readonly pageHeightMm: number;
  readonly shape: LabelShape;
  /** The label outlines to draw. */
  readonly boxes: LabelBox[];
  /** Ticks along the top edge (positions are x) and the left edge (positions are y). */
  readonly rulers: { readonly top: RulerTick[]; readonly left: RulerTick[] };
}

function rulerTicks(lengthMm: number): RulerTick[] {
  const ticks: RulerTick[] = [];
  for (let step = 0; step * CALIBRATION_TICK_SPACING_MM <= lengthMm + TOLERANCE_MM; step++) {
    const positionMm = step * CALIBRATION_TICK_SPACING_MM;
    ticks.push({ positionMm, lengthMm: positionMm % 50 === 0 ? 6 : 3, label: String(positionMm) });
  }
  return ticks;
}

/**
 * A calibration page: the label outlines plus rulers along the top and left edges, ticked every
 * 10 mm, so a user can check that the printer puts the boxes where the stock has its labels.
 */
export function calibrationPage(stock: LabelStock): CalibrationPage {
  const { widthMm, heightMm } = pageSizeMm(stock);
  return {
    title: `Calibration: ${stock.name}`,
    pageWidthMm: widthMm,
    pageHeightMm: heightMm,
    shape: stock.shape,
    boxes: labelPositions(stock),
    rulers: { top: rulerTicks(widthMm), left: rulerTicks(heightMm) },
  };
}
