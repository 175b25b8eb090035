import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { materialPageSchema, materialSchema, materialsByIdSchema } from '@batchproof/shared';
import {
  aFragrance,
  aMaterial,
  anUltramarineBlend,
} from '../../fixtures/builders/material-builder';
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

const post = (body: object) =>
  request(h.app).post('/api/materials').set(bearer(w.members.formulator)).send(body);

describe('POST /api/materials', () => {
  it('creates a material with its supplier and answers 201 in the shared shape', async () => {
    const supplier = await buildSupplier(h.handle.db, w.id);
    const res = await post(aMaterial({ supplierId: supplier.id, cas: '144-55-8' }));
    expect(res.status).toBe(201);
    const m = materialSchema.parse(res.body);
    expect(m.supplierName).toBe(supplier.name);
    expect(m.cas).toBe('144-55-8');
  });

  it('keeps a blend whose components add up to 100 %, within ± 0.01', async () => {
    const res = await post(anUltramarineBlend());
    expect(res.status).toBe(201);
    expect(res.body.components).toHaveLength(3);
    const near = anUltramarineBlend();
    near.components![2]!.percent = 15.005;
    expect((await post(near)).status).toBe(201);
  });

  it('keeps whether the material and each blend component is a nanomaterial; a material is not nano unless said', async () => {
    expect((await post(aMaterial())).body.nano).toBe(false);
    const blend = anUltramarineBlend({ nano: true });
    blend.components![1] = { ...blend.components![1]!, nano: true, cas: '13463-67-7' };
    const res = await post(blend);
    expect(res.status).toBe(201);
    expect(res.body.nano).toBe(true);
    expect(res.body.components[1]).toMatchObject({ nano: true, cas: '13463-67-7' });
    const read = await request(h.app)
      .get(`/api/materials/${res.body.id}`)
      .set(bearer(w.members.viewer));
    expect(materialSchema.parse(read.body)).toMatchObject({ nano: true });

    const cleared = await request(h.app)
      .put(`/api/materials/${res.body.id}`)
      .set(bearer(w.members.owner))
      .send({ ...blend, nano: false });
    expect(cleared.body.nano).toBe(false);
  });

  it('when blend components add up to 90 %, responds 400 with fieldErrors.components', async () => {
    const blend = anUltramarineBlend();
    blend.components![0]!.percent = 50;
    const res = await post(blend);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.components[0]).toMatch(/90 %.*100 %/);
  });

  it('keeps a fragrance with its IFRA maxima, certificate date, amendment and allergens', async () => {
    const res = await post(aFragrance());
    expect(res.status).toBe(201);
    const m = materialSchema.parse(res.body);
    expect(m.ifraCertificate?.maxPercentByIfraCategory['9']).toBe(5);
    expect(m.ifraCertificate?.amendment).toBe(51);
    expect(m.allergenDeclaration?.allergens.map((a) => a.inci)).toEqual(['Linalool', 'Limonene']);
  });

  it('when a base carries an IFRA certificate, responds 400 with fieldErrors.ifraCertificate', async () => {
    const { ifraCertificate } = aFragrance();
    const res = await post(aMaterial({ ifraCertificate }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.ifraCertificate).toBeDefined();
  });

  it('with an empty body responds 400 naming tradeName, inci and category', async () => {
    const res = await post({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(
      expect.arrayContaining(['tradeName', 'inci', 'category']),
    );
  });

  it('with fields of the wrong types responds 400, never 500', async () => {
    const res = await post({
      tradeName: ['x'],
      inci: 3,
      category: 'glitter',
      functions: 'abc',
      components: 'lots',
      weightPerVolume: { cup: -1 },
      calibrations: [{ unit: 'bucket', amount: 0, grams: 'x' }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['category']).toBeDefined();
    expect(res.body.error.fieldErrors['weightPerVolume.cup']).toBeDefined();
  });

  it('with a bad Colour Index number responds 400 with fieldErrors.colourIndex', async () => {
    const res = await post(aMaterial({ category: 'colourant', colourIndex: 'blue-ish' }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.colourIndex).toBeDefined();
  });

  it('when the supplier belongs to another workshop, responds 400 with fieldErrors.supplierId', async () => {
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const foreign = await buildSupplier(h.handle.db, other.id);
    const res = await post(aMaterial({ supplierId: foreign.id }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.supplierId).toBeDefined();
  });

  it('summarises calibrations per measure: average grams and spread', async () => {
    const res = await post(
      aMaterial({
        weightPerVolume: { cup: 220, teaspoon: 4.6 },
        calibrations: [
          { unit: 'cup', amount: 1, grams: 240 },
          { unit: 'cup', amount: 0.5, grams: 125 },
          { unit: 'teaspoon', amount: 2, grams: 9.2 },
        ],
      }),
    );
    expect(res.status).toBe(201);
    const m = materialSchema.parse(res.body);
    const cup = m.calibrationSummary.find((c) => c.unit === 'cup')!;
    expect(cup).toMatchObject({ count: 2, averageGrams: 245, minGrams: 240, maxGrams: 250 });
    expect(cup.spreadPercent).toBeCloseTo((10 / 245) * 100, 1);
    expect(m.weightPerVolume.cup).toBe(220);
  });
});

describe('GET /api/materials', () => {
  it('filters by text and category, sorts and pages on the server', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['production'] });
    const names = ['Shea Butter', 'Cocoa Butter', 'Mango Butter', 'Sweet Almond Oil'];
    for (const tradeName of names) {
      const category = tradeName.endsWith('Oil') ? 'oil' : 'butter';
      await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName, inci: tradeName, category }));
    }
    const get = async (qs: string) =>
      materialPageSchema.parse(
        (await request(h.app).get(`/api/materials?${qs}`).set(bearer(ws.members.production))).body,
      );
    expect((await get('q=butter&sort=tradeName&dir=desc')).items.map((m) => m.tradeName)).toEqual([
      'Shea Butter',
      'Mango Butter',
      'Cocoa Butter',
    ]);
    expect((await get('category=oil')).items.map((m) => m.tradeName)).toEqual(['Sweet Almond Oil']);
    const page = await get('sort=tradeName&pageSize=2&page=2');
    expect(page.items.map((m) => m.tradeName)).toEqual(['Shea Butter', 'Sweet Almond Oil']);
    expect(page.total).toBe(4);
    expect((await get('q=100%25')).total).toBe(0);
  });

  it('matches the text filter in the trade name, INCI, US name or CAS, whatever the case', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    await buildMaterial(
      h.handle.db,
      ws.id,
      aMaterial({ tradeName: 'Bath salt', inci: 'Magnesium Sulfate', cas: '7487-88-9' }),
    );
    await buildMaterial(h.handle.db, ws.id, aFragrance({ tradeName: 'Sea breeze' }));
    await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Cocoa Butter' }));
    const names = async (q: string) =>
      materialPageSchema
        .parse(
          (
            await request(h.app)
              .get(`/api/materials?q=${encodeURIComponent(q)}&sort=tradeName`)
              .set(bearer(ws.members.viewer))
          ).body,
        )
        .items.map((m) => m.tradeName);
    expect(await names('BATH SALT')).toEqual(['Bath salt']);
    expect(await names('magnesium sulf')).toEqual(['Bath salt']);
    expect(await names('7487-88')).toEqual(['Bath salt']);
    expect(await names('fragrance')).toEqual(['Sea breeze']); // its US name
    expect(await names('salt_')).toEqual([]); // LIKE wildcards match only themselves
  });

  it("matches a blend component's INCI too, ranks own-name matches first and says where each row matched", async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const blend = aMaterial({
      tradeName: 'Aroma blend',
      inci: 'Parfum',
      category: 'fragrance',
      components: [
        { inci: 'Benzyl Alcohol', percent: 40 },
        { inci: 'Linalyl Acetate', percent: 60 },
      ],
    });
    await buildMaterial(h.handle.db, ws.id, blend);
    // Its own INCI and its one component both match: that counts as a match on its own name.
    const zest = aMaterial({
      tradeName: 'Zest',
      inci: 'Linalool',
      components: [{ inci: 'Linalool', percent: 100 }],
    });
    await buildMaterial(h.handle.db, ws.id, zest);
    await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Cocoa Butter' }));
    const list = async (qs: string) =>
      materialPageSchema.parse(
        (await request(h.app).get(`/api/materials?${qs}`).set(bearer(ws.members.viewer))).body,
      );
    const rows = async (qs: string) =>
      (await list(qs)).items.map((m) => [m.tradeName, m.matchedIn, m.matchedComponent]);

    // By name alone "Aroma blend" sorts first; its match is only inside a component, so it follows.
    expect(await rows('q=LINAL&sort=tradeName')).toEqual([
      ['Zest', 'name', undefined],
      ['Aroma blend', 'components', 'Linalyl Acetate'],
    ]);
    expect(await rows('q=linal&sort=tradeName&dir=desc')).toEqual([
      ['Zest', 'name', undefined],
      ['Aroma blend', 'components', 'Linalyl Acetate'],
    ]);
    expect((await list('q=linal&pageSize=1&page=2')).items.map((m) => m.tradeName)).toEqual([
      'Aroma blend',
    ]);
    expect((await list('q=linal')).total).toBe(2);
    expect(await rows('q=parfum')).toEqual([['Aroma blend', 'name', undefined]]);
    // Without a text filter nothing matched anything.
    const unfiltered = (await request(h.app).get('/api/materials').set(bearer(ws.members.viewer)))
      .body.items;
    expect(unfiltered.map((m: object) => 'matchedIn' in m)).toEqual([false, false, false]);
  });

  it('with ids=a,b,c answers the full records of those materials in one request', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const blend = await buildMaterial(h.handle.db, ws.id, anUltramarineBlend());
    const fragrance = await buildMaterial(h.handle.db, ws.id, aFragrance());
    await buildMaterial(h.handle.db, ws.id, aMaterial({ tradeName: 'Not asked for' }));
    const theirs = await buildMaterial(h.handle.db, other.id, aMaterial());
    const res = await request(h.app)
      .get(`/api/materials?ids=${blend.id},${fragrance.id},${blend.id},${theirs.id}`)
      .set(bearer(ws.members.viewer));
    expect(res.status).toBe(200);
    const { items } = materialsByIdSchema.parse(res.body);
    // Each asked-for material once, with what the live check reads; another workshop's is left out.
    expect(items.map((m) => m.id).sort()).toEqual([blend.id, fragrance.id].sort());
    expect(items.find((m) => m.id === blend.id)!.components).toHaveLength(3);
    expect(items.find((m) => m.id === fragrance.id)!.ifraCertificate).not.toBeNull();
  });

  it('with ids that are not record ids, or too many of them, responds 400 with fieldErrors.ids', async () => {
    const get = (ids: string) =>
      request(h.app).get(`/api/materials?ids=${ids}`).set(bearer(w.members.viewer));
    for (const ids of [
      '',
      'not-an-id',
      Array.from({ length: 201 }, () => crypto.randomUUID()).join(','),
    ]) {
      const res = await get(ids);
      expect(res.status).toBe(400);
      expect(res.body.error.fieldErrors.ids).toBeDefined();
    }
  });

  it('with an unknown sort key responds 400 with fieldErrors.sort', async () => {
    const res = await request(h.app).get('/api/materials?sort=price').set(bearer(w.members.owner));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.sort).toBeDefined();
  });
});

describe('PUT and DELETE /api/materials/:id', () => {
  it('replaces a material’s fields', async () => {
    const m = await buildMaterial(h.handle.db, w.id);
    const res = await request(h.app)
      .put(`/api/materials/${m.id}`)
      .set(bearer(w.members.owner))
      .send(aMaterial({ tradeName: 'Fine Bicarb', functions: ['buffering', 'deodorant'] }));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      tradeName: 'Fine Bicarb',
      functions: ['buffering', 'deodorant'],
    });
  });

  it('refuses with 409 to delete a material a lot was received for, and deletes an unused one', async () => {
    const used = await buildMaterial(h.handle.db, w.id);
    await buildLot(h.handle.db, w.id, used.id);
    const del = (id: string) =>
      request(h.app).delete(`/api/materials/${id}`).set(bearer(w.members.owner));
    expect((await del(used.id)).status).toBe(409);
    const unused = await buildMaterial(h.handle.db, w.id);
    expect((await del(unused.id)).status).toBe(204);
  });
});
