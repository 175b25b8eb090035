import * as z from 'zod';
import { documentKindSchema, documentStatusStateSchema } from '../documents/document-schema';
import { lotUnitSchema } from '../lots/lot-schema';
import { roleSchema } from '../auth/roles';
import { reportingClockStates } from '../complaints/adverse-event-clock';
import { recallSeveritySchema } from '../deliveries/recall-schema';
import { complianceMarketSchema } from '../reference-data/reference-row';

/**
 * Lots expiring within this many days (or already expired) while stock remains show on the home
 * page. // common practice, no published source: two months leaves time to use up or reorder.
 */
export const ATTENTION_EXPIRY_DAYS = 60;

/** At most this many rows of one kind are listed; `counts` holds the full number. */
export const ATTENTION_ROWS_PER_KIND = 10;

/** A formula's draft or released version whose last check found blocking findings. */
export const formulaBlockedItemSchema = z.object({
  kind: z.literal('formula-blocked'),
  formulaId: z.string(),
  formulaName: z.string(),
  versionNumber: z.number().int(),
  state: z.enum(['draft', 'released']),
  blockCount: z.number().int(),
});

/** A material with an expected document missing, out of date or dated in the future. */
export const materialDocumentsItemSchema = z.object({
  kind: z.literal('material-documents'),
  materialId: z.string(),
  materialName: z.string(),
  /** Only the documents that are not current, in the expected order. */
  documents: z.array(
    z.object({
      kind: documentKindSchema,
      state: documentStatusStateSchema.exclude(['current']),
      message: z.string(),
    }),
  ),
});

/** A lot with stock on hand that expires within {@link ATTENTION_EXPIRY_DAYS} days or has expired. */
export const lotExpiringItemSchema = z.object({
  kind: z.literal('lot-expiring'),
  lotId: z.string(),
  materialName: z.string(),
  supplierLotNumber: z.string(),
  expiresOn: z.string(),
  /** Days from today to the expiry date; negative once expired. */
  daysLeft: z.number().int(),
  stockOnHand: z.number(),
  unit: lotUnitSchema,
});

/**
 * A formula whose newest printed labels are of a version older than the one now released: the
 * labels in use may no longer match the product.
 */
export const labelsOutOfDateItemSchema = z.object({
  kind: z.literal('labels-out-of-date'),
  formulaId: z.string(),
  formulaName: z.string(),
  /** The version the newest labels were printed from. */
  printedVersion: z.number().int(),
  releasedVersion: z.number().int(),
  /** When the newest labels were printed (ISO timestamp). */
  printedAt: z.string(),
  /** How many runs of the formula are out of date. */
  runCount: z.number().int(),
});

/**
 * A lot counts as low in stock while some is left but less than this share of what was received.
 * // common practice, no published source: a tenth left is when makers usually reorder.
 */
export const ATTENTION_LOW_STOCK_FRACTION = 0.1;

/** A lot with stock left, but less than {@link ATTENTION_LOW_STOCK_FRACTION} of what was received. */
export const lotLowStockItemSchema = z.object({
  kind: z.literal('lot-low-stock'),
  lotId: z.string(),
  materialName: z.string(),
  supplierLotNumber: z.string(),
  /** What was received, in the lot's unit. */
  quantity: z.number(),
  stockOnHand: z.number(),
  unit: lotUnitSchema,
});

/** A released batch still curing or drying: its ready day is after today. */
export const batchCuringItemSchema = z.object({
  kind: z.literal('batch-curing'),
  batchId: z.string(),
  batchCode: z.string(),
  productName: z.string(),
  readyOn: z.string(),
  /** Days from today to the ready day (at least 1). */
  daysLeft: z.number().int(),
});

/** A batch started and not yet released. */
export const batchAwaitingReleaseItemSchema = z.object({
  kind: z.literal('batch-awaiting-release'),
  batchId: z.string(),
  batchCode: z.string(),
  productName: z.string(),
  madeOn: z.string(),
});

/** A recall (or a recall drill) not yet closed. */
export const recallOpenItemSchema = z.object({
  kind: z.literal('recall-open'),
  recallId: z.string(),
  reason: z.string(),
  severity: recallSeveritySchema,
  drill: z.boolean(),
  batchCodes: z.array(z.string()),
  /** When it was opened (ISO timestamp). */
  openedAt: z.string(),
});

/**
 * An open complaint marked serious, about a product sold in the US, not yet reported to FDA:
 * its 15-business-day clock is running or overdue (FD&C Act §605(b)(1)).
 */
export const complaintClockItemSchema = z.object({
  kind: z.literal('complaint-clock'),
  complaintId: z.string(),
  productName: z.string(),
  batchCode: z.string().nullable(),
  receivedOn: z.string(),
  dueOn: z.string(),
  /** Business days from today to the due day; 0 on the day, negative once past. */
  businessDaysLeft: z.number().int(),
  state: z.enum(reportingClockStates).extract(['running', 'overdue']),
});

/**
 * A formula whose released version is made for the EU or the UK and has no signed safety
 * assessment (Regulation (EC) No 1223/2009, Art. 10; UK: the UK Cosmetics Regulation, Art. 10).
 */
export const assessmentMissingItemSchema = z.object({
  kind: z.literal('assessment-missing'),
  formulaId: z.string(),
  formulaName: z.string(),
  versionNumber: z.number().int(),
  /** The version's markets that need the assessment (EU, UK). */
  markets: z.array(complianceMarketSchema),
  /** The newest version of the formula that was assessed, or null when none was. */
  lastAssessedVersion: z.number().int().nullable(),
});

/** An invitation sent and not yet accepted (owners only). */
export const invitationPendingItemSchema = z.object({
  kind: z.literal('invitation-pending'),
  invitationId: z.string(),
  email: z.string(),
  role: roleSchema,
  expiresAt: z.string(),
});

/**
 * One thing on the home page that needs someone's attention. A new kind (batches, recalls) is
 * one more member of this union, one collector in the API's attention domain and one row format
 * on the home page.
 */
export const attentionItemSchema = z.discriminatedUnion('kind', [
  complaintClockItemSchema,
  recallOpenItemSchema,
  formulaBlockedItemSchema,
  materialDocumentsItemSchema,
  lotExpiringItemSchema,
  lotLowStockItemSchema,
  batchAwaitingReleaseItemSchema,
  batchCuringItemSchema,
  labelsOutOfDateItemSchema,
  assessmentMissingItemSchema,
  invitationPendingItemSchema,
]);
export type AttentionItem = z.infer<typeof attentionItemSchema>;
export type AttentionKind = AttentionItem['kind'];
export const ATTENTION_KINDS = attentionItemSchema.options.map(
  (o) => o.shape.kind.value,
) as AttentionKind[];

/**
 * How far the workshop has got, for the getting-started steps: a step shows only while its
 * count is zero. Null for a role that cannot open those records.
 */
export const workshopProgressSchema = z.object({
  materials: z.number().int(),
  lots: z.number().int(),
  formulas: z.number().int(),
  /** Members of the workshop, the caller included. */
  members: z.number().int(),
});
export type WorkshopProgress = z.infer<typeof workshopProgressSchema>;

/** `GET /api/attention`: what needs attention in the caller's workshop, as their role may see. */
export const attentionSchema = z.object({
  /** The day (YYYY-MM-DD, UTC) the answer was worked out for. */
  asOf: z.string(),
  /** Up to {@link ATTENTION_ROWS_PER_KIND} items per kind, most pressing first. */
  items: z.array(attentionItemSchema),
  /** How many items of each kind there are in all; only the kinds the role may see. */
  counts: z.partialRecord(
    z.enum(ATTENTION_KINDS as [AttentionKind, ...AttentionKind[]]),
    z.number().int(),
  ),
  progress: workshopProgressSchema.nullable(),
});
export type Attention = z.infer<typeof attentionSchema>;
