import * as z from 'zod';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import { isoDate, recordIdSchema } from '../records/record-fields';

/**
 * The audit log contract (`GET /api/audit-events`, `GET /api/audit-events/export.csv`): who
 * changed what and when, newest first. Read and exported by the owner only.
 */

/** Plain names for the subject types the features record; an unknown type shows as it is. */
export const AUDIT_SUBJECT_LABELS: Readonly<Record<string, string>> = {
  assessment: 'Safety assessment',
  assessment_share: 'Shared formula version',
  batch: 'Batch',
  complaint: 'Complaint',
  customer: 'Customer',
  delivery: 'Delivery',
  document: 'Document',
  formula: 'Formula',
  formula_version: 'Formula version',
  label_run: 'Label print run',
  label_stock: 'Label stock',
  lot: 'Lot',
  market_record: 'Notification or listing record',
  material: 'Material',
  recall: 'Recall',
  supplier: 'Supplier',
  workshop: 'Workshop',
};

/** The plain name of a subject type. */
export const auditSubjectLabel = (type: string) => AUDIT_SUBJECT_LABELS[type] ?? type;

const optionalDay = (label: string) =>
  z
    .union([z.literal(''), isoDate(label)])
    .optional()
    .transform((v) => (v ? v : undefined));

/**
 * Query of `GET /api/audit-events` and of the CSV export: newest first always; `q` matches the
 * action, the subject's id and the detail's text; `from` and `to` are UTC days, both included.
 */
export const auditListQuerySchema = listQuerySchema(['createdAt'], 'createdAt')
  .extend({
    dir: z.enum(['asc', 'desc'], { error: 'Sort direction is asc or desc' }).default('desc'),
    subjectType: z
      .string({ error: 'The subject type must be text' })
      .trim()
      .regex(/^[a-z_-]{0,40}$/, { error: 'Choose a subject type from the list' })
      .optional()
      .transform((v) => (v ? v : undefined)),
    actorId: z
      .union([z.literal(''), recordIdSchema('member')])
      .optional()
      .transform((v) => (v ? v : undefined)),
    from: optionalDay('the first day'),
    to: optionalDay('the last day'),
  })
  .superRefine((q, ctx) => {
    if (q.from && q.to && q.to < q.from) {
      ctx.addIssue({
        code: 'custom',
        path: ['to'],
        message: 'The last day cannot be before the first day',
      });
    }
  });
export type AuditListQuery = z.output<typeof auditListQuerySchema>;

/** One entry of the audit log. */
export const auditEventSchema = z.object({
  id: z.string(),
  /** When it happened (ISO timestamp). */
  at: z.string(),
  actorId: z.string().nullable(),
  /** Who did it; null once the member was removed (or for the demo seed). */
  actorName: z.string().nullable(),
  /** What was done, e.g. `complaint.created`, `archive`, `formula.released`. */
  action: z.string(),
  subjectType: z.string(),
  subjectId: z.string().nullable(),
  /** What the feature recorded about the change. */
  detail: z.record(z.string(), z.unknown()).nullable(),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;
export const auditPageSchema = pageSchema(auditEventSchema);
export type AuditPage = z.infer<typeof auditPageSchema>;

/** Columns of the audit log CSV export, in order. */
export const AUDIT_CSV_COLUMNS = [
  'when',
  'who',
  'action',
  'subjectType',
  'subjectId',
  'detail',
] as const;

/** Most rows one CSV export holds; a narrower filter exports the rest. */
export const AUDIT_CSV_MAX_ROWS = 50_000;
