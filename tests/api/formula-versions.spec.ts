import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formulaSchema, versionComparisonSchema } from '@batchproof/shared';
import { auditEvents } from '../../apps/api/src/db/schema';
import { aDraft } from '../../fixtures/builders/formula-builder';
import type { BuiltWorkshop } from '../support/workshop-builder';
import type { ApiHarness } from '../support/api-harness';
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

describe('the release rule', () => {
  it('releases a version without blocking findings', async () => {
    const f = await createFormula();
    const res = await release(f.id, 1);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'released', overrideReason: null });
    expect(res.body.releasedAt).toEqual(expect.any(String));
  });

  it('refuses with 409 a version with blocking findings, and the formulator may not override (403)', async () => {
    const f = await createFormula([...base(), { materialId: m.blue, grams: 2 }]);
    const refused = await release(f.id, 1);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/blocking/);
    const override = await release(f.id, 1, w.members.formulator, {
      override: { reason: 'Assessor approved the exception in writing' },
    });
    expect(override.status).toBe(403);
    expect((await getVersion(f.id, 1)).state).toBe('draft');
  });

  it('the owner may override with a reason, recorded on the version and in the audit log', async () => {
    const f = await createFormula([...base(), { materialId: m.blue, grams: 2 }]);
    const reason = 'Sold in the EU only for now; US label not in use';
    const res = await release(f.id, 1, w.members.owner, { override: { reason } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'released', overrideReason: reason });
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, w.id), eq(auditEvents.subjectId, res.body.id)));
    expect(events).toEqual([
      expect.objectContaining({
        action: 'formula.released-with-override',
        detail: expect.objectContaining({ overrideReason: reason }),
      }),
    ]);
  });

  it('an override reason shorter than 10 characters responds 400 with fieldErrors.override.reason', async () => {
    const f = await createFormula([...base(), { materialId: m.blue, grams: 2 }]);
    const res = await release(f.id, 1, w.members.owner, { override: { reason: 'ok' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['override.reason']).toBeDefined();
  });
});

describe('a released version', () => {
  it('refuses PUT and PATCH with 409; a new draft copied from it can change, and releasing it supersedes the old one', async () => {
    const f = await createFormula();
    await release(f.id, 1);
    const put = await request(h.app)
      .put(versionUrl(f.id, 1))
      .set(bearer(w.members.owner))
      .send(aDraft(base()));
    expect(put.status).toBe(409);
    const patch = await request(h.app)
      .patch(versionUrl(f.id, 1))
      .set(bearer(w.members.owner))
      .send({ notes: 'x' });
    expect(patch.status).toBe(409);

    const draft = await request(h.app)
      .post(`/api/formulas/${f.id}/versions`)
      .set(bearer(w.members.formulator))
      .send({});
    expect(draft.status).toBe(201);
    expect(draft.body).toMatchObject({ number: 2, state: 'draft' });
    expect(draft.body.lines.map((l: { grams: number }) => l.grams)).toEqual([200, 100]);
    const second = await request(h.app)
      .post(`/api/formulas/${f.id}/versions`)
      .set(bearer(w.members.formulator))
      .send({});
    expect(second.status).toBe(409);

    await request(h.app)
      .put(versionUrl(f.id, 2))
      .set(bearer(w.members.formulator))
      .send(
        aDraft([
          { materialId: m.bicarb, grams: 180 },
          { materialId: m.citric, grams: 120 },
        ]),
      );
    expect((await release(f.id, 2)).status).toBe(200);
    const formula = formulaSchema.parse(
      (await request(h.app).get(`/api/formulas/${f.id}`).set(bearer(w.members.viewer))).body,
    );
    expect(formula.versions.map((v) => [v.number, v.state])).toEqual([
      [1, 'superseded'],
      [2, 'released'],
    ]);
    expect((await getVersion(f.id, 1)).lines.map((l) => l.grams)).toEqual([200, 100]);
  });
});

describe('GET /api/formulas/:id/compare', () => {
  it('reports line changes in grams and percent and how declarations and findings moved per market', async () => {
    const f = await createFormula();
    await release(f.id, 1);
    await request(h.app)
      .post(`/api/formulas/${f.id}/versions`)
      .set(bearer(w.members.owner))
      .send({ fromVersion: 1 });
    await request(h.app)
      .put(versionUrl(f.id, 2))
      .set(bearer(w.members.owner))
      .send(
        aDraft([
          { materialId: m.bicarb, grams: 200 },
          { materialId: m.blue, grams: 1 },
          { materialId: m.scent, grams: 6 },
        ]),
      );
    const res = await request(h.app)
      .get(`/api/formulas/${f.id}/compare?from=1&to=2`)
      .set(bearer(w.members.viewer));
    expect(res.status).toBe(200);
    const c = versionComparisonSchema.parse(res.body);
    const change = Object.fromEntries(c.lines.map((l) => [l.materialId, l.change]));
    // the bicarbonate's grams did not change: its share moved because other lines did
    expect(change).toEqual({
      [m.bicarb]: 'unchanged',
      [m.citric]: 'removed',
      [m.blue]: 'added',
      [m.scent]: 'added',
    });
    const bicarb = c.lines.find((l) => l.materialId === m.bicarb)!;
    expect(bicarb.fromGrams).toBe(200);
    expect(bicarb.toGrams).toBe(200);
    expect(bicarb.toPercent).toBeGreaterThan(bicarb.fromPercent!);
    expect(bicarb.percentMoved).toBe(true);
    const us = c.markets.find((x) => x.market === 'US')!;
    expect(us.declarationChanged).toBe(true);
    expect(us.ingredientsRemoved).toContain('Citric Acid');
    expect(us.findingsAdded.some((x) => x.severity === 'block')).toBe(true);
    const eu = c.markets.find((x) => x.market === 'EU')!;
    expect(eu.ingredientsAdded).toEqual(expect.arrayContaining(['Linalool', 'Parfum']));
  });

  it('with a missing version number responds 400 with fieldErrors.to; an unknown version is 404', async () => {
    const f = await createFormula();
    const bad = await request(h.app)
      .get(`/api/formulas/${f.id}/compare?from=1`)
      .set(bearer(w.members.owner));
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.to).toBeDefined();
    const missing = await request(h.app)
      .get(`/api/formulas/${f.id}/compare?from=1&to=9`)
      .set(bearer(w.members.owner));
    expect(missing.status).toBe(404);
  });
});
