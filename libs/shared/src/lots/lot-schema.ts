import * as z from 'zod';
import { addDays, todayIso } from '../dates/calendar-day';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { warningsField } from '../records/housekeeping-schema';
import {
  isoDate,
  optionalIsoDate,
  optionalText,
  quantity,
  recordIdSchema,
  requiredText,
  storedRecordFields,
} from '../records/record-fields';

/** Units a lot's quantity is counted in. */
export const LOT_UNITS = ['g', 'kg', 'mL', 'L', 'units'] as const;
export const lotUnitSchema = z.enum(LOT_UNITS, { error: `Choose a unit: ${LOT_UNITS.join(', ')}` });
export type LotUnit = z.infer<typeof lotUnitSchema>;

/**
 * The latest received date accepted: tomorrow as the UTC calendar day. "Today" is the UTC day
 * (see `dates/calendar-day.ts`), and a maker east of Greenwich (up to UTC+14) is already on the
 * next day while UTC is not, so one day of tolerance lets them record today's delivery. Anything
 * later is a typing mistake: goods cannot arrive in the future.
 */
export const latestReceivedOn = (now: Date = new Date()) => addDays(todayIso(now), 1);

/** Goods-in of one supplier lot of a material (create and full update). */
export const lotCreateSchema = z
  .object({
    materialId: recordIdSchema('material'),
    supplierLotNumber: requiredText('Supplier lot number', 100),
    // Stored as numeric(16, 4).
    quantity: quantity('The quantity received', { decimals: 4, max: 1e9, zero: 'refused' }),
    unit: lotUnitSchema,
    receivedOn: isoDate('the day it was received'),
    expiresOn: optionalIsoDate('the expiry date'),
    // Stored as numeric(14, 4).
    unitCost: quantity('The cost per unit', { decimals: 4, max: 1e7, zero: 'allowed' })
      .nullish()
      .transform((v) => v ?? null),
    notes: optionalText('Notes', 2000),
  })
  .superRefine((lot, ctx) => {
    // Both are YYYY-MM-DD, so text order is calendar order.
    if (lot.receivedOn > latestReceivedOn()) {
      ctx.addIssue({
        code: 'custom',
        path: ['receivedOn'],
        message: 'The received date cannot be in the future',
      });
    }
    if (lot.expiresOn && lot.expiresOn < lot.receivedOn) {
      ctx.addIssue({
        code: 'custom',
        path: ['expiresOn'],
        message: 'The expiry date cannot be before the day it was received',
      });
    }
  });
export type LotCreate = z.input<typeof lotCreateSchema>;
export type LotFields = z.output<typeof lotCreateSchema>;
/** Full replacement of a lot's fields (PUT). */
export const lotUpdateSchema = lotCreateSchema;

/** A lot as the API returns it, with its stock on hand. */
export const lotSchema = z.object({
  ...storedRecordFields,
  materialId: z.string(),
  materialName: z.string(),
  /** The material's supplier, when one is recorded. */
  supplierName: z.string().nullable(),
  supplierLotNumber: z.string(),
  quantity: z.number(),
  unit: lotUnitSchema,
  receivedOn: z.string(),
  expiresOn: z.string().nullable(),
  unitCost: z.number().nullable(),
  notes: z.string().nullable(),
  /** Quantity received minus everything batches consumed, in the lot's unit. */
  stockOnHand: z.number(),
  /** On a create or update: the lot number was already received for this material. */
  warnings: warningsField,
});
export type Lot = z.infer<typeof lotSchema>;

/** Query of `GET /api/lots`: `q` matches the supplier lot number and the material's trade name. */
export const lotListQuerySchema = listQuerySchema(
  ['receivedOn', 'expiresOn', 'supplierLotNumber', 'materialName', 'quantity', 'createdAt'],
  'receivedOn',
).extend({
  materialId: recordIdSchema('material').optional(),
  /** Only lots whose expiry falls on or before this day (for "expiring soon"). */
  expiresBefore: isoDate('the expiry cut-off').optional(),
});
export type LotListQuery = z.output<typeof lotListQuerySchema>;
export const lotPageSchema = pageSchema(lotSchema);
export type LotPage = z.infer<typeof lotPageSchema>;
