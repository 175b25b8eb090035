import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  attentionSchema,
  formulaVersionSchema,
  labelRunListSchema,
  labelRunRecordSchema,
  type ComplianceFinding,
} from '@batchproof/shared';
import { assessments } from '../../apps/api/src/db/schema';
import { aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { aLabelRun } from '../../fixtures/builders/label-run-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { giveAddress, releasedFormula } from '../support/label-printing';
import { buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  await giveAddress(h, w);
});
afterAll(() => h.close());

const owner = () => bearer(w.members.owner);

async function version(formulaId: string, n: number) {
  const res = await request(h.app).get(`/api/formulas/${formulaId}/versions/${n}`).set(owner());
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return formulaVersionSchema.parse(res.body);
}

/** Inserts a signed assessment of the version (signed rows cannot change, so signed at once). */
async function sign(versionId: string) {
  await h.handle.db.insert(assessments).values({
    workshopId: w.id,
    versionId,
    assessorName: 'Test Assessor',
    status: 'signed',
    partB: { conclusion: 'Safe.', labelWarnings: '', reasoning: 'MoS > 100.', credentials: 'Test' },
    signedAt: new Date(),
    signedByName: 'Test Assessor',
    contentHash: 'b'.repeat(64),
  });
}

/** Copies the released version into a new draft and releases it: version `n`. */
async function releaseNext(formulaId: string, n: number) {
  const draft = await request(h.app)
    .post(`/api/formulas/${formulaId}/versions`)
    .set(owner())
    .send({ fromVersion: n - 1 });
  expect(draft.status, JSON.stringify(draft.body)).toBe(201);
  const released = await request(h.app)
    .post(`/api/formulas/${formulaId}/versions/${n}/release`)
    .set(owner())
    .send({});
  expect(released.status, JSON.stringify(released.body)).toBe(200);
  return formulaVersionSchema.parse(released.body);
}

const missing = (findings: readonly ComplianceFinding[] | undefined) =>
  (findings ?? []).filter((f) => f.code === 'SAFETY_ASSESSMENT_MISSING');

async function attentionRows() {
  const res = await request(h.app).get('/api/attention').set(bearer(w.members.viewer));
  expect(res.status).toBe(200);
  return attentionSchema.parse(res.body).items.filter((i) => i.kind === 'assessment-missing');
}

describe('SAFETY_ASSESSMENT_MISSING', () => {
  it('a later version shows the finding, naming the earlier assessed version, beside (not in) its evaluation', async () => {
    const formulaId = await releasedFormula(h, w);
    const v1 = await version(formulaId, 1);
    expect(missing(v1.assessmentFindings).map((f) => f.market)).toEqual(['EU', 'UK']);
    expect(v1.assessmentFindings![0]!.message).toMatch(
      /^Version 1 has no signed safety assessment\./,
    );
    await sign(v1.id);
    expect((await version(formulaId, 1)).assessmentFindings).toEqual([]);

    const released = await releaseNext(formulaId, 2);
    // The release answer is the version view too, and carries the finding.
    expect(missing(released.assessmentFindings)).toHaveLength(2);
    const v2 = await version(formulaId, 2);
    const [eu, uk] = v2.assessmentFindings!;
    expect(eu).toMatchObject({
      code: 'SAFETY_ASSESSMENT_MISSING',
      severity: 'warn',
      market: 'EU',
      source: 'Regulation (EC) No 1223/2009, Art. 10 and Annex I',
      status: 'C',
      lines: [],
    });
    expect(eu!.message).toMatch(
      /^Version 2 has no signed safety assessment; version 1 was assessed\. .*A qualified safety assessor must assess and sign this version before it is sold in the EU\.$/,
    );
    expect(uk).toMatchObject({ market: 'UK' });
    expect(uk!.source).toMatch(/UK Cosmetics Regulation.*Art\. 10/);
    expect(uk!.message).toMatch(/before it is sold in the UK\.$/);
    // Never mixed into the stored evaluation or its counts.
    expect(missing(v2.evaluation!.findings)).toEqual([]);
    const warns = v2.evaluation!.findings.filter((f) => f.severity === 'warn').length;
    expect(v2.counts!.warn).toBe(warns);

    const rows = await attentionRows();
    expect(rows.filter((r) => r.formulaId === formulaId)).toEqual([
      expect.objectContaining({ versionNumber: 2, markets: ['EU', 'UK'], lastAssessedVersion: 1 }),
    ]);
  });

  it('labels printed from an unassessed version carry it for their EU and UK markets', async () => {
    const formulaId = await releasedFormula(h, w);
    const res = await request(h.app)
      .post('/api/label-runs')
      .set(owner())
      .send(aLabelRun(formulaId, { markets: ['US', 'EU'], expiresOn: '2027-06-30' }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const run = labelRunRecordSchema.parse(res.body);
    expect(missing(run.assessmentFindings).map((f) => f.market)).toEqual(['EU']);
    expect(run.assessmentFindings![0]!.message).toMatch(/^Version 1 has no signed safety/);

    const list = await request(h.app)
      .get(`/api/label-runs?formulaId=${formulaId}`)
      .set(bearer(w.members.assessor));
    expect(list.status).toBe(200);
    const listed = labelRunListSchema.parse(list.body).items[0]!;
    expect(missing(listed.assessmentFindings)).toHaveLength(1);

    await sign((await version(formulaId, 1)).id);
    const after = await request(h.app).get(`/api/label-runs/${run.id}`).set(owner());
    expect(labelRunRecordSchema.parse(after.body).assessmentFindings).toEqual([]);
  });

  it('a signed current version has none, nor does a version sold only in the US or Canada', async () => {
    const formulaId = await releasedFormula(h, w);
    await sign((await version(formulaId, 1)).id);
    expect((await version(formulaId, 1)).assessmentFindings).toEqual([]);
    expect((await attentionRows()).map((r) => r.formulaId)).not.toContain(formulaId);

    const material = await buildMaterial(h.handle.db, w.id);
    const usOnly = aFormula([{ materialId: material.id, grams: 100 }]);
    usOnly.draft = aDraft([{ materialId: material.id, grams: 100 }]);
    usOnly.draft.profile.markets = ['US', 'CA'];
    const created = await request(h.app).post('/api/formulas').set(owner()).send(usOnly);
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect((await version(created.body.id, 1)).assessmentFindings).toEqual([]);
  });
});
