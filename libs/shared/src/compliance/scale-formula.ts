import * as z from 'zod';

/** Options of {@link scaleFormula}. */
export const scaleFormulaOptionsSchema = z.object({
  /** How many finished units to make. */
  units: z
    .number()
    .int({ error: 'Units must be a whole number' })
    .positive({ error: 'Make at least one unit' }),
  /** Target weight of one finished unit, grams. */
  unitGrams: z.number().gt(0, { error: 'Unit weight must be more than 0 g' }),
  /** Extra to make for losses (sticking to bowls and moulds, trimming), percent of the target. */
  lossPercent: z
    .number()
    .min(0, { error: 'Loss cannot be negative' })
    .max(100, { error: 'Loss cannot exceed 100 %' })
    .default(0),
});
/** Options of {@link scaleFormula}. */
export type ScaleFormulaOptions = z.input<typeof scaleFormulaOptionsSchema>;

/** A scaled batch: each line keeps its percentage and gets new grams. */
export interface ScaledFormula<T> {
  /** units × unit grams. */
  readonly targetGrams: number;
  /** Target plus the loss allowance: the weight to mix. */
  readonly batchGrams: number;
  readonly lines: (T & { percent: number; scaledGrams: number })[];
}

/**
 * Scales a formula by weight to a batch of `units` × `unitGrams`, plus `lossPercent` extra
 * (common practice, no published source). Percentages are unchanged by construction. Throws a
 * ZodError with field paths on invalid options, and a RangeError when the formula weighs nothing.
 */
export function scaleFormula<T extends { grams: number }>(
  lines: readonly T[],
  options: ScaleFormulaOptions,
): ScaledFormula<T> {
  const { units, unitGrams, lossPercent } = scaleFormulaOptionsSchema.parse(options);
  const total = lines.reduce((sum, line) => sum + line.grams, 0);
  if (!(total > 0))
    throw new RangeError(
      'The formula weighs 0 g: enter grams for at least one line before scaling',
    );
  const targetGrams = units * unitGrams;
  const batchGrams = targetGrams * (1 + lossPercent / 100);
  return {
    targetGrams,
    batchGrams,
    lines: lines.map((line) => {
      const fraction = line.grams / total;
      return { ...line, percent: fraction * 100, scaledGrams: fraction * batchGrams };
    }),
  };
}
