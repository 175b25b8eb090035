import * as z from 'zod';
import { textField } from '../records/record-fields';

/** Largest page a list route serves; bigger pages are refused rather than silently cut. */
export const MAX_PAGE_SIZE = 100;

/** Sort direction of a list query. */
export const sortDirectionSchema = z
  .enum(['asc', 'desc'], { error: 'Sort direction is asc or desc' })
  .default('asc');

/**
 * The query every list route accepts: a text filter `q`, a sort key from `sortKeys`, a direction
 * and a 1-based page. Values arrive as query-string text, hence the coercion.
 */
export function listQuerySchema<const K extends readonly [string, ...string[]]>(
  sortKeys: K,
  defaultSort: K[number],
) {
  return z.object({
    q: textField('The filter')
      .trim()
      .max(100, { error: 'Keep the filter under 100 characters' })
      .default(''),
    sort: z
      .enum(sortKeys as unknown as { [P in K[number]]: P }, {
        error: `Sort by one of: ${sortKeys.join(', ')}`,
      })
      .default(defaultSort as never),
    dir: sortDirectionSchema,
    page: z.coerce
      .number({ error: 'Page must be a number' })
      .int({ error: 'Page must be a whole number' })
      .min(1, { error: 'Pages start at 1' })
      .default(1),
    pageSize: z.coerce
      .number({ error: 'Page size must be a number' })
      .int({ error: 'Page size must be a whole number' })
      .min(1, { error: 'Show at least 1 row a page' })
      .max(MAX_PAGE_SIZE, { error: `Show at most ${MAX_PAGE_SIZE} rows a page` })
      .default(25),
  });
}

/** One page of a list: the rows, how many match in all, and which page this is. */
export function pageSchema<T extends z.ZodType>(item: T) {
  return z.object({
    items: z.array(item),
    total: z.number().int(),
    page: z.number().int(),
    pageSize: z.number().int(),
  });
}

/** A page of rows of type `T`. */
export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}
