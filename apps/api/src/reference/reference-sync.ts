import { referenceLists as shippedLists, type ReferenceRow } from '@batchproof/shared';
import type { Database } from '../db/database';
import { referenceLists, referenceRows } from '../db/schema';

/** The name a row is listed under, whatever kind of list it belongs to. */
function labelOf(row: ReferenceRow): string {
  const r = row as unknown as Record<string, unknown>;
  for (const key of ['labelName', 'name', 'euName', 'title', 'text']) {
    if (typeof r[key] === 'string' && r[key]) return r[key] as string;
  }
  return row.id;
}

/** Every string and number inside a value, lower-cased, for the list filter. */
function searchTextOf(value: unknown): string {
  const parts: string[] = [];
  const walk = (v: unknown) => {
    if (typeof v === 'string' || typeof v === 'number') parts.push(String(v));
    else if (Array.isArray(v)) v.forEach(walk);
    else if (v && typeof v === 'object') Object.values(v).forEach(walk);
  };
  walk(value);
  return parts.join(' ').toLowerCase();
}

/**
 * Replaces the stored reference lists with the ones shipped in `@batchproof/shared`, in one
 * transaction, so the tables always match the rules the engine runs.
 */
export async function syncReferenceData(db: Database): Promise<number> {
  let total = 0;
  await db.transaction(async (tx) => {
    await tx.delete(referenceRows);
    await tx.delete(referenceLists);
    for (const [position, list] of shippedLists.entries()) {
      await tx.insert(referenceLists).values({
        key: list.key,
        title: list.title,
        description: list.description,
        position,
        rowCount: list.rows.length,
      });
      if (list.rows.length === 0) continue;
      await tx.insert(referenceRows).values(
        list.rows.map((row, i) => ({
          listKey: list.key,
          rowId: row.id,
          position: i,
          label: labelOf(row),
          searchText: searchTextOf(row),
          source: row.source,
          status: row.status,
          effectiveFrom: row.effectiveFrom ?? null,
          effectiveTo: row.effectiveTo ?? null,
          note: row.note ?? null,
          data: row as unknown as Record<string, unknown>,
        })),
      );
      total += list.rows.length;
    }
  });
  return total;
}
