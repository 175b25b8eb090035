import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  type FormulaVersion,
  type FormulaVersionInput,
  formulaSchema,
  formulaVersionSchema,
  type Material,
  materialSchema,
  type ProductType,
} from '@batchproof/shared';
// The editor's live check itself, imported by path: live-evaluation.ts and what it imports
// (formula-form.ts, product-types.ts) use Angular only for types, so it runs here in Node as it
// runs in the browser. Its form value is built below field by field as `createFormulaForm` builds
// it from a loaded version, because the real form needs Angular's forms runtime.
import type { FormulaFormValue } from '../../apps/web/src/app/formulas/formula-editor/formula-form';
import { evaluateDraft } from '../../apps/web/src/app/formulas/live-checks/live-evaluation';
import { aBathProfile, aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { buildMaterial } from '../support/row-builders';
import type { ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { startFormulaWorkspace } from '../support/formula-workspace';

let f$: Awaited<ReturnType<typeof startFormulaWorkspace>>;
let h: ApiHarness;
let nanoWhite: string;
beforeAll(async () => {
  f$ = await startFormulaWorkspace();
  h = f$.h;
  nanoWhite = (
    await buildMaterial(
      h.handle.db,
      f$.w.id,
      aMaterial({
        tradeName: 'Nano white',
        inci: 'Titanium Dioxide',
        category: 'colourant',
        colourIndex: 'CI 77891',
        nano: true,
      }),
    )
  ).id;
});
afterAll(() => h.close());

/** The editor's form value for a loaded formula and version, as `createFormulaForm` builds it. */
function formValueOf(name: string, productType: ProductType, v: FormulaVersion): FormulaFormValue {
  const p = v.profile;
  return {
    name,
    productType,
    entry: 'grams',
    batchGrams: v.totalGrams || null,
    lines: v.lines.map((l) => ({ ...l })),
    profile: {
      use: p.use,
      contact: { ...p.contact },
      inBath: p.inBath,
      adultsOnly: p.adultsOnly,
      soldAsSoap: p.soldAsSoap,
      ifraCategory: p.ifraCategory,
      markets: [...p.markets],
      unitMassGrams: p.unitMassGrams,
      netQuantity: { amount: p.netQuantity?.amount ?? null, unit: p.netQuantity?.unit ?? 'g' },
    },
    notes: v.notes ?? '',
  };
}

/** The lines' materials as the editor reads them: `GET /api/materials/:id`, parsed by the contract. */
async function materialsOf(v: FormulaVersion): Promise<Map<string, Material>> {
  const map = new Map<string, Material>();
  for (const id of new Set(v.lines.map((l) => l.materialId))) {
    const res = await request(h.app).get(`/api/materials/${id}`).set(bearer(f$.w.members.viewer));
    expect(res.status).toBe(200);
    map.set(id, materialSchema.parse(res.body));
  }
  return map;
}

const cases: { title: string; productType: ProductType; draft: () => FormulaVersionInput }[] = [
  {
    title: 'a fizzer with an ultramarine blend and a fragrance, in all four markets',
    productType: 'fizzer',
    draft: () =>
      aDraft([
        ...f$.base(),
        { materialId: f$.m.blue, grams: 2 },
        { materialId: f$.m.scent, grams: 3 },
      ]),
  },
  {
    title: 'a soap sold only as soap, with a nano colourant',
    productType: 'soap',
    draft: () =>
      aDraft(
        [
          { materialId: f$.m.bicarb, grams: 300 },
          { materialId: f$.m.scent, grams: 6 },
          { materialId: nanoWhite, grams: 1 },
        ],
        {
          profile: aBathProfile({
            inBath: false,
            contact: { mucousMembranes: false, eyeArea: false, lips: false },
            soldAsSoap: true,
            markets: ['US', 'EU', 'UK'],
          }),
        },
      ),
  },
  {
    title: 'a lip balm whose profile does not tick lips (the type implies them)',
    productType: 'lip-balm',
    draft: () =>
      aDraft(
        [
          { materialId: f$.m.bicarb, grams: 20 },
          { materialId: f$.m.scent, grams: 0.5 },
        ],
        {
          profile: aBathProfile({
            use: 'leave-on',
            inBath: false,
            contact: { mucousMembranes: false, eyeArea: false, lips: false },
            ifraCategory: '1',
            netQuantity: { amount: 4.5, unit: 'g' },
          }),
        },
      ),
  },
];

describe('the editor’s live check and the server’s check on save', () => {
  it.each(cases)(
    'agree on declarations and findings for $title',
    async ({ productType, draft }) => {
      const body = draft();
      const created = await request(h.app)
        .post('/api/formulas')
        .set(bearer(f$.w.members.formulator))
        .send(aFormula(body.lines!, { productType, draft: body }));
      expect(created.status).toBe(201);
      const formula = formulaSchema.parse(created.body);
      const saved = await request(h.app)
        .put(f$.versionUrl(formula.id, 1))
        .set(bearer(f$.w.members.formulator))
        .send(body);
      expect(saved.status).toBe(200);
      const stored = formulaVersionSchema.parse(saved.body);
      expect(stored.evaluationProblems).toEqual([]);
      const server = saved.body.evaluation;
      expect(server).not.toBeNull();

      const live = evaluateDraft(
        formValueOf(formula.name, productType, stored),
        await materialsOf(stored),
        server.asOf,
      );
      expect(live.problems).toEqual([]);
      expect(live.pending).toBe(false);
      // Compared as JSON, the form the server stored and sent.
      const result = JSON.parse(JSON.stringify(live.result));
      expect(result.declarations).toEqual(server.declarations);
      expect(result.findings).toEqual(server.findings);
      expect(server.findings.length).toBeGreaterThan(0);
    },
  );

  it('still agree after the formula’s type changes and the draft is saved again', async () => {
    const formula = await f$.createFormula([...f$.base(), { materialId: f$.m.blue, grams: 2 }]);
    await request(h.app)
      .patch(`/api/formulas/${formula.id}`)
      .set(bearer(f$.w.members.formulator))
      .send({ name: formula.name, productType: 'shower-steamer', notes: null });
    const saved = await request(h.app)
      .put(f$.versionUrl(formula.id, 1))
      .set(bearer(f$.w.members.formulator))
      .send(aDraft([...f$.base(), { materialId: f$.m.blue, grams: 2 }]));
    const stored = formulaVersionSchema.parse(saved.body);
    const live = evaluateDraft(
      formValueOf(formula.name, 'shower-steamer', stored),
      await materialsOf(stored),
      saved.body.evaluation.asOf,
    );
    const result = JSON.parse(JSON.stringify(live.result));
    expect(result.findings).toEqual(saved.body.evaluation.findings);
    expect(result.declarations).toEqual(saved.body.evaluation.declarations);
  });
});
