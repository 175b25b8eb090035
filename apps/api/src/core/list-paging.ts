import { asc, desc, type AnyColumn, type SQL } from 'drizzle-orm';

/** Escapes LIKE wildcards so a user's filter matches literally, then wraps it for "contains". */
export const containsPattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/**
 * ORDER BY for a list: the chosen column in the chosen direction, then the id so that pages are
 * stable when many rows share a value.
 */
export function listOrder(column: AnyColumn | SQL, dir: 'asc' | 'desc', tieBreak: AnyColumn) {
  const order = dir === 'desc' ? desc : asc;
  return [order(column), order(tieBreak)];
}

/** LIMIT and OFFSET of a 1-based page. */
export const pageWindow = (q: { page: number; pageSize: number }) => ({
  limit: q.pageSize,
  offset: (q.page - 1) * q.pageSize,
});

/** Turns Date values into ISO strings, as the shared response schemas expect. */
export function withIsoDates<T extends object>(
  row: T,
): { [K in keyof T]: T[K] extends Date ? string : T[K] } {
  return Object.fromEntries(
    Object.entries(row).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v]),
  ) as { [K in keyof T]: T[K] extends Date ? string : T[K] };
}
