import * as z from 'zod';
import { isCalendarDay } from '../dates/calendar-day';
import { complianceMarketSchema } from '../reference-data/reference-row';
import { recordIdSchema, requiredText } from '../records/record-fields';
import { complianceFindingSchema } from '../compliance/evaluation-result-schema';
import { GS1_CSET_82 } from '../compliance/gs1-element-string';
import { MAX_VERSION_NUMBER } from '../formulas/formula-schema';
import { LABEL_FIELD_KEYS } from './label-content';
import { missingLabelElementSchema } from './label-refusal';
import { productIdentitySchema } from './product-identity';

export {
  labelFitProblemSchema,
  missingLabelElementSchema,
  type LabelFitProblem,
  type MissingLabelElementRecord,
} from './label-refusal';

/**
 * The label-run routes' contract: `POST /api/label-runs` records a print run of a released formula
 * version and renders its PDF (`GET /api/label-runs/:id/pdf`); `GET /api/label-runs` lists runs;
 * the public ingredients page of a run lives at `/p/:token`.
 */

/** Most labels one run may print (all markets and panels together). */
export const MAX_LABELS_PER_RUN = 2000;
/** Most copies (products) per market in one run. */
export const MAX_COPIES = 1000;

/**
 * How a product's label is laid out:
 * - `single`: everything on one label;
 * - `panels`: a principal display panel (front) and an information panel (back), two labels in a row;
 * - `small`: a small item's label: name, net quantity, lot and durability, the maker, and a QR code
 *   to the public ingredients page; the rest of the label must be on the outer pack, a tag or a card.
 */
export const labelLayoutSchema = z.enum(['single', 'panels', 'small'], {
  error: 'Choose one label, front and back, or small item',
});
export type LabelLayout = z.infer<typeof labelLayoutSchema>;

/** Which symbology carries the lot's GS1 element string. */
export const lotBarcodeSchema = z.enum(['gs1-datamatrix', 'gs1-128'], {
  error: 'Choose GS1 DataMatrix or GS1-128',
});
export type LotBarcode = z.infer<typeof lotBarcodeSchema>;

const labelFieldKeySchema = z.enum(LABEL_FIELD_KEYS);

const lotCode = z
  .string({ error: 'Enter the lot code' })
  .trim()
  .min(1, { error: 'Enter the lot code' })
  .max(20, { error: 'A lot code printed in a GS1 barcode has at most 20 characters' })
  .refine((v) => [...v].every((c) => GS1_CSET_82.includes(c)), {
    error: 'Use letters, digits and ! " % & \' ( ) * + , - . / : ; < = > ? _ in a lot code',
  });

const calendarDay = (what: string) =>
  z
    .string({ error: `Enter the ${what} as a date` })
    .refine(isCalendarDay, { error: `Enter the ${what} as a date (YYYY-MM-DD)` });

/** `POST /api/label-runs`. */
export const labelRunCreateSchema = z
  .object({
    formulaId: recordIdSchema('formula'),
    version: z
      .number({ error: 'Choose a released version' })
      .int({ error: 'Choose a released version' })
      .min(1, { error: 'Choose a released version' })
      .max(MAX_VERSION_NUMBER, { error: 'Choose a released version' }),
    markets: z
      .array(complianceMarketSchema, { error: 'Choose at least one market' })
      .min(1, { error: 'Choose at least one market' })
      .max(4, { error: 'Choose at most four markets' })
      .transform((m) => [...new Set(m)]),
    /** A built-in stock's key or the workshop's own stock's id. */
    stockId: z
      .string({ error: 'Choose a label stock' })
      .trim()
      .min(1, { error: 'Choose a label stock' })
      .max(100, { error: 'Choose a label stock' }),
    /** First label position to print on (1 = top left), for a part-used sheet. */
    startPosition: z
      .number({ error: 'Enter the first position to print on' })
      .int({ error: 'Enter the first position as a whole number' })
      .min(1, { error: 'Positions start at 1 (top left)' })
      .max(1000, { error: 'That position is beyond any sheet' })
      .default(1),
    /** How many products to label, per market. */
    copies: z
      .number({ error: 'Enter how many labels to print' })
      .int({ error: 'Enter a whole number of labels' })
      .min(1, { error: 'Print at least one label' })
      .max(MAX_COPIES, { error: `Print at most ${MAX_COPIES} labels per market in one run` }),
    lotCode: lotCode.optional(),
    /** Expiry (printed, and GS1 AI 17) as YYYY-MM-DD; without it, a shelf life gives a best-before. */
    expiresOn: calendarDay('expiry date').optional(),
    /** A batch this run is for, once batches exist (production prints for batches). */
    batchId: recordIdSchema('batch').optional(),
    layout: labelLayoutSchema.default('single'),
    /** Fields moved off their default panel in the `panels` layout. */
    placement: z.partialRecord(labelFieldKeySchema, z.enum(['front', 'back'])).default({}),
    barcode: lotBarcodeSchema.default('gs1-datamatrix'),
    /**
     * For the `small` layout: the maker confirms the outer pack, a tag or a card carries what the
     * small label leaves out (ingredients, warnings, directions).
     */
    outerPackConfirmed: z.boolean().default(false),
    /** The owner's recorded reason for printing while required elements are missing. */
    overrideReason: requiredText('Reason for printing anyway', 500).optional(),
  })
  .superRefine((run, ctx) => {
    if (run.layout === 'small' && !run.outerPackConfirmed)
      ctx.addIssue({
        code: 'custom',
        path: ['outerPackConfirmed'],
        message:
          'Confirm that the outer pack, a tag or a card carries the ingredients, warnings and directions',
      });
  });
export type LabelRunCreate = z.input<typeof labelRunCreateSchema>;
export type LabelRunCreateParsed = z.output<typeof labelRunCreateSchema>;

/** Progress of a run's PDF. */
export const labelRunStatusSchema = z.enum(['rendering', 'ready', 'failed']);
export type LabelRunStatus = z.infer<typeof labelRunStatusSchema>;

/** A print run as the API answers it. */
export const labelRunRecordSchema = z.object({
  id: z.uuid(),
  formulaId: z.uuid(),
  formulaName: z.string(),
  version: z.number().int(),
  markets: z.array(complianceMarketSchema),
  stock: z.object({ id: z.string(), name: z.string() }),
  layout: labelLayoutSchema,
  barcode: lotBarcodeSchema,
  startPosition: z.number().int(),
  copies: z.number().int(),
  /** Labels printed in all (markets × copies × panels). */
  labelCount: z.number().int(),
  pageCount: z.number().int(),
  lotCode: z.string().nullable(),
  expiresOn: z.string().nullable(),
  batchId: z.uuid().nullable(),
  status: labelRunStatusSchema,
  /** Labels laid out so far, for a progress bar. */
  progress: z.object({ done: z.number().int(), total: z.number().int() }),
  /** Reason the owner gave for printing with missing elements, or null. */
  overrideReason: z.string().nullable(),
  /** What was missing when the owner overrode. */
  overriddenMissing: z.array(missingLabelElementSchema),
  /** A newer version of the formula has been released since. */
  outOfDate: z.boolean(),
  /** The public ingredients page, for runs printed with a QR code or any run once published. */
  publicPage: z.object({ path: z.string(), withdrawnAt: z.string().nullable() }).nullable(),
  createdAt: z.string(),
  /** Who printed it; the id is null once that member has left the workshop. */
  createdBy: z.object({ id: z.uuid().nullable(), name: z.string() }),
  /**
   * What the printed version lacks in safety assessment for the run's EU and UK labels
   * (`SAFETY_ASSESSMENT_MISSING`), as of the answer; empty once the version's assessment is signed.
   */
  assessmentFindings: z.array(complianceFindingSchema).optional(),
});
export type LabelRunRecord = z.infer<typeof labelRunRecordSchema>;

/** `GET /api/label-runs?formulaId=`: one formula's runs, or the workshop's latest without it. */
export const labelRunListQuerySchema = z.object({
  formulaId: recordIdSchema('formula').optional(),
});
export type LabelRunListQuery = z.output<typeof labelRunListQuerySchema>;

/** Most runs one list answers, newest first. */
export const LABEL_RUN_LIST_MAX = 200;

/** `GET /api/label-runs?formulaId=`: newest first. */
export const labelRunListSchema = z.object({ items: z.array(labelRunRecordSchema) });
export type LabelRunList = z.infer<typeof labelRunListSchema>;

/** A formula's product identity as stored and answered (`GET/PUT /api/formulas/:id/identity`). */
export const productIdentityRecordSchema = z.object({
  formulaId: z.uuid(),
  identity: productIdentitySchema.nullable(),
  updatedAt: z.string().nullable(),
});
export type ProductIdentityRecord = z.infer<typeof productIdentityRecordSchema>;

/** The workshop's name and address as printed on labels (`GET/PUT /api/workshop/label-details`). */
export const workshopLabelDetailsSchema = z.object({
  name: requiredText('Business name', 200),
  address: requiredText('Business address', 300),
});
export type WorkshopLabelDetails = z.output<typeof workshopLabelDetailsSchema>;
