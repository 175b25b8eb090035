import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { batchSchema, ROLES, ROLE_SETS, type Role } from '@batchproof/shared';
import {
  auditEvents,
  batches,
  customers,
  deliveries,
  deliveryLines,
} from '../../apps/api/src/db/schema';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { buildLot, buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildWeighedBatch, type BuiltLine } from '../support/released-batch-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
const m = { citric: '', corn: '', tapioca: '', bicarb: '' };
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  const db = h.handle.db;
  m.citric = (await buildMaterial(db, w.id, aMaterial({ tradeName: 'Citric acid' }))).id;
  m.corn = (await buildMaterial(db, w.id, aMaterial({ tradeName: 'Corn starch' }))).id;
  m.tapioca = (await buildMaterial(db, w.id, aMaterial({ tradeName: 'Tapioca starch' }))).id;
  m.bicarb = (await buildMaterial(db, w.id, aMaterial({ tradeName: 'Bicarb' }))).id;
});
afterAll(() => h.close());

const kgLot = (materialId: string, quantity: number, supplierLotNumber: string) =>
  buildLot(h.handle.db, w.id, materialId, { quantity, unit: 'kg', supplierLotNumber });
const stockOf = async (lotId: string) =>
  (await request(h.app).get(`/api/lots/${lotId}`).set(bearer(w.members.viewer))).body
    .stockOnHand as number;
const amend = (batchId: string, body: object, who = w.members.formulator) =>
  request(h.app).post(`/api/batches/${batchId}/amendments`).set(bearer(who)).send(body);
const getBatch = async (batchId: string) => {
  const res = await request(h.app).get(`/api/batches/${batchId}`).set(bearer(w.members.viewer));
  expect(res.status).toBe(200);
  return batchSchema.parse(res.body);
};
const effectiveColumns = async (batchId: string) => {
  const [row] = await h.handle.db
    .select({ unitsMade: batches.unitsMade, readyOn: batches.readyOn })
    .from(batches)
    .where(eq(batches.id, batchId));
  return row!;
};

/**
 * A released batch: line 1 citric acid 200 g from lot CIT-A (1 kg), line 2 corn starch 100 g
 * (tapioca approved instead) from lot CORN-A (1 kg), 24 units, made 2026-01-15, 24 h in the mould
 * and 14 days' cure.
 */
async function aReleasedBatch() {
  const citA = await kgLot(m.citric, 1, 'CIT-A');
  const cornA = await kgLot(m.corn, 1, 'CORN-A');
  const lines: BuiltLine[] = [
    {
      materialId: m.citric,
      materialName: 'Citric acid',
      grams: 200,
      picks: [{ lotId: citA.id, grams: 200 }],
    },
    {
      materialId: m.corn,
      materialName: 'Corn starch',
      grams: 100,
      picks: [{ lotId: cornA.id, grams: 100 }],
      substitutes: [{ materialId: m.tapioca, materialName: 'Tapioca starch' }],
    },
  ];
  const batch = await buildWeighedBatch(h.handle.db, w.id, {
    lines,
    unitsMade: 24,
    record: { timing: { hoursInMould: 24, curingDays: 14 } },
  });
  return { batch, citA, cornA };
}

const REASON = 'Recounted after unmoulding';

describe('POST /api/batches/:id/amendments: fields of the record', () => {
  it('a corrected unit count keeps the released value beside the amendment and moves the effective count', async () => {
    const { batch } = await aReleasedBatch();
    const res = await amend(batch.id, { field: 'mould.unitsMade', value: 22, reason: REASON });
    expect(res.status).toBe(201);
    const answered = batchSchema.parse(res.body);
    expect(answered.mould.unitsMade).toBe(24);
    expect(answered.amendments).toEqual([
      {
        id: expect.any(String),
        field: 'mould.unitsMade',
        previousValue: 24,
        value: 22,
        reason: REASON,
        amendedAt: expect.any(String),
        amendedBy: 'Test formulator',
      },
    ]);
    // GET shows the released record unchanged, and the finished lot's quantity is now 22.
    const read = await getBatch(batch.id);
    expect(read.state).toBe('released');
    expect(read.mould).toEqual({ name: null, unitsMade: 24 });
    expect(read.lines.map((l) => l.actualGrams)).toEqual([200, 100]);
    expect((await effectiveColumns(batch.id)).unitsMade).toBe(22);
  });

  it("a second amendment of the same field replaces the first's value: previousValue is the amended one", async () => {
    const { batch } = await aReleasedBatch();
    await amend(batch.id, { field: 'mould.unitsMade', value: 22, reason: REASON });
    const res = await amend(
      batch.id,
      { field: 'mould.unitsMade', value: 23, reason: 'One more found in the drying rack' },
      w.members.owner,
    );
    expect(res.status).toBe(201);
    const read = await getBatch(batch.id);
    expect(read.mould.unitsMade).toBe(24);
    expect(read.amendments.map((a) => [a.previousValue, a.value, a.amendedBy])).toEqual([
      [24, 22, 'Test formulator'],
      [22, 23, 'Test owner'],
    ]);
    expect((await effectiveColumns(batch.id)).unitsMade).toBe(23);
  });

  it("a corrected curing time moves the effective ready day (made 2026-01-15 + 1 day's moulding + 21 days = 2026-02-06)", async () => {
    const { batch } = await aReleasedBatch();
    const res = await amend(batch.id, {
      field: 'timing.curingDays',
      value: 21,
      reason: 'Humid week: cured longer',
    });
    expect(res.status).toBe(201);
    const read = await getBatch(batch.id);
    // As released: 2026-01-15 + 1 + 14.
    expect(read.timing).toEqual({ hoursInMould: 24, curingDays: 14, readyOn: '2026-01-30' });
    expect((await effectiveColumns(batch.id)).readyOn).toBe('2026-02-06');
  });

  it('the units made cannot drop below the units already delivered (409)', async () => {
    const { batch } = await aReleasedBatch();
    const db = h.handle.db;
    const [customer] = await db
      .insert(customers)
      .values({ workshopId: w.id, kind: 'stockist', name: 'Brindle Lane Gifts' })
      .returning();
    const [delivery] = await db
      .insert(deliveries)
      .values({ workshopId: w.id, customerId: customer!.id, deliveredOn: '2026-02-01' })
      .returning();
    await db.insert(deliveryLines).values({
      workshopId: w.id,
      deliveryId: delivery!.id,
      position: 1,
      batchId: batch.id,
      units: 20,
    });
    const res = await amend(batch.id, { field: 'mould.unitsMade', value: 19, reason: REASON });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.value).toEqual(['At least 20: the units already delivered']);
    expect(
      (await amend(batch.id, { field: 'mould.unitsMade', value: 20, reason: REASON })).status,
    ).toBe(201);
    expect((await effectiveColumns(batch.id)).unitsMade).toBe(20);
  });

  it('corrects notes and a check; the released values stay', async () => {
    const { batch } = await aReleasedBatch();
    expect(
      (
        await amend(batch.id, {
          field: 'checks.hardness',
          value: { result: 'fail', note: 'Crumbled at the edge' },
          reason: 'Hardness was recorded on the wrong batch',
        })
      ).status,
    ).toBe(201);
    const read = await getBatch(batch.id);
    expect(read.checks.hardness).toEqual({ result: 'not-checked', note: null });
    expect(read.amendments[0]).toMatchObject({
      field: 'checks.hardness',
      previousValue: { result: 'not-checked', note: null },
      value: { result: 'fail', note: 'Crumbled at the edge' },
    });
  });

  it('is in the audit log with the field, both values and the reason', async () => {
    const { batch } = await aReleasedBatch();
    await amend(batch.id, { field: 'mould.unitsMade', value: 20, reason: REASON });
    const [event] = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, batch.id), eq(auditEvents.action, 'batch.amended')));
    expect(event).toMatchObject({ actorId: w.members.formulator.id, subjectType: 'batch' });
    expect(event!.detail).toMatchObject({
      batchCode: batch.batchCode,
      reason: REASON,
      changes: [{ field: 'mould.unitsMade', previousValue: 24, value: 20 }],
      stockMoved: [],
    });
  });

  it('a draft is refused with 409: its record is edited directly', async () => {
    const lot = await kgLot(m.citric, 1, 'CIT-D');
    const draft = await buildWeighedBatch(h.handle.db, w.id, {
      state: 'draft',
      lines: [
        {
          materialId: m.citric,
          materialName: 'Citric acid',
          grams: 10,
          picks: [{ lotId: lot.id, grams: 10 }],
        },
      ],
    });
    const res = await amend(draft.id, { field: 'mould.unitsMade', value: 3, reason: REASON });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('is a draft: change its record directly');
    expect((await getBatch(draft.id)).amendments).toEqual([]);
  });
});

describe('POST /api/batches/:id/amendments: lot picks move stock', () => {
  it('splitting line 1 over two lots gives back 0.2 kg of CIT-A and takes 0.15 kg of it and 0.05 kg of CIT-B', async () => {
    const { batch, citA } = await aReleasedBatch();
    const citB = await kgLot(m.citric, 0.5, 'CIT-B');
    expect(await stockOf(citA.id)).toBe(0.8);
    const value = [
      { lotId: citA.id, grams: 150 },
      { lotId: citB.id, grams: 50 },
    ];
    const res = await amend(batch.id, {
      field: 'lines.1.lotPicks',
      value,
      reason: 'Last 50 g came from the new bag',
    });
    expect(res.status).toBe(201);
    expect(await stockOf(citA.id)).toBe(0.85);
    expect(await stockOf(citB.id)).toBe(0.45);
    const read = await getBatch(batch.id);
    // The released picks stay; the weight still adds up, so nothing else is amended.
    expect(read.lines[0]!.lotPicks.map((p) => [p.supplierLotNumber, p.grams])).toEqual([
      ['CIT-A', 200],
    ]);
    expect(read.amendments).toHaveLength(1);
    expect(read.amendments[0]).toMatchObject({
      field: 'lines.1.lotPicks',
      previousValue: [{ lotId: citA.id, grams: 200 }],
      value,
    });
    const movements = (
      await request(h.app).get(`/api/lots/${citA.id}/movements`).set(bearer(w.members.viewer))
    ).body as { kind: string; quantity: number; grams: number; batchCode: string }[];
    expect(movements.map((mv) => [mv.kind, mv.quantity, mv.grams, mv.batchCode]).sort()).toEqual(
      [
        ['amendment', -0.2, -200, batch.batchCode],
        ['amendment', 0.15, 150, batch.batchCode],
        ['batch', 0.2, 200, batch.batchCode],
      ].sort(),
    );
  });

  it('refuses a correction that would take a lot below zero with 409 stock_short, and moves nothing', async () => {
    const { batch, citA } = await aReleasedBatch();
    const citC = await kgLot(m.citric, 0.3, 'CIT-C');
    const res = await amend(batch.id, {
      field: 'lines.1.lotPicks',
      value: [{ lotId: citC.id, grams: 350 }],
      reason: 'It was the small bag all along',
    });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stock_short');
    expect(res.body.error.fieldErrors.value).toEqual([
      'Lot CIT-C has only 0.3 kg on hand; this correction takes 0.35 kg more',
    ]);
    expect(await stockOf(citA.id)).toBe(0.8);
    expect(await stockOf(citC.id)).toBe(0.3);
    expect((await getBatch(batch.id)).amendments).toEqual([]);
  });

  it('the stock a line gives back counts: the same lot may take up to what it had plus what it gave', async () => {
    const { batch, citA } = await aReleasedBatch();
    // 0.8 kg on hand + 0.2 kg given back = 1 kg for the corrected pick.
    const res = await amend(batch.id, {
      field: 'lines.1.lotPicks',
      value: [{ lotId: citA.id, grams: 1000 }],
      reason: 'The whole bag went in',
    });
    expect(res.status).toBe(201);
    expect(await stockOf(citA.id)).toBe(0);
    // The weight follows the lots.
    const read = await getBatch(batch.id);
    expect(read.amendments.map((a) => [a.field, a.previousValue, a.value])).toEqual(
      expect.arrayContaining([['lines.1.actualGrams', 200, 1000]]),
    );
    expect(read.lines[0]!.actualGrams).toBe(200);
  });

  it('lots of an approved substitute switch the material used (recorded as its own amendment)', async () => {
    const { batch, cornA } = await aReleasedBatch();
    const tapioca = await kgLot(m.tapioca, 2, 'TAP-1');
    const res = await amend(batch.id, {
      field: 'lines.2.lotPicks',
      value: [{ lotId: tapioca.id, grams: 100 }],
      reason: 'Tapioca was used: corn ran out',
    });
    expect(res.status).toBe(201);
    expect(await stockOf(cornA.id)).toBe(1);
    expect(await stockOf(tapioca.id)).toBe(1.9);
    const read = await getBatch(batch.id);
    expect(read.lines[1]!.usedMaterialName).toBe('Corn starch');
    expect(read.amendments.map((a) => [a.field, a.previousValue, a.value]).sort()).toEqual(
      [
        [
          'lines.2.lotPicks',
          [{ lotId: cornA.id, grams: 100 }],
          [{ lotId: tapioca.id, grams: 100 }],
        ],
        ['lines.2.usedMaterialId', null, m.tapioca],
      ].sort(),
    );
  });

  it("a corrected weight on a one-lot line takes the difference from that lot's stock", async () => {
    const { batch, cornA } = await aReleasedBatch();
    const res = await amend(batch.id, {
      field: 'lines.2.actualGrams',
      value: 90,
      reason: 'Scale read 100 g with the scoop on it',
    });
    expect(res.status).toBe(201);
    expect(await stockOf(cornA.id)).toBe(0.91);
    const fields = (await getBatch(batch.id)).amendments.map((a) => a.field).sort();
    expect(fields).toEqual(['lines.2.actualGrams', 'lines.2.lotPicks']);
  });

  it('a corrected weight on a line weighed from two lots is refused: its lots are corrected instead', async () => {
    const { batch, citA } = await aReleasedBatch();
    const citB = await kgLot(m.citric, 1, 'CIT-E');
    await amend(batch.id, {
      field: 'lines.1.lotPicks',
      value: [
        { lotId: citA.id, grams: 120 },
        { lotId: citB.id, grams: 80 },
      ],
      reason: 'Two bags were used for this line',
    });
    const res = await amend(batch.id, {
      field: 'lines.1.actualGrams',
      value: 210,
      reason: 'Scale was not zeroed before weighing',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.value).toEqual([
      'Line 1 was weighed from 2 lots: correct its lots (lines.1.lotPicks) and the weight follows',
    ]);
    expect(await stockOf(citA.id)).toBe(0.88);
    expect(await stockOf(citB.id)).toBe(0.92);
  });

  it('refuses lots of a material the line may not use, and a changed material while the lots are of the old one', async () => {
    const { batch, citA } = await aReleasedBatch();
    const bicarb = await kgLot(m.bicarb, 1, 'BIC-1');
    const wrong = await amend(batch.id, {
      field: 'lines.1.lotPicks',
      value: [{ lotId: bicarb.id, grams: 200 }],
      reason: 'Mixed up the bags on the shelf',
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fieldErrors.value).toEqual(['Lot BIC-1 is not a lot of Citric acid']);
    const material = await amend(batch.id, {
      field: 'lines.2.usedMaterialId',
      value: m.tapioca,
      reason: 'Tapioca was used: corn ran out',
    });
    expect(material.status).toBe(400);
    expect(material.body.error.fieldErrors.value[0]).toContain(
      'correct its lots (lines.2.lotPicks)',
    );
    const foreign = await buildLot(
      h.handle.db,
      other.id,
      (await buildMaterial(h.handle.db, other.id)).id,
    );
    const elsewhere = await amend(batch.id, {
      field: 'lines.1.lotPicks',
      value: [{ lotId: foreign.id, grams: 200 }],
      reason: 'Mixed up the bags on the shelf',
    });
    expect(elsewhere.status).toBe(400);
    expect(elsewhere.body.error.fieldErrors.value).toEqual([
      'Choose lots recorded in this workshop',
    ]);
    expect(await stockOf(citA.id)).toBe(0.8);
    expect((await getBatch(batch.id)).amendments).toEqual([]);
  });
});

describe('POST /api/batches/:id/amendments: bad input', () => {
  it('answers 400 with field errors: a fixed field, a short reason, a wrong value, a missing line, the same value', async () => {
    const { batch } = await aReleasedBatch();
    const fixed = await amend(batch.id, { field: 'batchCode', value: 'X', reason: REASON });
    expect(fixed.status).toBe(400);
    expect(fixed.body.error.fieldErrors.field[0]).toContain('batchCode cannot be corrected');
    const short = await amend(batch.id, { field: 'notes', value: 'x', reason: 'oops' });
    expect(short.status).toBe(400);
    expect(short.body.error.fieldErrors.reason).toEqual([
      'Explain the correction in at least 10 characters',
    ]);
    const wrongValue = await amend(batch.id, {
      field: 'mould.unitsMade',
      value: -3,
      reason: REASON,
    });
    expect(wrongValue.status).toBe(400);
    expect(wrongValue.body.error.fieldErrors.value).toBeDefined();
    const noLine = await amend(batch.id, {
      field: 'lines.7.actualGrams',
      value: 5,
      reason: REASON,
    });
    expect(noLine.status).toBe(400);
    expect(noLine.body.error.fieldErrors.field).toEqual([`Batch ${batch.batchCode} has no line 7`]);
    const same = await amend(batch.id, { field: 'mould.unitsMade', value: 24, reason: REASON });
    expect(same.status).toBe(400);
    expect(same.body.error.fieldErrors.value).toEqual([
      'That is the value the batch already has: nothing to correct',
    ]);
    expect((await getBatch(batch.id)).amendments).toEqual([]);
  });
});

describe('who may amend', () => {
  it.each(ROLES.map((r) => [r]))('as %s', async (role: Role) => {
    const { batch } = await aReleasedBatch();
    const res = await amend(
      batch.id,
      { field: 'mould.unitsMade', value: 20, reason: REASON },
      w.members[role],
    );
    const allowed = (ROLE_SETS.writers as readonly Role[]).includes(role);
    expect(res.status).toBe(allowed ? 201 : 403);
    expect((await effectiveColumns(batch.id)).unitsMade).toBe(allowed ? 20 : 24);
  });

  it("another workshop's owner gets 404 and changes nothing; anonymous gets 401", async () => {
    const { batch } = await aReleasedBatch();
    const body = { field: 'mould.unitsMade', value: 20, reason: REASON };
    expect((await amend(batch.id, body, other.members.owner)).status).toBe(404);
    expect(
      (await request(h.app).post(`/api/batches/${batch.id}/amendments`).send(body)).status,
    ).toBe(401);
    expect((await getBatch(batch.id)).amendments).toEqual([]);
    expect((await effectiveColumns(batch.id)).unitsMade).toBe(24);
  });
});
