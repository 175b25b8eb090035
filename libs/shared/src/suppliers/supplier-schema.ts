import * as z from 'zod';
import { listQuerySchema, pageSchema } from '../lists/list-query-schema';
import {
  archivedAtField,
  includeArchivedSchema,
  warningsField,
} from '../records/housekeeping-schema';
import {
  optionalEmail,
  optionalText,
  requiredText,
  storedRecordFields,
  textField,
} from '../records/record-fields';

/** What the owner or formulator enters for a supplier (create and full update). */
export const supplierCreateSchema = z.object({
  name: requiredText('Supplier name'),
  contact: optionalText('Contact person'),
  email: optionalEmail(),
  website: textField('Website')
    .pipe(
      z.union([
        z.literal(''),
        z.url({ protocol: /^https?$/, error: 'Enter a web address starting with https://' }),
      ]),
    )
    .nullish()
    .transform((v) => (v ? v : null)),
  notes: optionalText('Notes', 2000),
});
/** Supplier input as a form sends it. */
export type SupplierCreate = z.input<typeof supplierCreateSchema>;
/** Full replacement of a supplier's fields (PUT). */
export const supplierUpdateSchema = supplierCreateSchema;
export type SupplierUpdate = z.input<typeof supplierUpdateSchema>;

/** A supplier as the API returns it. */
export const supplierSchema = z.object({
  ...storedRecordFields,
  name: z.string(),
  contact: z.string().nullable(),
  email: z.string().nullable(),
  website: z.string().nullable(),
  notes: z.string().nullable(),
  /** How many materials name this supplier. */
  materialCount: z.number().int(),
  archivedAt: archivedAtField,
  /** On a create or update: another supplier has the same name (the save went through). */
  warnings: warningsField,
});
export type Supplier = z.infer<typeof supplierSchema>;

/**
 * Query of `GET /api/suppliers`: `q` matches name, contact and e-mail; archived suppliers only
 * with `includeArchived=true`.
 */
export const supplierListQuerySchema = listQuerySchema(
  ['name', 'createdAt', 'updatedAt'],
  'name',
).extend({ includeArchived: includeArchivedSchema });
export type SupplierListQuery = z.output<typeof supplierListQuerySchema>;
export const supplierPageSchema = pageSchema(supplierSchema);
export type SupplierPage = z.infer<typeof supplierPageSchema>;
