import * as z from 'zod';
import { batchCodePatternSchema } from '../batches/batch-code';
import { weighingToleranceSchema } from '../batches/weighing-tolerance';

/**
 * The workshop's production settings (`GET/PUT /api/workshop/production`, owner writes, members
 * read): the weighing tolerance new batches take, the batch code pattern, and the owner's answer
 * to whether the business is a small business under MoCRA (adverse-event records kept 3 years
 * instead of 6, FD&C Act §605(e)).
 */
export const productionSettingsSchema = z.object({
  weighingTolerancePercent: weighingToleranceSchema,
  batchCodePattern: batchCodePatternSchema,
  smallBusiness: z
    .boolean({ error: 'Say whether the business is a small business' })
    .default(false),
});
export type ProductionSettingsInput = z.input<typeof productionSettingsSchema>;
export type ProductionSettings = z.output<typeof productionSettingsSchema>;
