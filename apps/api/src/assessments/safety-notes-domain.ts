import { safetyNotesSchema, type SafetyNotes, type SafetyNotesRecord } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { notFound } from '../core/app-error';
import type { Database } from '../db/database';
import { signedRefusal } from './assessments-domain';
import * as repo from './assessments-repository';

/**
 * The version the caller may read the notes of: any version of the workshop for its members; for
 * an assessor, only a version shared with them now. Anything else is not found.
 */
async function visibleVersion(db: Database, actor: AuthUser, formulaId: string, n: number) {
  const version = await repo.findVersionByNumber(db, actor.workshopId, formulaId, n);
  if (!version) throw notFound('That version');
  if (
    actor.role === 'assessor' &&
    !(await repo.hasLiveShare(db, actor.workshopId, version.id, actor.id))
  ) {
    throw notFound('That version');
  }
  return version;
}

async function notesRecord(db: Database, workshopId: string, versionId: string) {
  const row = await repo.findSafetyNotes(db, workshopId, versionId);
  return {
    versionId,
    notes: row?.notes ?? safetyNotesSchema.parse({}),
    updatedAt: row?.updatedAt.toISOString() ?? null,
    updatedByName: row?.updatedByName ?? null,
  } satisfies SafetyNotesRecord;
}

/** The maker's notes for Part A items 2–5 of a version (empty until written). */
export async function getSafetyNotes(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  n: number,
): Promise<SafetyNotesRecord> {
  const version = await visibleVersion(db, actor, formulaId, n);
  return notesRecord(db, actor.workshopId, version.id);
}

/** Replaces a version's notes; refused once the version's assessment is signed. */
export async function putSafetyNotes(
  db: Database,
  actor: AuthUser,
  formulaId: string,
  n: number,
  notes: SafetyNotes,
): Promise<SafetyNotesRecord> {
  return db.transaction(async (tx) => {
    const version = await visibleVersion(tx, actor, formulaId, n);
    const assessment = await repo.assessmentOfVersion(tx, actor.workshopId, version.id);
    if (assessment?.status === 'signed') throw signedRefusal();
    await repo.upsertSafetyNotes(tx, {
      workshopId: actor.workshopId,
      versionId: version.id,
      notes,
      updatedBy: actor.id,
    });
    await recordAudit(tx, actor, {
      action: 'safety_notes.saved',
      subjectType: 'formula_version',
      subjectId: version.id,
      detail: { formulaId, versionNumber: n },
    });
    return notesRecord(tx, actor.workshopId, version.id);
  });
}
