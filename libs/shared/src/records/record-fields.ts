import * as z from 'zod';

/** A UTF-16 surrogate without its partner: not a Unicode character at all (jsonb refuses it). */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/**
 * Whether a string can be stored as text: no NUL (PostgreSQL's text and jsonb types refuse
 * U+0000) and no unpaired surrogate.
 */
export const isStorableText = (value: string) =>
  !value.includes('\u0000') && !LONE_SURROGATE.test(value);

/**
 * The one text rule every text field of the contract builds on (body fields, query filters, record
 * keys, multipart fields): a string that PostgreSQL can store. Add length and trimming on top.
 */
export const textField = (label: string, typeError = `${label} must be text`) =>
  z.string({ error: typeError }).refine(isStorableText, {
    error: `${label} contains a character that cannot be stored (a NUL or a broken Unicode character)`,
  });

/** A required one-line text field, trimmed, with a plain message naming the field. */
export const requiredText = (label: string, max = 200) =>
  textField(label, `${label} is required`)
    .trim()
    .min(1, { error: `${label} is required` })
    .max(max, { error: `${label} is too long (${max} characters at most)` });

/**
 * An optional text field: empty, null or missing all mean "not given" and come out as null,
 * so a form can clear a field by sending an empty string.
 */
export const optionalText = (label: string, max = 200) =>
  textField(label)
    .trim()
    .max(max, { error: `${label} is too long (${max} characters at most)` })
    .nullish()
    .transform((v) => (v ? v : null));

/** An optional e-mail address, kept in lower case; empty, null or missing come out as null. */
export const optionalEmail = (label = 'E-mail') =>
  textField(label)
    .pipe(
      z.union([
        z.literal(''),
        z.email({ error: 'Enter an e-mail address such as orders@example.com' }),
      ]),
    )
    .nullish()
    .transform((v) => (v ? v.toLowerCase() : null));

/**
 * The one date rule: a calendar date as YYYY-MM-DD in year 1 to 9999. The format already stops at
 * 9999; year 0000 passes the format but is not a year of the Gregorian calendar, and PostgreSQL's
 * `date` refuses it.
 */
export const isoDate = (label: string) =>
  z.iso
    .date({
      // A missing date is asked for plainly (a date picker sends none for text it cannot read);
      // only text in another form is told the wire format.
      error: (issue) =>
        issue.input === undefined || issue.input === null
          ? `Enter ${label}`
          : `Enter ${label} as YYYY-MM-DD`,
    })
    .refine((v) => !v.startsWith('0000-'), { error: `Enter ${label} in year 1 or later` });

/** An optional calendar date; empty means none. */
export const optionalIsoDate = (label: string) =>
  z
    .union([z.literal(''), isoDate(label)])
    .nullish()
    .transform((v) => (v ? v : null));

/** How a quantity is recorded: its decimals, its largest value and whether 0 is allowed. */
export interface QuantityColumn {
  /** Decimals kept when stored (the `numeric` column's scale). */
  decimals: number;
  /** Largest value accepted: far above any real use, well inside the column's precision. */
  max: number;
  /** Whether 0 is a valid value (a line of 0 g) or the quantity must be more than 0. */
  zero: 'allowed' | 'refused';
}

/**
 * The one quantity rule: a finite number from 0 to `max` that keeps its meaning once rounded to
 * the column's decimals. A positive amount that would round to 0 is refused, so a stored lot never
 * holds 0 and a line entered as a trace never silently becomes nothing.
 */
export const quantity = (label: string, column: QuantityColumn) => {
  const smallest = Number(`1e-${column.decimals}`);
  return z
    .number({ error: `${label} must be a number` })
    .min(0, { error: `${label} cannot be negative` })
    .max(column.max, {
      error: `${label} is too large (${column.max.toLocaleString('en')} at most)`,
    })
    .refine((v) => v === 0 || v >= smallest, {
      error: `${label} is too small to record (${smallest.toFixed(column.decimals)} at least)`,
    })
    .refine((v) => column.zero === 'allowed' || v > 0, {
      error: `${label} must be more than 0`,
    });
};

/** Largest value of a PostgreSQL `integer` column. */
export const MAX_STORED_INTEGER = 2_147_483_647;

/**
 * The one whole-number rule for numbers that reach an `integer` column or a query on one (version
 * numbers): an integer from `min` to `max`, never beyond the column's range. `fromText` reads
 * query-string text as a number.
 */
export const wholeNumber = (
  label: string,
  { min = 1, max = MAX_STORED_INTEGER, fromText = false } = {},
) => {
  const top = Math.min(max, MAX_STORED_INTEGER);
  const number = fromText ? z.coerce.number : z.number;
  return number({ error: `Enter ${label} as a whole number` })
    .int({ error: `Enter ${label} as a whole number` })
    .min(min, { error: `${label} must be at least ${min}` })
    .max(top, { error: `${label} must be at most ${top.toLocaleString('en')}` });
};

/** A record id in a path or body. */
export const recordIdSchema = (label: string) => z.uuid({ error: `Choose a valid ${label}` });

/** Fields every stored record sends back. */
export const storedRecordFields = {
  id: z.string(),
  createdAt: z.string(),
  updatedAt: z.string(),
};
