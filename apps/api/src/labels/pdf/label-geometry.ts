import type { LabelShape } from '@batchproof/shared';

/** Millimetres and points: the PDF's unit is 1/72 in, labels are measured in millimetres. */
export const PT_PER_MM = 72 / 25.4;
export const mmToPt = (mm: number) => mm * PT_PER_MM;

/** Space kept clear inside a label's edge (die-cut tolerance of sheet labels and printers). */
export const LABEL_PADDING_MM = 1.5; // common practice, no published source

/** A rectangle in millimetres, relative to a label's top-left corner. */
export interface RectMm {
  readonly xMm: number;
  readonly yMm: number;
  readonly widthMm: number;
  readonly heightMm: number;
}

/**
 * The rectangle text and codes may use inside a label of the given shape: a rounded rectangle
 * loses what its corners cut off, a circle or an oval keeps its largest inscribed rectangle
 * (sides ÷ √2), and every shape keeps {@link LABEL_PADDING_MM} clear of its edge.
 */
export function safeArea(widthMm: number, heightMm: number, shape: LabelShape): RectMm {
  let insetX = LABEL_PADDING_MM;
  let insetY = LABEL_PADDING_MM;
  if (shape.kind === 'rounded-rectangle') {
    const corner = shape.cornerRadiusMm * (1 - Math.SQRT1_2);
    insetX += corner;
    insetY += corner;
  } else if (shape.kind === 'circle' || shape.kind === 'oval') {
    insetX += (widthMm - widthMm * Math.SQRT1_2) / 2;
    insetY += (heightMm - heightMm * Math.SQRT1_2) / 2;
  }
  return {
    xMm: insetX,
    yMm: insetY,
    widthMm: Math.max(0, widthMm - 2 * insetX),
    heightMm: Math.max(0, heightMm - 2 * insetY),
  };
}

/** A length for a label's name: one decimal, no trailing zero (66.7, 25.4, 50.8). */
export function mmForName(mm: number): string {
  return String(Math.round(mm * 10) / 10);
}
