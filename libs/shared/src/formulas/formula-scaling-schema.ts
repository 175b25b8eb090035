import * as z from 'zod';
import { MAX_UNIT_GRAMS } from './formula-schema';

/** Largest batch a scale asks for: the most a version may weigh (1,000 tonnes). */
export const MAX_BATCH_GRAMS = 1e9;
/** Most units one scaled batch makes. */
export const MAX_UNITS = 1_000_000;

const loss = z
  .number({ error: 'Enter the loss allowance as a percentage' })
  .min(0, { error: 'Loss cannot be negative' })
  .max(100, { error: 'Loss cannot exceed 100 %' })
  .default(0);

/**
 * Scale a version to a number of units (unit mass from the request or the version's profile)
 * or to a total mass, plus a loss allowance. Sizes no workshop makes are refused, so nothing is
 * computed with them.
 */
export const scaleRequestSchema = z
  .object({
    units: z
      .number({ error: 'Enter how many units to make' })
      .int({ error: 'Units must be a whole number' })
      .positive({ error: 'Make at least one unit' })
      .max(MAX_UNITS, { error: 'Make at most 1,000,000 units at a time' })
      .optional(),
    unitMassGrams: z
      .number({ error: 'Enter the unit mass in grams' })
      .gt(0, { error: 'The unit mass must be more than 0 g' })
      .max(MAX_UNIT_GRAMS, { error: 'The unit mass is too large (1,000,000 g at most)' })
      .optional(),
    totalGrams: z
      .number({ error: 'Enter the total batch mass in grams' })
      .gt(0, { error: 'The total must be more than 0 g' })
      .max(MAX_BATCH_GRAMS, { error: 'The total is too large (1,000,000,000 g at most)' })
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
    const { units, unitMassGrams: mass } = r;
    // Each refused on its own already when beyond its own maximum.
    if (units !== undefined && mass !== undefined && units <= MAX_UNITS && mass <= MAX_UNIT_GRAMS) {
      if (units * mass > MAX_BATCH_GRAMS) {
        ctx.addIssue({
          code: 'custom',
          path: ['units'],
          message: 'That batch would weigh more than 1,000,000,000 g: make fewer units',
        });
      }
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
