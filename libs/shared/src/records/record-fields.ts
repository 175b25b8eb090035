import * as z from 'zod';

/** A required one-line text field, trimmed, with a plain message naming the field. */
export const requiredText = (label: string, max = 200) =>
  z
    .string({ error: `${label} is required` })
    .trim()
    .min(1, { error: `${label} is required` })
    .max(max, { error: `${label} is too long (${max} characters at most)` });

/**
 * An optional text field: empty, null or missing all mean "not given" and come out as null,
 * so a form can clear a field by sending an empty string.
 */
export const optionalText = (label: string, max = 200) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .max(max, { error: `${label} is too long (${max} characters at most)` })
    .nullish()
    .transform((v) => (v ? v : null));

/** A calendar date as YYYY-MM-DD. */
export const isoDate = (label: string) => z.iso.date({ error: `Enter ${label} as YYYY-MM-DD` });

/** An optional calendar date; empty means none. */
export const optionalIsoDate = (label: string) =>
  z
    .union([z.literal(''), isoDate(label)])
    .nullish()
    .transform((v) => (v ? v : null));

/** A record id in a path or body. */
export const recordIdSchema = (label: string) => z.uuid({ error: `Choose a valid ${label}` });

/** Fields every stored record sends back. */
export const storedRecordFields = {
  id: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
};
