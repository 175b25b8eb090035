import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lotPageSchema, lotSchema } from '@batchproof/shared';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { buildLot, buildMaterial, buildSupplier, consumeFromLot } from '../support/row-builders';
import { aLot } from '../../fixtures/builders/lot-builder';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let w: BuiltWorkshop;
let materialId: string;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  materialId = (await buildMaterial(h.handle.db, w.id)).id;
});
afterAll(() => h.close());

const post = (body: object) =>
  request(h.app).post('/api/lots').set(bearer(w.members.formulator)).send(body);

describe('POST /api/lots', () => {
  it('records goods-in and answers 201 with stock on hand equal to the quantity', async () => {
    const res = await post(aLot(materialId, { quantity: 12.5, unit: 'kg', unitCost: 2.75 }));
    expect(res.status).toBe(201);
    const lot = lotSchema.parse(res.body);
    expect(lot).toMatchObject({ quantity: 12.5, unit: 'kg', unitCost: 2.75, stockOnHand: 12.5 });
  });

  it("names the material's supplier, or null when none is recorded", async () => {
    const supplier = await buildSupplier(h.handle.db, w.id, { name: 'Quillmoor Salts' });
    const supplied = await buildMaterial(h.handle.db, w.id, aMaterial({ supplierId: supplier.id }));
    const withSupplier = lotSchema.parse((await post(aLot(supplied.id))).body);
    const without = lotSchema.parse((await post(aLot(materialId))).body);
    expect(withSupplier.supplierName).toBe('Quillmoor Salts');
    expect(without.supplierName).toBeNull();
  });

  it('when the expiry is before the day received, responds 400 with fieldErrors.expiresOn', async () => {
    const res = await post(aLot(materialId, { receivedOn: '2025-06-01', expiresOn: '2025-05-31' }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.expiresOn).toBeDefined();
  });

  it('with an unknown unit, a zero quantity and a bad date responds 400 naming each field', async () => {
    const res = await post({
      ...aLot(materialId),
      unit: 'bucket',
      quantity: 0,
      receivedOn: '1/5/25',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(
      expect.arrayContaining(['unit', 'quantity', 'receivedOn']),
    );
  });

  it('for another workshop’s material responds 400 with fieldErrors.materialId', async () => {
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const foreign = await buildMaterial(h.handle.db, other.id);
    const res = await post(aLot(foreign.id));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.materialId).toBeDefined();
  });
});

describe('stock on hand', () => {
  it('is the quantity received minus what batches consumed', async () => {
    const lot = await buildLot(h.handle.db, w.id, materialId, { quantity: 10, unit: 'kg' });
    await consumeFromLot(h.handle.db, w.id, lot.id, 2.5);
    await consumeFromLot(h.handle.db, w.id, lot.id, 1.25);
    const res = await request(h.app).get(`/api/lots/${lot.id}`).set(bearer(w.members.viewer));
    expect(res.status).toBe(200);
    expect(res.body.stockOnHand).toBe(6.25);
  });

  it('a lot cannot be cut below what was consumed (409), nor deleted once used (409)', async () => {
    const lot = await buildLot(h.handle.db, w.id, materialId, { quantity: 10, unit: 'kg' });
    await consumeFromLot(h.handle.db, w.id, lot.id, 4);
    const put = await request(h.app)
      .put(`/api/lots/${lot.id}`)
      .set(bearer(w.members.owner))
      .send(aLot(materialId, { quantity: 3, unit: 'kg' }));
    expect(put.status).toBe(409);
    expect(put.body.error.fieldErrors.quantity).toBeDefined();
    const del = await request(h.app).delete(`/api/lots/${lot.id}`).set(bearer(w.members.owner));
    expect(del.status).toBe(409);
  });
});

describe('GET /api/lots', () => {
  it('filters by lot number or material, sorts and pages on the server', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const salt = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Epsom Salt' }));
    const clay = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Kaolin Clay' }));
    await buildLot(h.handle.db, ws.id, salt.id, {
      supplierLotNumber: 'ES-001',
      receivedOn: '2025-01-10',
    });
    await buildLot(h.handle.db, ws.id, salt.id, {
      supplierLotNumber: 'ES-002',
      receivedOn: '2025-03-10',
    });
    await buildLot(h.handle.db, ws.id, clay.id, {
      supplierLotNumber: 'KC-777',
      receivedOn: '2025-02-10',
    });
    const get = async (qs: string) =>
      lotPageSchema.parse(
        (await request(h.app).get(`/api/lots?${qs}`).set(bearer(ws.members.viewer))).body,
      );
    const bySalt = await get('q=epsom&sort=receivedOn&dir=desc');
    expect(bySalt.items.map((l) => l.supplierLotNumber)).toEqual(['ES-002', 'ES-001']);
    expect((await get(`materialId=${clay.id}`)).items.map((l) => l.materialName)).toEqual([
      'Kaolin Clay',
    ]);
    const page = await get('sort=supplierLotNumber&pageSize=2&page=2');
    expect(page.items.map((l) => l.supplierLotNumber)).toEqual(['KC-777']);
    expect(page.total).toBe(3);
    expect((await get('sort=materialName&dir=asc')).items[0]!.materialName).toBe('Epsom Salt');
  });

  it('when a material is renamed, its lots carry and sort by the new name at once', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const clay = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Kaolin Clay' }));
    const salt = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Epsom Salt' }));
    await buildLot(h.handle.db, ws.id, clay.id, { supplierLotNumber: 'KC-1' });
    await buildLot(h.handle.db, ws.id, salt.id, { supplierLotNumber: 'ES-1' });
    const names = async () =>
      lotPageSchema
        .parse(
          (
            await request(h.app)
              .get('/api/lots?sort=materialName&dir=asc')
              .set(bearer(ws.members.owner))
          ).body,
        )
        .items.map((l) => l.materialName);
    expect(await names()).toEqual(['Epsom Salt', 'Kaolin Clay']);

    const renamed = await request(h.app)
      .put(`/api/materials/${clay.id}`)
      .set(bearer(ws.members.owner))
      .send(aMaterial({ tradeName: 'China Clay' }));
    expect(renamed.status).toBe(200);
    expect(await names()).toEqual(['China Clay', 'Epsom Salt']);
  });

  it('with a bad expiry cut-off responds 400 with fieldErrors.expiresBefore', async () => {
    const res = await request(h.app)
      .get('/api/lots?expiresBefore=soon')
      .set(bearer(w.members.owner));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.expiresBefore).toBeDefined();
  });
});

// Production receives deliveries, so it records goods-in (DEVELOPERS.md, "Roles").
describe('goods-in by a production member', () => {
  it('records a lot receipt (201) and corrects it (200)', async () => {
    const created = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.production))
      .send(aLot(materialId, { supplierLotNumber: 'PR-1', quantity: 10 }));
    expect(created.status).toBe(201);
    const lot = lotSchema.parse(created.body);
    expect(lot).toMatchObject({ supplierLotNumber: 'PR-1', stockOnHand: 10 });

    const corrected = await request(h.app)
      .put(`/api/lots/${lot.id}`)
      .set(bearer(w.members.production))
      .send(aLot(materialId, { supplierLotNumber: 'PR-1', quantity: 12 }));
    expect(corrected.status).toBe(200);
    expect(lotSchema.parse(corrected.body).stockOnHand).toBe(12);
  });

  it('may not delete a lot (403): deleting stays with owner and formulator', async () => {
    const created = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.production))
      .send(aLot(materialId));
    const res = await request(h.app)
      .delete(`/api/lots/${created.body.id}`)
      .set(bearer(w.members.production));
    expect(res.status).toBe(403);
  });

  it('a viewer still may not record goods-in (403)', async () => {
    const res = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.viewer))
      .send(aLot(materialId));
    expect(res.status).toBe(403);
  });
});
