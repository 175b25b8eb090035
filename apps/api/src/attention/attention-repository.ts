import {
  and,
  asc,
  count,
  desc,
  eq,
  gt,
  inArray,
  isNotNull,
  isNull,
  lte,
  sql,
  type SQL,
} from 'drizzle-orm';
import type { DocumentKind } from '@batchproof/shared';
import type { Database } from '../db/database';
import {
  batches,
  complaints,
  documents,
  formulas,
  formulaVersions,
  labelRuns,
  lotConsumptions,
  lots,
  materials,
  memberships,
  recalls,
} from '../db/schema';
import { productNameOf, soldInUs } from '../complaints/complaints-repository';
import { documentInUse } from '../documents/documents-repository';
import { stockOnHand } from '../lots/lots-repository';

/** The number of rows the query matched before its LIMIT (every matching row is small here). */
const matched = sql<number>`count(*) over ()`.mapWith(Number);

/**
 * Draft and released versions (never superseded history) of formulas in use (not archived) whose
 * last check found blocking findings: released ones first, since those are what the workshop
 * sells.
 */
export async function blockedVersions(db: Database, workshopId: string, limit: number) {
  return db
    .select({
      formulaId: formulaVersions.formulaId,
      formulaName: formulas.name,
      versionNumber: formulaVersions.number,
      state: formulaVersions.state,
      blockCount: formulaVersions.blockCount,
      matched,
    })
    .from(formulaVersions)
    .innerJoin(formulas, eq(formulas.id, formulaVersions.formulaId))
    .where(
      and(
        eq(formulaVersions.workshopId, workshopId),
        inArray(formulaVersions.state, ['draft', 'released']),
        gt(formulaVersions.blockCount, 0),
        isNull(formulas.archivedAt),
      ),
    )
    .orderBy(
      desc(sql`${formulaVersions.state} = 'released'`),
      asc(formulas.name),
      asc(formulaVersions.number),
    )
    .limit(limit);
}

/**
 * Lots of materials in use (not archived) with stock on hand whose expiry falls on or before
 * `cutoff`, soonest first.
 */
export async function expiringLotsWithStock(
  db: Database,
  workshopId: string,
  cutoff: string,
  limit: number,
) {
  return db
    .select({
      lotId: lots.id,
      materialName: materials.tradeName,
      supplierLotNumber: lots.supplierLotNumber,
      expiresOn: lots.expiresOn,
      stockOnHand: stockOnHand.mapWith(Number),
      unit: lots.unit,
      matched,
    })
    .from(lots)
    .innerJoin(materials, eq(materials.id, lots.materialId))
    .where(
      and(
        eq(lots.workshopId, workshopId),
        isNotNull(lots.expiresOn),
        lte(lots.expiresOn, cutoff),
        gt(stockOnHand, 0),
        isNull(materials.archivedAt),
      ),
    )
    .orderBy(asc(lots.expiresOn), asc(lots.id))
    .limit(limit);
}

/** Every material of the workshop in use (not archived) with its category, by name. */
export async function materialsByName(db: Database, workshopId: string) {
  return db
    .select({ id: materials.id, tradeName: materials.tradeName, category: materials.category })
    .from(materials)
    .where(and(eq(materials.workshopId, workshopId), isNull(materials.archivedAt)))
    .orderBy(asc(materials.tradeName), asc(materials.id));
}

/**
 * The newest document in use (neither archived nor replaced) of each kind in `kinds` of every
 * material of the workshop.
 */
export async function newestMaterialDocuments(
  db: Database,
  workshopId: string,
  kinds: DocumentKind[],
) {
  return db
    .selectDistinctOn([documents.materialId, documents.kind], {
      materialId: documents.materialId,
      kind: documents.kind,
      issuedOn: documents.issuedOn,
    })
    .from(documents)
    .where(
      and(
        eq(documents.workshopId, workshopId),
        isNotNull(documents.materialId),
        inArray(documents.kind, kinds),
        documentInUse(),
      ),
    )
    .orderBy(
      documents.materialId,
      documents.kind,
      desc(documents.issuedOn),
      desc(documents.createdAt),
    );
}

/**
 * Formulas in use whose newest print run is of a version older than the released one, by name,
 * with how many of their runs are out of date.
 */
export async function formulasWithOutOfDateLabels(db: Database, workshopId: string, limit: number) {
  const result = await db.execute<{
    formulaId: string;
    formulaName: string;
    releasedVersion: number;
    printedVersion: number;
    printedAt: string | Date;
    runCount: number;
    matched: number;
  }>(sql`
    select ${formulas.id} as "formulaId", ${formulas.name} as "formulaName",
      ${formulaVersions.number} as "releasedVersion",
      newest.version_number as "printedVersion", newest.created_at as "printedAt",
      (select count(*) from ${labelRuns} older
        where older.workshop_id = ${formulas.workshopId} and older.formula_id = ${formulas.id}
          and older.version_number < ${formulaVersions.number})::int as "runCount",
      (count(*) over ())::int as "matched"
    from ${formulas}
    join ${formulaVersions} on ${formulaVersions.workshopId} = ${formulas.workshopId}
      and ${formulaVersions.formulaId} = ${formulas.id} and ${formulaVersions.state} = 'released'
    join lateral (
      select r.version_number, r.created_at from ${labelRuns} r
      where r.workshop_id = ${formulas.workshopId} and r.formula_id = ${formulas.id}
      order by r.created_at desc limit 1
    ) newest on true
    where ${formulas.workshopId} = ${workshopId} and ${formulas.archivedAt} is null
      and newest.version_number < ${formulaVersions.number}
    order by ${formulas.name}, ${formulas.id}
    limit ${limit}`);
  return result.rows.map((r) => ({ ...r, printedAt: new Date(r.printedAt).toISOString() }));
}

/** How many materials, lots, formulas and members the workshop has. */
export async function workshopCounts(db: Database, workshopId: string) {
  const countOf = async (
    table: typeof materials | typeof lots | typeof formulas | typeof memberships,
  ) => {
    const [row] = await db
      .select({ n: count() })
      .from(table)
      .where(eq(table.workshopId, workshopId));
    return row?.n ?? 0;
  };
  const [m, l, f, u] = await Promise.all([
    countOf(materials),
    countOf(lots),
    countOf(formulas),
    countOf(memberships),
  ]);
  return { materials: m, lots: l, formulas: f, members: u };
}

/**
 * Lots with some stock left but less than `fraction` of what was received, least left first.
 * Only lots something was taken from can be low, so the sums start from the workshop's stock
 * movements (one grouped pass over `lot_consumptions_workshop_idx`), never from every lot.
 */
export async function lowStockLots(
  db: Database,
  workshopId: string,
  fraction: number,
  limit: number,
) {
  const result = await db.execute<{
    lotId: string;
    materialName: string;
    supplierLotNumber: string;
    quantity: number;
    stockOnHand: number;
    unit: string;
    matched: number;
  }>(sql`
    with taken as (
      select ${lotConsumptions.lotId} as lot_id, sum(${lotConsumptions.quantity}) as n
      from ${lotConsumptions} where ${lotConsumptions.workshopId} = ${workshopId}
      group by ${lotConsumptions.lotId})
    select l.id as "lotId", m.trade_name as "materialName",
      l.supplier_lot_number as "supplierLotNumber", l.quantity::float8 as "quantity",
      (l.quantity - taken.n)::float8 as "stockOnHand", l.unit as "unit",
      (count(*) over ())::int as "matched"
    from taken
    join ${lots} l on l.id = taken.lot_id and l.workshop_id = ${workshopId}
    join ${materials} m on m.id = l.material_id and m.archived_at is null
    where l.quantity - taken.n > 0 and l.quantity - taken.n < l.quantity * ${fraction}
    order by (l.quantity - taken.n) / l.quantity, l.id
    limit ${limit}`);
  return result.rows;
}

/** Batches in `state`, by `order`, with their product's name (`batches_workshop_state_ready_idx`). */
async function batchesIn(
  db: Database,
  workshopId: string,
  where: SQL,
  order: SQL[],
  limit: number,
) {
  return db
    .select({
      batchId: batches.id,
      batchCode: batches.batchCode,
      productName: productNameOf(sql.raw('"batches"."formula_id"')),
      madeOn: batches.madeOn,
      readyOn: batches.readyOn,
      matched,
    })
    .from(batches)
    .where(and(eq(batches.workshopId, workshopId), where))
    .orderBy(...order)
    .limit(limit);
}

/** Released batches whose ready day is after `today`, readiest first. */
export const curingBatches = (db: Database, workshopId: string, today: string, limit: number) =>
  batchesIn(
    db,
    workshopId,
    and(eq(batches.state, 'released'), gt(batches.readyOn, today))!,
    [asc(batches.readyOn), asc(batches.id)],
    limit,
  );

/** Batches started and not yet released, oldest first. */
export const draftBatches = (db: Database, workshopId: string, limit: number) =>
  batchesIn(
    db,
    workshopId,
    eq(batches.state, 'draft'),
    [asc(batches.madeOn), asc(batches.id)],
    limit,
  );

/** Recalls and drills not yet closed, oldest first (`recalls_workshop_state_idx`). */
export async function openRecalls(db: Database, workshopId: string, limit: number) {
  return db
    .select({
      recallId: recalls.id,
      reason: recalls.reason,
      severity: recalls.severity,
      drill: recalls.drill,
      batchCodes: recalls.batchCodes,
      openedAt: recalls.openedAt,
      matched,
    })
    .from(recalls)
    .where(and(eq(recalls.workshopId, workshopId), eq(recalls.state, 'open')))
    .orderBy(asc(recalls.openedAt), asc(recalls.id))
    .limit(limit);
}

/**
 * Open complaints marked serious and not reported to FDA, about products sold in the US, oldest
 * received first (`complaints_workshop_open_idx`). Every one has a running or overdue clock.
 */
export async function unreportedSeriousComplaints(db: Database, workshopId: string, limit: number) {
  return db
    .select({
      complaintId: complaints.id,
      productName: productNameOf(sql.raw('"complaints"."formula_id"')),
      batchCode: sql<
        string | null
      >`(select ${batches.batchCode} from ${batches} where ${batches.id} = ${sql.raw('"complaints"."batch_id"')})`,
      receivedOn: complaints.receivedOn,
      matched,
    })
    .from(complaints)
    .where(
      and(
        eq(complaints.workshopId, workshopId),
        eq(complaints.status, 'open'),
        eq(complaints.serious, true),
        isNull(complaints.reportedToFdaOn),
        soldInUs(sql`${workshopId}`, sql.raw('"complaints"."formula_id"')),
      ),
    )
    .orderBy(asc(complaints.receivedOn), asc(complaints.id))
    .limit(limit);
}
