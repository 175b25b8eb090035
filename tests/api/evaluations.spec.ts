import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluationResultSchema, type EvaluationInputDraft } from '@batchproof/shared';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['production'] });
});
afterAll(() => h.close());

/** An invented bath bomb coloured with a blue mica blend that contains ultramarines. */
const blueFizzer = (): EvaluationInputDraft => ({
  asOf: '2026-12-01',
  markets: ['US', 'EU'],
  product: {
    name: 'Tidewater Fizzer',
    use: 'rinse-off',
    contact: { mucousMembranes: false, eyeArea: false, lips: false },
    inBath: true,
    adultsOnly: false,
    ifraCategory: '9',
  },
  lines: [
    {
      grams: 500,
      material: { name: 'Bicarb', inci: 'Sodium Bicarbonate', functions: ['buffering'] },
    },
    { grams: 250, material: { name: 'Citric', inci: 'Citric Acid', functions: ['ph adjuster'] } },
    {
      grams: 5,
      material: {
        name: 'Lagoon Blue Mica',
        inci: 'Mica',
        functions: ['colourant'],
        components: [
          { inci: 'Mica', colourIndex: '77019', percent: 70 },
          { inci: 'Ultramarines', colourIndex: '77007', percent: 30 },
        ],
      },
    },
  ],
});

const post = (body: object) =>
  request(h.app)
    .post('/api/evaluations')
    .set('Authorization', `Bearer ${w.members.production.token}`)
    .send(body);

describe('POST /api/evaluations', () => {
  it('blocks ultramarines in a US bath product and names the rule', async () => {
    const res = await post(blueFizzer());
    expect(res.status).toBe(200);
    const result = evaluationResultSchema.parse(res.body);
    // 21 CFR 73.2725: ultramarines are listed for externally applied cosmetics only; a bath
    // product reaches mucous membranes (21 CFR 82.3(n)).
    const block = result.findings.find(
      (f) => f.severity === 'block' && f.market === 'US' && /ultramarine/i.test(f.subject),
    );
    expect(block, JSON.stringify(result.findings, null, 1)).toBeDefined();
    expect(block!.source).toMatch(/73\.2725/);
  });

  it('lists the EU declaration in descending order by weight with colourants last by CI number', async () => {
    const result = evaluationResultSchema.parse((await post(blueFizzer())).body);
    // Regulation (EC) No 1223/2009, Art. 19(1)(g)
    const eu = result.declarations.EU!.ingredients;
    expect(eu.slice(0, 2)).toEqual(['Sodium Bicarbonate', 'Citric Acid']);
    expect([...eu.slice(-2)].sort()).toEqual(['CI 77007', 'CI 77019']);
  });

  it('when a line has a negative weight and no market is chosen, responds 400 naming both fields', async () => {
    const bad = { ...blueFizzer(), markets: [] } as EvaluationInputDraft;
    bad.lines[0]!.grams = -1;
    const res = await post(bad);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['lines.0.grams']).toBeDefined();
    expect(res.body.error.fieldErrors.markets).toBeDefined();
  });

  it('when blend components do not add up to 100 %, responds 400 on that material', async () => {
    const bad = blueFizzer();
    bad.lines[2]!.material.components![1]!.percent = 20;
    const res = await post(bad);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['lines.2.material.components']).toBeDefined();
  });

  it('refuses an anonymous caller with 401', async () => {
    expect((await request(h.app).post('/api/evaluations').send(blueFizzer())).status).toBe(401);
  });
});
