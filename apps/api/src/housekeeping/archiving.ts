import { and, eq, isNull, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn, PgTable } from 'drizzle-orm/pg-core';
import { Router, type RequestHandler } from 'express';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import { recordId } from '../core/record-id';
import type { Database } from '../db/database';

/** A workshop table that can be archived: it has the three columns archiving reads. */
type ArchivableTable = PgTable & {
  id: AnyPgColumn;
  workshopId: AnyPgColumn;
  archivedAt: AnyPgColumn;
};

/** How a feature's records are archived: the table, the audit subject and how to read one back. */
export interface Archivable<T> {
  table: ArchivableTable;
  /** The audit log's subject type, e.g. `material`. */
  subjectType: string;
  /** What a 404 calls the record, e.g. `That material`. */
  label: string;
  /** Reads the record back as the API answers it, inside the archiving transaction. */
  read: (db: Database, actor: AuthUser, id: string) => Promise<T>;
  /**
   * Turns the path's `:id` into a record id, throwing the answer for one that cannot be archived
   * (404 by default; a feature with read-only records of its own may refuse them otherwise).
   */
  idOf?: (raw: unknown) => string;
}

/** Lists leave archived rows out unless the query asks for them. */
export const unlessArchived = (column: AnyPgColumn, includeArchived: boolean): SQL | undefined =>
  includeArchived ? undefined : isNull(column);

/**
 * Archives (or brings back) one record of the caller's workshop and logs it, in one transaction.
 * Archiving an archived record keeps its first date. 404 for a record of another workshop.
 */
export async function setArchived<T>(
  db: Database,
  actor: AuthUser,
  what: Archivable<T>,
  id: string,
  archived: boolean,
): Promise<T> {
  const { table } = what;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(table)
      .set({ archivedAt: archived ? sql`coalesce(${table.archivedAt}, now())` : null })
      .where(and(eq(table.workshopId, actor.workshopId), eq(table.id, id)))
      .returning({ id: table.id });
    if (!row) throw notFound(what.label);
    await recordAudit(tx, actor, {
      action: archived ? 'archive' : 'unarchive',
      subjectType: what.subjectType,
      subjectId: id,
    });
    return what.read(tx, actor, id);
  });
}

/** `POST /:id/archive` and `POST /:id/unarchive`, for the roles in `write`. */
export function archiveRoutes<T>(db: Database, write: RequestHandler[], what: Archivable<T>) {
  const router = Router();
  for (const [path, archived] of [
    ['/:id/archive', true],
    ['/:id/unarchive', false],
  ] as const) {
    router.post(path, ...write, async (req, res) => {
      const id = what.idOf ? what.idOf(req.params['id']) : recordId(req.params['id'], what.label);
      res.json(await setArchived(db, req.user!, what, id, archived));
    });
  }
  return router;
}
