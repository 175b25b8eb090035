import * as z from 'zod';

const loss = z
  .number({ error: 'Enter the loss allowance as a percentage' })
  .min(0, { error: 'Loss cannot be negative' })
  .max(100, { error: 'Loss cannot exceed 100 %' })
  .default(0);

/**
 * Scale a version to a number of units (unit mass from the request or the version's profile)
 * or to a total mass, plus a loss allowance.
 */
export const scaleRequestSchema = z
  .object({
    units: z
      .number({ error: 'Enter how many units to make' })
      .int({ error: 'Units must be a whole number' })
      .positive({ error: 'Make at least one unit' })
      .optional(),
    unitMassGrams: z
      .number({ error: 'Enter the unit mass in grams' })
      .gt(0, { error: 'The unit mass must be more than 0 g' })
      .optional(),
    totalGrams: z
      .number({ error: 'Enter the total batch mass in grams' })
      .gt(0, { error: 'The total must be more than 0 g' })
      .optional(),
    lossPercent: loss,
  })
  .superRefine((r, ctx) => {
    if ((r.units === undefined) === (r.totalGrams === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: ['units'],
        message: 'Send a number of units or a total in grams, not both',
      });
    }
  });
export type ScaleRequest = z.input<typeof scaleRequestSchema>;

/** A scaled batch: grams to weigh per line. */
export const scaledVersionSchema = z.object({
  targetGrams: z.number(),
  batchGrams: z.number(),
  lossPercent: z.number(),
  lines: z.array(
    z.object({
      materialId: z.string(),
      materialName: z.string(),
      percent: z.number(),
      grams: z.number(),
    }),
  ),
});
export type ScaledVersion = z.infer<typeof scaledVersionSchema>;
