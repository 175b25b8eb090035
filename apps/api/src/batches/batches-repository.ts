import { and, asc, eq, gt, inArray, max, or, sql, type SQL } from 'drizzle-orm';
import type { BatchAmendmentRecord, BatchListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import type { Database } from '../db/database';
import { findSubstitutes } from '../formulas/formulas-repository';
import {
  batchAmendments,
  batches,
  formulaLines,
  formulas,
  formulaVersions,
  lotConsumptions,
  lots,
  materials,
  users,
  workshops,
} from '../db/schema';
import { stockOnHand } from '../lots/lots-repository';
import { batchView, type BatchRow, type PickedLot } from './batch-view';

/**
 * Batches in PostgreSQL: the row keeps the weigh sheet it was started with and what production
 * recorded (jsonb); stock moves only through `lot_consumptions`, written under row locks.
 */

/** A batch row of the workshop; `lock` holds it (`FOR UPDATE`) for the rest of the transaction. */
export async function findBatchRow(db: Database, workshopId: string, id: string, lock = false) {
  const query = db
    .select()
    .from(batches)
    .where(and(eq(batches.workshopId, workshopId), eq(batches.id, id)));
  const [row] = lock ? await query.for('update') : await query;
  return row;
}

/** The lot rows a batch, an amendment or an adjustment draws on. */
export type LockedLot = PickedLot & { quantity: number };

const lotColumns = {
  id: lots.id,
  materialId: lots.materialId,
  supplierLotNumber: lots.supplierLotNumber,
  expiresOn: lots.expiresOn,
  unit: lots.unit,
  quantity: lots.quantity,
};

/** The workshop's lots among `lotIds` (others are left out), by id. */
export async function findLots(
  db: Database,
  workshopId: string,
  lotIds: readonly string[],
): Promise<Map<string, LockedLot>> {
  if (lotIds.length === 0) return new Map();
  const rows = await db
    .select(lotColumns)
    .from(lots)
    .where(and(eq(lots.workshopId, workshopId), inArray(lots.id, [...lotIds])));
  return new Map(rows.map((r) => [r.id, r]));
}

/**
 * Locks the workshop's lots among `lotIds` (`SELECT … FOR UPDATE`) in id order, so two
 * transactions locking overlapping lots queue instead of deadlocking. Call it before reading
 * stock with {@link stockOnHandOf} and writing `lot_consumptions` in the same transaction: a
 * concurrent writer then waits, and reads the stock this one leaves. Lots of another workshop or
 * that do not exist are left out of the answer (the caller refuses them).
 */
export async function lockLots(
  tx: Database,
  workshopId: string,
  lotIds: readonly string[],
): Promise<Map<string, LockedLot>> {
  const ids = [...new Set(lotIds)].sort();
  if (ids.length === 0) return new Map();
  const rows = await tx
    .select(lotColumns)
    .from(lots)
    .where(and(eq(lots.workshopId, workshopId), inArray(lots.id, ids)))
    .orderBy(asc(lots.id))
    .for('update');
  return new Map(rows.map((r) => [r.id, r]));
}

/**
 * Stock on hand of the workshop's lots among `lotIds`, in each lot's own unit: received minus
 * every stock movement. Read it after {@link lockLots} in the same transaction.
 */
export async function stockOnHandOf(
  tx: Database,
  workshopId: string,
  lotIds: readonly string[],
): Promise<Map<string, number>> {
  if (lotIds.length === 0) return new Map();
  const rows = await tx
    .select({ id: lots.id, stock: stockOnHand.mapWith(Number) })
    .from(lots)
    .where(and(eq(lots.workshopId, workshopId), inArray(lots.id, [...new Set(lotIds)])));
  return new Map(rows.map((r) => [r.id, r.stock]));
}

/** Grams per millilitre of the workshop's materials among `ids` (null when not known). */
export async function gramsPerMillilitreOf(
  db: Database,
  workshopId: string,
  ids: readonly string[],
): Promise<Map<string, number | null>> {
  if (ids.length === 0) return new Map();
  const rows = await db
    .select({ id: materials.id, weightPerVolume: materials.weightPerVolume })
    .from(materials)
    .where(and(eq(materials.workshopId, workshopId), inArray(materials.id, [...new Set(ids)])));
  return new Map(rows.map((r) => [r.id, r.weightPerVolume.millilitre ?? null]));
}

/** Corrections of a released batch, oldest first, with the amending member's name. */
async function amendmentsOf(
  db: Database,
  workshopId: string,
  batchId: string,
): Promise<BatchAmendmentRecord[]> {
  const rows = await db
    .select({
      id: batchAmendments.id,
      field: batchAmendments.field,
      previousValue: batchAmendments.previousValue,
      value: batchAmendments.value,
      reason: batchAmendments.reason,
      createdAt: batchAmendments.createdAt,
      amendedBy: users.name,
    })
    .from(batchAmendments)
    .leftJoin(users, eq(users.id, batchAmendments.amendedBy))
    .where(and(eq(batchAmendments.workshopId, workshopId), eq(batchAmendments.batchId, batchId)))
    .orderBy(asc(batchAmendments.createdAt), asc(batchAmendments.id));
  return rows.map(({ createdAt, amendedBy, ...a }) => ({
    ...a,
    amendedAt: createdAt.toISOString(),
    amendedBy: amendedBy ?? 'A former member',
  }));
}

/** Reads everything a batch's view needs beside its row. */
async function viewOf(db: Database, workshopId: string, row: BatchRow) {
  const pickIds = row.record.lines.flatMap((l) => l.lotPicks.map((p) => p.lotId));
  const usedIds = row.sheet.lines.flatMap((l) => [
    l.materialId,
    ...l.substitutes.map((s) => s.materialId),
  ]);
  // One after another: inside a transaction the queries share one connection.
  const [head] = await db
    .select({
      formulaName: formulas.name,
      profile: formulaVersions.profile,
      releasedByName: sql<
        string | null
      >`(select ${users.name} from ${users} where ${users.id} = ${row.releasedBy ?? null}::uuid)`,
    })
    .from(formulaVersions)
    .innerJoin(formulas, eq(formulas.id, formulaVersions.formulaId))
    .where(and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.id, row.versionId)));
  const lotRows = await findLots(db, workshopId, pickIds);
  const densities = await gramsPerMillilitreOf(db, workshopId, usedIds);
  const amendments = await amendmentsOf(db, workshopId, row.id);
  return batchView(row, {
    formulaName: head!.formulaName,
    netQuantity: head!.profile.netQuantity ?? null,
    lots: lotRows,
    gramsPerMillilitre: densities,
    releasedByName: row.releasedBy ? (head!.releasedByName ?? 'A former member') : null,
    amendments,
  });
}

/**
 * A batch of the workshop as the API returns it (`batchSchema`), or undefined. The fields are as
 * recorded (as released, for a released batch); `amendments` lists the corrections made since.
 */
export async function loadBatch(db: Database, workshopId: string, id: string) {
  const row = await findBatchRow(db, workshopId, id);
  return row ? viewOf(db, workshopId, row) : undefined;
}

const sortColumns = {
  madeOn: batches.madeOn,
  batchCode: batches.batchCode,
  formulaName: formulas.name,
  state: batches.state,
  createdAt: batches.createdAt,
} as const;

/** One page of the workshop's batches, filtered, sorted and paged in SQL. */
export async function pageBatches(db: Database, workshopId: string, q: BatchListQuery) {
  const conditions: (SQL | undefined)[] = [eq(batches.workshopId, workshopId)];
  if (q.q) {
    const p = containsPattern(q.q);
    conditions.push(
      or(
        sql`${batches.batchCode} ilike ${p}`,
        sql`${batches.formulaId} in (select f.id from ${formulas} f where f.workshop_id = ${workshopId} and f.name ilike ${p})`,
      ),
    );
  }
  if (q.state) conditions.push(eq(batches.state, q.state));
  if (q.formulaId) conditions.push(eq(batches.formulaId, q.formulaId));
  if (q.curingOn) conditions.push(gt(batches.readyOn, q.curingOn));
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({
      row: batches,
      formulaName: formulas.name,
      total: totalColumn(batches, where),
    })
    .from(batches)
    .innerJoin(formulas, eq(formulas.id, batches.formulaId))
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, batches.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: batches, where, page: q.page });
}

/** The workshop's batch settings: weighing tolerance and batch code pattern. */
export async function workshopBatchSettings(db: Database, workshopId: string) {
  const [row] = await db
    .select({
      tolerancePercent: workshops.weighingTolerancePercent,
      batchCodePattern: workshops.batchCodePattern,
    })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row!;
}

/** The lines of a version in order, with material names, densities and approved substitutes. */
export async function sheetSources(db: Database, workshopId: string, versionId: string) {
  const lines = await db
    .select({
      lineId: formulaLines.id,
      materialId: formulaLines.materialId,
      materialName: materials.tradeName,
      grams: formulaLines.grams,
      weightPerVolume: materials.weightPerVolume,
    })
    .from(formulaLines)
    .innerJoin(materials, eq(materials.id, formulaLines.materialId))
    .where(and(eq(formulaLines.workshopId, workshopId), eq(formulaLines.versionId, versionId)))
    .orderBy(asc(formulaLines.position));
  const substitutes = await findSubstitutes(
    db,
    workshopId,
    lines.map((l) => l.lineId),
  );
  return lines.map(({ lineId, weightPerVolume, ...line }) => ({
    ...line,
    gramsPerMillilitre: weightPerVolume.millilitre ?? null,
    substitutes: substitutes.get(lineId) ?? [],
  }));
}

/** The workshop's lots of these materials with stock on hand, for pick suggestions. */
export async function lotsInStock(db: Database, workshopId: string, materialIds: string[]) {
  if (materialIds.length === 0) return [];
  const stock = stockOnHand.mapWith(Number);
  return db
    .select({
      id: lots.id,
      materialId: lots.materialId,
      supplierLotNumber: lots.supplierLotNumber,
      unit: lots.unit,
      receivedOn: lots.receivedOn,
      expiresOn: lots.expiresOn,
      stockOnHand: stock,
    })
    .from(lots)
    .where(
      and(
        eq(lots.workshopId, workshopId),
        inArray(lots.materialId, [...new Set(materialIds)]),
        sql`${stockOnHand} > 0`,
      ),
    );
}

/** The highest sequence of the workshop's batches made on a day (0 when none). */
export async function highestSequence(db: Database, workshopId: string, madeOn: string) {
  const [row] = await db
    .select({ n: max(batches.sequence) })
    .from(batches)
    .where(and(eq(batches.workshopId, workshopId), eq(batches.madeOn, madeOn)));
  return row?.n ?? 0;
}

export async function insertBatch(db: Database, values: typeof batches.$inferInsert) {
  const [row] = await db.insert(batches).values(values).returning({ id: batches.id });
  return row!.id;
}

export async function updateBatch(
  db: Database,
  workshopId: string,
  id: string,
  values: Partial<typeof batches.$inferInsert>,
) {
  await db
    .update(batches)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(batches.workshopId, workshopId), eq(batches.id, id)));
}

export async function deleteBatch(db: Database, workshopId: string, id: string) {
  await db.delete(batches).where(and(eq(batches.workshopId, workshopId), eq(batches.id, id)));
}

/** Records stock taken out of lots (positive quantities in each lot's unit). */
export async function insertConsumptions(
  db: Database,
  rows: (typeof lotConsumptions.$inferInsert)[],
) {
  if (rows.length > 0) await db.insert(lotConsumptions).values(rows);
}
