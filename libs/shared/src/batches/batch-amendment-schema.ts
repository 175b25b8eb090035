import * as z from 'zod';
import { MAX_LINES } from '../compliance/evaluation-input-schema';
import { lotUnitSchema } from '../lots/lot-schema';
import {
  optionalText,
  quantity,
  recordIdSchema,
  requiredText,
  textField,
} from '../records/record-fields';
import { batchFields, batchLineFields } from './batch-schema';

/**
 * Records that keep: a released batch never changes. A correction is an amendment naming the field,
 * its new value and the reason, kept beside the original; stock is corrected by an adjustment with
 * its reason, never by editing a lot's received quantity.
 */

/** The fields of a released batch an amendment may correct, each with the rule its value follows. */
export const AMENDABLE_BATCH_FIELDS = {
  'conditions.roomTemperatureC': batchFields.roomTemperatureC,
  'conditions.humidityPercent': batchFields.humidityPercent,
  'mould.name': batchFields.mouldName,
  'mould.unitsMade': batchFields.unitsMade,
  'timing.hoursInMould': batchFields.hoursInMould,
  'timing.curingDays': batchFields.curingDays,
  'checks.appearance': batchFields.appearance,
  'checks.hardness': batchFields.hardness,
  'checks.fizzOrLather': batchFields.fizzOrLather,
  'checks.unitWeightsGrams': batchFields.unitWeightsGrams,
  'checks.ph': batchFields.ph,
  notes: batchFields.notes,
} as const;

/**
 * Line fields an amendment may correct, as `lines.<line number>.<field>`. A corrected lot pick
 * moves stock: the API records the change to the lots' consumption in the same transaction.
 */
export const AMENDABLE_LINE_FIELDS = batchLineFields;

const LINE_FIELD = /^lines\.(\d{1,3})\.(usedMaterialId|lotPicks|actualGrams)$/;

/** The value rule of an amendable field, or null when the field cannot be amended. */
export function amendableFieldSchema(field: string): z.ZodType | null {
  if (Object.hasOwn(AMENDABLE_BATCH_FIELDS, field))
    return AMENDABLE_BATCH_FIELDS[field as keyof typeof AMENDABLE_BATCH_FIELDS];
  const line = LINE_FIELD.exec(field);
  if (!line) return null;
  const number = Number(line[1]);
  if (number < 1 || number > MAX_LINES) return null;
  return AMENDABLE_LINE_FIELDS[line[2] as keyof typeof AMENDABLE_LINE_FIELDS];
}

/** Shortest reason an amendment accepts: enough to say what went wrong. */
export const AMENDMENT_REASON_MIN = 10;

/** `POST /api/batches/:id/amendments`: one field's corrected value and why. */
export const batchAmendmentSchema = z
  .object({
    field: textField('The field to correct', 'Choose the field to correct')
      .trim()
      .min(1, { error: 'Choose the field to correct' })
      .max(100, { error: 'Choose the field to correct' }),
    value: z.unknown(),
    reason: requiredText('The reason for the correction', 2000).min(AMENDMENT_REASON_MIN, {
      error: `Explain the correction in at least ${AMENDMENT_REASON_MIN} characters`,
    }),
  })
  .transform((amendment, ctx) => {
    const schema = amendableFieldSchema(amendment.field);
    if (!schema) {
      ctx.addIssue({
        code: 'custom',
        path: ['field'],
        message: `${amendment.field} cannot be corrected: the batch code, size, formula and release are fixed once released`,
      });
      return z.NEVER;
    }
    const value = schema.safeParse(amendment.value);
    if (!value.success) {
      for (const issue of value.error.issues)
        ctx.addIssue({ code: 'custom', path: ['value', ...issue.path], message: issue.message });
      return z.NEVER;
    }
    return { ...amendment, value: value.data };
  });
export type BatchAmendment = z.input<typeof batchAmendmentSchema>;
export type BatchAmendmentFields = z.output<typeof batchAmendmentSchema>;

/** An amendment as the API returns it, beside the original. */
export const batchAmendmentRecordSchema = z.object({
  id: z.string(),
  field: z.string(),
  /** The value before this amendment (the released one, or the previous amendment's). */
  previousValue: z.unknown(),
  value: z.unknown(),
  reason: z.string(),
  amendedAt: z.string(),
  amendedBy: z.string(),
});
export type BatchAmendmentRecord = z.infer<typeof batchAmendmentRecordSchema>;

/** Why stock was adjusted outside a batch. */
export const STOCK_ADJUSTMENT_REASONS = [
  'spillage',
  'count-correction',
  'disposal',
  'other',
] as const;
export const stockAdjustmentReasonSchema = z.enum(STOCK_ADJUSTMENT_REASONS, {
  error: 'Choose a reason: spillage, count correction, disposal or other',
});

/** Most a single adjustment moves, in the lot's unit: a lot's own largest quantity. */
const MAX_ADJUSTMENT = 1e9;
const magnitude = quantity('The adjustment', { decimals: 4, max: MAX_ADJUSTMENT, zero: 'refused' });

/**
 * `POST /api/lots/:id/adjustments` (or with `lotId` in the body): a signed quantity in the lot's
 * own unit (negative takes stock away, positive adds after a count), a reason, and a note. The API
 * refuses an adjustment that would take the lot below zero, in the transaction that records it.
 */
export const stockAdjustmentSchema = z
  .object({
    lotId: recordIdSchema('lot'),
    quantity: z
      .number({ error: 'The adjustment must be a number' })
      .refine((v) => v !== 0, { error: 'An adjustment of 0 changes nothing' })
      .superRefine((v, ctx) => {
        if (v === 0) return;
        const checked = magnitude.safeParse(Math.abs(v));
        if (!checked.success)
          for (const issue of checked.error.issues)
            ctx.addIssue({ code: 'custom', message: issue.message });
      }),
    reason: stockAdjustmentReasonSchema,
    note: optionalText('Note', 1000),
  })
  .superRefine((a, ctx) => {
    if (a.reason === 'other' && a.note === null)
      ctx.addIssue({
        code: 'custom',
        path: ['note'],
        message: 'Say what happened: a note is needed when the reason is "other"',
      });
  });
export type StockAdjustment = z.input<typeof stockAdjustmentSchema>;
export type StockAdjustmentFields = z.output<typeof stockAdjustmentSchema>;

/** What moved a lot's stock: a batch's release, an adjustment, or an amendment of a released batch. */
export const STOCK_MOVEMENT_KINDS = ['batch', 'adjustment', 'amendment'] as const;

/**
 * One movement of a lot's stock as the API returns it (`GET /api/lots/:id/movements`, and the
 * answer of `POST /api/lots/:id/adjustments`). `quantity` is signed in the lot's unit: positive
 * takes stock out, negative puts it back (an adjustment that adds after a count is negative here).
 */
export const stockMovementSchema = z.object({
  id: z.string(),
  lotId: z.string(),
  kind: z.enum(STOCK_MOVEMENT_KINDS),
  quantity: z.number(),
  unit: lotUnitSchema,
  /** The same amount in grams, as weighed (batch and amendment rows); null for adjustments. */
  grams: z.number().nullable(),
  batchId: z.string().nullable(),
  batchCode: z.string().nullable(),
  lineNumber: z.number().int().nullable(),
  reason: stockAdjustmentReasonSchema.nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
  /** Who recorded it; null when unknown (a removed member, or a row written by the system). */
  createdByName: z.string().nullable(),
});
export type StockMovement = z.infer<typeof stockMovementSchema>;
