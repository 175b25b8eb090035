import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { lotPageSchema, materialPageSchema } from '@batchproof/shared';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildLot, buildMaterial } from '../support/row-builders';
import { buildWorkshop } from '../support/workshop-builder';

// A list answers its page and its total from one statement (apps/api/src/core/list-paging.ts);
// these pin the totals that the pager shows, on every page and past the last one.

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

describe('GET /api/materials: total', () => {
  it('counts every match of the filter on each page, past the last page too, and 0 for none', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    for (const tradeName of ['Rose Clay', 'French Green Clay', 'Kaolin Clay', 'Citric Acid']) {
      await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName, inci: tradeName }));
    }
    await buildMaterial(h.handle.db, other.id, aMaterial({ tradeName: 'Bentonite Clay' }));
    const get = async (qs: string) =>
      materialPageSchema.parse(
        (await request(h.app).get(`/api/materials?${qs}`).set(bearer(ws.members.viewer))).body,
      );

    const first = await get('q=clay&sort=tradeName&pageSize=2&page=1');
    expect(first.items.map((m) => m.tradeName)).toEqual(['French Green Clay', 'Kaolin Clay']);
    expect(first.total).toBe(3);
    expect(await get('q=clay&sort=tradeName&pageSize=2&page=2')).toMatchObject({
      items: [{ tradeName: 'Rose Clay' }],
      total: 3,
    });
    expect(await get('q=clay&pageSize=2&page=3')).toMatchObject({ items: [], total: 3, page: 3 });
    expect(await get('q=glitter')).toMatchObject({ items: [], total: 0 });
    expect(await get('q=glitter&page=2')).toMatchObject({ items: [], total: 0 });
  });
});

describe('GET /api/lots: total', () => {
  it('counts the workshop’s lots of the filter with each page, past the last page too', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const clay = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Kaolin Clay' }));
    const salt = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Epsom Salt' }));
    for (const n of ['KC-1', 'KC-2', 'KC-3']) {
      await buildLot(h.handle.db, ws.id, clay.id, { supplierLotNumber: n });
    }
    await buildLot(h.handle.db, ws.id, salt.id, { supplierLotNumber: 'ES-1' });
    const elsewhere = await buildMaterial(h.handle.db, other.id, aMaterial());
    await buildLot(h.handle.db, other.id, elsewhere.id, { supplierLotNumber: 'KC-9' });
    const get = async (qs: string) =>
      lotPageSchema.parse(
        (await request(h.app).get(`/api/lots?${qs}`).set(bearer(ws.members.viewer))).body,
      );

    expect(await get('sort=materialName&pageSize=3')).toMatchObject({ total: 4 });
    const second = await get('q=KC-&sort=supplierLotNumber&pageSize=2&page=2');
    expect(second.items.map((l) => l.supplierLotNumber)).toEqual(['KC-3']);
    expect(second.total).toBe(3);
    expect(await get(`materialId=${salt.id}&page=4`)).toMatchObject({ items: [], total: 1 });
  });
});
