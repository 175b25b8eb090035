import { and, desc, eq, type SQL } from 'drizzle-orm';
import type { StockMovement } from '@batchproof/shared';
import type { Database } from '../db/database';
import { batches, lotConsumptions, lots, users } from '../db/schema';

/** A lot's stock movements in PostgreSQL: the rows of `lot_consumptions`, signed (positive = out). */

/** The movements of one lot of the workshop (or one movement of it), newest first. */
export async function findMovements(
  db: Database,
  workshopId: string,
  lotId: string,
  movementId?: string,
): Promise<StockMovement[]> {
  const conditions: (SQL | undefined)[] = [
    eq(lotConsumptions.workshopId, workshopId),
    eq(lotConsumptions.lotId, lotId),
    movementId ? eq(lotConsumptions.id, movementId) : undefined,
  ];
  const rows = await db
    .select({
      id: lotConsumptions.id,
      lotId: lotConsumptions.lotId,
      kind: lotConsumptions.kind,
      quantity: lotConsumptions.quantity,
      unit: lots.unit,
      grams: lotConsumptions.grams,
      batchId: lotConsumptions.batchId,
      batchCode: batches.batchCode,
      lineNumber: lotConsumptions.lineNumber,
      reason: lotConsumptions.reason,
      note: lotConsumptions.note,
      createdAt: lotConsumptions.createdAt,
      createdByName: users.name,
    })
    .from(lotConsumptions)
    .innerJoin(lots, eq(lots.id, lotConsumptions.lotId))
    .leftJoin(batches, eq(batches.id, lotConsumptions.batchId))
    .leftJoin(users, eq(users.id, lotConsumptions.createdBy))
    .where(and(...conditions))
    .orderBy(desc(lotConsumptions.createdAt), desc(lotConsumptions.id));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** Records one adjustment of a lot; answers its id. */
export async function insertAdjustment(
  db: Database,
  values: Omit<typeof lotConsumptions.$inferInsert, 'kind'>,
) {
  const [row] = await db
    .insert(lotConsumptions)
    .values({ ...values, kind: 'adjustment' })
    .returning({ id: lotConsumptions.id });
  return row!.id;
}
