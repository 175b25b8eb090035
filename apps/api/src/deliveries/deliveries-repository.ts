import { and, eq, ilike, inArray, ne, or, sql, type SQL } from 'drizzle-orm';
import type { DeliveryListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import { deleteOwnRow, updateOwnRow } from '../core/workshop-rows';
import type { Database } from '../db/database';
import {
  batches,
  customers,
  deliveries,
  deliveryLines,
  formulas,
  productIdentities,
} from '../db/schema';

/** A delivery's own fields as stored, with its lines' finished lots resolved to batch ids. */
export interface DeliveryValues {
  customerId: string;
  deliveredOn: string;
  reference: string | null;
  notes: string | null;
  lines: { batchId: string; units: number }[];
}

// The outer ids are spelled out so a subquery can never bind them to its own table's id.
const totalUnits = sql<number>`(select coalesce(sum(dl.units), 0)::int from ${deliveryLines} dl where dl.delivery_id = ${sql.raw('"deliveries"."id"')})`;
const columns = {
  id: deliveries.id,
  customerId: deliveries.customerId,
  customerName: customers.name,
  deliveredOn: deliveries.deliveredOn,
  reference: deliveries.reference,
  notes: deliveries.notes,
  totalUnits: totalUnits.mapWith(Number),
  createdAt: deliveries.createdAt,
  updatedAt: deliveries.updatedAt,
};
const sortColumns = {
  deliveredOn: deliveries.deliveredOn,
  customerName: customers.name,
  reference: deliveries.reference,
  createdAt: deliveries.createdAt,
} as const;

/** Deliveries with a line of a finished lot whose code matches `condition`. */
const withLotCode = (condition: SQL) =>
  sql`exists (select 1 from ${deliveryLines} dl join ${batches} b on b.id = dl.batch_id and b.workshop_id = dl.workshop_id
    where dl.delivery_id = ${sql.raw('"deliveries"."id"')} and ${condition})`;

/** One page of the workshop's deliveries (without their lines), filtered and sorted in SQL. */
export async function pageDeliveries(db: Database, workshopId: string, q: DeliveryListQuery) {
  const conditions: (SQL | undefined)[] = [eq(deliveries.workshopId, workshopId)];
  if (q.q) {
    const p = containsPattern(q.q);
    conditions.push(
      or(
        ilike(deliveries.reference, p),
        sql`${sql.raw('"deliveries"."customer_id"')} in (select c.id from ${customers} c where c.workshop_id = ${workshopId} and c.name ilike ${p})`,
        withLotCode(sql`b.batch_code ilike ${p}`),
      ),
    );
  }
  if (q.customerId) conditions.push(eq(deliveries.customerId, q.customerId));
  if (q.lotCode) conditions.push(withLotCode(sql`b.batch_code = ${q.lotCode}`));
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({ ...columns, total: totalColumn(deliveries, where) })
    .from(deliveries)
    .innerJoin(customers, eq(customers.id, deliveries.customerId))
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, deliveries.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: deliveries, where, page: q.page });
}

export async function findDelivery(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(columns)
    .from(deliveries)
    .innerJoin(customers, eq(customers.id, deliveries.customerId))
    .where(and(eq(deliveries.workshopId, workshopId), eq(deliveries.id, id)));
  return row;
}

/** The product a finished lot is a batch of: its product identity's name, else the formula's. */
const productName = sql<string | null>`coalesce(
  (select ${productIdentities.identity}->>'productName' from ${productIdentities}
    where ${productIdentities.workshopId} = ${batches.workshopId} and ${productIdentities.formulaId} = ${batches.formulaId}),
  (select ${formulas.name} from ${formulas} where ${formulas.workshopId} = ${batches.workshopId} and ${formulas.id} = ${batches.formulaId}))`;

/** The lines of these deliveries, each delivery's in its order. */
export async function linesOf(db: Database, workshopId: string, deliveryIds: string[]) {
  if (deliveryIds.length === 0) return [];
  return db
    .select({
      deliveryId: deliveryLines.deliveryId,
      finishedLotId: deliveryLines.batchId,
      lotCode: batches.batchCode,
      productName,
      units: deliveryLines.units,
    })
    .from(deliveryLines)
    .innerJoin(
      batches,
      and(eq(batches.workshopId, deliveryLines.workshopId), eq(batches.id, deliveryLines.batchId)),
    )
    .where(
      and(eq(deliveryLines.workshopId, workshopId), inArray(deliveryLines.deliveryId, deliveryIds)),
    )
    .orderBy(deliveryLines.deliveryId, deliveryLines.position);
}

/**
 * The workshop's finished lots (released batches) with these codes, locked until the end of the
 * transaction so that two deliveries of the same lot are checked one after the other against its
 * units made. Lot codes are compared as written (GS1 lot codes are case-sensitive).
 */
export async function lockReleasedLots(db: Database, workshopId: string, codes: string[]) {
  if (codes.length === 0) return [];
  return db
    .select({ id: batches.id, batchCode: batches.batchCode, unitsMade: batches.unitsMade })
    .from(batches)
    .where(
      and(
        eq(batches.workshopId, workshopId),
        eq(batches.state, 'released'),
        inArray(batches.batchCode, codes),
      ),
    )
    .orderBy(batches.id)
    .for('no key update');
}

/** Units of each of these finished lots already on deliveries (other than `exceptDeliveryId`). */
export async function deliveredUnits(
  db: Database,
  workshopId: string,
  batchIds: string[],
  exceptDeliveryId?: string,
) {
  if (batchIds.length === 0) return new Map<string, number>();
  const rows = await db
    .select({
      batchId: deliveryLines.batchId,
      units: sql<number>`sum(${deliveryLines.units})::int`.mapWith(Number),
    })
    .from(deliveryLines)
    .where(
      and(
        eq(deliveryLines.workshopId, workshopId),
        inArray(deliveryLines.batchId, batchIds),
        exceptDeliveryId ? ne(deliveryLines.deliveryId, exceptDeliveryId) : undefined,
      ),
    )
    .groupBy(deliveryLines.batchId);
  return new Map(rows.map((r) => [r.batchId, r.units]));
}

/** Whether the customer exists in the workshop. */
export async function customerExists(db: Database, workshopId: string, customerId: string) {
  const [row] = await db
    .select({ id: customers.id })
    .from(customers)
    .where(and(eq(customers.workshopId, workshopId), eq(customers.id, customerId)));
  return row !== undefined;
}

async function insertLines(
  db: Database,
  workshopId: string,
  deliveryId: string,
  lines: DeliveryValues['lines'],
) {
  await db.insert(deliveryLines).values(
    lines.map((line, index) => ({
      workshopId,
      deliveryId,
      position: index + 1,
      batchId: line.batchId,
      units: line.units,
    })),
  );
}

export async function insertDelivery(
  db: Database,
  workshopId: string,
  createdBy: string,
  { lines, ...values }: DeliveryValues,
) {
  const [row] = await db
    .insert(deliveries)
    .values({ ...values, workshopId, createdBy })
    .returning({ id: deliveries.id });
  await insertLines(db, workshopId, row!.id, lines);
  return row!.id;
}

/** Replaces a delivery's fields and lines; undefined when there is no such delivery. */
export async function updateDelivery(
  db: Database,
  workshopId: string,
  id: string,
  { lines, ...values }: DeliveryValues,
) {
  if (!(await updateOwnRow(db, deliveries, workshopId, id, values))) return undefined;
  await db
    .delete(deliveryLines)
    .where(and(eq(deliveryLines.workshopId, workshopId), eq(deliveryLines.deliveryId, id)));
  await insertLines(db, workshopId, id, lines);
  return id;
}

/** Deletes a delivery with its lines (they cascade). */
export const deleteDelivery = (db: Database, workshopId: string, id: string) =>
  deleteOwnRow(db, deliveries, workshopId, id);
