import { and, asc, desc, eq, inArray, sql, type SQL } from 'drizzle-orm';
import type {
  RecallAffectedCustomer,
  RecallDrillReport,
  RecallFields,
  RecallListQuery,
  RecallNoticeStatus,
  RecallReplyFields,
} from '@batchproof/shared';
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
  formulas,
  lots,
  memberships,
  productIdentities,
  recallNotices,
  recallReplies,
  recalls,
  users,
  workshops,
} from '../db/schema';
import type { FinishedLotRef } from '../trace/trace-repository';

/** Units delivered over every affected customer, read from the stored `affected` list. */
const unitsDelivered = sql<number>`(select coalesce(sum((a->>'unitsDelivered')::int), 0)
  from jsonb_array_elements(${recalls.affected}) a)::int`;
/** Units returned over every reply to the recall (outer id spelled out, as in lots' stock). */
const unitsReturned = sql<number>`(select coalesce(sum(${recallReplies.unitsReturned}), 0)
  from ${recallReplies} where ${recallReplies.recallId} = ${sql.raw('"recalls"."id"')})::int`;
/** The product names of the lots in scope, one lookup per batch code (unique per workshop). */
const productNames = sql<
  string[]
>`array(select distinct coalesce(pi.identity->>'productName', f.name)
  from jsonb_array_elements_text(${recalls.batchCodes}) code
  join ${batches} b on b.workshop_id = ${sql.raw('"recalls"."workshop_id"')} and b.batch_code = code
  join ${formulas} f on f.workshop_id = b.workshop_id and f.id = b.formula_id
  left join ${productIdentities} pi on pi.workshop_id = b.workshop_id and pi.formula_id = b.formula_id
  order by 1)`;

const sortColumns = {
  openedAt: recalls.openedAt,
  batchCodes: sql`${recalls.batchCodes}->>0`,
  severity: recalls.severity,
  drill: recalls.drill,
  unitsReturned,
} as const;

const listColumns = {
  id: recalls.id,
  openedAt: recalls.openedAt,
  closedAt: recalls.closedAt,
  state: recalls.state,
  drill: recalls.drill,
  severity: recalls.severity,
  reason: recalls.reason,
  batchCodes: recalls.batchCodes,
  products: productNames,
  customers: sql<number>`jsonb_array_length(${recalls.affected})`.mapWith(Number),
  unitsDelivered: unitsDelivered.mapWith(Number),
  unitsReturned: unitsReturned.mapWith(Number),
};

/** One page of the workshop's recalls. */
export async function pageRecalls(db: Database, workshopId: string, q: RecallListQuery) {
  const conditions: (SQL | undefined)[] = [eq(recalls.workshopId, workshopId)];
  if (q.q) {
    const p = containsPattern(q.q);
    conditions.push(sql`(${recalls.reason} ilike ${p} or ${recalls.batchCodes}::text ilike ${p})`);
  }
  if (q.state) conditions.push(eq(recalls.state, q.state));
  if (q.drill !== undefined) conditions.push(eq(recalls.drill, q.drill));
  const where = and(...conditions);
  const { limit, offset } = pageWindow(q);
  const order =
    q.sort === 'state'
      ? [
          q.dir === 'desc' ? desc(recalls.state) : asc(recalls.state),
          desc(recalls.openedAt),
          desc(recalls.id),
        ]
      : listOrder(sortColumns[q.sort], q.dir, recalls.id);
  const rows = await db
    .select({ ...listColumns, total: totalColumn(recalls, where) })
    .from(recalls)
    .where(where)
    .orderBy(...order)
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: recalls, where, page: q.page });
}

/** A recall row with its product names and returned units; undefined for another workshop's. */
export async function findRecall(db: Database, workshopId: string, id: string, lock = false) {
  const query = db
    .select({
      recall: recalls,
      products: productNames,
      unitsReturned: unitsReturned.mapWith(Number),
    })
    .from(recalls)
    .where(and(eq(recalls.workshopId, workshopId), eq(recalls.id, id)));
  const [row] = lock ? await query.for('update', { of: recalls }) : await query;
  return row;
}

export type RecallRow = NonNullable<Awaited<ReturnType<typeof findRecall>>>;

export async function noticesOf(db: Database, recallId: string) {
  return db
    .select()
    .from(recallNotices)
    .where(eq(recallNotices.recallId, recallId))
    .orderBy(asc(recallNotices.createdAt), asc(recallNotices.id));
}

export async function repliesOf(db: Database, recallId: string) {
  return db
    .select()
    .from(recallReplies)
    .where(eq(recallReplies.recallId, recallId))
    .orderBy(asc(recallReplies.repliedOn), asc(recallReplies.createdAt), asc(recallReplies.id));
}

/** Released batches of the workshop among `ids`, as finished lots, oldest first. */
export async function releasedFinishedLots(
  db: Database,
  workshopId: string,
  ids: readonly string[],
): Promise<FinishedLotRef[]> {
  if (ids.length === 0) return [];
  return db
    .select({
      batchId: batches.id,
      batchCode: batches.batchCode,
      formulaId: batches.formulaId,
      productName: sql<string>`coalesce(${productIdentities.identity}->>'productName', ${formulas.name})`,
      madeOn: batches.madeOn,
      unitsMade: batches.unitsMade,
    })
    .from(batches)
    .innerJoin(
      formulas,
      and(eq(formulas.workshopId, batches.workshopId), eq(formulas.id, batches.formulaId)),
    )
    .leftJoin(
      productIdentities,
      and(
        eq(productIdentities.workshopId, batches.workshopId),
        eq(productIdentities.formulaId, batches.formulaId),
      ),
    )
    .where(
      and(
        eq(batches.workshopId, workshopId),
        inArray(batches.id, [...ids]),
        eq(batches.state, 'released'),
      ),
    )
    .orderBy(asc(batches.madeOn), asc(batches.batchCode), asc(batches.id));
}

/** A supplier lot in words (its number and material); null when not one of the workshop's. */
export async function supplierLotLabel(db: Database, workshopId: string, lotId: string) {
  const [row] = await db
    .select({ material: lots.materialName, number: lots.supplierLotNumber })
    .from(lots)
    .where(and(eq(lots.workshopId, workshopId), eq(lots.id, lotId)));
  return row ? `${row.number} of ${row.material}` : null;
}

export async function insertRecall(
  db: Database,
  workshopId: string,
  values: RecallFields & {
    openedBy: string;
    batchCodes: string[];
    affected: RecallAffectedCustomer[];
    drillReport: RecallDrillReport | null;
  },
) {
  const [row] = await db
    .insert(recalls)
    .values({
      ...values,
      workshopId,
      supplierLotId: values.scope.kind === 'supplier-lot' ? values.scope.supplierLotId : null,
    })
    .returning({ id: recalls.id });
  return row!.id;
}

export async function closeRecall(
  db: Database,
  workshopId: string,
  id: string,
  values: { summary: string; closedBy: string },
) {
  await db
    .update(recalls)
    .set({ ...values, state: 'closed', closedAt: new Date() })
    .where(and(eq(recalls.workshopId, workshopId), eq(recalls.id, id)));
}

export async function setWhatToDo(db: Database, id: string, whatToDo: string | null) {
  await db.update(recalls).set({ whatToDo }).where(eq(recalls.id, id));
}

/** A notice as written before sending; replaces a failed one for the same customer. */
export async function saveNotice(
  db: Database,
  values: {
    workshopId: string;
    recallId: string;
    customerId: string;
    to: string;
    subject: string;
    body: string;
    status: RecallNoticeStatus;
    failure: string | null;
  },
) {
  const [row] = await db
    .insert(recallNotices)
    .values(values)
    .onConflictDoUpdate({
      target: [recallNotices.recallId, recallNotices.customerId],
      set: {
        to: values.to,
        subject: values.subject,
        body: values.body,
        status: values.status,
        failure: values.failure,
        updatedAt: new Date(),
      },
    })
    .returning({ id: recallNotices.id });
  return row!.id;
}

export async function markNotice(
  db: Database,
  id: string,
  outcome: { status: 'sent' | 'failed'; failure: string | null },
) {
  await db
    .update(recallNotices)
    .set({ ...outcome, sentAt: outcome.status === 'sent' ? new Date() : null })
    .where(eq(recallNotices.id, id));
}

export async function insertReply(
  db: Database,
  workshopId: string,
  recallId: string,
  createdBy: string,
  values: RecallReplyFields,
) {
  const [row] = await db
    .insert(recallReplies)
    .values({ ...values, workshopId, recallId, createdBy })
    .returning({ id: recallReplies.id });
  return row!.id;
}

/** The workshop's name, and who opened and closed the recall, for notices and the summary. */
export async function workshopName(db: Database, workshopId: string) {
  const [row] = await db
    .select({ name: workshops.name })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row?.name ?? '';
}

export async function userNames(db: Database, workshopId: string, ids: (string | null)[]) {
  const wanted = ids.filter((id): id is string => id !== null);
  if (wanted.length === 0) return new Map<string, string>();
  const rows = await db
    .select({ id: users.id, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workshopId, workshopId), inArray(memberships.userId, wanted)));
  return new Map(rows.map((r) => [r.id, r.name]));
}
