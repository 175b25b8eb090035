import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formulaPageSchema, formulaVersionSchema, scaledVersionSchema } from '@batchproof/shared';
import { aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { startFormulaWorkspace, type FormulaMaterials } from '../support/formula-workspace';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let w: BuiltWorkshop;
let m: FormulaMaterials;
let f$: Awaited<ReturnType<typeof startFormulaWorkspace>>;
beforeAll(async () => {
  f$ = await startFormulaWorkspace();
  ({ h, w, m } = f$);
});
afterAll(() => h.close());

const base = () => f$.base();
const createFormula = (lines = base()) => f$.createFormula(lines);
const versionUrl = (id: string, n: number) => f$.versionUrl(id, n);
const getVersion = (id: string, n: number) => f$.getVersion(id, n);
const release = (...args: Parameters<typeof f$.release>) => f$.release(...args);

describe('POST /api/formulas', () => {
  it('creates the formula with draft version 1, evaluated on the server', async () => {
    const f = await createFormula();
    expect(f.versions).toEqual([expect.objectContaining({ number: 1, state: 'draft' })]);
    const v = await getVersion(f.id, 1);
    expect(v.totalGrams).toBe(300);
    expect(v.lines.map((l) => Math.round(l.percent * 100) / 100)).toEqual([66.67, 33.33]);
    expect(v.evaluation?.declarations.US?.ingredients).toEqual([
      'Sodium Bicarbonate',
      'Citric Acid',
    ]);
    expect(v.counts).toEqual({ block: 0, warn: expect.any(Number), info: expect.any(Number) });
  });

  it('stores lines entered by percent as grams of the batch total', async () => {
    const body = aFormula([], {
      draft: aDraft([], {
        lines: undefined,
        byPercent: {
          batchGrams: 500,
          lines: [
            { materialId: m.bicarb, percent: 60 },
            { materialId: m.citric, percent: 40 },
          ],
        },
      }),
    });
    const res = await request(h.app).post('/api/formulas').set(bearer(w.members.owner)).send(body);
    expect(res.status).toBe(201);
    expect((await getVersion(res.body.id, 1)).lines.map((l) => l.grams)).toEqual([300, 200]);
  });

  it('when percent lines add up to 90 %, responds 400 with fieldErrors for draft.byPercent.lines', async () => {
    const body = aFormula([], {
      draft: aDraft([], {
        lines: undefined,
        byPercent: { batchGrams: 500, lines: [{ materialId: m.bicarb, percent: 90 }] },
      }),
    });
    const res = await request(h.app).post('/api/formulas').set(bearer(w.members.owner)).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['draft.byPercent.lines']).toBeDefined();
  });

  it('when a line has no material, responds 400 with fieldErrors.draft.lines.0.materialId', async () => {
    const res = await request(h.app)
      .post('/api/formulas')
      .set(bearer(w.members.owner))
      .send(aFormula([{ grams: 5 } as never]));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['draft.lines.0.materialId']).toBeDefined();
  });

  it('when a line names another workshop’s material, responds 400 with fieldErrors.lines.1.materialId', async () => {
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const foreign = await buildMaterial(h.handle.db, other.id);
    const res = await request(h.app)
      .post('/api/formulas')
      .set(bearer(w.members.owner))
      .send(
        aFormula([
          { materialId: m.bicarb, grams: 1 },
          { materialId: foreign.id, grams: 1 },
        ]),
      );
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['lines.1.materialId']).toBeDefined();
  });

  it('with a bad product profile responds 400 naming the fields, never 500', async () => {
    const body = aFormula(base());
    const res = await request(h.app)
      .post('/api/formulas')
      .set(bearer(w.members.owner))
      .send({
        ...body,
        productType: 'candle',
        draft: { ...body.draft, profile: { use: 'sprinkled', markets: ['MARS'] } },
      });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(
      expect.arrayContaining([
        'productType',
        'draft.profile.use',
        'draft.profile.inBath',
        'draft.profile.markets.0',
      ]),
    );
  });
});

describe('saving a draft (PUT/PATCH /api/formulas/:id/versions/:n)', () => {
  it('re-evaluates: an ultramarine blend in a bath product blocks in the US, a fragrance adds EU allergens', async () => {
    const f = await createFormula();
    const res = await request(h.app)
      .put(versionUrl(f.id, 1))
      .set(bearer(w.members.formulator))
      .send(
        aDraft([...base(), { materialId: m.blue, grams: 1 }, { materialId: m.scent, grams: 6 }]),
      );
    expect(res.status).toBe(200);
    const v = formulaVersionSchema.parse(res.body);
    const usBlocks = v.evaluation!.findings.filter(
      (f) => f.severity === 'block' && f.market === 'US',
    );
    expect(usBlocks.map((x) => x.subject).join()).toMatch(/Ultramarine|77007/); // 21 CFR 73.2725: externally applied only
    expect(v.counts!.block).toBeGreaterThan(0);
    expect(v.evaluation!.declarations.EU!.ingredients).toEqual(
      expect.arrayContaining(['Linalool', 'Limonene']),
    );
  });

  it('PATCH changes only the notes and keeps the lines', async () => {
    const f = await createFormula();
    const res = await request(h.app)
      .patch(versionUrl(f.id, 1))
      .set(bearer(w.members.owner))
      .send({ notes: 'Less citric next time' });
    expect(res.status).toBe(200);
    expect(res.body.notes).toBe('Less citric next time');
    expect(res.body.lines).toHaveLength(2);
  });

  it('saves an empty draft but keeps why it cannot be evaluated', async () => {
    const f = await createFormula();
    const res = await request(h.app)
      .put(versionUrl(f.id, 1))
      .set(bearer(w.members.owner))
      .send(aDraft([]));
    expect(res.status).toBe(200);
    expect(res.body.evaluation).toBeNull();
    expect(res.body.evaluationProblems.length).toBeGreaterThan(0);
    expect((await release(f.id, 1)).status).toBe(409);
  });
});

describe('POST /api/formulas/:id/versions/:n/scale', () => {
  it('scales to units × the profile’s unit mass plus loss, keeping percentages', async () => {
    const f = await createFormula();
    const res = await request(h.app)
      .post(`${versionUrl(f.id, 1)}/scale`)
      .set(bearer(w.members.production))
      .send({ units: 10, lossPercent: 5 });
    expect(res.status).toBe(200);
    const s = scaledVersionSchema.parse(res.body);
    expect(s.targetGrams).toBe(1500); // 10 × 150 g
    expect(s.batchGrams).toBeCloseTo(1575, 6);
    expect(s.lines.map((l) => Math.round(l.grams * 100) / 100)).toEqual([1050, 525]);
  });

  it('scales to a total mass; sending both units and a total responds 400 with fieldErrors.units', async () => {
    const f = await createFormula();
    const ok = await request(h.app)
      .post(`${versionUrl(f.id, 1)}/scale`)
      .set(bearer(w.members.owner))
      .send({ totalGrams: 3000 });
    expect(ok.body.lines.map((l: { grams: number }) => l.grams)).toEqual([2000, 1000]);
    const both = await request(h.app)
      .post(`${versionUrl(f.id, 1)}/scale`)
      .set(bearer(w.members.owner))
      .send({ totalGrams: 3000, units: 2 });
    expect(both.status).toBe(400);
    expect(both.body.error.fieldErrors.units).toBeDefined();
  });
});

describe('GET and PATCH /api/formulas', () => {
  it('lists with the latest and released versions, filtered and sorted on the server', async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const bicarb = await buildMaterial(h.handle.db, ws.id);
    for (const name of ['Rose Fizzer', 'Lime Fizzer', 'Oat Bath Salts']) {
      await request(h.app)
        .post('/api/formulas')
        .set(bearer(ws.members.owner))
        .send(aFormula([{ materialId: bicarb.id, grams: 100 }], { name }));
    }
    const res = await request(h.app)
      .get('/api/formulas?q=fizzer&sort=name&dir=asc')
      .set(bearer(ws.members.owner));
    const page = formulaPageSchema.parse(res.body);
    expect(
      page.items.map((x) => [x.name, x.latestVersion, x.latestState, x.releasedVersion]),
    ).toEqual([
      ['Lime Fizzer', 1, 'draft', null],
      ['Rose Fizzer', 1, 'draft', null],
    ]);
  });

  it("lists each formula with its latest version's findings by severity, as the version reports them", async () => {
    const ws = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const bicarb = await buildMaterial(h.handle.db, ws.id);
    const created = await request(h.app)
      .post('/api/formulas')
      .set(bearer(ws.members.owner))
      .send(aFormula([{ materialId: bicarb.id, grams: 100 }], { name: 'Counted Fizzer' }));
    const version = await request(h.app)
      .get(versionUrl(created.body.id, 1))
      .set(bearer(ws.members.owner));
    const page = formulaPageSchema.parse(
      (await request(h.app).get('/api/formulas').set(bearer(ws.members.owner))).body,
    );
    expect(version.body.counts).not.toBeNull();
    expect(page.items[0]!.latestCounts).toEqual(version.body.counts);
  });

  it('renames a formula; a malformed version number is 404', async () => {
    const f = await createFormula();
    const res = await request(h.app)
      .patch(`/api/formulas/${f.id}`)
      .set(bearer(w.members.owner))
      .send({ name: 'Moonlit Fizzer', productType: 'fizzer' });
    expect(res.status).toBe(200);
    expect(res.body.name).toBe('Moonlit Fizzer');
    expect(
      (await request(h.app).get(versionUrl(f.id, 0)).set(bearer(w.members.owner))).status,
    ).toBe(404);
  });
});
