import { and, asc, eq, lte, ne, sql, type SQL } from 'drizzle-orm';
import type { LotFields, LotListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import type { Database } from '../db/database';
import { foldedText } from '../housekeeping/folded-text';
import { lotConsumptions, lots, materials, suppliers } from '../db/schema';

/**
 * A lot's stock on hand: received minus what batches consumed, for a query over `lots`.
 * Computed per returned row only: PostgreSQL evaluates select-list subqueries after LIMIT. The
 * outer id is spelled out so the subquery can never bind it to its own table's id.
 */
export const stockOnHand = sql<number>`(${lots.quantity} - coalesce((select sum(${lotConsumptions.quantity}) from ${lotConsumptions} where ${lotConsumptions.lotId} = ${sql.raw('"lots"."id"')}), 0))::float8`;

// The material's supplier, looked up per returned row like stock on hand (no join to page over).
const supplierName = sql<
  string | null
>`(select ${suppliers.name} from ${suppliers} where ${suppliers.id} = ${sql.raw('"materials"."supplier_id"')})`;

const columns = {
  id: lots.id,
  materialId: lots.materialId,
  materialName: lots.materialName,
  supplierName,
  supplierLotNumber: lots.supplierLotNumber,
  quantity: lots.quantity,
  unit: lots.unit,
  receivedOn: lots.receivedOn,
  expiresOn: lots.expiresOn,
  unitCost: lots.unitCost,
  notes: lots.notes,
  stockOnHand: stockOnHand.mapWith(Number),
  createdAt: lots.createdAt,
  updatedAt: lots.updatedAt,
};
const sortColumns = {
  receivedOn: lots.receivedOn,
  expiresOn: lots.expiresOn,
  supplierLotNumber: lots.supplierLotNumber,
  // The lot's copy of the name, which an index serves (a sort on the joined table reads every lot).
  materialName: lots.materialName,
  quantity: lots.quantity,
  createdAt: lots.createdAt,
} as const;

/** One page of the workshop's lots with stock on hand, filtered, sorted and paged in SQL. */
export async function pageLots(db: Database, workshopId: string, q: LotListQuery) {
  const conditions: (SQL | undefined)[] = [eq(lots.workshopId, workshopId)];
  if (q.q) {
    const p = containsPattern(q.q);
    // A UNION of two index-backed lookups (lot number via its trigram index; material name via
    // materials' trigram index, then lots by material) instead of an OR, which PostgreSQL can only
    // answer by scanning every lot of the workshop.
    conditions.push(
      sql`${sql.raw('"lots"."id"')} in (
        select l.id from ${lots} l where l.workshop_id = ${workshopId} and l.supplier_lot_number ilike ${p}
        union
        select l.id from ${lots} l join ${materials} m on m.id = l.material_id
        where l.workshop_id = ${workshopId} and m.workshop_id = ${workshopId} and m.trade_name ilike ${p})`,
    );
  }
  if (q.materialId) conditions.push(eq(lots.materialId, q.materialId));
  if (q.expiresBefore) conditions.push(lte(lots.expiresOn, q.expiresBefore));
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    // Every lot has its material (FK, not null), so the total needs no join.
    .select({ ...columns, total: totalColumn(lots, where) })
    .from(lots)
    .innerJoin(materials, eq(materials.id, lots.materialId))
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, lots.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: lots, where, page: q.page });
}

export async function findLot(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(columns)
    .from(lots)
    .innerJoin(materials, eq(materials.id, lots.materialId))
    .where(and(eq(lots.workshopId, workshopId), eq(lots.id, id)));
  return row;
}

export async function insertLot(db: Database, workshopId: string, values: LotFields) {
  const [row] = await db
    .insert(lots)
    .values({ ...values, workshopId })
    .returning({ id: lots.id });
  return row!.id;
}

export async function updateLot(db: Database, workshopId: string, id: string, values: LotFields) {
  const [row] = await db
    .update(lots)
    .set(values)
    .where(and(eq(lots.workshopId, workshopId), eq(lots.id, id)))
    .returning({ id: lots.id });
  return row?.id;
}

export async function deleteLot(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .delete(lots)
    .where(and(eq(lots.workshopId, workshopId), eq(lots.id, id)))
    .returning({ id: lots.id });
  return row?.id;
}

/** How much of the lot batches have consumed, in the lot's unit. */
export async function consumedQuantity(db: Database, workshopId: string, lotId: string) {
  const [row] = await db
    .select({
      n: sql<number>`coalesce(sum(${lotConsumptions.quantity}), 0)::float8`.mapWith(Number),
    })
    .from(lotConsumptions)
    .where(and(eq(lotConsumptions.workshopId, workshopId), eq(lotConsumptions.lotId, lotId)));
  return row?.n ?? 0;
}

/** Whether the material exists in the workshop. */
export async function materialExists(db: Database, workshopId: string, materialId: string) {
  const [row] = await db
    .select({ id: materials.id })
    .from(materials)
    .where(and(eq(materials.workshopId, workshopId), eq(materials.id, materialId)));
  return row !== undefined;
}

/**
 * The material's other lots with the same supplier lot number, ignoring case and spaces, oldest
 * receipt first: the same delivery entered twice, most likely.
 */
export async function lotsNumbered(
  db: Database,
  workshopId: string,
  materialId: string,
  supplierLotNumber: string,
  exceptId?: string,
) {
  return db
    .select({ id: lots.id, receivedOn: lots.receivedOn })
    .from(lots)
    .where(
      and(
        eq(lots.workshopId, workshopId),
        eq(lots.materialId, materialId),
        sql`${foldedText(lots.supplierLotNumber, '')} = ${foldedText(supplierLotNumber, '')}`,
        exceptId ? ne(lots.id, exceptId) : undefined,
      ),
    )
    .orderBy(asc(lots.receivedOn), asc(lots.id));
}
