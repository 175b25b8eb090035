import * as z from 'zod';
import {
  isoDate,
  optionalText,
  recordIdSchema,
  requiredText,
  storedRecordFields,
} from '../records/record-fields';
import { archivedAtField, includeArchivedSchema } from '../records/housekeeping-schema';

/** Kinds of supplier document. */
export const DOCUMENT_KINDS = [
  'sds',
  'certificate-of-analysis',
  'ifra-certificate',
  'allergen-declaration',
  'specification',
  'other',
] as const;
export const documentKindSchema = z.enum(DOCUMENT_KINDS, {
  error: `Choose a kind: ${DOCUMENT_KINDS.join(', ')}`,
});
export type DocumentKind = z.infer<typeof documentKindSchema>;

/** File types a supplier document may be, decided from the file's first bytes. */
export const DOCUMENT_MIME_TYPES = ['application/pdf', 'image/png', 'image/jpeg'] as const;
/** Largest file accepted, bytes (10 MB). */
export const DOCUMENT_MAX_BYTES = 10 * 1024 * 1024;
/** A document older than this many days counts as out of date. */
export const DOCUMENT_STALE_DAYS = 365;

/**
 * The form fields sent with an uploaded file (multipart). A document belongs to exactly one
 * material or one lot. `replacesId` names an older document of the same material or lot that
 * this one replaces: the old one stays on file as history, marked superseded.
 */
export const documentUploadSchema = z
  .object({
    kind: documentKindSchema,
    title: requiredText('Title'),
    issuedOn: isoDate('the issue date'),
    version: optionalText('Version', 50),
    materialId: recordIdSchema('material')
      .optional()
      .or(z.literal('').transform(() => undefined)),
    lotId: recordIdSchema('lot')
      .optional()
      .or(z.literal('').transform(() => undefined)),
    replacesId: recordIdSchema('document to replace')
      .optional()
      .or(z.literal('').transform(() => undefined)),
  })
  .superRefine((d, ctx) => {
    if (!d.materialId === !d.lotId) {
      ctx.addIssue({
        code: 'custom',
        path: ['materialId'],
        message: 'Attach the document to one material or one lot',
      });
    }
  });
export type DocumentUpload = z.input<typeof documentUploadSchema>;

/** A document's metadata as the API returns it (the file itself comes from `/content`). */
export const documentSchema = z.object({
  ...storedRecordFields,
  kind: documentKindSchema,
  title: z.string(),
  issuedOn: z.string(),
  version: z.string().nullable(),
  materialId: z.string().nullable(),
  lotId: z.string().nullable(),
  filename: z.string(),
  mimeType: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string(),
  /** The older document this one replaced, if any. */
  replacesId: z.string().nullable().optional(),
  /** The newer document that replaced this one: it is kept as history, no longer current. */
  supersededById: z.string().nullable().optional(),
  archivedAt: archivedAtField,
});
export type SupplierDocument = z.infer<typeof documentSchema>;
export const documentListSchema = z.object({ items: z.array(documentSchema) });

/**
 * Query of `GET /api/documents`: the documents of one material or one lot, superseded ones
 * included (as history); archived ones only with `includeArchived=true`.
 */
export const documentListQuerySchema = z
  .object({
    materialId: recordIdSchema('material').optional(),
    lotId: recordIdSchema('lot').optional(),
    includeArchived: includeArchivedSchema,
  })
  .superRefine((d, ctx) => {
    if (!d.materialId === !d.lotId) {
      ctx.addIssue({
        code: 'custom',
        path: ['materialId'],
        message: 'Ask for the documents of one material or one lot',
      });
    }
  });

/**
 * Where an expected document stands: none on file, older than a year, dated after today (never
 * current), or current.
 */
export const documentStatusStateSchema = z.enum([
  'missing',
  'out-of-date',
  'future-dated',
  'current',
]);
export type DocumentStatusState = z.infer<typeof documentStatusStateSchema>;

/** Whether an expected document is on file and current. */
export const documentStatusEntrySchema = z.object({
  kind: documentKindSchema,
  state: documentStatusStateSchema,
  /** The newest document of this kind, when there is one. */
  latest: documentSchema.nullable(),
  message: z.string(),
});
/** Which of a material's expected documents are missing, older than a year or dated ahead. */
export const documentStatusSchema = z.object({
  materialId: z.string(),
  asOf: z.string(),
  entries: z.array(documentStatusEntrySchema),
  /** Whether every expected document is on file and current. */
  complete: z.boolean(),
});
export type DocumentStatus = z.infer<typeof documentStatusSchema>;

/** Kinds every material of the category should have on file. */
export function expectedDocumentKinds(category: string): DocumentKind[] {
  return category === 'fragrance' || category === 'essential-oil'
    ? ['sds', 'ifra-certificate', 'allergen-declaration']
    : ['sds'];
}
