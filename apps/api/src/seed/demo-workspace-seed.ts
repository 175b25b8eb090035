import { and, asc, count, eq } from 'drizzle-orm';
import {
  addDays,
  todayIso,
  formulaCreateSchema,
  lotCreateSchema,
  materialCreateSchema,
  supplierCreateSchema,
} from '@batchproof/shared';
import { seedDemoLabels } from './demo-label-seed';
import { demoFormulas } from './hollowmere-formulas';
import {
  demoLots,
  demoMaterials,
  demoSuppliers,
  type DemoMaterialKey,
} from './hollowmere-materials';
import { recordAudit } from '../audit/audit-log';
import type { AuthUser } from '../auth/authenticate';
import type { Database } from '../db/database';
import { auditEvents, materials, memberships, users } from '../db/schema';
import { createFormula, release } from '../formulas/formulas-domain';
import { insertLot } from '../lots/lots-repository';
import { insertMaterials } from '../materials/materials-repository';
import { insertSupplier } from '../suppliers/suppliers-repository';

/** The workshop's owner, as the seeds act: what they record is the owner's, as if entered. */
export async function demoOwner(db: Database, workshopId: string): Promise<AuthUser | undefined> {
  const [owner] = await db
    .select({ id: users.id, name: users.name, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workshopId, workshopId), eq(memberships.role, 'owner')))
    .orderBy(asc(memberships.createdAt))
    .limit(1);
  if (!owner) return undefined;
  return { id: owner.id, workshopId, role: 'owner', name: owner.name, email: owner.email };
}

/** Audit action that marks the demo workspace as seeded, so it is never seeded twice. */
const SEEDED = 'demo.workspace-seeded';
const daysBefore = (now: Date, days: number) => addDays(todayIso(now), -days);

/**
 * Seeds the demo workshop's suppliers, materials, lots and formulas once. Safe on every start:
 * it does nothing when the marker event exists, and it never adds to a workshop that already
 * has materials of its own (it only records the marker then). Releases go through the same
 * domain code as the API, so a formula with blocking findings stays a draft.
 */
export async function seedDemoWorkspace(
  db: Database,
  workshopId: string,
  now = new Date(),
): Promise<'seeded' | 'already-seeded'> {
  const actor = await demoOwner(db, workshopId);
  if (!actor) return 'already-seeded';
  return db.transaction(async (tx) => {
    // Serialise two starts racing on the same fresh database.
    await tx.execute('select pg_advisory_xact_lock(4242001)');
    const [marker] = await tx
      .select({ n: count() })
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, workshopId), eq(auditEvents.action, SEEDED)));
    if (marker!.n > 0) return 'already-seeded';
    const [existing] = await tx
      .select({ n: count() })
      .from(materials)
      .where(eq(materials.workshopId, workshopId));
    const mark = (detail: Record<string, unknown>) =>
      recordAudit(tx, actor, {
        action: SEEDED,
        subjectType: 'workshop',
        subjectId: workshopId,
        detail,
      });
    if (existing!.n > 0) {
      await mark({ skipped: 'the workshop already had materials' });
      return 'already-seeded';
    }

    const supplierIds: Record<string, string> = {};
    for (const [key, s] of Object.entries(demoSuppliers)) {
      supplierIds[key] = await insertSupplier(tx, workshopId, supplierCreateSchema.parse(s));
    }
    const entries = Object.entries(demoMaterials) as [
      DemoMaterialKey,
      (typeof demoMaterials)[DemoMaterialKey],
    ][];
    const ids = await insertMaterials(
      tx,
      workshopId,
      entries.map(([, { supplier, ...m }]) =>
        materialCreateSchema.parse({ ...m, supplierId: supplierIds[supplier] }),
      ),
    );
    const materialIds = Object.fromEntries(entries.map(([key], i) => [key, ids[i]!])) as Record<
      DemoMaterialKey,
      string
    >;
    for (const { material, daysAgo, shelfDays, ...l } of demoLots) {
      const receivedOn = daysBefore(now, daysAgo);
      const expiresOn = shelfDays === null ? null : daysBefore(now, daysAgo - shelfDays);
      await insertLot(
        tx,
        workshopId,
        lotCreateSchema.parse({ ...l, materialId: materialIds[material], receivedOn, expiresOn }),
      );
    }
    const outcomes: Record<string, string> = {};
    for (const f of demoFormulas) {
      const input = formulaCreateSchema.parse({
        name: f.name,
        productType: f.productType,
        notes: f.notes,
        draft: {
          lines: f.lines.map(([key, grams, substitutes = []]) => ({
            materialId: materialIds[key],
            grams,
            substitutes: substitutes.map((k) => materialIds[k]),
          })),
          profile: f.profile,
          notes: null,
        },
      });
      const created = await createFormula(tx, actor, input);
      const blocks = await blockCount(tx, created.id);
      if (f.release && blocks === 0) {
        await release(tx, actor, created.id, 1, {});
        outcomes[f.name] = 'released';
      } else {
        outcomes[f.name] = `draft (${blocks} blocking)`;
      }
    }
    await seedDemoLabels(tx, workshopId);
    await mark({ formulas: outcomes });
    return 'seeded';
  });
}

async function blockCount(db: Database, formulaId: string) {
  const version = await db.query.formulaVersions.findFirst({
    where: (v, { and: all, eq: is }) => all(is(v.formulaId, formulaId), is(v.number, 1)),
  });
  return version?.blockCount ?? 0;
}
