import bcrypt from 'bcryptjs';
import { and, count, eq, inArray, sql } from 'drizzle-orm';
import request from 'supertest';
import {
  BUILT_IN_LABEL_STOCKS,
  labelAreas,
  missingLabelElements,
  readinessListSchema,
} from '@batchproof/shared';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { packetHash } from '../../apps/api/src/assessments/packet';
import {
  assessments,
  assessmentShares,
  auditEvents,
  formulas,
  formulaVersions,
  labelRuns,
  lots,
  marketRecords,
  materials,
  memberships,
  productIdentities,
  safetyNotes,
  users,
  workshops,
} from '../../apps/api/src/db/schema';
import {
  DEMO_ASSESSMENTS_SEEDED,
  seedDemoAssessments,
} from '../../apps/api/src/seed/demo-assessment-seed';
import { demoWorkshop } from '../../apps/api/src/seed/hollowmere';
import {
  DEMO_ASSESSOR_EMAIL,
  demoNotification,
  LOTION,
  tidewrack,
  TIDEWRACK_STARTED,
  TIDEWRACK_WAITING,
} from '../../apps/api/src/seed/hollowmere-assessments';
import { seedDemoLabels } from '../../apps/api/src/seed/demo-label-seed';
import { aLabelRun } from '../../fixtures/builders/label-run-builder';
import { bearer } from '../support/auth-header';
import { seedDemo } from '../../apps/api/src/seed/demo-seed';
import { seedDemoWorkspace } from '../../apps/api/src/seed/demo-workspace-seed';
import { demoMaterials } from '../../apps/api/src/seed/hollowmere-materials';
import { buildMaterial } from '../support/row-builders';
import { addMembership, buildWorkshop, tokenFor } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

const countOf = async (
  table: typeof materials | typeof lots | typeof formulas | typeof productIdentities,
  workshopId: string,
) =>
  (await h.handle.db.select({ n: count() }).from(table).where(eq(table.workshopId, workshopId)))[0]!
    .n;

describe('the demo workspace seed', () => {
  it('adds suppliers, 25+ materials, lots and five formulas once; the ultramarine bubble bar stays a draft', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    expect(await seedDemoWorkspace(h.handle.db, w.id)).toBe('seeded');
    expect(await countOf(materials, w.id)).toBeGreaterThanOrEqual(25);
    expect(await countOf(lots, w.id)).toBeGreaterThanOrEqual(20);
    const versions = await h.handle.db
      .select({
        name: formulas.name,
        state: formulaVersions.state,
        blocks: formulaVersions.blockCount,
        evaluation: formulaVersions.evaluation,
      })
      .from(formulaVersions)
      .innerJoin(formulas, eq(formulas.id, formulaVersions.formulaId))
      .where(eq(formulas.workshopId, w.id))
      .orderBy(formulas.name);
    expect(versions.map((v) => [v.name, v.state])).toEqual([
      ['Everyday Body Lotion', 'released'],
      ['Lavender Oat Bath Salts', 'released'],
      ['Midnight Bubble Bar', 'draft'],
      ['Orchard Fog Fizzer', 'released'],
      ['Rainfall Foaming Fizzer', 'released'],
    ]);
    const bar = versions.find((v) => v.name === 'Midnight Bubble Bar')!;
    // 21 CFR 73.2725: ultramarines are listed for externally applied cosmetics only; bath water reaches mucous membranes
    expect(
      bar.evaluation!.findings.some(
        (f) => f.severity === 'block' && f.market === 'US' && /77007|Ultramarine/i.test(f.subject),
      ),
    ).toBe(true);

    expect(await seedDemoWorkspace(h.handle.db, w.id)).toBe('already-seeded');
    expect(await countOf(formulas, w.id)).toBe(5);
  });

  it("spells the function as the UI does, 'colourant', in every material and blend component", () => {
    const functions = Object.values(demoMaterials).flatMap((m) => [
      ...(m.functions ?? []),
      ...(m.components ?? []).flatMap((c) => c.functions ?? []),
    ]);
    expect(functions).toContain('colourant');
    expect(functions.filter((f) => /color/i.test(f))).toEqual([]);
  });

  it('never adds to a workshop that already has materials of its own', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    await buildMaterial(h.handle.db, w.id);
    expect(await seedDemoWorkspace(h.handle.db, w.id)).toBe('already-seeded');
    expect(await countOf(materials, w.id)).toBe(1);
  });
});

describe('the demo workspace is ready to print labels', () => {
  it('has an address and a complete product identity for every released formula in each of its markets', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    expect(await seedDemoWorkspace(h.handle.db, w.id)).toBe('seeded');
    const [workshop] = await h.handle.db.select().from(workshops).where(eq(workshops.id, w.id));
    expect(workshop!.address).toMatch(/\d{5}/);
    const released = await h.handle.db
      .select({
        formulaId: formulas.id,
        name: formulas.name,
        profile: formulaVersions.profile,
        evaluation: formulaVersions.evaluation,
        identity: productIdentities.identity,
      })
      .from(formulaVersions)
      .innerJoin(formulas, eq(formulas.id, formulaVersions.formulaId))
      .leftJoin(productIdentities, eq(productIdentities.formulaId, formulas.id))
      .where(and(eq(formulas.workshopId, w.id), eq(formulaVersions.state, 'released')));
    expect(released).toHaveLength(4);
    for (const f of released) {
      expect(f.identity, f.name).not.toBeNull();
      const stock = BUILT_IN_LABEL_STOCKS.find((s) => s.key === 'letter-4x3.333in-6')!;
      for (const market of f.profile.markets) {
        const missing = missingLabelElements({
          market,
          evaluation: f.evaluation!,
          identity: f.identity!,
          workshop: { name: workshop!.name, address: workshop!.address },
          netQuantity: f.profile.netQuantity ?? null,
          lotCode: 'HB-0412',
          expiresOn: null,
          madeOn: '2026-01-15',
          areas: labelAreas(stock, 'single'),
        });
        expect(missing, `${f.name} ${market}`).toEqual([]);
      }
    }
    const fizzer = released.find((f) => f.name === 'Rainfall Foaming Fizzer')!;
    const res = await request(h.app)
      .post('/api/label-runs')
      .set(bearer(w.members.owner))
      .send(aLabelRun(fizzer.formulaId, { markets: ['US', 'EU'], stockId: 'letter-4x3.333in-6' }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });

  it('fills in the address and identities of a demo seeded before labels, never over what was entered', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    await seedDemoWorkspace(h.handle.db, w.id);
    await h.handle.db
      .update(workshops)
      .set({ address: 'Our own address' })
      .where(eq(workshops.id, w.id));
    await h.handle.db.delete(productIdentities).where(eq(productIdentities.workshopId, w.id));
    await seedDemoLabels(h.handle.db, w.id);
    const [workshop] = await h.handle.db.select().from(workshops).where(eq(workshops.id, w.id));
    expect(workshop!.address).toBe('Our own address');
    expect(await countOf(productIdentities, w.id)).toBe(5);
  });
});

describe('the demo seed on a later start', () => {
  it('checks the stored demo password without hashing it again; a changed password is hashed once', async () => {
    await seedDemo(h.handle.db, 'demo-password-as-started');
    const hash = vi.spyOn(bcrypt, 'hash');
    try {
      expect(await seedDemo(h.handle.db, 'demo-password-as-started')).toBe('unchanged');
      expect(hash).not.toHaveBeenCalled();
      expect(await seedDemo(h.handle.db, 'a-changed-demo-password')).toBe('updated');
      expect(hash).toHaveBeenCalledTimes(1);
    } finally {
      hash.mockRestore();
    }
  }, 60_000); // the first call seeds the whole demo (workspace, production, assessments, a labels PDF)
});

describe('the demo safety-assessment story', () => {
  const PASSWORD = 'demo-password-for-the-assessment-story';
  const db = () => h.handle.db;
  let hollowmereId: string;

  beforeAll(async () => {
    await seedDemo(db(), PASSWORD);
    const [w] = await db()
      .select({ id: workshops.id })
      .from(workshops)
      .where(eq(workshops.name, demoWorkshop.name));
    hollowmereId = w!.id;
  }, 60_000);

  /** Rows the story adds, counted across every workshop. */
  const tallies = async () => {
    const tables = {
      workshops,
      users,
      memberships,
      formulaVersions,
      assessmentShares,
      assessments,
      safetyNotes,
      labelRuns,
      marketRecords,
      auditEvents,
    };
    const out: Record<string, number> = {};
    for (const [name, table] of Object.entries(tables))
      out[name] = (await db().select({ n: count() }).from(table))[0]!.n;
    return out;
  };

  const lotionVersions = async () =>
    db()
      .select({
        id: formulaVersions.id,
        number: formulaVersions.number,
        state: formulaVersions.state,
      })
      .from(formulaVersions)
      .innerJoin(formulas, eq(formulas.id, formulaVersions.formulaId))
      .where(and(eq(formulas.workshopId, hollowmereId), eq(formulas.name, LOTION)))
      .orderBy(formulaVersions.number);

  it('makes the demo assessor an assessor of a second workshop too, where they worked last, so sign-in opens it', async () => {
    const rows = await db()
      .select({
        workshop: workshops.name,
        role: memberships.role,
        lastActiveAt: memberships.lastActiveAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .innerJoin(workshops, eq(workshops.id, memberships.workshopId))
      .where(eq(users.email, DEMO_ASSESSOR_EMAIL))
      .orderBy(sql`${memberships.lastActiveAt} desc nulls last`);
    expect(rows.map((r) => [r.workshop, r.role])).toEqual([
      [tidewrack.name, 'assessor'],
      [demoWorkshop.name, 'assessor'],
    ]);
    expect(rows[0]!.lastActiveAt).not.toBeNull();

    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: DEMO_ASSESSOR_EMAIL, password: PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.user.workshop.name).toBe(tidewrack.name);
    expect(res.body.user.memberships.map((m: { workshopName: string }) => m.workshopName)).toEqual([
      demoWorkshop.name,
      tidewrack.name,
    ]);
    // In Tidewrack they have one assessment started and one version waiting for them.
    const list = await request(h.app)
      .get('/api/assessments')
      .set('Authorization', `Bearer ${res.body.accessToken}`);
    expect(list.status).toBe(200);
    expect(
      list.body.items.map((a: { formulaName: string; status: string }) => [
        a.formulaName,
        a.status,
      ]),
    ).toEqual([[TIDEWRACK_STARTED, 'draft']]);
    expect(list.body.waiting.map((s: { formulaName: string }) => s.formulaName)).toEqual([
      TIDEWRACK_WAITING,
    ]);
  });

  it('lets the second workshop’s owner sign in with the demo password', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: tidewrack.owner.email, password: PASSWORD });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.user.workshop.name).toBe(tidewrack.name);
    expect(res.body.user.role).toBe('owner');
  });

  it('signs the lotion’s version 1 with a genuine hash of the stored packet; version 2 is released, unassessed, with notes and EU labels made', async () => {
    const versions = await lotionVersions();
    expect(versions.map((v) => [v.number, v.state])).toEqual([
      [1, 'superseded'],
      [2, 'released'],
    ]);
    const rows = await db()
      .select()
      .from(assessments)
      .where(
        inArray(
          assessments.versionId,
          versions.map((v) => v.id),
        ),
      );
    expect(rows).toHaveLength(1);
    const signed = rows[0]!;
    expect(signed.versionId).toBe(versions[0]!.id);
    expect(signed.status).toBe('signed');
    expect(signed.signedByName).toBe('Dr. Orla Finchley');
    expect(signed.signedAt!.getTime()).toBeLessThan(Date.now());
    expect(signed.contentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(packetHash(signed.signedPacket!)).toBe(signed.contentHash);
    expect(signed.exposure!.presetKey).toBe('body-lotion');
    expect(signed.substances.length).toBeGreaterThanOrEqual(4);
    expect(signed.partB.credentials).toMatch(/fictional/i);
    // The signed packet carries the maker's Part A notes of version 1.
    expect(JSON.stringify(signed.signedPacket)).toContain('12 weeks at 40 °C');

    const notes = await db()
      .select({ versionId: safetyNotes.versionId })
      .from(safetyNotes)
      .where(
        inArray(
          safetyNotes.versionId,
          versions.map((v) => v.id),
        ),
      );
    expect(notes.map((n) => n.versionId).sort()).toEqual(versions.map((v) => v.id).sort());
    const runs = await db()
      .select({ status: labelRuns.status, markets: labelRuns.markets })
      .from(labelRuns)
      .where(eq(labelRuns.versionId, versions[1]!.id));
    expect(runs).toEqual([{ status: 'ready', markets: ['EU'] }]);

    // Version 2 shows that its assessment is missing, naming the version that was assessed.
    const [owner] = await db()
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, 'owner@hollowmere.example'));
    const [{ formulaId }] = (await db()
      .select({ formulaId: formulaVersions.formulaId })
      .from(formulaVersions)
      .where(eq(formulaVersions.id, versions[1]!.id))) as [{ formulaId: string }];
    const view = await request(h.app)
      .get(`/api/formulas/${formulaId}/versions/2`)
      .set(bearer({ token: tokenFor(TEST_JWT_SECRET, owner!, hollowmereId, 'owner') }));
    expect(view.status).toBe(200);
    const missing = view.body.assessmentFindings as {
      code: string;
      market: string;
      message: string;
    }[];
    expect(missing.map((f) => [f.code, f.market]).sort()).toEqual([
      ['SAFETY_ASSESSMENT_MISSING', 'EU'],
      ['SAFETY_ASSESSMENT_MISSING', 'UK'],
    ]);
    expect(missing[0]!.message).toMatch(/version 1 was assessed/i);
  });

  it('shows the lotion’s EU readiness missing only the assessment and the notification; another product’s notification is done', async () => {
    const [owner] = await db()
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, 'owner@hollowmere.example'));
    const token = tokenFor(TEST_JWT_SECRET, owner!, hollowmereId, 'owner');
    const res = await request(h.app).get('/api/readiness').set('Authorization', `Bearer ${token}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const list = readinessListSchema.parse(res.body);
    const eu = (name: string) =>
      list.items.find((p) => p.formulaName === name)!.markets.find((m) => m.market === 'EU')!;
    const lotion = list.items.find((p) => p.formulaName === LOTION)!;
    expect(lotion.versionNumber).toBe(2);
    expect(
      eu(LOTION)
        .items.filter((i) => !i.done)
        .map((i) => i.key),
    ).toEqual(['assessment', 'notification']);
    // It names the version that was assessed.
    expect(eu(LOTION).items.find((i) => i.key === 'assessment')!.detail).toMatch(/version 1/);
    expect(eu(demoNotification.formula).items.find((i) => i.key === 'notification')!.done).toBe(
      true,
    );
  });

  it('turns the lotion’s EU readiness complete but for the notification once version 2 is signed, as the journey does', async () => {
    const person = async (email: string) =>
      (await db().select().from(users).where(eq(users.email, email)))[0]!;
    const owner = bearer({
      token: tokenFor(
        TEST_JWT_SECRET,
        await person('owner@hollowmere.example'),
        hollowmereId,
        'owner',
      ),
    });
    const assessorRow = await person(DEMO_ASSESSOR_EMAIL);
    const assessor = bearer({
      token: tokenFor(TEST_JWT_SECRET, assessorRow, hollowmereId, 'assessor'),
    });
    const [v1, v2] = await lotionVersions();
    // The same exposure as version 1's signed assessment.
    const [{ exposure: signedExposure }] = (await db()
      .select({ exposure: assessments.exposure })
      .from(assessments)
      .where(eq(assessments.versionId, v1!.id))) as [{ exposure: unknown }];
    const share = await request(h.app)
      .post('/api/assessment-shares')
      .set(owner)
      .send({ versionId: v2!.id, assessorId: assessorRow.id });
    expect(share.status, JSON.stringify(share.body)).toBe(201);
    const started = await request(h.app)
      .post('/api/assessments')
      .set(assessor)
      .send({ shareId: share.body.id });
    expect(started.status, JSON.stringify(started.body)).toBe(201);
    const id = started.body.id as string;
    const saved = await request(h.app)
      .put(`/api/assessments/${id}`)
      .set(assessor)
      .send({
        exposure: signedExposure,
        substances: [],
        partB: { conclusion: 'Safe as used (test).', credentials: 'Test credentials.' },
      });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    const signed = await request(h.app)
      .post(`/api/assessments/${id}/sign`)
      .set(assessor)
      .send({ contentHash: saved.body.contentHash, confirm: true });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);

    const res = await request(h.app).get('/api/readiness').set(owner);
    const lotion = readinessListSchema.parse(res.body).items.find((p) => p.formulaName === LOTION)!;
    const eu = lotion.markets.find((m) => m.market === 'EU')!;
    expect(eu.items.filter((i) => !i.done).map((i) => i.key)).toEqual(['notification']);
  });

  it('changes nothing when seeded again', async () => {
    const before = await tallies();
    await seedDemo(db(), PASSWORD);
    expect(await seedDemoAssessments(db(), hollowmereId)).toBe('already-seeded');
    expect(await tallies()).toEqual(before);
  });

  it('skips what an older demo cannot take (a lotion changed by its user, the second workshop already there) and records why', async () => {
    const w = await buildWorkshop(db(), TEST_JWT_SECRET, { roles: ['owner'] });
    expect(await seedDemoWorkspace(db(), w.id)).toBe('seeded');
    const [assessor] = await db()
      .select({ id: users.id, email: users.email, name: users.name })
      .from(users)
      .where(eq(users.email, DEMO_ASSESSOR_EMAIL));
    await addMembership(db(), TEST_JWT_SECRET, assessor!, w.id, 'assessor');
    const [lotion] = await db()
      .select({ id: formulas.id })
      .from(formulas)
      .where(and(eq(formulas.workshopId, w.id), eq(formulas.name, LOTION)));
    const started = await request(h.app)
      .post(`/api/formulas/${lotion!.id}/versions`)
      .set(bearer(w.members.owner))
      .send({});
    expect(started.status, JSON.stringify(started.body)).toBe(201);
    const before = await tallies();

    expect(await seedDemoAssessments(db(), w.id)).toBe('seeded');
    const [marker] = await db()
      .select({ detail: auditEvents.detail })
      .from(auditEvents)
      .where(
        and(eq(auditEvents.workshopId, w.id), eq(auditEvents.action, DEMO_ASSESSMENTS_SEEDED)),
      );
    const detail = marker!.detail as Record<string, { skipped?: string }>;
    expect(detail['tidewrack']!.skipped).toMatch(/exists/);
    expect(detail['lotion']!.skipped).toMatch(/has changed/);
    expect(detail['notification']!.skipped).toBeUndefined();
    const after = await tallies();
    // Only the notification reference, its audit entry and the marker were added.
    expect(after).toEqual({
      ...before,
      marketRecords: before['marketRecords']! + 1,
      auditEvents: before['auditEvents']! + 2,
    });
    expect(await seedDemoAssessments(db(), w.id)).toBe('already-seeded');
    // The demo assessor leaves this test workshop again, so the story's memberships stay two.
    await db()
      .delete(memberships)
      .where(and(eq(memberships.workshopId, w.id), eq(memberships.userId, assessor!.id)));
  });
});
