import * as z from 'zod';

/**
 * `includeArchived` of a list query: archived records stay out of lists and pickers unless the
 * query asks for them. Query-string text, so `true`/`false` (also `1`/`0`, `yes`/`no`).
 */
export const includeArchivedSchema = z
  .stringbool({ error: 'includeArchived is true or false' })
  .default(false);

/**
 * When the record was archived; null while it is in use. Optional in the type so that a client
 * built before archiving still parses, but the API always sends it.
 */
export const archivedAtField = z.string().nullable().optional();

/**
 * Something the user should know about a save that still went through (a second supplier with the
 * same name, a lot number already received for the material). Warnings never block: the record
 * is saved, and the form shows each beside its field.
 */
export const fieldWarningSchema = z.object({
  /** The field the warning is about, as the form names it (`name`, `supplierLotNumber`). */
  field: z.string(),
  message: z.string(),
});
export type FieldWarning = z.infer<typeof fieldWarningSchema>;

/** `warnings` of a save's answer: empty (or absent on reads) when there is nothing to say. */
export const warningsField = z.array(fieldWarningSchema).optional();

/**
 * Trims, folds case and collapses runs of white space, so "Alder  Chemicals " and
 * "alder chemicals" count as the same name when looking for duplicates.
 */
export const duplicateKey = (text: string) => text.trim().replace(/\s+/g, ' ').toLowerCase();
