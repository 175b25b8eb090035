import bcrypt from 'bcryptjs';
import { and, count, eq } from 'drizzle-orm';
import request from 'supertest';
import { BUILT_IN_LABEL_STOCKS, labelAreas, missingLabelElements } from '@batchproof/shared';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
  formulas,
  formulaVersions,
  lots,
  materials,
  productIdentities,
  workshops,
} from '../../apps/api/src/db/schema';
import { seedDemoLabels } from '../../apps/api/src/seed/demo-label-seed';
import { aLabelRun } from '../../fixtures/builders/label-run-builder';
import { bearer } from '../support/auth-header';
import { seedDemo } from '../../apps/api/src/seed/demo-seed';
import { seedDemoWorkspace } from '../../apps/api/src/seed/demo-workspace-seed';
import { demoMaterials } from '../../apps/api/src/seed/hollowmere-materials';
import { buildMaterial } from '../support/row-builders';
import { buildWorkshop } from '../support/workshop-builder';
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
  });
});
