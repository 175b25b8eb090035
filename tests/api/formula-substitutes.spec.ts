import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  errorEnvelopeSchema,
  formulaSchema,
  formulaVersionSchema,
  type FormulaVersionInput,
} from '@batchproof/shared';
import { aBathProfile, aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { bearer } from '../support/auth-header';
import { startFormulaWorkspace } from '../support/formula-workspace';
import { buildMaterial } from '../support/row-builders';
import { buildWorkshop } from '../support/workshop-builder';
import { TEST_JWT_SECRET } from '../support/api-harness';

let f$: Awaited<ReturnType<typeof startFormulaWorkspace>>;
/** Materials of this file: two starches and two colourants, and another workshop's starch. */
const m = { corn: '', tapioca: '', arrowroot: '', green: '', violet: '', elsewhere: '' };
beforeAll(async () => {
  f$ = await startFormulaWorkspace();
  const db = f$.h.handle.db;
  const add = async (body: Parameters<typeof aMaterial>[0]) =>
    (await buildMaterial(db, f$.w.id, aMaterial(body))).id;
  m.corn = await add({ tradeName: 'Corn Starch', inci: 'Zea Mays Starch', category: 'additive' });
  m.tapioca = await add({
    tradeName: 'Tapioca Starch',
    inci: 'Tapioca Starch',
    category: 'additive',
  });
  m.arrowroot = await add({
    tradeName: 'Arrowroot Powder',
    inci: 'Maranta Arundinacea Root Powder',
    category: 'additive',
  });
  const colourant = (tradeName: string, ci: string) =>
    add({
      tradeName,
      inci: `CI ${ci}`,
      category: 'colourant',
      functions: ['colorant'],
      colourIndex: `CI ${ci}`,
    });
  m.green = await colourant('Green Dye', '61570');
  m.violet = await colourant('Violet Dye', '60730');
  const other = await buildWorkshop(db, TEST_JWT_SECRET, { roles: ['owner'] });
  m.elsewhere = (await buildMaterial(db, other.id, aMaterial({ tradeName: 'Their Starch' }))).id;
});
afterAll(() => f$.h.close());

const formulator = () => bearer(f$.w.members.formulator);

/** An EU bath fizzer (bath water reaches mucous membranes): bicarb, citric, starch, a green dye. */
function fizzer(starchSubs: string[] = [], greenSubs: string[] = []): FormulaVersionInput {
  return aDraft(
    [
      { materialId: f$.m.bicarb, grams: 200 },
      { materialId: f$.m.citric, grams: 100 },
      { materialId: m.corn, grams: 40, substitutes: starchSubs },
      { materialId: m.green, grams: 0.05, substitutes: greenSubs },
    ],
    { profile: aBathProfile({ markets: ['EU'] }) },
  );
}

async function created(draft: FormulaVersionInput) {
  const res = await request(f$.h.app)
    .post('/api/formulas')
    .set(formulator())
    .send(aFormula(draft.lines!, { draft }));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return formulaSchema.parse(res.body).id;
}

describe('approved substitutes on formula lines', () => {
  it('are saved and answered per line, in the order given, with their names', async () => {
    const id = await created(fizzer([m.tapioca, m.arrowroot]));
    const v = await f$.getVersion(id, 1);
    expect(v.lines.map((l) => l.substitutes)).toEqual([
      [],
      [],
      [
        { materialId: m.tapioca, materialName: 'Tapioca Starch' },
        { materialId: m.arrowroot, materialName: 'Arrowroot Powder' },
      ],
      [],
    ]);
    // A save replaces them, a PATCH of something else keeps them.
    const saved = await request(f$.h.app)
      .put(f$.versionUrl(id, 1))
      .set(formulator())
      .send(fizzer([m.arrowroot]));
    expect(saved.status).toBe(200);
    expect(formulaVersionSchema.parse(saved.body).lines[2]!.substitutes).toEqual([
      { materialId: m.arrowroot, materialName: 'Arrowroot Powder' },
    ]);
    const patched = await request(f$.h.app)
      .patch(f$.versionUrl(id, 1))
      .set(formulator())
      .send({ notes: 'Arrowroot on humid days' });
    expect(patched.status).toBe(200);
    expect(formulaVersionSchema.parse(patched.body).lines[2]!.substitutes).toEqual([
      { materialId: m.arrowroot, materialName: 'Arrowroot Powder' },
    ]);
  });

  it('are copied into a new draft started from a released version', async () => {
    const id = await created(fizzer([m.tapioca]));
    expect((await f$.release(id, 1)).status).toBe(200);
    const next = await request(f$.h.app)
      .post(`/api/formulas/${id}/versions`)
      .set(formulator())
      .send({ fromVersion: 1 });
    expect(next.status).toBe(201);
    const v2 = formulaVersionSchema.parse(next.body);
    expect(v2.number).toBe(2);
    expect(v2.lines[2]!.substitutes).toEqual([
      { materialId: m.tapioca, materialName: 'Tapioca Starch' },
    ]);
    // The released version keeps its own.
    expect((await f$.getVersion(id, 1)).lines[2]!.substitutes).toHaveLength(1);
  });

  it('refuses another workshop’s material as a substitute, on that substitute (400)', async () => {
    const id = await created(fizzer());
    const res = await request(f$.h.app)
      .put(f$.versionUrl(id, 1))
      .set(formulator())
      .send(fizzer([m.tapioca, m.elsewhere]));
    expect(res.status).toBe(400);
    expect(errorEnvelopeSchema.parse(res.body).error.fieldErrors).toEqual({
      'lines.2.substitutes.1': ['Choose one of this workshop’s materials'],
    });
  });

  it('refuses the line’s own material as its substitute (400)', async () => {
    const id = await created(fizzer());
    const res = await request(f$.h.app)
      .put(f$.versionUrl(id, 1))
      .set(formulator())
      .send(fizzer([m.corn]));
    expect(res.status).toBe(400);
    expect(errorEnvelopeSchema.parse(res.body).error.fieldErrors).toEqual({
      'lines.2.substitutes.0': [
        'A line’s own material cannot be its substitute: choose another material',
      ],
    });
  });
});

describe('the engine checks each substitute like the line’s own material', () => {
  it('a starch substitute that changes nothing adds no finding', async () => {
    const plain = await f$.getVersion(await created(fizzer()), 1);
    const withTapioca = await f$.getVersion(await created(fizzer([m.tapioca])), 1);
    expect(withTapioca.evaluation!.findings.filter((f) => f.substitute)).toEqual([]);
    expect(withTapioca.counts).toEqual(plain.counts);
    expect(withTapioca.evaluation!.substitutes).toEqual([
      {
        lineNumber: 3,
        materialId: m.tapioca,
        materialName: 'Tapioca Starch',
        replacesName: 'Corn Starch',
      },
    ]);
  });

  it('a colourant substitute not permitted in the EU for the bath blocks release, naming the substitute', async () => {
    const plain = await f$.getVersion(await created(fizzer()), 1);
    // Without the substitute nothing blocks: D&C Green No. 5 is permitted in all cosmetics.
    // Regulation (EC) No 1223/2009, Annex IV, entry 91 (CI 61570)
    expect(plain.counts!.block).toBe(0);

    const id = await created(fizzer([], [m.violet]));
    const v = await f$.getVersion(id, 1);
    // Regulation (EC) No 1223/2009, Annex IV, entry 90 (CI 60730): "Not to be used in products
    // applied on mucous membranes"; this profile states mucous-membrane contact.
    const blocks = v.evaluation!.findings.filter((f) => f.severity === 'block');
    expect(blocks).toHaveLength(1);
    expect(blocks[0]).toMatchObject({
      code: 'COLOURANT_NOT_PERMITTED',
      market: 'EU',
      substitute: {
        lineNumber: 4,
        materialId: m.violet,
        materialName: 'Violet Dye',
        replacesName: 'Green Dye',
      },
      lines: [3],
    });
    expect(blocks[0]!.message).toMatch(
      /^With Violet Dye in place of Green Dye on line 4: .*not permitted in products applied on mucous membranes/,
    );
    expect(blocks[0]!.source).toMatch(/Annex IV.*entry 90/);
    expect(v.counts!.block).toBe(1);

    const refused = await f$.release(id, 1);
    expect(refused.status).toBe(409);
    const error = errorEnvelopeSchema.parse(refused.body).error;
    expect(error.code).toBe('release_blocked');
    expect(error.findings!.map((f) => f.substitute?.materialName)).toEqual(['Violet Dye']);
  });

  it('the declaration stays the formula’s own material’s', async () => {
    const v = await f$.getVersion(await created(fizzer([m.tapioca])), 1);
    const declaration = v.evaluation!.declarations.EU!.ingredients;
    expect(declaration).toContain('Zea Mays Starch');
    expect(declaration).not.toContain('Tapioca Starch');
  });
});
