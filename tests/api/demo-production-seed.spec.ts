import { and, eq, sql } from 'drizzle-orm';
import { addDays, todayIso } from '@batchproof/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuthUser } from '../../apps/api/src/auth/authenticate';
import { batches, recallNotices, recalls } from '../../apps/api/src/db/schema';
import { seedDemoLabels } from '../../apps/api/src/seed/demo-label-seed';
import { seedDemoProduction } from '../../apps/api/src/seed/demo-production-seed';
import { demoOwner, seedDemoWorkspace } from '../../apps/api/src/seed/demo-workspace-seed';
import { demoBatches, demoCustomers } from '../../apps/api/src/seed/hollowmere-production';
import { buildWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';

let h: ApiHarness;
let owner: AuthUser;
const NOW = new Date('2026-12-02T10:00:00Z');
const today = todayIso(NOW);

beforeAll(async () => {
  h = await startApiHarness();
  const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  await seedDemoWorkspace(h.handle.db, w.id, NOW);
  await seedDemoLabels(h.handle.db, w.id);
  owner = (await demoOwner(h.handle.db, w.id))!;
  expect(await seedDemoProduction(h.handle.db, owner, NOW)).toBe('seeded');
}, 120_000);
afterAll(() => h.close());

describe('the demo production history', () => {
  it('makes the planned batches through the batch domain: released ones hold stock taken, the last waits for release, the newest released one is curing', async () => {
    const rows = await h.handle.db
      .select()
      .from(batches)
      .where(eq(batches.workshopId, owner.workshopId))
      .orderBy(batches.madeOn, batches.createdAt);
    expect(rows.map((b) => [b.madeOn, b.state])).toEqual(
      demoBatches.map((b) => [addDays(today, -b.daysAgo), b.release ? 'released' : 'draft']),
    );
    // Fizzers spend 12 h in the mould (a whole day) and cure 3 days: made 2 days ago, ready in 2.
    expect(rows.filter((b) => b.state === 'released' && b.readyOn! > today)).toHaveLength(1);
    expect(rows.at(-2)!.readyOn).toBe(addDays(today, 2));
    const { rows: negative } = await h.handle.db.execute(sql`
      select l.supplier_lot_number from lots l
      where l.workshop_id = ${owner.workshopId}
        and l.quantity - coalesce((select sum(c.quantity) from lot_consumptions c where c.lot_id = l.id), 0) < 0`);
    expect(negative).toEqual([]);
    const { rows: taken } = await h.handle.db.execute<{ n: number }>(sql`
      select count(distinct batch_id)::int as n from lot_consumptions
      where workshop_id = ${owner.workshopId} and kind = 'batch'`);
    expect(taken[0]!.n).toBe(demoBatches.filter((b) => b.release).length);
  });

  it('has a finished recall drill on the earlier citric acid lot that wrote notices without sending and found the stall without e-mail', async () => {
    const [drill] = await h.handle.db
      .select()
      .from(recalls)
      .where(eq(recalls.workshopId, owner.workshopId));
    expect(drill).toMatchObject({ drill: true, state: 'closed' });
    // Every fizzer (plain and foaming) released before today took citric acid from FB-CA-0612.
    const fizzerCodes = demoBatches.filter(
      (b) => b.release && b.formula !== 'Lavender Oat Bath Salts',
    );
    expect(drill!.batchCodes).toHaveLength(fizzerCodes.length);
    const stall = demoCustomers.find((c) => c.kind === 'market-stall')!;
    expect(drill!.drillReport!.missing.join('\n')).toContain(stall.name);
    const notices = await h.handle.db
      .select()
      .from(recallNotices)
      .where(and(eq(recallNotices.recallId, drill!.id)));
    expect(notices.length).toBe(drill!.affected.length);
    expect(new Set(notices.map((n) => n.status))).toEqual(new Set(['drill']));
  });

  it('is seeded once', async () => {
    expect(await seedDemoProduction(h.handle.db, owner, NOW)).toBe('already-seeded');
  });
});
