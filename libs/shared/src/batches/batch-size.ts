import { scaleFormula } from '../compliance/scale-formula';

/**
 * How big a batch is and what to weigh for it. The scaling itself is the formulator's
 * `scaleFormula` (the same one behind `POST /api/formulas/:id/versions/:n/scale`), so a batch and
 * the scale panel give the same grams for the same request; this module adds the batch's own
 * limits and rounds each line for the scale it is weighed on.
 */

/** Most loss allowance a batch may carry, percent: more is a mistake, not an allowance. */
export const MAX_BATCH_LOSS_PERCENT = 50;

/** A batch sized by units × unit mass, or by a total; the loss allowance goes on top of either. */
export type BatchSizing =
  | { readonly units: number; readonly unitMassGrams: number; readonly lossPercent?: number }
  | { readonly totalGrams: number; readonly lossPercent?: number };

/** The size of a batch. */
export interface BatchSize {
  /** Units to make, or null when sized by total. */
  readonly units: number | null;
  readonly unitMassGrams: number | null;
  /** units × unit mass, or the total asked for. */
  readonly targetGrams: number;
  readonly lossPercent: number;
  /** Target plus the loss allowance: the weight to mix. */
  readonly batchGrams: number;
}

/**
 * A kitchen or workshop scale's step for a line of this many grams (common practice, no published
 * source): a pocket scale reads 0.01 g for small additions (fragrance, colour, preservative under
 * 10 g), a kitchen scale 0.1 g up to 1 kg, and a bench scale whole grams above that.
 */
export function scaleStepGrams(grams: number): 0.01 | 0.1 | 1 {
  if (grams < 10) return 0.01;
  if (grams < 1000) return 0.1;
  return 1;
}

const DECIMALS = { 0.01: 2, 0.1: 1, 1: 0 } as const;

/** Rounds to a number of decimals without binary noise (2002.3, never 2002.3000000000002). */
export function roundTo(value: number, decimals: number): number {
  // Shift the decimal point in the number's text, so 1.005 is 100.5 hundredths, not 100.4999….
  const shift = (n: number, places: number) => {
    const [mantissa, exponent = '0'] = String(n).split('e');
    return Number(`${mantissa}e${Number(exponent) + places}`);
  };
  return shift(Math.round(shift(value, decimals)), -decimals);
}

/** One line of a weigh sheet. */
export type WeighSheetLine<T> = T & {
  /** Share of the batch, percent, from the released version's grams. */
  readonly percent: number;
  /** Exact grams for this batch. */
  readonly grams: number;
  /** Grams to weigh, rounded to the scale step. */
  readonly weighGrams: number;
  readonly stepGrams: 0.01 | 0.1 | 1;
};

/** The sum check of a weigh sheet: the rounded lines against the batch. */
export interface WeighSheetSum {
  /** The batch to mix (target plus loss). */
  readonly batchGrams: number;
  /** What the rounded lines add up to. */
  readonly roundedGrams: number;
  /** roundedGrams − batchGrams. */
  readonly differenceGrams: number;
  /** Whether the difference is no more than half a step per line, i.e. only rounding. */
  readonly withinRounding: boolean;
}

/** A weigh sheet: the batch size, a line per formula line and the sum check. */
export interface WeighSheet<T> {
  readonly size: BatchSize;
  readonly lines: WeighSheetLine<T>[];
  readonly sum: WeighSheetSum;
  /** Plain notes for the maker (a line too small for its scale …). */
  readonly notes: string[];
}

/** Grams shown with their step's decimals, e.g. `2,002.3 g`. */
export function gramsText(grams: number, step: 0.01 | 0.1 | 1 = scaleStepGrams(grams)): string {
  const decimals = DECIMALS[step];
  return `${grams.toLocaleString('en', { minimumFractionDigits: decimals, maximumFractionDigits: decimals })} g`;
}

function sizeOf(sizing: BatchSizing): { units: number; unitGrams: number; lossPercent: number } {
  const lossPercent = sizing.lossPercent ?? 0;
  if (!(lossPercent >= 0 && lossPercent <= MAX_BATCH_LOSS_PERCENT))
    throw new RangeError(`The loss allowance must be 0 to ${MAX_BATCH_LOSS_PERCENT} %`);
  // Sized by total: one "unit" of the total, as the formulas' scale route does.
  return 'totalGrams' in sizing
    ? { units: 1, unitGrams: sizing.totalGrams, lossPercent }
    : { units: sizing.units, unitGrams: sizing.unitMassGrams, lossPercent };
}

/**
 * The weigh sheet of a batch: each line of the released version scaled with `scaleFormula` to the
 * batch size, then rounded to its scale step, with the rounded sum checked against the batch.
 * 24 units × 180 g + 3 % loss = 4,449.6 g; a line at 45 % weighs 2,002.32 g, on the scale 2,002 g.
 * Throws a RangeError on a size no batch can have or a version that weighs nothing, and a ZodError
 * from `scaleFormula` on units that are not whole.
 */
export function weighSheet<T extends { grams: number }>(
  lines: readonly T[],
  sizing: BatchSizing,
): WeighSheet<T> {
  const { units, unitGrams, lossPercent } = sizeOf(sizing);
  const scaled = scaleFormula(lines, { units, unitGrams, lossPercent });
  const batchGrams = roundTo(scaled.batchGrams, 6);
  const notes: string[] = [];
  const sheetLines = scaled.lines.map(({ scaledGrams, percent, ...line }) => {
    const grams = roundTo(scaledGrams, 6);
    const stepGrams = scaleStepGrams(grams);
    const weighGrams = roundTo(grams, DECIMALS[stepGrams]);
    if (grams > 0 && weighGrams === 0)
      notes.push(
        `A line of ${grams} g is below what a 0.01 g scale reads: weigh a premix or make a larger batch`,
      );
    return { ...(line as unknown as T), percent, grams, weighGrams, stepGrams };
  });
  const roundedGrams = roundTo(
    sheetLines.reduce((sum, l) => sum + l.weighGrams, 0),
    2,
  );
  const differenceGrams = roundTo(roundedGrams - batchGrams, 6);
  const slack = sheetLines.reduce((sum, l) => sum + l.stepGrams / 2, 0);
  const withinRounding = Math.abs(differenceGrams) <= slack + 1e-9;
  if (differenceGrams !== 0)
    notes.push(
      `The rounded lines add up to ${gramsText(roundedGrams, 0.01)}, ${gramsText(Math.abs(differenceGrams), 0.01)} ${differenceGrams > 0 ? 'over' : 'under'} the batch of ${gramsText(batchGrams, 0.01)} (rounding to the scale)`,
    );
  return {
    size: {
      units: 'units' in sizing ? sizing.units : null,
      unitMassGrams: 'units' in sizing ? sizing.unitMassGrams : null,
      targetGrams: roundTo(scaled.targetGrams, 6),
      lossPercent,
      batchGrams,
    },
    lines: sheetLines,
    sum: { batchGrams, roundedGrams, differenceGrams, withinRounding },
    notes,
  };
}
