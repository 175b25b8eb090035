import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, ROLE_SETS, stockMovementSchema, type Role } from '@batchproof/shared';
import { auditEvents, lotConsumptions } from '../../apps/api/src/db/schema';
import { buildLot, buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildFinishedLot, buildReleasedFormula } from '../support/finished-lot-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
let materialId: string;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  materialId = (await buildMaterial(h.handle.db, w.id)).id;
});
afterAll(() => h.close());

const aKgLot = (quantity = 10) =>
  buildLot(h.handle.db, w.id, materialId, { quantity, unit: 'kg', supplierLotNumber: 'CIT-77' });
const adjust = (lotId: string, body: object, who = w.members.production) =>
  request(h.app).post(`/api/lots/${lotId}/adjustments`).set(bearer(who)).send(body);
const movements = (lotId: string, who = w.members.viewer) =>
  request(h.app).get(`/api/lots/${lotId}/movements`).set(bearer(who));
const stockOf = async (lotId: string) =>
  (await request(h.app).get(`/api/lots/${lotId}`).set(bearer(w.members.viewer))).body
    .stockOnHand as number;

describe('POST /api/lots/:id/adjustments', () => {
  it('takes spilt stock away: 201 with the movement stored as 0.8 kg out, stock 10 → 9.2 kg', async () => {
    const lot = await aKgLot();
    const res = await adjust(lot.id, { quantity: -0.8, reason: 'spillage', note: 'Bag split' });
    expect(res.status).toBe(201);
    const movement = stockMovementSchema.parse(res.body);
    expect(movement).toMatchObject({
      lotId: lot.id,
      kind: 'adjustment',
      quantity: 0.8,
      unit: 'kg',
      grams: null,
      batchId: null,
      batchCode: null,
      reason: 'spillage',
      note: 'Bag split',
      createdByName: 'Test production',
    });
    expect(await stockOf(lot.id)).toBe(9.2);
  });

  it('adds stock found in a count (stored as −1.5 kg out) and takes disposed stock away', async () => {
    const lot = await aKgLot();
    const added = await adjust(lot.id, { quantity: 1.5, reason: 'count-correction' });
    expect(added.status).toBe(201);
    expect(added.body.quantity).toBe(-1.5);
    expect(added.body.note).toBeNull();
    expect(await stockOf(lot.id)).toBe(11.5);
    const disposed = await adjust(lot.id, { quantity: -11.5, reason: 'disposal', note: 'Expired' });
    expect(disposed.status).toBe(201);
    expect(await stockOf(lot.id)).toBe(0);
  });

  it('refuses to take the lot below zero with 409 stock_short naming what is on hand, and records nothing', async () => {
    const lot = await aKgLot(5);
    await adjust(lot.id, { quantity: -1.8, reason: 'spillage' });
    const res = await adjust(lot.id, { quantity: -3.3, reason: 'disposal' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stock_short');
    expect(res.body.error.fieldErrors).toEqual({ quantity: ['Only 3.2 kg on hand'] });
    expect(await stockOf(lot.id)).toBe(3.2);
    // Exactly what is on hand may go.
    expect((await adjust(lot.id, { quantity: -3.2, reason: 'disposal' })).status).toBe(201);
    expect(await stockOf(lot.id)).toBe(0);
  });

  it('two adjustments competing for the last stock: exactly one succeeds and the lot never goes below zero', async () => {
    for (let round = 0; round < 5; round++) {
      const lot = await aKgLot(1);
      const results = await Promise.all([
        adjust(lot.id, { quantity: -0.6, reason: 'disposal' }, w.members.production),
        adjust(lot.id, { quantity: -0.6, reason: 'spillage' }, w.members.formulator),
      ]);
      expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
      expect(await stockOf(lot.id)).toBe(0.4);
    }
  });

  it('is recorded in the audit log with the stock before and after', async () => {
    const lot = await aKgLot();
    await adjust(lot.id, { quantity: -2, reason: 'other', note: 'Sample for the lab' });
    const [event] = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.subjectId, lot.id), eq(auditEvents.action, 'lot.stock-adjusted')));
    expect(event).toMatchObject({ actorId: w.members.production.id, subjectType: 'lot' });
    expect(event!.detail).toMatchObject({
      quantity: -2,
      reason: 'other',
      note: 'Sample for the lab',
      stockBefore: 10,
      stockAfter: 8,
    });
  });

  it('answers 400 with field errors for a zero quantity, an unknown reason, and "other" without a note', async () => {
    const lot = await aKgLot();
    const zero = await adjust(lot.id, { quantity: 0, reason: 'stolen' });
    expect(zero.status).toBe(400);
    expect(zero.body.error.fieldErrors.quantity).toEqual(['An adjustment of 0 changes nothing']);
    expect(zero.body.error.fieldErrors.reason).toEqual([
      'Choose a reason: spillage, count correction, disposal or other',
    ]);
    const other = await adjust(lot.id, { quantity: -1, reason: 'other' });
    expect(other.status).toBe(400);
    expect(other.body.error.fieldErrors.note).toEqual([
      'Say what happened: a note is needed when the reason is "other"',
    ]);
    const text = await adjust(lot.id, { quantity: '-1', reason: 'spillage' });
    expect(text.status).toBe(400);
    expect(text.body.error.fieldErrors.quantity).toEqual(['The adjustment must be a number']);
    const notAnObject = await adjust(lot.id, ['x'] as unknown as object);
    expect(notAnObject.status).toBe(400);
    expect(await stockOf(lot.id)).toBe(10);
  });

  it('the lot comes from the path: a lotId in the body is ignored', async () => {
    const lot = await aKgLot();
    const elsewhere = await aKgLot();
    const res = await adjust(lot.id, { lotId: elsewhere.id, quantity: -1, reason: 'spillage' });
    expect(res.status).toBe(201);
    expect(res.body.lotId).toBe(lot.id);
    expect(await stockOf(elsewhere.id)).toBe(10);
  });

  it('a retry with the same Idempotency-Key records the adjustment once', async () => {
    const lot = await aKgLot();
    const send = () =>
      adjust(lot.id, { quantity: -1, reason: 'spillage' }).set('Idempotency-Key', `adj-${lot.id}`);
    const first = await send();
    const second = await send();
    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(second.body).toEqual(first.body);
    expect(await stockOf(lot.id)).toBe(9);
  });

  describe('who may adjust', () => {
    it.each(ROLES.map((r) => [r]))('as %s', async (role: Role) => {
      const lot = await aKgLot();
      const res = await adjust(lot.id, { quantity: -1, reason: 'spillage' }, w.members[role]);
      const allowed = (ROLE_SETS.goodsIn as readonly Role[]).includes(role);
      expect(res.status).toBe(allowed ? 201 : 403);
      expect(await stockOf(lot.id)).toBe(allowed ? 9 : 10);
    });

    it("another workshop's lot is 404 and keeps its stock; an unknown or malformed id is 404", async () => {
      const lot = await aKgLot();
      const res = await adjust(lot.id, { quantity: -1, reason: 'spillage' }, other.members.owner);
      expect(res.status).toBe(404);
      expect(await stockOf(lot.id)).toBe(10);
      const unknown = '00000000-0000-4000-8000-000000000000';
      expect((await adjust(unknown, { quantity: -1, reason: 'spillage' })).status).toBe(404);
      expect((await adjust('not-a-lot', { quantity: -1, reason: 'spillage' })).status).toBe(404);
    });

    it('anonymous is 401', async () => {
      const lot = await aKgLot();
      const res = await request(h.app)
        .post(`/api/lots/${lot.id}/adjustments`)
        .send({ quantity: -1, reason: 'spillage' });
      expect(res.status).toBe(401);
    });
  });
});

describe('GET /api/lots/:id/movements', () => {
  it('lists every movement newest first, with the batch code of batch rows and who recorded each', async () => {
    const lot = await aKgLot();
    const formula = await buildReleasedFormula(h.handle.db, w.id);
    const batch = await buildFinishedLot(h.handle.db, w.id, {
      ...formula,
      batchCode: 'MOVE-001',
      unitsMade: 12,
    });
    const earlier = new Date('2026-11-01T10:00:00Z');
    await h.handle.db.insert(lotConsumptions).values({
      workshopId: w.id,
      lotId: lot.id,
      quantity: 2.5,
      kind: 'batch',
      batchId: batch.id,
      lineNumber: 2,
      grams: 2500,
      createdBy: w.members.formulator.id,
      createdAt: earlier,
    });
    await adjust(lot.id, { quantity: -0.5, reason: 'spillage' });
    const res = await movements(lot.id);
    expect(res.status).toBe(200);
    const list = res.body.map((m: unknown) => stockMovementSchema.parse(m));
    expect(list).toHaveLength(2);
    expect(list[0]).toMatchObject({ kind: 'adjustment', quantity: 0.5, reason: 'spillage' });
    expect(list[1]).toMatchObject({
      kind: 'batch',
      quantity: 2.5,
      unit: 'kg',
      grams: 2500,
      batchId: batch.id,
      batchCode: 'MOVE-001',
      lineNumber: 2,
      reason: null,
      createdAt: earlier.toISOString(),
      createdByName: 'Test formulator',
    });
    expect(await stockOf(lot.id)).toBe(7);
  });

  it('is empty for a lot nothing has moved', async () => {
    const lot = await aKgLot();
    const res = await movements(lot.id);
    expect(res.status).toBe(200);
    expect(res.body).toEqual([]);
  });

  it.each(ROLES.map((r) => [r]))('as %s', async (role: Role) => {
    const lot = await aKgLot();
    const res = await movements(lot.id, w.members[role]);
    expect(res.status).toBe((ROLE_SETS.members as readonly Role[]).includes(role) ? 200 : 403);
  });

  it("another workshop's lot is 404; anonymous is 401", async () => {
    const lot = await aKgLot();
    expect((await movements(lot.id, other.members.owner)).status).toBe(404);
    expect((await request(h.app).get(`/api/lots/${lot.id}/movements`)).status).toBe(401);
  });
});
