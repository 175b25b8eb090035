import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { supplierPageSchema, supplierSchema } from '@batchproof/shared';
import { aMaterial, aSupplier } from '../../fixtures/builders/material-builder';
import { buildMaterial, buildSupplier } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
});
afterAll(() => h.close());

describe('POST /api/suppliers', () => {
  it('creates a supplier and answers it with 201, e-mail lower-cased and blanks as null', async () => {
    const res = await request(h.app)
      .post('/api/suppliers')
      .set(bearer(w.members.formulator))
      .send(aSupplier({ email: 'Orders@Wrenfield-Chem.EXAMPLE', contact: '' }));
    expect(res.status).toBe(201);
    const supplier = supplierSchema.parse(res.body);
    expect(supplier.email).toBe('orders@wrenfield-chem.example');
    expect(supplier.contact).toBeNull();
    expect(supplier.materialCount).toBe(0);
  });

  it('with a bad e-mail and website responds 400 with fieldErrors.email and fieldErrors.website', async () => {
    const res = await request(h.app)
      .post('/api/suppliers')
      .set(bearer(w.members.owner))
      .send(aSupplier({ email: 'not-an-email', website: 'ftp://x' }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.email).toBeDefined();
    expect(res.body.error.fieldErrors.website).toBeDefined();
  });

  it('without a name responds 400 with fieldErrors.name, even for a body of the wrong types', async () => {
    const res = await request(h.app)
      .post('/api/suppliers')
      .set(bearer(w.members.owner))
      .send({ name: 42, notes: ['x'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.name).toBeDefined();
  });
});

describe('GET /api/suppliers', () => {
  it('filters by name, sorts and pages on the server', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    for (const name of ['Birchwick Oils', 'Alder Chemicals', 'Cobble Clays', 'Alder Micas']) {
      await buildSupplier(h.handle.db, ws.id, { name });
    }
    const minerals = await buildSupplier(h.handle.db, ws.id, { name: 'Alder Minerals' });
    await buildMaterial(h.handle.db, ws.id, aMaterial({ supplierId: minerals.id }));
    const get = (qs: string) =>
      request(h.app).get(`/api/suppliers?${qs}`).set(bearer(ws.members.viewer));
    const filtered = supplierPageSchema.parse((await get('q=alder&sort=name&dir=desc')).body);
    expect(filtered.items.map((s) => [s.name, s.materialCount])).toEqual([
      ['Alder Minerals', 1],
      ['Alder Micas', 0],
      ['Alder Chemicals', 0],
    ]);
    expect(filtered.total).toBe(3);
    const page2 = supplierPageSchema.parse((await get('sort=name&page=2&pageSize=3')).body);
    expect(page2.items.map((s) => s.name)).toEqual(['Birchwick Oils', 'Cobble Clays']);
    expect(page2).toMatchObject({ total: 5, page: 2, pageSize: 3 });
  });

  it('with a page size over 100 responds 400 with fieldErrors.pageSize', async () => {
    const res = await request(h.app)
      .get('/api/suppliers?pageSize=1000')
      .set(bearer(w.members.owner));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.pageSize).toBeDefined();
  });
});

describe('PUT and DELETE /api/suppliers/:id', () => {
  it('replaces the fields, then deletes the supplier', async () => {
    const s = await buildSupplier(h.handle.db, w.id);
    const put = await request(h.app)
      .put(`/api/suppliers/${s.id}`)
      .set(bearer(w.members.owner))
      .send(aSupplier({ name: 'Renamed Supplies' }));
    expect(put.status).toBe(200);
    expect(put.body.name).toBe('Renamed Supplies');
    const del = await request(h.app).delete(`/api/suppliers/${s.id}`).set(bearer(w.members.owner));
    expect(del.status).toBe(204);
    const get = await request(h.app).get(`/api/suppliers/${s.id}`).set(bearer(w.members.owner));
    expect(get.status).toBe(404);
  });

  it('a malformed id is 404, not 500', async () => {
    const res = await request(h.app).get('/api/suppliers/not-a-uuid').set(bearer(w.members.owner));
    expect(res.status).toBe(404);
  });
});
