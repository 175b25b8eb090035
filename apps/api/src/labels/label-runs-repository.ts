import { and, desc, eq, sql } from 'drizzle-orm';
import type { Database } from '../db/database';
import { formulaVersions, labelRunPdfs, labelRuns } from '../db/schema';

/** A run as inserted: everything but what the database fills in. */
export type NewLabelRun = typeof labelRuns.$inferInsert;

// Spelled out in full: in a single-table select Drizzle renders `${labelRuns.formulaId}` as a
// bare "formula_id", which inside the subquery would mean the version's own column.
const run = (column: string) => sql.raw(`"label_runs"."${column}"`);

/** A newer version of the run's formula has been released since it was printed. */
const outOfDate = sql<boolean>`exists (select 1 from ${formulaVersions} newer
  where newer.workshop_id = ${run('workshop_id')}
    and newer.formula_id = ${run('formula_id')}
    and newer.state = 'released'
    and newer.number > ${run('version_number')})`.mapWith(Boolean);

/** Every column but the label contents (the record does not answer them), plus `outOfDate`. */
const recordColumns = {
  id: labelRuns.id,
  formulaId: labelRuns.formulaId,
  formulaName: labelRuns.formulaName,
  versionId: labelRuns.versionId,
  versionNumber: labelRuns.versionNumber,
  markets: labelRuns.markets,
  stockId: labelRuns.stockId,
  stock: labelRuns.stock,
  layout: labelRuns.layout,
  barcode: labelRuns.barcode,
  startPosition: labelRuns.startPosition,
  copies: labelRuns.copies,
  labelCount: labelRuns.labelCount,
  pageCount: labelRuns.pageCount,
  lotCode: labelRuns.lotCode,
  expiresOn: labelRuns.expiresOn,
  batchId: labelRuns.batchId,
  status: labelRuns.status,
  progressDone: labelRuns.progressDone,
  progressTotal: labelRuns.progressTotal,
  overrideReason: labelRuns.overrideReason,
  overriddenMissing: labelRuns.overriddenMissing,
  publicToken: labelRuns.publicToken,
  withdrawnAt: labelRuns.withdrawnAt,
  createdBy: labelRuns.createdBy,
  createdByName: labelRuns.createdByName,
  createdAt: labelRuns.createdAt,
  outOfDate,
};
/** A run as the record reads it. */
export type LabelRunRecordRow = Awaited<ReturnType<typeof findRunRecord>> & object;

export async function insertRun(db: Database, run: NewLabelRun) {
  const [row] = await db.insert(labelRuns).values(run).returning({ id: labelRuns.id });
  return row!.id;
}

export async function findRunRecord(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select(recordColumns)
    .from(labelRuns)
    .where(and(eq(labelRuns.workshopId, workshopId), eq(labelRuns.id, id)));
  return row;
}

/** The workshop's runs, or one formula's, newest first. */
export async function listRunRecords(
  db: Database,
  workshopId: string,
  formulaId: string | undefined,
  limit: number,
) {
  return db
    .select(recordColumns)
    .from(labelRuns)
    .where(
      and(
        eq(labelRuns.workshopId, workshopId),
        formulaId ? eq(labelRuns.formulaId, formulaId) : undefined,
      ),
    )
    .orderBy(desc(labelRuns.createdAt), desc(labelRuns.id))
    .limit(limit);
}

/** The whole stored run, contents included, for rendering its PDF. */
export async function findRun(db: Database, workshopId: string, id: string) {
  const [row] = await db
    .select()
    .from(labelRuns)
    .where(and(eq(labelRuns.workshopId, workshopId), eq(labelRuns.id, id)));
  return row;
}

/** Raises a rendering run's progress; a late write never lowers it or touches a finished run. */
export async function raiseProgress(db: Database, workshopId: string, id: string, done: number) {
  await db
    .update(labelRuns)
    .set({ progressDone: sql`greatest(${labelRuns.progressDone}, ${done})` })
    .where(
      and(
        eq(labelRuns.workshopId, workshopId),
        eq(labelRuns.id, id),
        eq(labelRuns.status, 'rendering'),
      ),
    );
}

/** Stores the finished PDF and marks the run ready, in one transaction. */
export async function storePdf(db: Database, workshopId: string, id: string, content: Buffer) {
  await db.transaction(async (tx) => {
    await tx
      .insert(labelRunPdfs)
      .values({ workshopId, runId: id, content })
      .onConflictDoUpdate({ target: labelRunPdfs.runId, set: { content, updatedAt: new Date() } });
    await tx
      .update(labelRuns)
      .set({ status: 'ready', progressDone: labelRuns.progressTotal, updatedAt: new Date() })
      .where(and(eq(labelRuns.workshopId, workshopId), eq(labelRuns.id, id)));
  });
}

export async function markFailed(db: Database, workshopId: string, id: string) {
  await db
    .update(labelRuns)
    .set({ status: 'failed', updatedAt: new Date() })
    .where(and(eq(labelRuns.workshopId, workshopId), eq(labelRuns.id, id)));
}

export async function findPdf(db: Database, workshopId: string, runId: string) {
  const [row] = await db
    .select({ content: labelRunPdfs.content })
    .from(labelRunPdfs)
    .where(and(eq(labelRunPdfs.workshopId, workshopId), eq(labelRunPdfs.runId, runId)));
  return row?.content;
}

/** Withdraws a run's public page; returns whether this call withdrew it. */
export async function withdrawRun(db: Database, workshopId: string, id: string) {
  const rows = await db
    .update(labelRuns)
    .set({ withdrawnAt: new Date(), updatedAt: new Date() })
    .where(
      and(
        eq(labelRuns.workshopId, workshopId),
        eq(labelRuns.id, id),
        sql`${labelRuns.withdrawnAt} is null`,
      ),
    )
    .returning({ id: labelRuns.id });
  return rows.length > 0;
}

/**
 * What the public page shows of a run, by its token: one lookup on the unique index. Across
 * workshops by design: the token is the only key.
 */
export async function findPublicRun(db: Database, token: string) {
  const [row] = await db
    .select({
      markets: labelRuns.markets,
      contents: labelRuns.contents,
      withdrawnAt: labelRuns.withdrawnAt,
    })
    .from(labelRuns)
    .where(eq(labelRuns.publicToken, token));
  return row;
}
