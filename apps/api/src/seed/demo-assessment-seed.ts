import { and, asc, count, eq, inArray } from 'drizzle-orm';
import {
  addDays,
  assessmentUpdateSchema,
  DEFAULT_BODY_WEIGHT_KG,
  findExposureDefault,
  formulaCreateSchema,
  labelRunCreateSchema,
  marketRecordInputSchema,
  materialCreateSchema,
  safetyNotesSchema,
  supplierCreateSchema,
  todayIso,
  type ExposureInput,
  type SubstanceInput,
} from '@batchproof/shared';
import {
  getAssessment,
  signAssessment,
  startAssessment,
  updateAssessment,
} from '../assessments/assessments-domain';
import { putSafetyNotes } from '../assessments/safety-notes-domain';
import { shareVersion } from '../assessments/shares-domain';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import type { Database } from '../db/database';
import {
  assessments,
  auditEvents,
  formulas,
  formulaVersions,
  labelRuns,
  marketRecords,
  memberships,
  users,
  workshops,
} from '../db/schema';
import { createFormula, newDraft, patchDraft, release } from '../formulas/formulas-domain';
import { findLines } from '../formulas/formulas-repository';
import { createRun } from '../labels/label-runs-domain';
import { startRendering } from '../labels/label-run-rendering';
import type { Mailer } from '../mail/mailer';
import { insertMaterials } from '../materials/materials-repository';
import { saveMarketRecord } from '../readiness/readiness-domain';
import { insertSupplier } from '../suppliers/suppliers-repository';
import { demoOwner } from './demo-workspace-seed';
import {
  butterDraft,
  DEMO_ASSESSOR_EMAIL,
  demoNotification,
  LOTION,
  lotionLabelRun,
  lotionNotes,
  lotionPartB,
  lotionSubstances,
  lotionV2,
  tidewrack,
  TIDEWRACK_STARTED,
  TIDEWRACK_WAITING,
  tidewrackFormulas,
  tidewrackMaterials,
} from './hollowmere-assessments';
import { demoMaterials, demoSuppliers, type DemoSupplierKey } from './hollowmere-materials';

/** Audit action that marks the demo assessments as seeded, so they are never seeded twice. */
export const DEMO_ASSESSMENTS_SEEDED = 'demo.assessments-seeded';

/** The e-mail addresses this seed creates accounts for (the demo password applies to them too). */
export const demoAssessmentEmails = [tidewrack.owner.email];

/** The seed shares versions without mailing anyone: a mailer that sends nothing. */
const quietMailer: Mailer = { send: () => Promise.resolve(), close: () => undefined };

/** How long a start waits for the seeded labels' PDF before leaving it to the first reader. */
const RENDER_WAIT_MS = 30_000;

const message = (error: unknown) => (error instanceof Error ? error.message : String(error));

/**
 * Seeds the demo's safety-assessment story once, after the workspace, labels and production: the
 * demo assessor also works for a second workshop (Tidewrack Soap Co., where they opened last), the
 * lotion's version 1 carries their signed assessment, version 2 is released with its safety notes
 * and EU labels and waits for its own, and another product has an EU notification reference.
 * Everything goes through the API's domain functions, so hashes and the signed packet are genuine.
 * Each part runs in its own savepoint: one that cannot be made (a demo whose lotion a user has
 * changed, an address already taken) is skipped and recorded in the marker; start goes on.
 */
export async function seedDemoAssessments(
  db: Database,
  workshopId: string,
  options: { now?: Date; appUrl?: string } = {},
): Promise<'seeded' | 'already-seeded'> {
  const now = options.now ?? new Date();
  const appUrl = options.appUrl ?? process.env['APP_URL'] ?? 'http://127.0.0.1:3000';
  const owner = await demoOwner(db, workshopId);
  if (!owner) return 'already-seeded';
  const outcome = await db.transaction(async (tx) => {
    await tx.execute('select pg_advisory_xact_lock(4242003)');
    const [marker] = await tx
      .select({ n: count() })
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.workshopId, workshopId),
          eq(auditEvents.action, DEMO_ASSESSMENTS_SEEDED),
        ),
      );
    if (marker!.n > 0) return undefined;
    const part = async <T>(work: (inner: Database) => Promise<T>) => {
      try {
        return await tx.transaction(work);
      } catch (error) {
        return { skipped: message(error) };
      }
    };
    const assessor = await assessorIn(tx, workshopId);
    const detail: Record<string, unknown> = {};
    detail['tidewrack'] = assessor
      ? await part((inner) => seedTidewrack(inner, owner, assessor, now, appUrl))
      : { skipped: 'the demo assessor is not a member of the demo workshop' };
    const lotion = assessor
      ? await part((inner) => seedLotion(inner, owner, assessor, now, appUrl))
      : { skipped: 'the demo assessor is not a member of the demo workshop' };
    detail['lotion'] = lotion;
    detail['notification'] = await part((inner) => seedNotification(inner, owner, now));
    await recordAudit(tx, owner, {
      action: DEMO_ASSESSMENTS_SEEDED,
      subjectType: 'workshop',
      subjectId: workshopId,
      detail,
    });
    return 'runId' in lotion ? lotion.runId : null;
  });
  if (outcome === undefined) return 'already-seeded';
  if (outcome) await renderLabels(db, workshopId, outcome, appUrl);
  return 'seeded';
}

/** The demo assessor as a member of `workshopId` with role assessor, or undefined. */
async function assessorIn(db: Database, workshopId: string): Promise<AuthUser | undefined> {
  const [row] = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(
      and(
        eq(memberships.workshopId, workshopId),
        eq(memberships.role, 'assessor'),
        eq(users.email, DEMO_ASSESSOR_EMAIL),
      ),
    );
  return row && { ...row, workshopId, role: 'assessor' };
}

/** Shares a released version with the assessor and starts the assessment as them. */
async function shareAndStart(
  db: Database,
  owner: AuthUser,
  assessor: AuthUser,
  versionId: string,
  appUrl: string,
) {
  const { share } = await shareVersion(db, quietMailer, appUrl, owner, {
    versionId,
    assessorId: assessor.id,
  });
  return startAssessment(db, assessor, { shareId: share.id });
}

/** The assessor's entries for the packet's substances that have one, in the packet's order. */
function substancesFor(
  packetKeys: string[],
  entries: Record<string, Omit<SubstanceInput, 'substanceKey'>>,
): SubstanceInput[] {
  return packetKeys.filter((k) => k in entries).map((k) => ({ substanceKey: k, ...entries[k]! }));
}

/** A shipped exposure default, as the assessor picks it. */
function presetExposure(key: string): ExposureInput {
  const preset = findExposureDefault(key);
  if (!preset) throw new Error(`no exposure default '${key}'`);
  return {
    presetKey: preset.key,
    dailyAmountGrams: preset.dailyAmountGrams,
    retentionFactor: preset.retentionFactor,
    bodyWeightKg: DEFAULT_BODY_WEIGHT_KG,
    source: preset.source,
  };
}

/**
 * Tidewrack Soap Co.: its owner (the demo password, copied from the demo owner's account), the
 * demo assessor as a member who worked there last, two released products, one shared and started
 * (a draft), one shared and waiting.
 */
async function seedTidewrack(
  tx: Database,
  hollowmereOwner: AuthUser,
  assessor: AuthUser,
  now: Date,
  appUrl: string,
) {
  const [taken] = await tx
    .select({ n: count() })
    .from(users)
    .where(eq(users.email, tidewrack.owner.email));
  const [named] = await tx
    .select({ n: count() })
    .from(workshops)
    .where(eq(workshops.name, tidewrack.name));
  if (taken!.n > 0 || named!.n > 0) throw new Error(`${tidewrack.name} or its owner exists`);
  const [{ passwordHash }] = (await tx
    .select({ passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.id, hollowmereOwner.id))) as [{ passwordHash: string }];
  const [workshop] = await tx
    .insert(workshops)
    .values({ name: tidewrack.name, address: tidewrack.address })
    .returning({ id: workshops.id });
  const [user] = await tx
    .insert(users)
    .values({ ...tidewrack.owner, passwordHash })
    .returning({ id: users.id });
  const workshopId = workshop!.id;
  await tx.insert(memberships).values([
    { workshopId, userId: user!.id, role: 'owner', lastActiveAt: addMinutes(now, -60) },
    // The assessor worked here last: signing in opens Tidewrack; Hollowmere is one switch away.
    { workshopId, userId: assessor.id, role: 'assessor', lastActiveAt: now },
  ]);
  const owner: AuthUser = { id: user!.id, workshopId, role: 'owner', ...tidewrack.owner };
  const assessorHere: AuthUser = { ...assessor, workshopId };

  const supplierIds = new Map<DemoSupplierKey, string>();
  for (const key of new Set(tidewrackMaterials.map((m) => demoMaterials[m].supplier))) {
    supplierIds.set(
      key,
      await insertSupplier(tx, workshopId, supplierCreateSchema.parse(demoSuppliers[key])),
    );
  }
  const ids = await insertMaterials(
    tx,
    workshopId,
    tidewrackMaterials.map((key) => {
      const { supplier, ...m } = demoMaterials[key];
      return materialCreateSchema.parse({ ...m, supplierId: supplierIds.get(supplier) });
    }),
  );
  const materialId = new Map(tidewrackMaterials.map((key, i) => [key, ids[i]!]));
  const versionIds = new Map<string, string>();
  for (const f of tidewrackFormulas) {
    const created = await createFormula(
      tx,
      owner,
      formulaCreateSchema.parse({
        name: f.name,
        productType: f.productType,
        notes: f.notes,
        draft: {
          lines: f.lines.map(([key, grams]) => ({ materialId: materialId.get(key), grams })),
          profile: f.profile,
          notes: null,
        },
      }),
    );
    const released = await release(tx, owner, created.id, 1, {});
    versionIds.set(f.name, released.id);
  }
  const started = await shareAndStart(
    tx,
    owner,
    assessorHere,
    versionIds.get(TIDEWRACK_STARTED)!,
    appUrl,
  );
  await updateAssessment(
    tx,
    assessorHere,
    started.id,
    assessmentUpdateSchema.parse({
      exposure: presetExposure('body-lotion'),
      substances: substancesFor(
        started.packet.substances.map((s) => s.key),
        butterDraft.substances,
      ),
      partB: butterDraft.partB,
    }),
  );
  await shareVersion(tx, quietMailer, appUrl, owner, {
    versionId: versionIds.get(TIDEWRACK_WAITING)!,
    assessorId: assessor.id,
  });
  return { workshopId, formulas: tidewrackFormulas.map((f) => f.name), draft: started.id };
}

const addMinutes = (date: Date, minutes: number) => new Date(date.getTime() + minutes * 60_000);

/**
 * The lotion: safety notes and a signed assessment of version 1 (signed three weeks before the
 * seed), then version 2 with a little less fragrance, released, with its own notes and EU labels.
 * Only on the lotion as the workspace seed made it (version 1 released, nothing assessed).
 */
async function seedLotion(
  tx: Database,
  owner: AuthUser,
  assessor: AuthUser,
  now: Date,
  appUrl: string,
) {
  const { workshopId } = owner;
  const [lotion] = await tx
    .select({ id: formulas.id })
    .from(formulas)
    .where(and(eq(formulas.workshopId, workshopId), eq(formulas.name, LOTION)));
  if (!lotion) throw new Error(`no formula named ${LOTION}`);
  const versions = await tx
    .select({
      id: formulaVersions.id,
      number: formulaVersions.number,
      state: formulaVersions.state,
    })
    .from(formulaVersions)
    .where(eq(formulaVersions.formulaId, lotion.id))
    .orderBy(asc(formulaVersions.number));
  const [assessed] = await tx
    .select({ n: count() })
    .from(assessments)
    .where(
      inArray(
        assessments.versionId,
        versions.map((v) => v.id),
      ),
    );
  const v1 = versions[0];
  if (versions.length !== 1 || v1?.state !== 'released' || assessed!.n > 0)
    throw new Error(`${LOTION} has changed since it was seeded`);

  const signedAt = addMinutes(now, -21 * 24 * 60);
  await putSafetyNotes(tx, owner, lotion.id, 1, safetyNotesSchema.parse(lotionNotes(1)));
  const started = await shareAndStart(tx, owner, assessor, v1.id, appUrl);
  await updateAssessment(
    tx,
    assessor,
    started.id,
    assessmentUpdateSchema.parse({
      exposure: presetExposure('body-lotion'),
      substances: substancesFor(
        started.packet.substances.map((s) => s.key),
        lotionSubstances,
      ),
      partB: lotionPartB,
    }),
  );
  const read = await getAssessment(tx, assessor, started.id);
  const signed = await signAssessment(
    tx,
    assessor,
    started.id,
    { contentHash: read.contentHash, confirm: true },
    signedAt,
  );

  await newDraft(tx, owner, lotion.id, 1);
  const v2 = versions.length + 1;
  const draft = await tx
    .select({ id: formulaVersions.id })
    .from(formulaVersions)
    .where(and(eq(formulaVersions.formulaId, lotion.id), eq(formulaVersions.number, v2)));
  const names = new Map(
    Object.entries(lotionV2.changes).map(([key, delta]) => [
      demoMaterials[key as keyof typeof lotionV2.changes].tradeName,
      delta,
    ]),
  );
  const lines = (await findLines(tx, workshopId, draft[0]!.id)).map((l) => ({
    materialId: l.materialId,
    grams: l.grams + (names.get(l.materialName) ?? 0),
    substitutes: l.substitutes.map((s) => s.materialId),
  }));
  await patchDraft(tx, owner, lotion.id, v2, { lines, notes: lotionV2.notes });
  await release(tx, owner, lotion.id, v2, {});
  await putSafetyNotes(tx, owner, lotion.id, v2, safetyNotesSchema.parse(lotionNotes(2)));
  const run = await createRun(
    tx,
    owner,
    labelRunCreateSchema.parse({ formulaId: lotion.id, version: v2, ...lotionLabelRun }),
    appUrl,
    now,
  );
  return { signed: signed.id, contentHash: signed.contentHash, released: v2, runId: run.id };
}

/** An EU notification reference for another demo product (never over one a user recorded). */
async function seedNotification(tx: Database, owner: AuthUser, now: Date) {
  const [formula] = await tx
    .select({ id: formulas.id })
    .from(formulas)
    .where(
      and(eq(formulas.workshopId, owner.workshopId), eq(formulas.name, demoNotification.formula)),
    );
  if (!formula) throw new Error(`no formula named ${demoNotification.formula}`);
  const [recorded] = await tx
    .select({ n: count() })
    .from(marketRecords)
    .where(and(eq(marketRecords.formulaId, formula.id), eq(marketRecords.kind, 'eu-notification')));
  if (recorded!.n > 0) throw new Error('an EU notification is already recorded');
  const record = await saveMarketRecord(
    tx,
    owner,
    formula.id,
    'eu-notification',
    marketRecordInputSchema.parse({
      ...demoNotification.record,
      recordedOn: addDays(todayIso(now), -demoNotification.daysAgo),
    }),
  );
  return { formula: demoNotification.formula, reference: record.reference };
}

/**
 * Makes the seeded run's PDF now, as the print route does once its run is committed, and waits a
 * while for it: labels count as printed once their PDF is made. A start that cannot wait leaves
 * the run `rendering`; the first read of the run starts it again.
 */
async function renderLabels(db: Database, workshopId: string, runId: string, appUrl: string) {
  startRendering(db, workshopId, runId, appUrl);
  const until = Date.now() + RENDER_WAIT_MS;
  while (Date.now() < until) {
    const [run] = await db
      .select({ status: labelRuns.status })
      .from(labelRuns)
      .where(and(eq(labelRuns.workshopId, workshopId), eq(labelRuns.id, runId)));
    if (run?.status !== 'rendering') return;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
