import { and, asc, eq } from 'drizzle-orm';
import type { LabelStock } from '@batchproof/shared';
import type { Database } from '../db/database';
import { unlessArchived } from '../housekeeping/archiving';
import { labelStocks, type StoredLabelStockGeometry } from '../db/schema';

/** A label stock row as stored. */
export type LabelStockRow = typeof labelStocks.$inferSelect;

/** The stored columns of a stock: its name apart, the rest of the geometry as jsonb. */
function columnsOf(stock: LabelStock) {
  const { name, ...geometry } = stock;
  return { name, geometry: geometry as StoredLabelStockGeometry };
}

/** The workshop's own stocks by name (archived ones only when asked for). */
export async function listLabelStocks(db: Database, workshopId: string, includeArchived: boolean) {
  return db
    .select()
    .from(labelStocks)
    .where(
      and(
        eq(labelStocks.workshopId, workshopId),
        unlessArchived(labelStocks.archivedAt, includeArchived),
      ),
    )
    .orderBy(asc(labelStocks.name), asc(labelStocks.id));
}

export async function findLabelStock(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select()
    .from(labelStocks)
    .where(and(eq(labelStocks.workshopId, workshopId), eq(labelStocks.id, id)));
  return row;
}

export async function insertLabelStock(db: Database, workshopId: string, stock: LabelStock) {
  const [row] = await db
    .insert(labelStocks)
    .values({ ...columnsOf(stock), workshopId })
    .returning({ id: labelStocks.id });
  return row!.id;
}

export async function updateLabelStock(
  db: Database,
  workshopId: string,
  id: string,
  stock: LabelStock,
) {
  const [row] = await db
    .update(labelStocks)
    .set(columnsOf(stock))
    .where(and(eq(labelStocks.workshopId, workshopId), eq(labelStocks.id, id)))
    .returning({ id: labelStocks.id });
  return row?.id;
}

export async function deleteLabelStock(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .delete(labelStocks)
    .where(and(eq(labelStocks.workshopId, workshopId), eq(labelStocks.id, id)))
    .returning({ id: labelStocks.id });
  return row?.id;
}
