import {
  AUDIT_CSV_COLUMNS,
  AUDIT_CSV_MAX_ROWS,
  type AuditEvent,
  type AuditListQuery,
  type AuditPage,
} from '@batchproof/shared';
import type { AuthUser } from '../auth/authenticate';
import { csvText } from '../core/csv-export';
import type { Database } from '../db/database';
import * as repo from './audit-repository';

type Row = Awaited<ReturnType<typeof repo.allAuditEvents>>[number];

const toEvent = (row: Row): AuditEvent => ({ ...row, at: row.at.toISOString() });

/** A page of the caller's workshop's audit log, newest first. */
export async function listAuditEvents(
  db: Database,
  actor: AuthUser,
  q: AuditListQuery,
): Promise<AuditPage> {
  const { items, total } = await repo.pageAuditEvents(db, actor.workshopId, q);
  return { items: items.map(toEvent), total, page: q.page, pageSize: q.pageSize };
}

/**
 * The filtered log as CSV (every matching entry up to {@link AUDIT_CSV_MAX_ROWS}, not just one
 * page): when (ISO timestamp, UTC), who, action, subject type and id, and the detail as JSON.
 */
export async function exportAuditCsv(db: Database, actor: AuthUser, q: AuditListQuery) {
  const rows = await repo.allAuditEvents(db, actor.workshopId, q, AUDIT_CSV_MAX_ROWS);
  return csvText(
    AUDIT_CSV_COLUMNS,
    rows.map(toEvent).map((e) => ({
      when: e.at,
      who: e.actorName ?? '',
      action: e.action,
      subjectType: e.subjectType,
      subjectId: e.subjectId ?? '',
      detail: e.detail ? JSON.stringify(e.detail) : '',
    })),
  );
}
