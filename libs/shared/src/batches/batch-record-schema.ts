import * as z from 'zod';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { isoDate, recordIdSchema, storedRecordFields } from '../records/record-fields';
import { batchAmendmentRecordSchema } from './batch-amendment-schema';
import {
  batchStateSchema,
  checkResultSchema,
  lineLotPicksSchema,
  lotPickSchema,
  weighSheetLineSchema,
} from './batch-schema';

/** A batch as the API returns it: `POST /api/batches` answers 201 with one (its weigh sheet and suggested picks). */

/** A line of a batch: the weigh sheet line, the suggestion, and what was recorded. */
export const batchLineSchema = weighSheetLineSchema.extend({
  /** First-expiring lots with enough stock, suggested when the batch was started. */
  suggestedPicks: lineLotPicksSchema,
  /** The material used: the line's own, or the approved substitute recorded. */
  usedMaterialId: z.string(),
  usedMaterialName: z.string(),
  /** The lots it was weighed from. */
  lotPicks: z.array(lotPickSchema),
  actualGrams: z.number().nullable(),
  /** The weight against the target at the workshop's tolerance (see `checkWeighing`). */
  weighing: z.object({
    status: z.enum(['ok', 'out', 'not-weighed']),
    deviationPercent: z.number().nullable(),
    message: z.string().nullable(),
  }),
});
export type BatchLine = z.infer<typeof batchLineSchema>;

const checkSchema = z.object({ result: checkResultSchema, note: z.string().nullable() });

/** A batch record. */
export const batchSchema = z.object({
  ...storedRecordFields,
  formulaId: z.string(),
  formulaName: z.string(),
  version: z.number().int(),
  batchCode: z.string(),
  state: batchStateSchema,
  madeOn: z.string(),
  size: z.object({
    units: z.number().int().nullable(),
    unitMassGrams: z.number().nullable(),
    targetGrams: z.number(),
    lossPercent: z.number(),
    batchGrams: z.number(),
  }),
  /** The rounded lines against the batch (see `weighSheet`). */
  sum: z.object({
    batchGrams: z.number(),
    roundedGrams: z.number(),
    differenceGrams: z.number(),
    withinRounding: z.boolean(),
  }),
  weighSheetNotes: z.array(z.string()),
  /** The workshop's weighing tolerance when the batch was started, ± percent. */
  tolerancePercent: z.number(),
  lines: z.array(batchLineSchema),
  conditions: z.object({
    roomTemperatureC: z.number().nullable(),
    humidityPercent: z.number().nullable(),
  }),
  mould: z.object({ name: z.string().nullable(), unitsMade: z.number().int().nullable() }),
  timing: z.object({
    hoursInMould: z.number().nullable(),
    curingDays: z.number().int().nullable(),
    /** See `batchReadyOn`. */
    readyOn: z.string().nullable(),
  }),
  checks: z.object({
    appearance: checkSchema,
    hardness: checkSchema,
    fizzOrLather: checkSchema,
    unitWeightsGrams: z.array(z.number()),
    /** The units against the declared net quantity (see `checkUnitWeights`); null when none weighed or not in grams. */
    unitWeight: z
      .object({
        status: z.enum(['ok', 'light-units', 'average-below']),
        averageGrams: z.number(),
        messages: z.array(z.string()),
      })
      .nullable(),
    ph: z.number().nullable(),
  }),
  notes: z.string().nullable(),
  /** See `batchDurability`. */
  durability: z.object({
    bestBeforeMonth: z.string().nullable(),
    expiresOn: z.string().nullable(),
    periodAfterOpeningMonths: z.number().int().nullable(),
  }),
  releasedAt: z.string().nullable(),
  releasedBy: z.string().nullable(),
  /** Corrections after release, oldest first; the fields above stay as released. */
  amendments: z.array(batchAmendmentRecordSchema),
});
export type Batch = z.infer<typeof batchSchema>;

/** A row of the batches list. */
export const batchListItemSchema = batchSchema
  .pick({
    id: true,
    formulaId: true,
    formulaName: true,
    version: true,
    batchCode: true,
    state: true,
    madeOn: true,
    releasedAt: true,
    updatedAt: true,
    durability: true,
  })
  .extend({
    readyOn: z.string().nullable(),
    unitsMade: z.number().int().nullable(),
    /** Lines outside the weighing tolerance. */
    outOfTolerance: z.number().int(),
  });
export type BatchListItem = z.infer<typeof batchListItemSchema>;

/** Query of `GET /api/batches`; `q` matches the batch code and the formula's name. */
export const batchListQuerySchema = listQuerySchema(
  ['madeOn', 'batchCode', 'formulaName', 'state', 'createdAt'],
  'madeOn',
).extend({
  state: batchStateSchema.optional(),
  formulaId: recordIdSchema('formula').optional(),
  /** Batches still curing on this day (ready after it), for the home page. */
  curingOn: isoDate('the day').optional(),
});
export type BatchListQuery = z.output<typeof batchListQuerySchema>;
export const batchPageSchema = pageSchema(batchListItemSchema);
export type BatchPage = z.infer<typeof batchPageSchema>;
