import { count, eq } from 'drizzle-orm';
import Papa from 'papaparse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materialImportPreviewSchema, materialImportResultSchema } from '@batchproof/shared';
import { materials } from '../../apps/api/src/db/schema';
import { aFragrance, anUltramarineBlend } from '../../fixtures/builders/material-builder';
import { buildMaterial, buildSupplier } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

const materialCount = async (workshopId: string) =>
  (
    await h.handle.db
      .select({ n: count() })
      .from(materials)
      .where(eq(materials.workshopId, workshopId))
  )[0]!.n;

// Columns are the union of the rows' keys (Papa takes only the first row's keys otherwise).
const csv = (rows: Record<string, string>[]) =>
  Papa.unparse({ fields: [...new Set(rows.flatMap((r) => Object.keys(r)))], data: rows });
const good = (tradeName: string) => ({
  tradeName,
  inci: 'Sodium Chloride',
  category: 'base',
  functions: 'viscosity controlling; bulking',
  supplier: 'Fernbrook Salts',
});

async function workshopWithSupplier(): Promise<BuiltWorkshop> {
  const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
  await buildSupplier(h.handle.db, w.id, { name: 'Fernbrook Salts' });
  return w;
}

describe('POST /api/materials/import/preview', () => {
  it('parses a text/csv body and reports each row’s errors without writing anything', async () => {
    const w = await workshopWithSupplier();
    const body = csv([
      good('Sea Salt'),
      { ...good('Bad Row'), category: 'glitter', supplier: 'Nobody Ltd' },
    ]);
    const res = await request(h.app)
      .post('/api/materials/import/preview')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(body);
    expect(res.status).toBe(200);
    const p = materialImportPreviewSchema.parse(res.body);
    expect(p).toMatchObject({ validCount: 1, errorCount: 1, fileErrors: [] });
    expect(p.rows[1]).toMatchObject({ line: 3, valid: false });
    expect(Object.keys(p.rows[1]!.errors).sort()).toEqual(['category', 'supplier']);
    expect(await materialCount(w.id)).toBe(0);
  });

  it('accepts a multipart file and reports missing and unknown columns as file errors', async () => {
    const w = await workshopWithSupplier();
    const res = await request(h.app)
      .post('/api/materials/import/preview')
      .set(bearer(w.members.owner))
      .attach('file', Buffer.from('tradeName,colour\nSea Salt,white\n'), {
        filename: 'm.csv',
        contentType: 'text/csv',
      });
    expect(res.status).toBe(200);
    expect(res.body.fileErrors.join(' ')).toMatch(/"inci".*"category".*Unknown column "colour"/);
  });

  it('without a file responds 400 with fieldErrors.file', async () => {
    const w = await workshopWithSupplier();
    const res = await request(h.app)
      .post('/api/materials/import/preview')
      .set(bearer(w.members.owner))
      .send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.file).toBeDefined();
  });
});

describe('POST /api/materials/import', () => {
  it('writes every row in one go when all are valid', async () => {
    const w = await workshopWithSupplier();
    const res = await request(h.app)
      .post('/api/materials/import')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(csv([good('Sea Salt'), good('Epsom Salt'), good('Dead Sea Salt')]));
    expect(res.status).toBe(201);
    expect(materialImportResultSchema.parse(res.body).imported).toBe(3);
    expect(await materialCount(w.id)).toBe(3);
  });

  it('when one row is invalid (a blend adding to 90 %), responds 400 with the row’s errors and writes nothing', async () => {
    const w = await workshopWithSupplier();
    const badBlend = {
      ...good('Broken Blend'),
      category: 'colourant',
      components: JSON.stringify([{ inci: 'Mica', percent: 90 }]),
    };
    const res = await request(h.app)
      .post('/api/materials/import')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(csv([good('Sea Salt'), good('Epsom Salt'), badBlend]));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['rows.4.components']).toBeDefined();
    expect(await materialCount(w.id)).toBe(0);
  });

  it('reads an optional nano column as yes/no or true/false (blank is no) and refuses anything else', async () => {
    const w = await workshopWithSupplier();
    const rows = [
      { ...good('Nano Zinc'), nano: 'Yes' },
      { ...good('Nano White'), nano: 'true' },
      { ...good('Plain Salt'), nano: 'no' },
      { ...good('Blank Salt'), nano: '' },
      { ...good('Odd Salt'), nano: 'maybe' },
    ];
    const preview = await request(h.app)
      .post('/api/materials/import/preview')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(csv(rows));
    const p = materialImportPreviewSchema.parse(preview.body);
    expect(p.rows.map((r) => r.valid)).toEqual([true, true, true, true, false]);
    expect(Object.keys(p.rows[4]!.errors)).toEqual(['nano']);

    const res = await request(h.app)
      .post('/api/materials/import')
      .set(bearer(w.members.owner))
      .set('Content-Type', 'text/csv')
      .send(csv(rows.slice(0, 4)));
    expect(res.status).toBe(201);
    const stored = await h.handle.db
      .select({ tradeName: materials.tradeName, nano: materials.nano })
      .from(materials)
      .where(eq(materials.workshopId, w.id))
      .orderBy(materials.tradeName);
    expect(stored).toEqual([
      { tradeName: 'Blank Salt', nano: false },
      { tradeName: 'Nano White', nano: true },
      { tradeName: 'Nano Zinc', nano: true },
      { tradeName: 'Plain Salt', nano: false },
    ]);
  });

  it('a viewer may not import (403)', async () => {
    const w = await workshopWithSupplier();
    const res = await request(h.app)
      .post('/api/materials/import')
      .set(bearer(w.members.viewer))
      .set('Content-Type', 'text/csv')
      .send(csv([good('Sea Salt')]));
    expect(res.status).toBe(403);
  });
});

describe('GET /api/materials/export.csv', () => {
  it('exports CSV that imports back into another workshop unchanged, blends and certificates included', async () => {
    const from = await workshopWithSupplier();
    await buildMaterial(h.handle.db, from.id, anUltramarineBlend({ tradeName: 'Night Blue Mica' }));
    await buildMaterial(
      h.handle.db,
      from.id,
      aFragrance({ tradeName: '=Fig Leaf', notes: 'made-up scent' }),
    );
    await buildMaterial(
      h.handle.db,
      from.id,
      anUltramarineBlend({ tradeName: 'Ultrafine White', inci: 'Titanium Dioxide', nano: true }),
    );
    const res = await request(h.app)
      .get('/api/materials/export.csv')
      .set(bearer(from.members.viewer));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/materials\.csv/);
    expect(res.text).toContain("'=Fig Leaf"); // a leading "=" is defused for spreadsheets
    expect(res.text.split('\r\n')[0]).toContain(',nano,');

    const to = await workshopWithSupplier();
    const back = await request(h.app)
      .post('/api/materials/import')
      .set(bearer(to.members.owner))
      .set('Content-Type', 'text/csv')
      .send(res.text);
    expect(back.status).toBe(201);
    const list = await request(h.app)
      .get('/api/materials?sort=tradeName')
      .set(bearer(to.members.owner));
    expect(list.body.items.map((m: { tradeName: string }) => m.tradeName)).toEqual([
      '=Fig Leaf',
      'Night Blue Mica',
      'Ultrafine White',
    ]);
    const nano = await request(h.app)
      .get(`/api/materials/${list.body.items[2].id}`)
      .set(bearer(to.members.owner));
    expect(nano.body.nano).toBe(true);
    const blend = await request(h.app)
      .get(`/api/materials/${list.body.items[1].id}`)
      .set(bearer(to.members.owner));
    expect(blend.body.components.map((c: { colourIndex: string }) => c.colourIndex)).toContain(
      '77007',
    );
    expect(blend.body.nano).toBe(false);
  });
});
