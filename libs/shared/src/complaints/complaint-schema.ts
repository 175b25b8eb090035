import * as z from 'zod';
import { GS1_CSET_82 } from '../compliance/gs1-element-string';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { latestReceivedOn } from '../lots/lot-schema';
import {
  isoDate,
  optionalIsoDate,
  optionalText,
  recordIdSchema,
  requiredText,
  storedRecordFields,
} from '../records/record-fields';
import { reportingClockSchema } from './adverse-event-clock';
import { FIRST_US_HOLIDAY_YEAR } from './us-federal-holidays';

/**
 * The contract for logging a complaint or an adverse event against a product (`GET/POST
 * /api/complaints`). Batchproof records what the owner decides: whether an event is serious, and
 * whether it must be reported to FDA, are for the owner and their adviser to judge; the app only
 * keeps the record and counts the days.
 */

/** Where a complaint stands. */
export const COMPLAINT_STATUSES = ['open', 'closed'] as const;
export const complaintStatusSchema = z.enum(COMPLAINT_STATUSES, { error: 'Choose open or closed' });
export type ComplaintStatus = z.infer<typeof complaintStatusSchema>;

/** The statutory definition behind the "serious" checkbox. */
export const SERIOUS_ADVERSE_EVENT_DEFINITION_SOURCE = 'FD&C Act §604(5), 21 U.S.C. 364(5)';

/**
 * Help shown beside the "serious" checkbox: the MoCRA definition in plain words (FD&C Act
 * §604(5), 21 U.S.C. 364(5)), and who decides.
 */
export const SERIOUS_ADVERSE_EVENT_HELP =
  'Under US law (MoCRA) an adverse event is serious when it results in death; a life-threatening ' +
  'experience; inpatient hospital care; a persistent or significant disability or incapacity; a ' +
  'congenital anomaly or birth defect; an infection; or significant disfigurement (including ' +
  'serious and persistent rashes, second- or third-degree burns, significant hair loss, or a ' +
  'persistent or significant change of appearance) other than as intended, under customary or ' +
  'usual conditions of use — or when, in reasonable medical judgment, a medical or surgical ' +
  'intervention is needed to prevent one of these. You and your adviser decide whether this ' +
  'event is serious and must be reported; Batchproof only counts the days.';

/** Suggestions for the body-area field; anything else may be typed. */
export const BODY_AREA_SUGGESTIONS = [
  'Face',
  'Eyes',
  'Lips',
  'Scalp and hair',
  'Neck',
  'Hands',
  'Arms',
  'Torso',
  'Legs',
  'Feet',
  'Intimate area',
  'Whole body',
] as const;

/** Longest finished-lot code: the most a GS1 (10) batch/lot field holds. */
const MAX_LOT_CODE = 20;
const CSET_82 = new Set(GS1_CSET_82);

/**
 * The lot code as the customer read it off the label. Spaces are dropped (people read codes out
 * in groups); the rest must be characters a GS1 (10) lot can hold, or it cannot be one of ours.
 */
const finishedLotCodeField = z
  .string({ error: 'Enter the lot code as text' })
  .nullish()
  .transform((v) => (v ?? '').replace(/\s+/g, ''))
  .refine((v) => v.length <= MAX_LOT_CODE, {
    error: `A lot code has at most ${MAX_LOT_CODE} characters`,
  })
  .refine((v) => [...v].every((c) => CSET_82.has(c)), {
    error:
      'A lot code on our labels uses only letters, digits and ! " % & \' ( ) * + , - . / : ; < = > ? _',
  })
  .transform((v) => (v ? v : null));

/** `POST /api/complaints` (and a full update). */
export const complaintCreateSchema = z
  .object({
    /** The product: the formula it was made from. */
    formulaId: recordIdSchema('product'),
    /** The batch, when the maker knows it. */
    batchId: recordIdSchema('batch')
      .nullish()
      .transform((v) => v ?? null),
    /** The lot code printed on the product, when the customer gave it. */
    finishedLotCode: finishedLotCodeField,
    /** The day the complaint reached the business: day 0 of any reporting clock. */
    receivedOn: isoDate('the day it was received'),
    reporterName: optionalText('Who reported it', 200),
    reporterContact: optionalText('How to reach them', 200),
    whatHappened: requiredText('What happened', 4000),
    bodyArea: optionalText('Body area', 100),
    /** Whether the owner judges it a serious adverse event (see `SERIOUS_ADVERSE_EVENT_HELP`). */
    serious: z.boolean({ error: 'Say whether it is a serious adverse event' }),
    status: complaintStatusSchema.default('open'),
    followUpNotes: optionalText('Follow-up notes', 4000),
    /** The day a report went to FDA, once it has: stops the reporting clock. */
    reportedToFdaOn: optionalIsoDate('the day it was reported to FDA'),
  })
  .superRefine((complaint, ctx) => {
    const refuse = (field: 'receivedOn' | 'reportedToFdaOn', message: string) =>
      ctx.addIssue({ code: 'custom', path: [field], message });
    // YYYY-MM-DD text order is calendar order.
    const latest = latestReceivedOn();
    const { receivedOn, reportedToFdaOn: reported } = complaint;
    if (receivedOn > latest) refuse('receivedOn', 'The received date cannot be in the future');
    if (receivedOn < `${FIRST_US_HOLIDAY_YEAR}-01-01`) {
      refuse('receivedOn', `Enter a day in ${FIRST_US_HOLIDAY_YEAR} or later`);
    }
    if (reported && reported < receivedOn) {
      refuse('reportedToFdaOn', 'It cannot have been reported before it was received');
    }
    if (reported && reported > latest) {
      refuse('reportedToFdaOn', 'The reported date cannot be in the future');
    }
  });
export type ComplaintCreate = z.input<typeof complaintCreateSchema>;
export type ComplaintFields = z.output<typeof complaintCreateSchema>;
/** Full replacement of a complaint's fields (PUT). */
export const complaintUpdateSchema = complaintCreateSchema;

/** A complaint as the API answers it. */
export const complaintSchema = z.object({
  ...storedRecordFields,
  formulaId: z.string(),
  productName: z.string(),
  batchId: z.string().nullable(),
  /** The batch's code, when a batch is named. */
  batchCode: z.string().nullable(),
  finishedLotCode: z.string().nullable(),
  receivedOn: z.string(),
  reporterName: z.string().nullable(),
  reporterContact: z.string().nullable(),
  whatHappened: z.string(),
  bodyArea: z.string().nullable(),
  serious: z.boolean(),
  status: complaintStatusSchema,
  followUpNotes: z.string().nullable(),
  reportedToFdaOn: z.string().nullable(),
  /**
   * The 15-business-day clock for reporting to FDA: present when the complaint is marked serious
   * and the product is sold in the US (the API decides from the formula's markets); null otherwise.
   */
  usReportingClock: reportingClockSchema.nullable(),
  /** How long the record is kept (US: 6 years, 3 for a small business); null outside the US. */
  retention: z
    .object({ keepUntil: z.string(), years: z.number().int(), source: z.string() })
    .nullable(),
});
export type Complaint = z.infer<typeof complaintSchema>;

const booleanFromText = (label: string) =>
  z.enum(['true', 'false'], { error: `${label} is true or false` }).transform((v) => v === 'true');

/**
 * Query of `GET /api/complaints`: `q` matches what happened, the reporter and the lot code. The
 * reporting clock's due day follows the received day, so sorting by `receivedOn` also sorts the
 * clocks.
 */
export const complaintListQuerySchema = listQuerySchema(
  ['receivedOn', 'productName', 'batchCode', 'serious', 'status', 'createdAt'],
  'receivedOn',
).extend({
  formulaId: recordIdSchema('product').optional(),
  status: complaintStatusSchema.optional(),
  serious: booleanFromText('Serious').optional(),
});
export type ComplaintListQuery = z.output<typeof complaintListQuerySchema>;
export const complaintPageSchema = pageSchema(complaintSchema);
export type ComplaintPage = z.infer<typeof complaintPageSchema>;
