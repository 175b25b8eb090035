import { and, desc, asc, eq, gte, lt, sql, type SQL } from 'drizzle-orm';
import { addDays, type AuditListQuery } from '@batchproof/shared';
import { containsPattern, pageWindow, totalColumn, withTotal } from '../core/list-paging';
import type { Database } from '../db/database';
import { auditEvents, users } from '../db/schema';

// The actor's name, looked up per returned row (no join to page over).
const actorName = sql<
  string | null
>`(select ${users.name} from ${users} where ${users.id} = ${sql.raw('"audit_events"."actor_id"')})`;

const columns = {
  id: auditEvents.id,
  at: auditEvents.createdAt,
  actorId: auditEvents.actorId,
  actorName,
  action: auditEvents.action,
  subjectType: auditEvents.subjectType,
  subjectId: auditEvents.subjectId,
  detail: auditEvents.detail,
};

/** The WHERE of a filtered log: the workshop's events within the days, type, actor and text. */
function filtered(workshopId: string, q: AuditListQuery) {
  const conditions: (SQL | undefined)[] = [eq(auditEvents.workshopId, workshopId)];
  if (q.subjectType) conditions.push(eq(auditEvents.subjectType, q.subjectType));
  if (q.actorId) conditions.push(eq(auditEvents.actorId, q.actorId));
  // UTC days, both included: from the first day's midnight to before the day after the last.
  if (q.from) conditions.push(gte(auditEvents.createdAt, new Date(`${q.from}T00:00:00Z`)));
  if (q.to) conditions.push(lt(auditEvents.createdAt, new Date(`${addDays(q.to, 1)}T00:00:00Z`)));
  if (q.q) {
    const p = containsPattern(q.q);
    conditions.push(
      sql`(${auditEvents.action} ilike ${p} or ${auditEvents.subjectId} ilike ${p} or ${auditEvents.detail}::text ilike ${p})`,
    );
  }
  return and(...conditions);
}

const order = (q: AuditListQuery) =>
  q.dir === 'asc'
    ? [asc(auditEvents.createdAt), asc(auditEvents.id)]
    : [desc(auditEvents.createdAt), desc(auditEvents.id)];

/** One page of the workshop's log (newest first unless asked otherwise). */
export async function pageAuditEvents(db: Database, workshopId: string, q: AuditListQuery) {
  const where = filtered(workshopId, q);
  const { limit, offset } = pageWindow(q);
  const rows = await db
    .select({ ...columns, total: totalColumn(auditEvents, where) })
    .from(auditEvents)
    .where(where)
    .orderBy(...order(q))
    .limit(limit)
    .offset(offset);
  return withTotal(db, rows, { table: auditEvents, where, page: q.page });
}

/** Every event of the filtered log, up to `max`, in the list's order. */
export async function allAuditEvents(
  db: Database,
  workshopId: string,
  q: AuditListQuery,
  max: number,
) {
  return db
    .select(columns)
    .from(auditEvents)
    .where(filtered(workshopId, q))
    .orderBy(...order(q))
    .limit(max);
}
