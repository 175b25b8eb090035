import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { attentionSchema, type AttentionItem } from '@batchproof/shared';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { attention } from '../../apps/api/src/attention/attention-domain';
import { complaints, recalls } from '../../apps/api/src/db/schema';
import { buildBatchRow } from '../support/complaint-rows';
import { buildLot, buildMaterial, consumeFromLot } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

/**
 * The production and recall kinds of the home page, worked out by hand for an injected today:
 * Wednesday 2 December 2026 (noon UTC).
 */
const NOW = new Date('2026-12-02T12:00:00Z');

let h: ApiHarness;
let w: BuiltWorkshop;
let ids: Record<string, string>;

const kind = <K extends AttentionItem['kind']>(items: AttentionItem[], k: K) =>
  items.filter((i): i is Extract<AttentionItem, { kind: K }> => i.kind === k);

beforeAll(async () => {
  h = await startApiHarness();
  const db = h.handle.db;
  w = await buildWorkshop(db, TEST_JWT_SECRET);
  const formula = await request(h.app)
    .post('/api/formulas')
    .set(bearer(w.members.owner))
    .send(aFormula([], { name: 'Sea Glass Fizzer' }));
  expect(formula.status).toBe(201);
  const formulaId = formula.body.id as string;

  const material = await buildMaterial(db, w.id);
  const lotWithLeft = async (left: number) => {
    const lot = await buildLot(db, w.id, material.id, { quantity: 1000, unit: 'g' });
    if (left < 1000) await consumeFromLot(db, w.id, lot.id, 1000 - left);
    return lot.id;
  };
  const batch = (overrides: Parameters<typeof buildBatchRow>[3]) =>
    buildBatchRow(db, w.id, formulaId, overrides).then((b) => b.id);
  const complaint = (overrides: Partial<typeof complaints.$inferInsert>) =>
    db
      .insert(complaints)
      .values({
        workshopId: w.id,
        formulaId,
        receivedOn: '2026-11-20',
        whatHappened: 'Blistered skin on the neck',
        serious: true,
        ...overrides,
      })
      .returning()
      .then(([c]) => c!.id);
  const recall = (state: 'open' | 'closed', drill: boolean) =>
    db
      .insert(recalls)
      .values({
        workshopId: w.id,
        scope: { kind: 'finished-lots', finishedLotIds: [] },
        reason: 'Citric acid lot recalled by the supplier',
        severity: 'minor-harm',
        drill,
        state,
        batchCodes: ['261101-SGF-1'],
        affected: [],
        openedAt: new Date('2026-11-30T09:00:00Z'),
      })
      .returning()
      .then(([r]) => r!.id);

  ids = {
    // 1000 g received: 50 g left is 5 % (low); 100 g left is exactly 10 % (not below); none left
    // is used up, not low; an untouched lot is full.
    low: await lotWithLeft(50),
    tenth: await lotWithLeft(100),
    empty: await lotWithLeft(0),
    full: await lotWithLeft(1000),
    // Ready Sat 5 Dec: 3 days after Wed 2 Dec. Ready today is no longer curing.
    curing: await batch({ state: 'released', readyOn: '2026-12-05', batchCode: '261201-SGF-1' }),
    readyToday: await batch({ state: 'released', readyOn: '2026-12-02' }),
    draft: await batch({ state: 'draft', madeOn: '2026-11-30', batchCode: '261130-SGF-1' }),
    running: await complaint({}),
    reported: await complaint({ reportedToFdaOn: '2026-11-25' }),
    notSerious: await complaint({ serious: false }),
    closed: await complaint({ status: 'closed' }),
    openRecall: await recall('open', false),
    openDrill: await recall('open', true),
    closedRecall: await recall('closed', false),
  };
});
afterAll(() => h.close());

describe('attention: production and recall kinds on a hand-worked day', () => {
  it('lists a lot below a tenth of what was received, and not one at a tenth, used up or full', async () => {
    const answer = await attention(h.handle.db, w.members.viewer, NOW);
    expect(kind(answer.items, 'lot-low-stock')).toEqual([
      {
        kind: 'lot-low-stock',
        lotId: ids.low,
        materialName: expect.any(String),
        supplierLotNumber: expect.any(String),
        quantity: 1000,
        stockOnHand: 50,
        unit: 'g',
      },
    ]);
    expect(answer.counts['lot-low-stock']).toBe(1);
  });

  it('lists the batch curing until Saturday 5 December (3 days) and the draft awaiting release', async () => {
    const answer = await attention(h.handle.db, w.members.production, NOW);
    expect(kind(answer.items, 'batch-curing')).toEqual([
      {
        kind: 'batch-curing',
        batchId: ids.curing,
        batchCode: '261201-SGF-1',
        productName: 'Sea Glass Fizzer',
        readyOn: '2026-12-05',
        daysLeft: 3,
      },
    ]);
    expect(kind(answer.items, 'batch-awaiting-release')).toEqual([
      {
        kind: 'batch-awaiting-release',
        batchId: ids.draft,
        batchCode: '261130-SGF-1',
        productName: 'Sea Glass Fizzer',
        madeOn: '2026-11-30',
      },
    ]);
  });

  it('lists open recalls and drills, not closed ones', async () => {
    const answer = await attention(h.handle.db, w.members.viewer, NOW);
    const open = kind(answer.items, 'recall-open');
    expect(open.map((r) => [r.recallId, r.drill])).toEqual(
      expect.arrayContaining([
        [ids.openRecall, false],
        [ids.openDrill, true],
      ]),
    );
    expect(open).toHaveLength(2);
    expect(open[0]).toMatchObject({ openedAt: '2026-11-30T09:00:00.000Z', severity: 'minor-harm' });
  });

  it('shows the serious, unreported complaint due Mon 14 Dec with 8 business days left', async () => {
    // FD&C Act §605(b)(1): 15 business days from Fri 20 Nov 2026, Thanksgiving (Thu 26 Nov,
    // 5 U.S.C. 6103) skipped → Mon 14 Dec. From Wed 2 Dec: Thu 3, Fri 4, Mon 7 … Fri 11, Mon 14 = 8.
    const answer = await attention(h.handle.db, w.members.viewer, NOW);
    expect(kind(answer.items, 'complaint-clock')).toEqual([
      {
        kind: 'complaint-clock',
        complaintId: ids.running,
        productName: 'Sea Glass Fizzer',
        batchCode: null,
        receivedOn: '2026-11-20',
        dueOn: '2026-12-14',
        businessDaysLeft: 8,
        state: 'running',
      },
    ]);
    const dayAfter = await attention(
      h.handle.db,
      w.members.viewer,
      new Date('2026-12-15T08:00:00Z'),
    );
    expect(kind(dayAfter.items, 'complaint-clock')[0]).toMatchObject({
      businessDaysLeft: -1,
      state: 'overdue',
    });
  });

  it('answers GET /api/attention with the new kinds to members, none to the assessor', async () => {
    const res = await request(h.app).get('/api/attention').set(bearer(w.members.production));
    expect(res.status).toBe(200);
    const counts = attentionSchema.parse(res.body).counts;
    expect(counts['lot-low-stock']).toBe(1);
    expect(counts['batch-awaiting-release']).toBe(1);
    expect(counts['recall-open']).toBe(2);
    expect(counts['complaint-clock']).toBe(1);
    const assessor = await request(h.app).get('/api/attention').set(bearer(w.members.assessor));
    expect(assessor.body.items).toEqual([]);
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const theirs = await request(h.app).get('/api/attention').set(bearer(other.members.owner));
    expect(theirs.body.items).toEqual([]);
    expect((await request(h.app).get('/api/attention')).status).toBe(401);
  });
});
