import { and, eq, sql } from 'drizzle-orm';
import type { Database } from '../db/database';
import { batchAmendments, deliveryLines, lotConsumptions } from '../db/schema';

/** Amendments of released batches and the stock they move, in PostgreSQL. */

/** Records amendments of one batch (one transaction, one reason). */
export async function insertAmendments(
  db: Database,
  rows: (typeof batchAmendments.$inferInsert)[],
) {
  if (rows.length > 0) await db.insert(batchAmendments).values(rows);
}

/**
 * What one line of a batch has taken from each lot so far, net of earlier amendments (its batch
 * and amendment movements summed per lot), in each lot's unit and in grams. Lots with nothing
 * left taken are left out.
 */
export async function lineConsumption(
  db: Database,
  workshopId: string,
  batchId: string,
  lineNumber: number,
) {
  const rows = await db
    .select({
      lotId: lotConsumptions.lotId,
      quantity: sql<number>`sum(${lotConsumptions.quantity})::float8`.mapWith(Number),
      grams: sql<number>`coalesce(sum(${lotConsumptions.grams}), 0)::float8`.mapWith(Number),
    })
    .from(lotConsumptions)
    .where(
      and(
        eq(lotConsumptions.workshopId, workshopId),
        eq(lotConsumptions.batchId, batchId),
        eq(lotConsumptions.lineNumber, lineNumber),
      ),
    )
    .groupBy(lotConsumptions.lotId);
  return rows.filter((r) => Math.abs(r.quantity) > 0 || Math.abs(r.grams) > 0);
}

/** Units of a finished lot (a released batch) on deliveries so far. */
export async function unitsDelivered(db: Database, workshopId: string, batchId: string) {
  const [row] = await db
    .select({ n: sql<number>`coalesce(sum(${deliveryLines.units}), 0)::int`.mapWith(Number) })
    .from(deliveryLines)
    .where(and(eq(deliveryLines.workshopId, workshopId), eq(deliveryLines.batchId, batchId)));
  return row?.n ?? 0;
}
