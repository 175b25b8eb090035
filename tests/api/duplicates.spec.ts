import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addDays,
  lotSchema,
  materialImportPreviewSchema,
  materialImportResultSchema,
  materialSchema,
  todayIso,
} from '@batchproof/shared';
import { aLot } from '../../fixtures/builders/lot-builder';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { buildLot, buildMaterial, buildSupplier } from '../support/row-builders';
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

describe('lots: the same supplier lot number twice for one material', () => {
  it('warns on create and on update, without refusing, ignoring case and spaces', async () => {
    const material = await buildMaterial(h.handle.db, w.id);
    await buildLot(h.handle.db, w.id, material.id, {
      supplierLotNumber: 'AB-1234',
      receivedOn: '2025-03-01',
    });
    const again = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.production))
      .send(aLot(material.id, { supplierLotNumber: ' ab-1234 ' }));
    expect(again.status).toBe(201);
    expect(lotSchema.parse(again.body).warnings).toEqual([
      {
        field: 'supplierLotNumber',
        message:
          'This material already has lot ab-1234, received 2025-03-01. Check this is not the same delivery entered twice.',
      },
    ]);

    const otherMaterial = await buildMaterial(h.handle.db, w.id);
    const elsewhere = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.formulator))
      .send(aLot(otherMaterial.id, { supplierLotNumber: 'AB-1234' }));
    expect(elsewhere.body.warnings).toEqual([]);

    const edited = await request(h.app)
      .put(`/api/lots/${elsewhere.body.id}`)
      .set(bearer(w.members.formulator))
      .send(aLot(material.id, { supplierLotNumber: 'AB -1234' }));
    expect(edited.status).toBe(200);
    expect(edited.body.warnings).toHaveLength(1);
  });
});

describe('lots: a received date in the future', () => {
  it('refuses a day after tomorrow (UTC) with 400 and fieldErrors.receivedOn', async () => {
    const material = await buildMaterial(h.handle.db, w.id);
    const res = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.owner))
      .send(aLot(material.id, { receivedOn: addDays(todayIso(), 2), expiresOn: null }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.receivedOn).toEqual([
      'The received date cannot be in the future',
    ]);
  });

  it('accepts tomorrow (UTC): east of Greenwich it is already today', async () => {
    const material = await buildMaterial(h.handle.db, w.id);
    const res = await request(h.app)
      .post('/api/lots')
      .set(bearer(w.members.owner))
      .send(aLot(material.id, { receivedOn: addDays(todayIso(), 1), expiresOn: null }));
    expect(res.status).toBe(201);
  });
});

describe('materials CSV: rows matching materials already on file', () => {
  const csv = (lines: string[]) => ['tradeName,inci,category,supplier,notes', ...lines].join('\n');
  const send = (path: string, text: string, ws: BuiltWorkshop) =>
    request(h.app)
      .post(path)
      .set(bearer(ws.members.owner))
      .set('Content-Type', 'text/csv')
      .send(text);

  it('marks a row with the same trade name (case and spaces aside) and supplier as existing', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const supplier = await buildSupplier(h.handle.db, ws.id, { name: 'Wrenfield' });
    const bicarb = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Bicarb' }));
    const salt = await buildMaterial(
      h.handle.db,
      ws.id,
      aMaterial({ tradeName: 'Sea Salt', supplierId: supplier.id }),
    );
    const text = csv([
      ' bicarb ,Sodium Bicarbonate,base,,',
      'sea  salt,Sodium Chloride,base,Wrenfield,',
      'Sea Salt,Sodium Chloride,base,,',
      'Citric,Citric Acid,acid,,',
    ]);
    const preview = materialImportPreviewSchema.parse(
      (await send('/api/materials/import/preview', text, ws)).body,
    );
    expect(preview.rows.map((r) => [r.line, r.existingId])).toEqual([
      [2, bicarb.id],
      [3, salt.id],
      // Same name, no supplier: another material than Wrenfield's sea salt.
      [4, null],
      [5, null],
    ]);
    expect(preview.existingCount).toBe(2);
  });

  it('creates copies by default, and updates the existing materials with existing=update', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const bicarb = await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Bicarb' }));
    const text = csv(['Bicarb,Sodium Bicarbonate,base,,Food grade', 'Citric,Citric Acid,acid,,']);

    const updated = materialImportResultSchema.parse(
      (await send('/api/materials/import?existing=update', text, ws)).body,
    );
    expect(updated).toMatchObject({ imported: 2, updated: 1 });
    expect(updated.ids[0]).toBe(bicarb.id);
    const reread = await request(h.app)
      .get(`/api/materials/${bicarb.id}`)
      .set(bearer(ws.members.owner));
    expect(materialSchema.parse(reread.body).notes).toBe('Food grade');

    const copied = materialImportResultSchema.parse(
      (await send('/api/materials/import', text, ws)).body,
    );
    expect(copied).toMatchObject({ imported: 2, updated: 0 });
    expect(copied.ids).not.toContain(bicarb.id);
  });

  it('with existing other than create or update responds 400 with fieldErrors.existing', async () => {
    const res = await send('/api/materials/import?existing=merge', csv(['A,B,base,,']), w);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.existing).toBeDefined();
  });
});
