import type { AuthUser } from '../auth/authenticate';
import type { Database } from '../db/database';
import { auditEvents } from '../db/schema';

/**
 * Records who did what to which record. Call it inside the same transaction as the change, so
 * the log never claims something that was rolled back.
 */
export async function recordAudit(
  db: Database,
  actor: Pick<AuthUser, 'id' | 'workshopId'>,
  event: {
    action: string;
    subjectType: string;
    subjectId: string;
    detail?: Record<string, unknown>;
  },
) {
  await db.insert(auditEvents).values({
    workshopId: actor.workshopId,
    actorId: actor.id,
    action: event.action,
    subjectType: event.subjectType,
    subjectId: event.subjectId,
    detail: event.detail ?? null,
  });
}
