import type { ShareCreate, ShareList, ShareListQuery, ShareRecord } from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, notFound } from '../core/app-error';
import { runAfterAnswer } from '../core/after-answer';
import type { Database } from '../db/database';
import { versionSharedMail } from '../mail/mail-templates';
import type { Mailer } from '../mail/mailer';
import * as repo from './assessments-repository';

/**
 * A share as the lists show it. An assessor is never told about an assessment that is not
 * theirs (another assessor's of the same version).
 */
export function toShareRecord(row: repo.ShareRow, actor: AuthUser): ShareRecord {
  const hidden = actor.role === 'assessor' && row.assessmentAssessorId !== actor.id;
  return {
    id: row.id,
    formulaId: row.formulaId,
    formulaName: row.formulaName,
    versionId: row.versionId,
    versionNumber: row.versionNumber,
    assessorId: row.assessorId,
    assessorName: row.assessorName,
    sharedByName: row.sharedByName,
    sharedAt: row.sharedAt.toISOString(),
    assessmentId: hidden ? null : row.assessmentId,
    assessmentStatus: hidden ? null : row.assessmentStatus,
  };
}

/** The live shares the caller may see: every one for the workshop's members, an assessor's own. */
export async function listShares(
  db: Database,
  actor: AuthUser,
  q: ShareListQuery,
): Promise<ShareList> {
  const rows = await repo.listLiveShares(db, actor.workshopId, {
    versionId: q.versionId,
    assessorId: actor.role === 'assessor' ? actor.id : undefined,
  });
  return { items: rows.map((r) => toShareRecord(r, actor)) };
}

/** What the audit log keeps of a share given or taken back. */
const shareDetail = (row: repo.ShareRow) => ({
  formulaName: row.formulaName,
  versionNumber: row.versionNumber,
  assessorName: row.assessorName,
});

const refuse = (fieldErrors: Record<string, string[]>) =>
  new AppError(400, 'validation_failed', 'Some fields need attention.', fieldErrors);

/**
 * Shares a released (or superseded) version with an assessor member of this workshop and mails
 * them once the share is committed. A live share of the same version with the same assessor is
 * answered as it is (`created: false`), so sharing twice is harmless.
 */
export async function shareVersion(
  db: Database,
  mailer: Mailer,
  appUrl: string,
  actor: AuthUser,
  input: ShareCreate,
): Promise<{ created: boolean; share: ShareRecord }> {
  const done = await db.transaction(async (tx) => {
    const fieldErrors: Record<string, string[]> = {};
    const version = await repo.findVersionById(tx, actor.workshopId, input.versionId);
    if (!version) fieldErrors.versionId = ['Choose a version of one of this workshop’s formulas'];
    else if (version.state === 'draft') {
      fieldErrors.versionId = ['Release the version first: a draft can still change'];
    }
    const assessor = await repo.findMember(tx, actor.workshopId, input.assessorId);
    if (!assessor || assessor.role !== 'assessor') {
      fieldErrors.assessorId = ['Choose a member of this workshop whose role is assessor'];
    }
    if (Object.keys(fieldErrors).length > 0) throw refuse(fieldErrors);
    const existing = await repo.findLiveShare(
      tx,
      actor.workshopId,
      input.versionId,
      input.assessorId,
    );
    if (existing) return { created: false, share: toShareRecord(existing, actor) };
    const id = await repo.insertShare(tx, {
      workshopId: actor.workshopId,
      versionId: input.versionId,
      assessorId: input.assessorId,
      sharedBy: actor.id,
    });
    const row = (await repo.findShare(tx, actor.workshopId, id))!;
    await recordAudit(tx, actor, {
      action: 'assessment.shared',
      subjectType: 'assessment_share',
      subjectId: id,
      detail: shareDetail(row),
    });
    const mail = versionSharedMail({
      to: assessor!.email,
      workshopName: await repo.workshopName(tx, actor.workshopId),
      sharedByName: actor.name,
      formulaName: row.formulaName,
      versionNumber: row.versionNumber,
      link: `${appUrl}/assessments`,
    });
    return { created: true, share: toShareRecord(row, actor), mail };
  });
  if ('mail' in done && done.mail) {
    const mail = done.mail;
    runAfterAnswer('the shared-version mail', () => mailer.send(mail));
  }
  return { created: done.created, share: done.share };
}

/** Revokes a live share: the assessor no longer sees the version nor its assessment. */
export async function unshareVersion(db: Database, actor: AuthUser, id: string) {
  await db.transaction(async (tx) => {
    const row = await repo.findShare(tx, actor.workshopId, id);
    if (!row || row.revokedAt) throw notFound('That share');
    if (!(await repo.revokeShare(tx, actor.workshopId, id))) throw notFound('That share');
    await recordAudit(tx, actor, {
      action: 'assessment.unshared',
      subjectType: 'assessment_share',
      subjectId: id,
      detail: shareDetail(row),
    });
  });
}
