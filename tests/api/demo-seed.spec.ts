import bcrypt from 'bcryptjs';
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { formulas, formulaVersions, lots, materials } from '../../apps/api/src/db/schema';
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
  table: typeof materials | typeof lots | typeof formulas,
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
