import { asc, count, desc, sql, type AnyColumn, type SQL, type Table } from 'drizzle-orm';
import type { Database } from '../db/database';

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

/**
 * How many rows of `table` match `where`, as one more column of the page query, so that a list
 * costs one round trip and its total and its rows come from one snapshot. The subquery names
 * only `table`, so it is uncorrelated: PostgreSQL runs it once per statement (an InitPlan) and
 * the page itself still stops at its LIMIT. A window count (`count(*) over ()`) would push every
 * matching row through the joins and the sort instead: 212 ms against 19 ms for the first page
 * of 100,000 lots (apps/api/bench/list-bench.ts).
 */
export const totalColumn = (table: Table, where: SQL | undefined) =>
  sql<number>`(select count(*) from ${table} where ${where ?? sql`true`})`.mapWith(Number);

/**
 * Splits the `total` column off a page's rows. A page past the end has no row to carry it, so
 * only then is the total counted on its own.
 */
export async function withTotal<R extends { total: number }>(
  db: Database,
  rows: R[],
  of: { table: Table; where: SQL | undefined; page: number },
): Promise<{ items: Omit<R, 'total'>[]; total: number }> {
  const items = rows.map(({ total: _total, ...row }) => row);
  if (rows.length > 0) return { items, total: rows[0]!.total };
  if (of.page === 1) return { items, total: 0 };
  const [row] = await db.select({ n: count() }).from(of.table).where(of.where);
  return { items, total: row?.n ?? 0 };
}

/** A row's type with its Date fields as ISO strings (a nullable date stays nullable). */
export type WithIsoDates<T> = {
  [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K];
};

/** Turns Date values into ISO strings, as the shared response schemas expect. */
export function withIsoDates<T extends object>(row: T): WithIsoDates<T> {
  return Object.fromEntries(
    Object.entries(row).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v]),
  ) as WithIsoDates<T>;
}
