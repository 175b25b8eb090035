import * as z from 'zod';
import {
  isoDate,
  optionalText,
  recordIdSchema,
  requiredText,
  storedRecordFields,
  wholeNumber,
} from '../records/record-fields';
import { latestReceivedOn } from '../lots/lot-schema';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { MAX_DELIVERY_LINES, MAX_DELIVERY_UNITS, finishedLotCodeSchema } from './delivery-schema';

/**
 * How bad the problem could be for someone using the product, in Batchproof's own plain words
 * (not any agency's classes; the maker chooses, and an authority may classify it differently).
 * Common practice, no published source.
 */
export const RECALL_SEVERITIES = ['serious-harm', 'minor-harm', 'unlikely-harm'] as const;
export type RecallSeverity = (typeof RECALL_SEVERITIES)[number];
export const RECALL_SEVERITY_LABELS: Readonly<Record<RecallSeverity, string>> = {
  'serious-harm': 'Could cause serious harm',
  'minor-harm': 'Could cause minor or temporary harm',
  'unlikely-harm': 'Unlikely to cause harm',
};
export const recallSeveritySchema = z.enum(RECALL_SEVERITIES, {
  error: `Choose how serious it is: ${RECALL_SEVERITIES.map((s) => RECALL_SEVERITY_LABELS[s]).join('; ')}`,
});

/**
 * What a recall covers: everything made with one supplier lot (traced forward), or finished lots
 * named directly (a complaint about one batch).
 */
export const recallScopeSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('supplier-lot'), supplierLotId: recordIdSchema('supplier lot') }),
    z.object({
      kind: z.literal('finished-lots'),
      finishedLotIds: z
        .array(recordIdSchema('finished lot'))
        .min(1, { error: 'Choose at least one finished lot' })
        .max(MAX_DELIVERY_LINES, {
          error: `A recall names at most ${MAX_DELIVERY_LINES} finished lots; recall by supplier lot instead`,
        })
        .refine((ids) => new Set(ids).size === ids.length, {
          error: 'A finished lot is chosen twice',
        }),
    }),
  ],
  { error: 'Choose what the recall covers: a supplier lot or finished lots' },
);
export type RecallScope = z.infer<typeof recallScopeSchema>;

/** Opening a recall (from a trace). */
export const recallCreateSchema = z.object({
  scope: recallScopeSchema,
  reason: requiredText('Reason', 2000),
  severity: recallSeveritySchema,
  /** A drill runs every step without sending anything. */
  drill: z.boolean({ error: 'Say whether this is a drill' }).default(false),
});
export type RecallCreate = z.input<typeof recallCreateSchema>;
export type RecallFields = z.output<typeof recallCreateSchema>;

/** A whole number of units from 0, as counted on a shelf. */
const unitCount = (label: string) => wholeNumber(label, { min: 0, max: MAX_DELIVERY_UNITS });

/** A customer's reply to a notice: what they still held and what they sent back. */
export const recallReplyCreateSchema = z.object({
  customerId: recordIdSchema('customer'),
  repliedOn: isoDate('the day of the reply').refine((day) => day <= latestReceivedOn(), {
    error: 'The day of the reply cannot be in the future',
  }),
  unitsOnHand: unitCount('Units on hand'),
  unitsReturned: unitCount('Units returned'),
  notes: optionalText('Notes', 2000),
});
export type RecallReplyCreate = z.input<typeof recallReplyCreateSchema>;
export type RecallReplyFields = z.output<typeof recallReplyCreateSchema>;

/** Closing a recall: what was found, done and recovered, for the summary PDF. */
export const recallCloseSchema = z.object({
  summary: requiredText('Summary', 8000),
});
export type RecallClose = z.input<typeof recallCloseSchema>;

export const recallStateSchema = z.enum(['open', 'closed']);
export type RecallState = z.infer<typeof recallStateSchema>;

/** Where a notice stands: `drill` notices are written but never sent. */
export const RECALL_NOTICE_STATUSES = ['not-sent', 'sent', 'failed', 'drill'] as const;
export const recallNoticeStatusSchema = z.enum(RECALL_NOTICE_STATUSES);
export type RecallNoticeStatus = z.infer<typeof recallNoticeStatusSchema>;

/** A customer who received recalled lots, and how many units of each. */
export const recallAffectedCustomerSchema = z.object({
  customerId: z.string(),
  customerName: z.string(),
  /** Where the notice goes; null when the customer has no e-mail (call them instead). */
  email: z.string().nullable(),
  phone: z.string().nullable(),
  lots: z.array(
    z.object({
      finishedLotId: z.string(),
      lotCode: finishedLotCodeSchema,
      productName: z.string().nullable(),
      unitsDelivered: z.number().int(),
    }),
  ),
  unitsDelivered: z.number().int(),
});
export type RecallAffectedCustomer = z.infer<typeof recallAffectedCustomerSchema>;

export const recallNoticeSchema = z.object({
  id: z.string(),
  customerId: z.string(),
  /** The address it went (or would go) to. */
  to: z.string(),
  subject: z.string(),
  status: recallNoticeStatusSchema,
  /** When the mail server accepted it; null until then. */
  sentAt: z.string().nullable(),
  /** Why sending failed, in words. */
  failure: z.string().nullable(),
});
export type RecallNotice = z.infer<typeof recallNoticeSchema>;

export const recallReplySchema = z.object({
  id: z.string(),
  customerId: z.string(),
  repliedOn: z.string(),
  unitsOnHand: z.number().int(),
  unitsReturned: z.number().int(),
  notes: z.string().nullable(),
  createdAt: z.string(),
});
export type RecallReply = z.infer<typeof recallReplySchema>;

/** A drill's findings: how long the trace took and what a real recall would have lacked. */
export const recallDrillReportSchema = z.object({
  traceMilliseconds: z.number(),
  /** e.g. `Corner Shop has no e-mail address`, `Lot HB-0412 has no recorded delivery`. */
  missing: z.array(z.string()),
});
export type RecallDrillReport = z.infer<typeof recallDrillReportSchema>;

/** A recall as the API returns it. */
export const recallSchema = z.object({
  ...storedRecordFields,
  scope: recallScopeSchema,
  /** The lot codes in scope, as the notices name them. */
  batchCodes: z.array(z.string()),
  reason: z.string(),
  severity: recallSeveritySchema,
  drill: z.boolean(),
  state: recallStateSchema,
  openedAt: z.string(),
  closedAt: z.string().nullable(),
  affected: z.array(recallAffectedCustomerSchema),
  notices: z.array(recallNoticeSchema),
  replies: z.array(recallReplySchema),
  /** Units delivered, and returned so far, over every affected customer. */
  unitsDelivered: z.number().int(),
  unitsReturned: z.number().int(),
  drillReport: recallDrillReportSchema.nullable(),
  summary: z.string().nullable(),
  /** The product names of the finished lots in scope, for titles and notices. */
  products: z.array(z.string()),
  /** The extra steps the last notices carried, beyond the standing three. */
  whatToDo: z.string().nullable(),
});
export type Recall = z.infer<typeof recallSchema>;

/**
 * What opening a recall would cover, shown before it is opened: the finished lots in scope and
 * the customers who received them. `lotsWithoutDelivery` names lots no delivery records.
 */
export const recallPreviewSchema = z.object({
  batchCodes: z.array(z.string()),
  products: z.array(z.string()),
  affected: z.array(recallAffectedCustomerSchema),
  unitsDelivered: z.number().int(),
  lotsWithoutDelivery: z.array(z.string()),
});
export type RecallPreview = z.infer<typeof recallPreviewSchema>;

/** `POST /api/recalls/preview`: the scope only. */
export const recallPreviewRequestSchema = z.object({ scope: recallScopeSchema });
export type RecallPreviewRequest = z.input<typeof recallPreviewRequestSchema>;

/** `POST /api/recalls/:id/notices`: anything to add to the standing steps of the notice. */
export const recallNoticesSendSchema = z.object({
  whatToDo: optionalText('What to do', 2000),
});
export type RecallNoticesSend = z.input<typeof recallNoticesSendSchema>;

/** Sort keys of the recalls list; `state` puts open recalls first, newest first within each. */
export const RECALL_SORT_KEYS = [
  'state',
  'openedAt',
  'batchCodes',
  'severity',
  'drill',
  'unitsReturned',
] as const;

/** Query of `GET /api/recalls`: `q` matches the reason and the batch codes. */
export const recallListQuerySchema = listQuerySchema(RECALL_SORT_KEYS, 'state').extend({
  state: recallStateSchema.optional(),
  drill: z
    .enum(['true', 'false'], { error: 'drill is true or false' })
    .transform((v) => v === 'true')
    .optional(),
});
export type RecallListQuery = z.output<typeof recallListQuerySchema>;

/** A row of the recalls list. */
export const recallListItemSchema = z.object({
  id: z.string(),
  openedAt: z.string(),
  closedAt: z.string().nullable(),
  state: recallStateSchema,
  drill: z.boolean(),
  severity: recallSeveritySchema,
  reason: z.string(),
  batchCodes: z.array(z.string()),
  products: z.array(z.string()),
  customers: z.number().int(),
  unitsDelivered: z.number().int(),
  unitsReturned: z.number().int(),
});
export type RecallListItem = z.infer<typeof recallListItemSchema>;
export const recallPageSchema = pageSchema(recallListItemSchema);
export type RecallPage = z.infer<typeof recallPageSchema>;

/**
 * Whether the recall concerns possible harm to someone using the product, so the maker is
 * pointed to the authority's guidance.
 */
export const recallConcernsHarm = (severity: RecallSeverity) => severity !== 'unlikely-harm';

/**
 * What the maker is told when a recall concerns possible harm. Recall duties differ by country
 * and product; we name no deadline (common practice, no published source).
 */
export const RECALL_AUTHORITY_NOTE =
  "Someone could be hurt by this product. Follow your local authority's recall guidance; tell the authority where the law requires it.";
