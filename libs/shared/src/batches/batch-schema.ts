import * as z from 'zod';
import { MAX_LINES } from '../compliance/evaluation-input-schema';
import { addDays } from '../dates/calendar-day';
import { MAX_BATCH_GRAMS, scaleRequestSchema } from '../formulas/formula-scaling-schema';
import {
  MAX_UNIT_GRAMS,
  storedSubstituteSchema,
  versionNumberSchema,
} from '../formulas/formula-schema';
import { lotUnitSchema } from '../lots/lot-schema';
import {
  isoDate,
  optionalText,
  quantity,
  recordIdSchema,
  wholeNumber,
} from '../records/record-fields';
import { MAX_BATCH_LOSS_PERCENT } from './batch-size';

/**
 * The batch contract: `POST /api/batches`, the weigh sheet it answers with, what production
 * records on a draft batch, and the batch as the API returns it. A released batch never changes;
 * corrections are amendments (`batch-amendment-schema.ts`).
 */

/** A batch is recorded as a draft and released by the owner or a formulator. */
export const BATCH_STATES = ['draft', 'released'] as const;
export const batchStateSchema = z.enum(BATCH_STATES);
export type BatchState = z.infer<typeof batchStateSchema>;

const scaleFields = scaleRequestSchema.shape;

/** `POST /api/batches`: a released version, sized by units (× unit mass) or by total grams. */
export const batchCreateSchema = z
  .object({
    formulaId: recordIdSchema('formula'),
    version: versionNumberSchema('The released version'),
    units: scaleFields.units,
    /** Grams per unit; without it, the version's product profile's unit mass. */
    unitMass: scaleFields.unitMassGrams,
    totalGrams: scaleFields.totalGrams,
    lossPercent: z
      .number({ error: 'Enter the loss allowance as a percentage' })
      .min(0, { error: 'The loss allowance cannot be negative' })
      .max(MAX_BATCH_LOSS_PERCENT, {
        error: `The loss allowance is at most ${MAX_BATCH_LOSS_PERCENT} %`,
      })
      .default(0),
    /** The day the batch is made; the API takes today (the UTC day) when it is left out. */
    madeOn: isoDate('the day the batch is made').optional(),
  })
  .superRefine((b, ctx) => {
    const byUnits = b.units !== undefined;
    const byTotal = b.totalGrams !== undefined;
    if (byUnits && byTotal)
      ctx.addIssue({
        code: 'custom',
        path: ['totalGrams'],
        message: 'Size the batch by units or by a total in grams, not both',
      });
    if (!byUnits && !byTotal)
      ctx.addIssue({
        code: 'custom',
        path: ['units'],
        message: 'Enter how many units to make, or a total in grams',
      });
    if (byTotal && b.unitMass !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['unitMass'],
        message: 'A unit mass goes with a number of units, not with a total',
      });
    const { units, unitMass } = b;
    if (units !== undefined && unitMass !== undefined && unitMass <= MAX_UNIT_GRAMS)
      if (units * unitMass > MAX_BATCH_GRAMS)
        ctx.addIssue({
          code: 'custom',
          path: ['units'],
          message: 'That batch would weigh more than 1,000,000,000 g: make fewer units',
        });
  });
export type BatchCreate = z.input<typeof batchCreateSchema>;
export type BatchCreateFields = z.output<typeof batchCreateSchema>;

/** An approved alternative to a line's material (issue 11, item 2). */
export const substituteSchema = storedSubstituteSchema;

/** One weigh sheet line (see `weighSheet`). */
export const weighSheetLineSchema = z.object({
  /** 1-based, in the version's line order. */
  lineNumber: z.number().int(),
  materialId: z.string(),
  materialName: z.string(),
  percent: z.number(),
  /** Exact grams for this batch. */
  grams: z.number(),
  /** Grams rounded to the scale step. */
  weighGrams: z.number(),
  stepGrams: z.literal([0.01, 0.1, 1]),
  /** Approved substitutes the line may be made with instead. */
  substitutes: z.array(substituteSchema),
});
export type WeighSheetLineRecord = z.infer<typeof weighSheetLineSchema>;

/** Grams from one lot, with the same amount in the lot's unit (see `suggestLotPicks`). */
export const lotPickSchema = z.object({
  lotId: z.string(),
  supplierLotNumber: z.string(),
  expiresOn: z.string().nullable(),
  grams: z.number(),
  quantity: z.number(),
  unit: lotUnitSchema,
});
export type LotPickRecord = z.infer<typeof lotPickSchema>;

/** The suggested picks of one line. */
export const lineLotPicksSchema = z.object({
  status: z.enum(['single', 'split', 'short', 'none']),
  picks: z.array(lotPickSchema),
  shortGrams: z.number(),
  split: z.array(lotPickSchema).nullable(),
  notes: z.array(z.string()),
});

/** Grams taken from one lot, as recorded. */
export const lotPickInputSchema = z.object({
  lotId: recordIdSchema('lot'),
  // Stored as numeric(18, 6), like formula lines.
  grams: quantity('The grams from this lot', { decimals: 6, max: 1e9, zero: 'refused' }),
});

/** Most lots one line is weighed from. */
export const MAX_LOTS_PER_LINE = 20;

const actualGrams = quantity('The weight', { decimals: 6, max: 1e9, zero: 'allowed' })
  .nullish()
  .transform((v) => v ?? null);
const usedMaterialId = recordIdSchema('material')
  .nullish()
  .transform((v) => v ?? null);
const lotPicks = z
  .array(lotPickInputSchema, { error: 'List the lots this line was weighed from' })
  .max(MAX_LOTS_PER_LINE, { error: `A line is weighed from at most ${MAX_LOTS_PER_LINE} lots` })
  .refine((picks) => new Set(picks.map((p) => p.lotId)).size === picks.length, {
    error: 'Each lot is listed once per line: add its grams together',
  });

/** Field rules of a line, shared by the draft's form and by amendments. */
export const batchLineFields = { usedMaterialId, lotPicks, actualGrams };

/** What production records on one line of a draft. */
export const batchLineInputSchema = z
  .object({
    lineNumber: wholeNumber('The line number', { max: MAX_LINES }),
    /** The material used: null for the line's own, else one of its approved substitutes. */
    usedMaterialId,
    lotPicks: lotPicks.default([]),
    actualGrams,
  })
  .superRefine((line, ctx) => {
    if (line.actualGrams === null || line.lotPicks.length === 0) return;
    const picked = line.lotPicks.reduce((s, p) => s + p.grams, 0);
    // Half a hundredth of a gram: the finest scale step (common practice, no published source).
    if (Math.abs(picked - line.actualGrams) > 0.005)
      ctx.addIssue({
        code: 'custom',
        path: ['lotPicks'],
        message: `The lots add up to ${Math.round(picked * 100) / 100} g but the line weighed ${line.actualGrams} g: the grams from each lot must add up to the weight`,
      });
  });
export type BatchLineInput = z.input<typeof batchLineInputSchema>;

/** Why a line cannot be made with this material, or null: its own material or an approved substitute. */
export function usedMaterialProblem(
  line: Pick<WeighSheetLineRecord, 'materialId' | 'materialName' | 'substitutes'>,
  materialId: string | null,
): string | null {
  if (materialId === null || materialId === line.materialId) return null;
  if (line.substitutes.some((s) => s.materialId === materialId)) return null;
  return line.substitutes.length === 0
    ? `${line.materialName} has no approved substitutes: approve one on the formula first`
    : `That material is not an approved substitute for ${line.materialName}: use ${line.substitutes.map((s) => s.materialName).join(' or ')}`;
}

/** How a check went. */
export const checkResultSchema = z.enum(['pass', 'fail', 'not-checked'], {
  error: 'Choose pass, fail or not checked',
});
const check = (label: string) =>
  z
    .object({ result: checkResultSchema.default('not-checked'), note: optionalText(label, 1000) })
    .prefault({});

/** Most finished units weighed for the net quantity check. */
export const MAX_UNIT_WEIGHTS = 100;

/**
 * An optional reading from `min` to `max`: missing, null or empty means not recorded.
 * `optionalReading('room temperature', -10, 50, '°C')` says "The room temperature must be −10 to 50 °C".
 */
const optionalReading = (what: string, min: number, max: number, unit: string) => {
  const range = `The ${what} must be ${String(min).replace('-', '−')} to ${max}${unit ? ` ${unit}` : ''}`;
  return z
    .number({ error: `Enter the ${what}${unit ? ` in ${unit}` : ' as a number'}` })
    .min(min, { error: range })
    .max(max, { error: range })
    .nullish()
    .transform((v) => v ?? null);
};

/** Field rules shared by the draft's form and by amendments. */
export const batchFields = {
  /** Room temperature, °C (a workshop is between freezing and 50 °C). */
  roomTemperatureC: optionalReading('room temperature', -10, 50, '°C'),
  /** Relative humidity, %. */
  humidityPercent: optionalReading('humidity', 0, 100, '%'),
  mouldName: optionalText('Mould', 200),
  unitsMade: wholeNumber('The units made', { min: 0, max: 1_000_000 })
    .nullish()
    .transform((v) => v ?? null),
  /** Hours in the mould (up to 30 days). */
  hoursInMould: optionalReading('time in the mould', 0, 720, 'hours'),
  /** Curing or drying days after unmoulding (a year at most). */
  curingDays: wholeNumber('The curing or drying days', { min: 0, max: 365 })
    .nullish()
    .transform((v) => v ?? null),
  appearance: check('Appearance note'),
  hardness: check('Hardness note'),
  fizzOrLather: check('Fizz or lather note'),
  unitWeightsGrams: z
    .array(quantity('A unit weight', { decimals: 2, max: MAX_UNIT_GRAMS, zero: 'refused' }))
    .max(MAX_UNIT_WEIGHTS, { error: `Record at most ${MAX_UNIT_WEIGHTS} unit weights` })
    .default([]),
  /** pH where the maker measures it (pH 0 to 14). */
  ph: optionalReading('pH', 0, 14, ''),
  notes: optionalText('Notes', 4000),
};

/** Everything production records on a draft batch (`PUT` while it is a draft). */
export const batchRecordInputSchema = z.object({
  lines: z
    .array(batchLineInputSchema)
    .max(MAX_LINES, { error: `A batch has at most ${MAX_LINES} lines` })
    .refine((lines) => new Set(lines.map((l) => l.lineNumber)).size === lines.length, {
      error: 'Each line is recorded once',
    })
    .default([]),
  conditions: z
    .object({
      roomTemperatureC: batchFields.roomTemperatureC,
      humidityPercent: batchFields.humidityPercent,
    })
    .prefault({}),
  mould: z.object({ name: batchFields.mouldName, unitsMade: batchFields.unitsMade }).prefault({}),
  timing: z
    .object({ hoursInMould: batchFields.hoursInMould, curingDays: batchFields.curingDays })
    .prefault({}),
  checks: z
    .object({
      appearance: batchFields.appearance,
      hardness: batchFields.hardness,
      fizzOrLather: batchFields.fizzOrLather,
      unitWeightsGrams: batchFields.unitWeightsGrams,
      ph: batchFields.ph,
    })
    .prefault({}),
  notes: batchFields.notes,
});
export type BatchRecordInput = z.input<typeof batchRecordInputSchema>;
export type BatchRecordFields = z.output<typeof batchRecordInputSchema>;

/**
 * The day a batch is ready: the day made, plus the whole days it spends in the mould (rounded up),
 * plus the curing or drying days counted from unmoulding (common practice, no published source).
 * Made 2026-12-02, 48 h in the mould, 28 days' cure → 2027-01-01. Null until the curing time is known.
 */
export function batchReadyOn(
  madeOn: string,
  hoursInMould: number | null,
  curingDays: number | null,
): string | null {
  if (curingDays === null) return null;
  return addDays(madeOn, Math.ceil((hoursInMould ?? 0) / 24) + curingDays);
}
