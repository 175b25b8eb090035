import { sql, type AnyColumn } from 'drizzle-orm';

/**
 * A text column or value as duplicates are compared in SQL: trimmed, lower-cased, with each run
 * of white space replaced by `spaces` (one space for names, nothing for lot numbers). Mirrors
 * `duplicateKey` in `libs/shared`.
 */
export const foldedText = (value: AnyColumn | string, spaces: ' ' | '') =>
  sql`lower(regexp_replace(btrim(${value}), '[[:space:]]+', ${spaces}, 'g'))`;
