import {
  partBSchema,
  type AssessmentCreate,
  type AssessmentDetail,
  type AssessmentList,
  type AssessmentSign,
  type AssessmentSummary,
  type AssessmentUpdate,
  type SafetyPacket,
} from '@batchproof/shared';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import { AppError, conflict, notFound } from '../core/app-error';
import type { Database } from '../db/database';
import * as repo from './assessments-repository';
import { loadSafetyPacket, packetHash, renderPacketPdf, type AssessmentForPacket } from './packet';
import { toShareRecord } from './shares-domain';

const THAT = 'That assessment';

export const signedRefusal = () =>
  new AppError(
    409,
    'assessment_signed',
    'This assessment is signed and can no longer change. Share the new version and assess it.',
  );

/** Whether `err` is the database trigger refusing a change of a signed assessment (P0001). */
function isSignedTrigger(err: unknown): boolean {
  for (let e = err, depth = 0; e && typeof e === 'object' && depth < 5; depth++) {
    if ((e as { code?: unknown }).code === 'P0001') return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

/**
 * Runs a write to an assessment row. The routes check the status first; the trigger on
 * `assessments` is the last line of defence, and its refusal answers the same 409.
 */
export async function writeUnlessSigned(work: () => Promise<void>) {
  try {
    await work();
  } catch (err) {
    if (isSignedTrigger(err)) throw signedRefusal();
    throw err;
  }
}

function toSummary(row: repo.AssessmentRow): AssessmentSummary {
  return {
    id: row.id,
    formulaId: row.formulaId,
    formulaName: row.formulaName,
    versionId: row.versionId,
    versionNumber: row.versionNumber,
    status: row.status,
    assessorName: row.assessorName,
    signedAt: row.signedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
  };
}

const forPacket = (row: repo.AssessmentRow): AssessmentForPacket => ({
  id: row.id,
  versionId: row.versionId,
  status: row.status,
  assessorName: row.assessorName,
  exposure: row.exposure ?? null,
  substances: row.substances,
  partB: row.partB,
  signedAt: row.signedAt,
  signedByName: row.signedByName,
  contentHash: row.contentHash,
});

/**
 * The assessment, if the caller may see it: the workshop's members see every one; an assessor
 * only their own, and only while the version is shared with them. Anything else is not found.
 */
async function visibleAssessment(db: Database, actor: AuthUser, id: string, lock = false) {
  const row = await repo.findAssessment(db, actor.workshopId, id, lock);
  if (!row) throw notFound(THAT);
  if (actor.role === 'assessor') {
    const own = row.assessorId === actor.id;
    if (!own || !(await repo.hasLiveShare(db, actor.workshopId, row.versionId, actor.id))) {
      throw notFound(THAT);
    }
  }
  return row;
}

/** A change is the assessor's who owns it; another assessor is not told it exists. */
async function ownAssessmentForChange(db: Database, actor: AuthUser, id: string) {
  const row = await visibleAssessment(db, actor, id, true);
  if (row.assessorId !== actor.id) throw notFound(THAT);
  if (row.status === 'signed') throw signedRefusal();
  return row;
}

/** A signed assessment's packet as signed; a draft's as it is now. */
async function packetOf(db: Database, actor: AuthUser, row: repo.AssessmentRow) {
  if (row.status === 'signed' && row.signedPacket && row.contentHash) {
    return { packet: row.signedPacket, contentHash: row.contentHash };
  }
  const packet = await loadSafetyPacket(db, actor.workshopId, forPacket(row));
  return { packet, contentHash: packetHash(packet) };
}

async function toDetail(
  db: Database,
  actor: AuthUser,
  row: repo.AssessmentRow,
  built?: { packet: SafetyPacket; contentHash: string },
): Promise<AssessmentDetail> {
  const { packet, contentHash } = built ?? (await packetOf(db, actor, row));
  return {
    id: row.id,
    status: row.status,
    formulaId: row.formulaId,
    versionId: row.versionId,
    versionNumber: row.versionNumber,
    exposure: row.exposure ?? null,
    substances: row.substances,
    partB: row.partB,
    packet,
    contentHash,
    canEdit: row.status === 'draft' && actor.role === 'assessor' && row.assessorId === actor.id,
  };
}

/** The assessments the caller may see, and the live shares waiting to be accepted. */
export async function listAssessments(db: Database, actor: AuthUser): Promise<AssessmentList> {
  const assessor = actor.role === 'assessor' ? actor.id : undefined;
  const [rows, waiting] = await Promise.all([
    repo.listAssessments(db, actor.workshopId, assessor),
    repo.listLiveShares(db, actor.workshopId, { assessorId: assessor, waitingOnly: true }),
  ]);
  return {
    items: rows.map(toSummary),
    waiting: waiting.map((s) => toShareRecord(s, actor)),
  };
}

export async function getAssessment(db: Database, actor: AuthUser, id: string) {
  return toDetail(db, actor, await visibleAssessment(db, actor, id));
}

/**
 * The assessor accepts a share of theirs and starts the version's assessment: no exposure, no
 * substances, Part B empty. One assessment per version.
 */
export async function startAssessment(db: Database, actor: AuthUser, input: AssessmentCreate) {
  return db.transaction(async (tx) => {
    const share = await repo.findShare(tx, actor.workshopId, input.shareId);
    if (!share || share.revokedAt || share.assessorId !== actor.id) {
      throw notFound('That shared version');
    }
    if (await repo.assessmentOfVersion(tx, actor.workshopId, share.versionId)) {
      throw conflict('This version already has an assessment.');
    }
    const id = await repo.insertAssessment(tx, {
      workshopId: actor.workshopId,
      versionId: share.versionId,
      shareId: share.id,
      assessorId: actor.id,
      assessorName: actor.name,
      partB: partBSchema.parse({}),
    });
    await recordAudit(tx, actor, {
      action: 'assessment.started',
      subjectType: 'assessment',
      subjectId: id,
      detail: { formulaName: share.formulaName, versionNumber: share.versionNumber },
    });
    return getAssessment(tx, actor, id);
  });
}

/** Substance keys that are not among the packet's substances, as field errors. */
function unknownSubstances(packet: SafetyPacket, input: AssessmentUpdate) {
  const known = new Set(packet.substances.map((s) => s.key));
  const fieldErrors: Record<string, string[]> = {};
  input.substances.forEach((s, i) => {
    if (!known.has(s.substanceKey)) {
      fieldErrors[`substances.${i}.substanceKey`] = [
        'Choose one of the substances of this version',
      ];
    }
  });
  return fieldErrors;
}

/** The assessor saves their draft: exposure, substances and Part B as typed. */
export async function updateAssessment(
  db: Database,
  actor: AuthUser,
  id: string,
  input: AssessmentUpdate,
) {
  return db.transaction(async (tx) => {
    const found = await ownAssessmentForChange(tx, actor, id);
    // One packet, built with the new inputs: it checks the substance keys and is the answer.
    const row = {
      ...found,
      exposure: input.exposure,
      substances: input.substances,
      partB: input.partB,
    };
    const packet = await loadSafetyPacket(tx, actor.workshopId, forPacket(row));
    const fieldErrors = unknownSubstances(packet, input);
    if (Object.keys(fieldErrors).length > 0) {
      throw new AppError(400, 'validation_failed', 'Some fields need attention.', fieldErrors);
    }
    await writeUnlessSigned(() =>
      repo.updateAssessment(tx, actor.workshopId, id, {
        exposure: input.exposure,
        substances: input.substances,
        partB: input.partB,
      }),
    );
    await recordAudit(tx, actor, {
      action: 'assessment.changed',
      subjectType: 'assessment',
      subjectId: id,
      detail: { formulaName: row.formulaName, versionNumber: row.versionNumber },
    });
    return toDetail(tx, actor, row, { packet, contentHash: packetHash(packet) });
  });
}

/** What signing needs that the draft may still lack, as field errors. */
function missingForSigning(row: repo.AssessmentRow) {
  const fieldErrors: Record<string, string[]> = {};
  if (!row.exposure) fieldErrors.exposure = ['Enter the exposure to the product before signing'];
  if (!row.partB.conclusion.trim()) {
    fieldErrors['partB.conclusion'] = ['Write the assessment conclusion before signing'];
  }
  if (!row.partB.credentials.trim()) {
    fieldErrors['partB.credentials'] = ['State your credentials before signing'];
  }
  return fieldErrors;
}

/**
 * Signs the assessment: the hash the assessor quotes must be the packet's hash now (else 409
 * `packet_changed`), and the packet is stored as signed, with who and when, so the signed PDF
 * shows exactly what the hash covers. The row is locked from then on.
 */
export async function signAssessment(
  db: Database,
  actor: AuthUser,
  id: string,
  input: AssessmentSign,
  now = new Date(),
) {
  return db.transaction(async (tx) => {
    const row = await ownAssessmentForChange(tx, actor, id);
    const fieldErrors = missingForSigning(row);
    if (Object.keys(fieldErrors).length > 0) {
      throw new AppError(
        400,
        'validation_failed',
        'The assessment is not ready to sign.',
        fieldErrors,
      );
    }
    // Status, signer, time and hash are left out of the hash, so the packet built as signed
    // hashes as the draft the assessor read.
    const asSigned = {
      ...forPacket(row),
      status: 'signed' as const,
      signedAt: now,
      signedByName: actor.name,
    };
    const packet = await loadSafetyPacket(tx, actor.workshopId, asSigned, now);
    const contentHash = packetHash(packet);
    if (contentHash !== input.contentHash) {
      throw new AppError(
        409,
        'packet_changed',
        'The packet has changed since you read it. Reload it, read the changes and sign again.',
      );
    }
    const signedPacket: SafetyPacket = {
      ...packet,
      assessment: {
        ...packet.assessment,
        status: 'signed',
        signedAt: now.toISOString(),
        signedByName: actor.name,
        contentHash,
      },
    };
    await writeUnlessSigned(() =>
      repo.updateAssessment(tx, actor.workshopId, id, {
        status: 'signed',
        signedAt: now,
        signedBy: actor.id,
        signedByName: actor.name,
        contentHash,
        signedPacket,
      }),
    );
    await recordAudit(tx, actor, {
      action: 'assessment.signed',
      subjectType: 'assessment',
      subjectId: id,
      detail: { formulaName: row.formulaName, versionNumber: row.versionNumber, contentHash },
    });
    return getAssessment(tx, actor, id);
  });
}

/**
 * The packet as a PDF: a signed assessment's packet as signed; a draft's packet as it is now,
 * marked DRAFT – NOT SIGNED on every page.
 */
export async function assessmentPdf(db: Database, actor: AuthUser, id: string) {
  const row = await visibleAssessment(db, actor, id);
  const { packet } = await packetOf(db, actor, row);
  const signed = row.status === 'signed';
  const pdf = await renderPacketPdf(packet, { draft: !signed });
  const fileName = `Safety assessment ${row.formulaName} v${row.versionNumber}${signed ? '' : ' DRAFT'}.pdf`;
  return { pdf, fileName };
}
