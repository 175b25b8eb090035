import { and, eq, sql, type SQL } from 'drizzle-orm';
import type { ComplaintFields, ComplaintListQuery } from '@batchproof/shared';
import {
  containsPattern,
  listOrder,
  pageWindow,
  totalColumn,
  withTotal,
} from '../core/list-paging';
import type { Database } from '../db/database';
import {
  batches,
  complaints,
  formulas,
  formulaVersions,
  productIdentities,
  workshops,
} from '../db/schema';

/**
 * The product's name as its labels print it (the product identity's name), else the formula's
 * name. Looked up per returned row.
 */
export const productNameOf = (formulaId: SQL) =>
  sql<string>`coalesce((select ${productIdentities.identity}->>'productName' from ${productIdentities} where ${productIdentities.formulaId} = ${formulaId}), (select ${formulas.name} from ${formulas} where ${formulas.id} = ${formulaId}))`;

/**
 * Whether the formula is sold in the US: its released version's markets, or its newest
 * version's when none is released.
 */
export const soldInUs = (workshopId: SQL, formulaId: SQL) =>
  sql<boolean>`coalesce((select ${formulaVersions.profile}->'markets' @> '["US"]'::jsonb from ${formulaVersions}
    where ${formulaVersions.workshopId} = ${workshopId} and ${formulaVersions.formulaId} = ${formulaId}
    order by (${formulaVersions.state} = 'released') desc, ${formulaVersions.number} desc limit 1), false)`;

const complaintFormula = sql.raw('"complaints"."formula_id"');
const productName = productNameOf(complaintFormula);
// Looked up per returned row, like the product's name (no join to page over).
const batchCode = sql<
  string | null
>`(select ${batches.batchCode} from ${batches} where ${batches.id} = ${sql.raw('"complaints"."batch_id"')})`;

const columns = {
  id: complaints.id,
  formulaId: complaints.formulaId,
  productName,
  batchId: complaints.batchId,
  batchCode,
  finishedLotCode: complaints.finishedLotCode,
  receivedOn: complaints.receivedOn,
  reporterName: complaints.reporterName,
  reporterContact: complaints.reporterContact,
  whatHappened: complaints.whatHappened,
  bodyArea: complaints.bodyArea,
  serious: complaints.serious,
  status: complaints.status,
  followUpNotes: complaints.followUpNotes,
  reportedToFdaOn: complaints.reportedToFdaOn,
  soldInUs: soldInUs(sql.raw('"complaints"."workshop_id"'), complaintFormula),
  createdAt: complaints.createdAt,
  updatedAt: complaints.updatedAt,
};

const sortColumns = {
  receivedOn: complaints.receivedOn,
  productName,
  batchCode,
  serious: complaints.serious,
  status: complaints.status,
  createdAt: complaints.createdAt,
} as const;

const selectComplaints = (db: Database) => db.select(columns).from(complaints);

/** One page of the workshop's complaints, filtered, sorted and paged in SQL. */
export async function pageComplaints(db: Database, workshopId: string, q: ComplaintListQuery) {
  const conditions: (SQL | undefined)[] = [eq(complaints.workshopId, workshopId)];
  if (q.formulaId) conditions.push(eq(complaints.formulaId, q.formulaId));
  if (q.status) conditions.push(eq(complaints.status, q.status));
  if (q.serious !== undefined) conditions.push(eq(complaints.serious, q.serious));
  if (q.q) {
    const p = containsPattern(q.q);
    // A workshop logs few complaints: a plain scan of its rows is cheap.
    conditions.push(
      sql`(${complaints.whatHappened} ilike ${p} or ${complaints.reporterName} ilike ${p}
        or ${complaints.finishedLotCode} ilike ${p}
        or exists (select 1 from ${batches} b where b.workshop_id = ${complaints.workshopId}
          and b.id = ${complaints.batchId} and b.batch_code ilike ${p}))`,
    );
  }
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({ ...columns, total: totalColumn(complaints, where) })
    .from(complaints)
    .where(where)
    .orderBy(...listOrder(sortColumns[q.sort], q.dir, complaints.id))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: complaints, where, page: q.page });
}

export async function findComplaint(db: Database, workshopId: string, id: string) {
  const [row] = await selectComplaints(db).where(
    and(eq(complaints.workshopId, workshopId), eq(complaints.id, id)),
  );
  return row;
}

export async function insertComplaint(
  db: Database,
  workshopId: string,
  createdBy: string,
  values: ComplaintFields,
) {
  const [row] = await db
    .insert(complaints)
    .values({ ...values, workshopId, createdBy })
    .returning({ id: complaints.id });
  return row!.id;
}

export async function updateComplaint(
  db: Database,
  workshopId: string,
  id: string,
  values: ComplaintFields,
) {
  await db
    .update(complaints)
    .set(values)
    .where(and(eq(complaints.workshopId, workshopId), eq(complaints.id, id)));
}

/** The formula's id when it is one of the workshop's. */
export async function formulaExists(db: Database, workshopId: string, formulaId: string) {
  const [row] = await db
    .select({ id: formulas.id })
    .from(formulas)
    .where(and(eq(formulas.workshopId, workshopId), eq(formulas.id, formulaId)));
  return row !== undefined;
}

/** The batch's formula, when the batch is one of the workshop's. */
export async function batchFormula(db: Database, workshopId: string, batchId: string) {
  const [row] = await db
    .select({ formulaId: batches.formulaId })
    .from(batches)
    .where(and(eq(batches.workshopId, workshopId), eq(batches.id, batchId)));
  return row?.formulaId;
}

/** Whether the owner has said the workshop is a MoCRA small business. */
export async function isSmallBusiness(db: Database, workshopId: string) {
  const [row] = await db
    .select({ smallBusiness: workshops.smallBusiness })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row?.smallBusiness ?? false;
}
