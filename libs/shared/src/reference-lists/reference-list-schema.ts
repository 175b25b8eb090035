import * as z from 'zod';

/** A reference list as the "Reference lists" page shows it in its index. */
export const referenceListSummarySchema = z.object({
  key: z.string(),
  title: z.string(),
  description: z.string(),
  rowCount: z.number().int(),
  syncedAt: z.string(),
});
export type ReferenceListSummary = z.infer<typeof referenceListSummarySchema>;
export const referenceListIndexSchema = z.object({ items: z.array(referenceListSummarySchema) });

/** One row of a reference list: the common fields plus the list's own columns in `data`. */
export const referenceRowSchema = z.object({
  rowId: z.string(),
  label: z.string(),
  source: z.string(),
  status: z.enum(['C', 'C2', 'CALC', 'M']),
  effectiveFrom: z.string().nullable(),
  effectiveTo: z.string().nullable(),
  note: z.string().nullable(),
  data: z.record(z.string(), z.unknown()),
});
export type ReferenceRowView = z.infer<typeof referenceRowSchema>;

/** Query of `GET /api/reference/:key`: filter, sort and page on the server. */
export const referenceRowsQuerySchema = z.object({
  q: z.string().trim().max(100, 'Keep the filter under 100 characters.').default(''),
  status: z.enum(['C', 'C2', 'CALC', 'M']).optional(),
  sort: z.enum(['position', 'label', 'source', 'status', 'effectiveFrom']).default('position'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce
    .number()
    .int('Page must be a whole number.')
    .min(1, 'Page starts at 1.')
    .default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'At most 200 rows a page.').default(25),
});
export type ReferenceRowsQuery = z.infer<typeof referenceRowsQuerySchema>;

export const referenceRowsPageSchema = z.object({
  list: referenceListSummarySchema,
  items: z.array(referenceRowSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type ReferenceRowsPage = z.infer<typeof referenceRowsPageSchema>;
