import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
  batchRecordInputSchema,
  errorEnvelopeSchema,
  labelRunRecordSchema,
  type LabelContent,
} from '@batchproof/shared';
import { evaluateBatch } from '../../apps/api/src/batches/batch-labels';
import { batchAmendments, batches, labelRuns } from '../../apps/api/src/db/schema';
import { aBathProfile, aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { aLabelRun, aProductIdentity } from '../../fixtures/builders/label-run-builder';
import { aMaterial } from '../../fixtures/builders/material-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { asBytes } from '../support/binary-body';
import { giveAddress } from '../support/label-printing';
import { readPdf } from '../support/label-pdf-reader';
import { buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltMember, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
const m = { bicarb: '', corn: '', tapioca: '' };
let formulaId = '';
let versionId = '';

beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  await giveAddress(h, w);
  const db = h.handle.db;
  m.bicarb = (await buildMaterial(db, w.id)).id;
  const starch = (tradeName: string, inci: string) =>
    buildMaterial(db, w.id, aMaterial({ tradeName, inci, category: 'additive' }));
  m.corn = (await starch('Corn Starch', 'Zea Mays Starch')).id;
  m.tapioca = (await starch('Tapioca Starch', 'Tapioca Starch')).id;
  const owner = bearer(w.members.owner);
  const draft = aDraft(
    [
      { materialId: m.bicarb, grams: 200 },
      { materialId: m.corn, grams: 40, substitutes: [m.tapioca] },
    ],
    { profile: aBathProfile({ markets: ['EU'] }) },
  );
  const created = await request(h.app)
    .post('/api/formulas')
    .set(owner)
    .send(aFormula(draft.lines!, { draft }));
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  formulaId = created.body.id;
  const released = await request(h.app)
    .post(`/api/formulas/${formulaId}/versions/1/release`)
    .set(owner)
    .send({});
  expect(released.status, JSON.stringify(released.body)).toBe(200);
  versionId = released.body.id;
  const identity = await request(h.app)
    .put(`/api/formulas/${formulaId}/identity`)
    .set(owner)
    .send(aProductIdentity());
  expect(identity.status).toBe(200);
});
afterAll(() => h.close());

let sequence = 0;
/**
 * A batch of the formula inserted straight into `batches` (made 2026-11-03, best before the end of
 * 2027-11 from the identity's 12 months), line 2 made with `starch` (null: the line's own).
 */
async function aBatch(starch: string | null, state: 'draft' | 'released' = 'released') {
  sequence += 1;
  const [row] = await h.handle.db
    .insert(batches)
    .values({
      workshopId: w.id,
      formulaId,
      versionId,
      versionNumber: 1,
      batchCode: `261103-TF01-${sequence}`,
      sequence,
      state,
      madeOn: '2026-11-03',
      targetGrams: 2400,
      lossPercent: 0,
      batchGrams: 2400,
      tolerancePercent: 2,
      sheet: {
        lines: [],
        sum: { batchGrams: 2400, roundedGrams: 2400, differenceGrams: 0, withinRounding: true },
        notes: [],
      },
      record: batchRecordInputSchema.parse({
        lines: [{ lineNumber: 2, usedMaterialId: starch }],
        mould: { unitsMade: 10 },
      }),
      unitsMade: 10,
      bestBeforeMonth: '2027-11',
      expiresOn: '2027-11-30',
      releasedAt: state === 'released' ? new Date() : null,
    })
    .returning();
  return row!;
}

const print = (who: BuiltMember, body: object) =>
  request(h.app).post('/api/label-runs').set(bearer(who)).send(body);
const forBatch = (batchId: string, overrides: object = {}) =>
  aLabelRun(formulaId, { batchId, markets: ['EU'], lotCode: undefined, ...overrides });

/** The stored EU label's ingredients line of a run. */
async function storedIngredients(runId: string) {
  const [run] = await h.handle.db
    .select({ contents: labelRuns.contents })
    .from(labelRuns)
    .where(and(eq(labelRuns.workshopId, w.id), eq(labelRuns.id, runId)));
  const content = (run!.contents as LabelContent[]).find((c) => c.market === 'EU')!;
  return content.fields.find((f) => f.key === 'ingredients')!.text;
}

describe('evaluateBatch', () => {
  it('evaluates the version with each line’s material replaced by the one used', async () => {
    const withTapioca = await evaluateBatch(h.handle.db, w.id, (await aBatch(m.tapioca)).id);
    expect(withTapioca.lines.map((l) => l.usedMaterialId)).toEqual([m.bicarb, m.tapioca]);
    expect(withTapioca.evaluation.declarations.EU!.ingredients).toEqual([
      'Sodium Bicarbonate',
      'Tapioca Starch',
    ]);
    const own = await evaluateBatch(h.handle.db, w.id, (await aBatch(null)).id);
    expect(own.evaluation.declarations.EU!.ingredients).toEqual([
      'Sodium Bicarbonate',
      'Zea Mays Starch',
    ]);
  });

  it('follows an amendment of the material used', async () => {
    const batch = await aBatch(null);
    await h.handle.db.insert(batchAmendments).values({
      workshopId: w.id,
      batchId: batch.id,
      field: 'lines.2.usedMaterialId',
      previousValue: null,
      value: m.tapioca,
      reason: 'Tapioca was weighed in, not corn',
    });
    const evaluated = await evaluateBatch(h.handle.db, w.id, batch.id);
    expect(evaluated.evaluation.declarations.EU!.ingredients).toContain('Tapioca Starch');
  });

  it('is 404 for another workshop’s batch', async () => {
    const batch = await aBatch(null);
    await expect(evaluateBatch(h.handle.db, other.id, batch.id)).rejects.toMatchObject({
      status: 404,
    });
  });
});

describe('POST /api/label-runs for a batch', () => {
  it('production prints a released batch made with the substitute: the declaration names what was used', async () => {
    const batch = await aBatch(m.tapioca);
    const res = await print(w.members.production, forBatch(batch.id));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const run = labelRunRecordSchema.parse(res.body);
    expect(run).toMatchObject({
      batchId: batch.id,
      lotCode: batch.batchCode,
      expiresOn: '2027-11-30',
      formulaId,
      version: 1,
    });
    const ingredients = await storedIngredients(run.id);
    expect(ingredients).toContain('Tapioca Starch');
    expect(ingredients).not.toContain('Zea Mays Starch');

    const ready = await vi.waitFor(
      async () => {
        const one = await request(h.app)
          .get(`/api/label-runs/${run.id}`)
          .set(bearer(w.members.production));
        if (one.body.status === 'rendering') throw new Error('still rendering');
        return one.body;
      },
      { timeout: 50_000, interval: 100 },
    );
    expect(ready.status).toBe('ready');
    const pdf = await asBytes(
      request(h.app).get(`/api/label-runs/${run.id}/pdf`).set(bearer(w.members.production)),
    );
    expect(pdf.status).toBe(200);
    const text = (await readPdf(pdf.body as Buffer))
      .flatMap((p) => p.texts.map((t) => t.str))
      .join(' ');
    expect(text).toContain('Tapioca Starch');
    expect(text).not.toContain('Zea Mays');
    expect(text).toContain(batch.batchCode);
  }, 60_000);

  it('owner and formulator print a batch too; a batch of the main material names it', async () => {
    const batch = await aBatch(null);
    for (const who of [w.members.owner, w.members.formulator]) {
      const res = await print(who, forBatch(batch.id));
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(await storedIngredients(res.body.id)).toContain('Zea Mays Starch');
    }
  });

  it('refuses a draft batch with 409 and a plain message', async () => {
    const batch = await aBatch(m.tapioca, 'draft');
    const res = await print(w.members.production, forBatch(batch.id));
    expect(res.status).toBe(409);
    expect(errorEnvelopeSchema.parse(res.body).error.message).toBe(
      `Batch ${batch.batchCode} is still a draft: its labels print once it is released.`,
    );
  });

  it('refuses production without a batch (403)', async () => {
    const res = await print(
      w.members.production,
      aLabelRun(formulaId, { markets: ['EU'], lotCode: 'X-1' }),
    );
    expect(res.status).toBe(403);
  });

  it('refuses a lot code or formula other than the batch’s, on that field (400)', async () => {
    const batch = await aBatch(m.tapioca);
    const lot = await print(w.members.production, forBatch(batch.id, { lotCode: 'OTHER-1' }));
    expect(lot.status).toBe(400);
    expect(errorEnvelopeSchema.parse(lot.body).error.fieldErrors).toEqual({
      lotCode: [`A batch's labels carry its batch code, ${batch.batchCode}`],
    });
    const version = await print(w.members.production, forBatch(batch.id, { version: 2 }));
    expect(version.status).toBe(400);
    expect(Object.keys(errorEnvelopeSchema.parse(version.body).error.fieldErrors!)).toEqual([
      'version',
    ]);
  });

  it('answers 404 for another workshop’s batch, and viewer and assessor may not print (403)', async () => {
    const batch = await aBatch(m.tapioca);
    const res = await print(other.members.owner, forBatch(batch.id));
    expect(res.status).toBe(404);
    for (const who of [w.members.viewer, w.members.assessor])
      expect((await print(who, forBatch(batch.id))).status).toBe(403);
    const anonymous = await request(h.app).post('/api/label-runs').send(forBatch(batch.id));
    expect(anonymous.status).toBe(401);
  });
});
