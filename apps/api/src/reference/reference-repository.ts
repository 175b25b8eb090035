import { and, asc, desc, eq, ilike, type SQL } from 'drizzle-orm';
import type { ReferenceRowsQuery } from '@batchproof/shared';
import { totalColumn, withTotal } from '../core/list-paging';
import type { Database } from '../db/database';
import { referenceLists, referenceRows } from '../db/schema';

const listColumns = {
  key: referenceLists.key,
  title: referenceLists.title,
  description: referenceLists.description,
  rowCount: referenceLists.rowCount,
  syncedAt: referenceLists.syncedAt,
};

export function listReferenceLists(db: Database) {
  return db.select(listColumns).from(referenceLists).orderBy(asc(referenceLists.position));
}

export async function findReferenceList(db: Database, key: string) {
  const [row] = await db
    .select(listColumns)
    .from(referenceLists)
    .where(eq(referenceLists.key, key));
  return row;
}

const sortColumns = {
  position: referenceRows.position,
  label: referenceRows.label,
  source: referenceRows.source,
  status: referenceRows.status,
  effectiveFrom: referenceRows.effectiveFrom,
} as const;

/** Escapes LIKE wildcards so a filter matches literally. */
const likeLiteral = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

export async function pageReferenceRows(db: Database, key: string, q: ReferenceRowsQuery) {
  const conditions: SQL[] = [eq(referenceRows.listKey, key)];
  if (q.q) conditions.push(ilike(referenceRows.searchText, `%${likeLiteral(q.q.toLowerCase())}%`));
  if (q.status) conditions.push(eq(referenceRows.status, q.status));
  const where = and(...conditions);
  const order = q.dir === 'desc' ? desc : asc;
  const rows = await db
    .select({
      rowId: referenceRows.rowId,
      label: referenceRows.label,
      source: referenceRows.source,
      status: referenceRows.status,
      effectiveFrom: referenceRows.effectiveFrom,
      effectiveTo: referenceRows.effectiveTo,
      note: referenceRows.note,
      data: referenceRows.data,
      total: totalColumn(referenceRows, where),
    })
    .from(referenceRows)
    .where(where)
    .orderBy(order(sortColumns[q.sort]), asc(referenceRows.position))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
  return withTotal(db, rows, { table: referenceRows, where, page: q.page });
}
