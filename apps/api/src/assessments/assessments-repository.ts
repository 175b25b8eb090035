import { and, desc, eq, isNull, sql, type SQL } from 'drizzle-orm';
import type { PartB, SafetyNotes, SafetyPacket } from '@batchproof/shared';
import type { Database } from '../db/database';
import {
  assessments,
  assessmentShares,
  formulas,
  formulaVersions,
  memberships,
  safetyNotes,
  users,
  workshops,
} from '../db/schema';

/** A person's name, looked up per returned row. */
const nameOf = (userId: SQL | typeof assessmentShares.sharedBy) =>
  sql<string | null>`(select ${users.name} from ${users} where ${users.id} = ${userId})`;

const live = isNull(assessmentShares.revokedAt);

/** Join condition: the version a row names (same workshop). */
const versionNamedBy = (
  workshopId: typeof assessmentShares.workshopId | typeof assessments.workshopId,
  versionId: typeof assessmentShares.versionId | typeof assessments.versionId,
) => and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.id, versionId));

/** Join condition: the formula of the joined version. */
const formulaOfVersion = and(
  eq(formulas.workshopId, formulaVersions.workshopId),
  eq(formulas.id, formulaVersions.formulaId),
);

/** The live share of a version with an assessor (the access every assessor read rests on). */
export const liveShareOf = (versionId: SQL | typeof assessments.versionId, assessorId: string) =>
  sql<boolean>`exists (select 1 from ${assessmentShares} s
    where s.workshop_id = ${assessments.workshopId} and s.version_id = ${versionId}
      and s.assessor_id = ${assessorId} and s.revoked_at is null)`;

// ---------------------------------------------------------------------------------------------
// Shares

const shareColumns = {
  id: assessmentShares.id,
  formulaId: formulas.id,
  formulaName: formulas.name,
  versionId: assessmentShares.versionId,
  versionNumber: formulaVersions.number,
  versionState: formulaVersions.state,
  assessorId: assessmentShares.assessorId,
  assessorName: sql<string>`coalesce(${nameOf(sql`${assessmentShares.assessorId}`)}, '')`,
  sharedByName: nameOf(assessmentShares.sharedBy),
  sharedAt: assessmentShares.createdAt,
  revokedAt: assessmentShares.revokedAt,
  assessmentId: assessments.id,
  assessmentStatus: assessments.status,
  assessmentAssessorId: assessments.assessorId,
};
export type ShareRow = NonNullable<Awaited<ReturnType<typeof findShare>>>;

const selectShares = (db: Database) =>
  db
    .select(shareColumns)
    .from(assessmentShares)
    .innerJoin(
      formulaVersions,
      versionNamedBy(assessmentShares.workshopId, assessmentShares.versionId),
    )
    .innerJoin(formulas, formulaOfVersion)
    .leftJoin(
      assessments,
      and(
        eq(assessments.workshopId, assessmentShares.workshopId),
        eq(assessments.versionId, assessmentShares.versionId),
      ),
    );

/**
 * The workshop's live shares, newest first: of one assessor when named, of one version when
 * named, only those whose version has no assessment yet when `waitingOnly`.
 */
export async function listLiveShares(
  db: Database,
  workshopId: string,
  filter: { assessorId?: string; versionId?: string; waitingOnly?: boolean },
) {
  const conditions: (SQL | undefined)[] = [eq(assessmentShares.workshopId, workshopId), live];
  if (filter.assessorId) conditions.push(eq(assessmentShares.assessorId, filter.assessorId));
  if (filter.versionId) conditions.push(eq(assessmentShares.versionId, filter.versionId));
  if (filter.waitingOnly) conditions.push(isNull(assessments.id));
  return selectShares(db)
    .where(and(...conditions))
    .orderBy(desc(assessmentShares.createdAt), assessmentShares.id);
}

/** One share of the workshop, live or revoked. */
export async function findShare(db: Database, workshopId: string, id: string) {
  const [row] = await selectShares(db).where(
    and(eq(assessmentShares.workshopId, workshopId), eq(assessmentShares.id, id)),
  );
  return row;
}

/** The live share of a version with an assessor, if any. */
export async function findLiveShare(
  db: Database,
  workshopId: string,
  versionId: string,
  assessorId: string,
) {
  const [row] = await selectShares(db).where(
    and(
      eq(assessmentShares.workshopId, workshopId),
      eq(assessmentShares.versionId, versionId),
      eq(assessmentShares.assessorId, assessorId),
      live,
    ),
  );
  return row;
}

export async function insertShare(
  db: Database,
  values: { workshopId: string; versionId: string; assessorId: string; sharedBy: string },
) {
  const [row] = await db
    .insert(assessmentShares)
    .values(values)
    .returning({ id: assessmentShares.id });
  return row!.id;
}

/** Revokes a live share; false when it was not live. */
export async function revokeShare(db: Database, workshopId: string, id: string) {
  const rows = await db
    .update(assessmentShares)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(assessmentShares.workshopId, workshopId), eq(assessmentShares.id, id), live))
    .returning({ id: assessmentShares.id });
  return rows.length > 0;
}

/** The role of a person in the workshop, with their name and e-mail, if they are a member. */
export async function findMember(db: Database, workshopId: string, userId: string) {
  const [row] = await db
    .select({ role: memberships.role, name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workshopId, workshopId), eq(memberships.userId, userId)));
  return row;
}

/** A version of the workshop by id, with its formula's name. */
export async function findVersionById(db: Database, workshopId: string, versionId: string) {
  const [row] = await db
    .select({
      id: formulaVersions.id,
      number: formulaVersions.number,
      state: formulaVersions.state,
      formulaId: formulaVersions.formulaId,
      formulaName: formulas.name,
    })
    .from(formulaVersions)
    .innerJoin(formulas, formulaOfVersion)
    .where(and(eq(formulaVersions.workshopId, workshopId), eq(formulaVersions.id, versionId)));
  return row;
}

/** A version of the workshop by its formula and number. */
export async function findVersionByNumber(
  db: Database,
  workshopId: string,
  formulaId: string,
  number: number,
) {
  const [row] = await db
    .select({ id: formulaVersions.id })
    .from(formulaVersions)
    .where(
      and(
        eq(formulaVersions.workshopId, workshopId),
        eq(formulaVersions.formulaId, formulaId),
        eq(formulaVersions.number, number),
      ),
    );
  return row;
}

export async function workshopName(db: Database, workshopId: string) {
  const [row] = await db
    .select({ name: workshops.name })
    .from(workshops)
    .where(eq(workshops.id, workshopId));
  return row?.name ?? '';
}

// ---------------------------------------------------------------------------------------------
// Assessments

const assessmentColumns = {
  id: assessments.id,
  versionId: assessments.versionId,
  shareId: assessments.shareId,
  assessorId: assessments.assessorId,
  assessorName: assessments.assessorName,
  status: assessments.status,
  exposure: assessments.exposure,
  substances: assessments.substances,
  partB: assessments.partB,
  signedAt: assessments.signedAt,
  signedByName: assessments.signedByName,
  contentHash: assessments.contentHash,
  signedPacket: assessments.signedPacket,
  updatedAt: assessments.updatedAt,
  formulaId: formulaVersions.formulaId,
  formulaName: formulas.name,
  versionNumber: formulaVersions.number,
};
export type AssessmentRow = NonNullable<Awaited<ReturnType<typeof findAssessment>>>;

const selectAssessments = (db: Database) =>
  db
    .select(assessmentColumns)
    .from(assessments)
    .innerJoin(formulaVersions, versionNamedBy(assessments.workshopId, assessments.versionId))
    .innerJoin(formulas, formulaOfVersion);

/**
 * The workshop's assessments, latest change first. For an assessor (`assessorId`): only theirs
 * whose version is still shared with them.
 */
export async function listAssessments(db: Database, workshopId: string, assessorId?: string) {
  const conditions: (SQL | undefined)[] = [eq(assessments.workshopId, workshopId)];
  if (assessorId) {
    conditions.push(eq(assessments.assessorId, assessorId));
    conditions.push(liveShareOf(assessments.versionId, assessorId));
  }
  return selectAssessments(db)
    .where(and(...conditions))
    .orderBy(desc(assessments.updatedAt), assessments.id);
}

/** One assessment of the workshop; `lock` takes its row lock for a change. */
export async function findAssessment(db: Database, workshopId: string, id: string, lock = false) {
  const query = selectAssessments(db).where(
    and(eq(assessments.workshopId, workshopId), eq(assessments.id, id)),
  );
  const [row] = lock ? await query.for('update', { of: assessments }) : await query;
  return row;
}

/** Whether the assessor may still see the assessment's version (a live share of it). */
export async function hasLiveShare(
  db: Database,
  workshopId: string,
  versionId: string,
  assessorId: string,
) {
  return (await findLiveShare(db, workshopId, versionId, assessorId)) !== undefined;
}

/** The assessment of a version, if any. */
export async function assessmentOfVersion(db: Database, workshopId: string, versionId: string) {
  const [row] = await db
    .select({ id: assessments.id, status: assessments.status })
    .from(assessments)
    .where(and(eq(assessments.workshopId, workshopId), eq(assessments.versionId, versionId)));
  return row;
}

export async function insertAssessment(
  db: Database,
  values: {
    workshopId: string;
    versionId: string;
    shareId: string;
    assessorId: string;
    assessorName: string;
    partB: PartB;
  },
) {
  const [row] = await db
    .insert(assessments)
    .values({ ...values, exposure: null, substances: [] })
    .returning({ id: assessments.id });
  return row!.id;
}

export async function updateAssessment(
  db: Database,
  workshopId: string,
  id: string,
  values: Partial<{
    exposure: (typeof assessments.$inferInsert)['exposure'];
    substances: (typeof assessments.$inferInsert)['substances'];
    partB: PartB;
    status: 'signed';
    signedAt: Date;
    signedBy: string;
    signedByName: string;
    contentHash: string;
    signedPacket: SafetyPacket;
  }>,
) {
  await db
    .update(assessments)
    .set({ ...values, updatedAt: sql`now()` })
    .where(and(eq(assessments.workshopId, workshopId), eq(assessments.id, id)));
}

// ---------------------------------------------------------------------------------------------
// Safety notes

export async function findSafetyNotes(db: Database, workshopId: string, versionId: string) {
  const [row] = await db
    .select({
      notes: safetyNotes.notes,
      updatedAt: safetyNotes.updatedAt,
      updatedByName: nameOf(sql`${safetyNotes.updatedBy}`),
    })
    .from(safetyNotes)
    .where(and(eq(safetyNotes.workshopId, workshopId), eq(safetyNotes.versionId, versionId)));
  return row;
}

export async function upsertSafetyNotes(
  db: Database,
  values: { workshopId: string; versionId: string; notes: SafetyNotes; updatedBy: string },
) {
  await db
    .insert(safetyNotes)
    .values(values)
    .onConflictDoUpdate({
      target: [safetyNotes.workshopId, safetyNotes.versionId],
      set: { notes: values.notes, updatedBy: values.updatedBy, updatedAt: sql`now()` },
    });
}
