import request from 'supertest';
import { describe, expect, it } from 'vitest';
import {
  MAX_BLEND_COMPONENTS,
  MAX_FUNCTIONS,
  MAX_IFRA_CATEGORIES,
  MAX_LINES,
  MAX_MARKETS,
  type EvaluationInputDraft,
} from '@batchproof/shared';
import { aDraft, aBathProfile } from '../../fixtures/builders/formula-builder';
import { aFragrance } from '../../fixtures/builders/material-builder';
import { bearer } from '../support/auth-header';
import { formulaWorkspaceForFile } from '../support/formula-workspace';

const f$ = formulaWorkspaceForFile();

const times = <T>(n: number, make: (i: number) => T) =>
  Array.from({ length: n }, (_, i) => make(i));

/** An evaluation of `lines` lines of plain bicarbonate. */
const evaluation = (
  lines: number,
  material: Record<string, unknown> = {},
): EvaluationInputDraft => ({
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
  lines: times(lines, () => ({
    grams: 10,
    material: { name: 'Bicarb', inci: 'Sodium Bicarbonate', functions: ['buffering'], ...material },
  })),
});

const evaluate = (body: object) =>
  request(f$.h.app).post('/api/evaluations').set(bearer(f$.w.members.viewer)).send(body);

describe('every array a write route takes has a cap', () => {
  it('POST /api/evaluations with 5,000 lines answers 400 with fieldErrors.lines', async () => {
    const res = await evaluate(evaluation(5_000));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.lines).toEqual([`A formula has at most ${MAX_LINES} lines`]);
  });

  it('POST /api/evaluations with a blend of too many components, functions or markets answers 400 naming each', async () => {
    const body = evaluation(1, {
      functions: times(MAX_FUNCTIONS + 1, (i) => `function ${i}`),
      components: times(MAX_BLEND_COMPONENTS + 1, () => ({
        inci: 'Mica',
        percent: 100 / (MAX_BLEND_COMPONENTS + 1),
      })),
    });
    const res = await evaluate({ ...body, markets: times(MAX_MARKETS + 1, () => 'US') });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(
      expect.arrayContaining([
        'markets',
        'lines.0.material.functions',
        'lines.0.material.components',
      ]),
    );
  });

  it('POST /api/evaluations with a fragrance certificate of too many categories answers 400', async () => {
    const maxima = Object.fromEntries(times(MAX_IFRA_CATEGORIES + 1, (i) => [`${i + 1}`, 1]));
    const res = await evaluate(
      evaluation(1, { fragrance: { maxPercentByIfraCategory: maxima, allergens: [] } }),
    );
    expect(res.status).toBe(400);
    expect(
      res.body.error.fieldErrors['lines.0.material.fragrance.maxPercentByIfraCategory'],
    ).toEqual([`List at most ${MAX_IFRA_CATEGORIES} IFRA categories`]);
  });

  it('POST /api/materials with a certificate of too many IFRA categories answers 400', async () => {
    const fragrance = aFragrance();
    const maxima = Object.fromEntries(times(MAX_IFRA_CATEGORIES + 1, (i) => [`${i + 1}`, 1]));
    const res = await request(f$.h.app)
      .post('/api/materials')
      .set(bearer(f$.w.members.formulator))
      .send({
        ...fragrance,
        ifraCertificate: { ...fragrance.ifraCertificate!, maxPercentByIfraCategory: maxima },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['ifraCertificate.maxPercentByIfraCategory']).toBeDefined();
  });

  it('PUT a formula version with more lines or markets than allowed answers 400 naming both', async () => {
    const f = await f$.createFormula();
    const lines = times(MAX_LINES + 1, () => ({ materialId: f$.m.bicarb, grams: 1 }));
    const profile = aBathProfile({ markets: times(MAX_MARKETS + 1, () => 'US' as const) });
    const res = await request(f$.h.app)
      .put(f$.versionUrl(f.id, 1))
      .set(bearer(f$.w.members.formulator))
      .send(aDraft(lines, { profile }));
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.lines).toEqual([`A formula has at most ${MAX_LINES} lines`]);
    expect(res.body.error.fieldErrors['profile.markets']).toBeDefined();
  });
});
