import * as z from 'zod';
import { gs1ElementInputSchema } from '../compliance/gs1-element-string';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { latestReceivedOn } from '../lots/lot-schema';
import { duplicateKey } from '../records/housekeeping-schema';
import {
  isoDate,
  optionalText,
  recordIdSchema,
  storedRecordFields,
  wholeNumber,
} from '../records/record-fields';

/** Most lines one delivery lists: far above a wholesale order, small enough to check at once. */
export const MAX_DELIVERY_LINES = 200;
/** Most units on one line: a pallet of bath bombs is a few thousand. */
export const MAX_DELIVERY_UNITS = 1_000_000;

/**
 * A finished lot's code as printed on the label: the batch code, 1 to 20 characters of GS1
 * character set 82 (GS1 General Specifications, AI (10) BATCH/LOT), the rule the label's barcode
 * applies. Leading and trailing spaces are dropped; one inside the code is refused.
 */
export const finishedLotCodeSchema = z
  .string({ error: 'Enter a lot code' })
  .trim()
  .pipe(gs1ElementInputSchema.shape.lot);

/** Units delivered on a line: a whole number of at least 1. */
export const deliveryUnitsSchema = wholeNumber('Units', { min: 1, max: MAX_DELIVERY_UNITS });

/**
 * The day of a delivery: a calendar day no later than `latest()`, by default tomorrow's UTC day
 * (the same tolerance as goods-in, `latestReceivedOn`: a maker east of Greenwich is already on
 * the next day). Goods cannot have left in the future.
 */
export const deliveredOnSchema = (latest: () => string = () => latestReceivedOn()) =>
  isoDate('the delivery date').refine((day) => day <= latest(), {
    error: 'The delivery date cannot be in the future',
  });

/** One line of a delivery: which finished lot, how many units. */
export const deliveryLineSchema = z.object({
  lotCode: finishedLotCodeSchema,
  units: deliveryUnitsSchema,
});
export type DeliveryLineInput = z.input<typeof deliveryLineSchema>;

/** The message for a lot listed twice on one delivery. */
export const repeatedLotMessage = (lotCode: string) =>
  `Lot ${lotCode} is listed twice; put all its units on one line`;

/**
 * The message for units beyond what is left of a finished lot: its units made less the units
 * already on other deliveries.
 */
export const unitsLeftMessage = (lotCode: string, left: number) =>
  left <= 0
    ? `Lot ${lotCode} has no units left to deliver`
    : `Only ${left} ${left === 1 ? 'unit' : 'units'} of lot ${lotCode} ${left === 1 ? 'is' : 'are'} left to deliver`;

/** The lines of a delivery: 1 to {@link MAX_DELIVERY_LINES}, each lot at most once. */
export const deliveryLinesSchema = z
  .array(deliveryLineSchema)
  .min(1, { error: 'List at least one lot delivered' })
  .max(MAX_DELIVERY_LINES, {
    error: `A delivery has at most ${MAX_DELIVERY_LINES} lines`,
  })
  .superRefine((lines, ctx) => {
    const seen = new Set<string>();
    for (const [index, line] of lines.entries()) {
      // Lot codes are compared as written: GS1 lot codes are case-sensitive.
      if (seen.has(line.lotCode)) {
        ctx.addIssue({
          code: 'custom',
          path: [index, 'lotCode'],
          message: repeatedLotMessage(line.lotCode),
        });
      }
      seen.add(line.lotCode);
    }
  });

/** The invoice or order number a delivery goes by. */
export const deliveryReferenceSchema = optionalText('Reference', 100);

/** What a member enters for a delivery (create and full update). */
export const deliveryCreateSchema = z.object({
  customerId: recordIdSchema('customer'),
  deliveredOn: deliveredOnSchema(),
  reference: deliveryReferenceSchema,
  lines: deliveryLinesSchema,
  notes: optionalText('Notes', 2000),
});
export type DeliveryCreate = z.input<typeof deliveryCreateSchema>;
export type DeliveryFields = z.output<typeof deliveryCreateSchema>;
export const deliveryUpdateSchema = deliveryCreateSchema;
export type DeliveryUpdate = z.input<typeof deliveryUpdateSchema>;

/**
 * What makes two rows of an import one delivery: the customer (case and spaces folded), the day
 * and the reference (as written, trimmed; blank is a reference of its own).
 */
export const deliveryGroupKey = (customer: string, deliveredOn: string, reference: string | null) =>
  `${duplicateKey(customer)}\n${deliveredOn}\n${reference ?? ''}`;

/** A delivery line as the API returns it. */
export const deliveryLineRecordSchema = z.object({
  finishedLotId: z.string(),
  lotCode: z.string(),
  /** The product the lot is a batch of, as its label names it. */
  productName: z.string().nullable(),
  units: z.number().int(),
});
export type DeliveryLine = z.infer<typeof deliveryLineRecordSchema>;

/** A delivery as the API returns it. */
export const deliverySchema = z.object({
  ...storedRecordFields,
  customerId: z.string(),
  customerName: z.string(),
  deliveredOn: z.string(),
  reference: z.string().nullable(),
  lines: z.array(deliveryLineRecordSchema),
  /** Units on every line together. */
  totalUnits: z.number().int(),
  notes: z.string().nullable(),
});
export type Delivery = z.infer<typeof deliverySchema>;

/**
 * Query of `GET /api/deliveries`: `q` matches the customer's name, the reference and the lot
 * codes; `customerId` and `lotCode` narrow to one customer or one finished lot.
 */
export const deliveryListQuerySchema = listQuerySchema(
  ['deliveredOn', 'customerName', 'reference', 'createdAt'],
  'deliveredOn',
).extend({
  customerId: recordIdSchema('customer').optional(),
  lotCode: finishedLotCodeSchema.optional(),
});
export type DeliveryListQuery = z.output<typeof deliveryListQuerySchema>;
export const deliveryPageSchema = pageSchema(deliverySchema);
export type DeliveryPage = z.infer<typeof deliveryPageSchema>;
