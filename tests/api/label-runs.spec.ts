import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
  attentionSchema,
  errorEnvelopeSchema,
  labelRunListSchema,
  labelRunRecordSchema,
  type LabelRunRecord,
} from '@batchproof/shared';
import { auditEvents } from '../../apps/api/src/db/schema';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { aLabelRun } from '../../fixtures/builders/label-run-builder';
import { aRollLabelStock } from '../../fixtures/builders/label-stock-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { asBytes } from '../support/binary-body';
import { giveAddress, releasedFormula } from '../support/label-printing';
import { buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltMember, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  await giveAddress(h, w);
});
afterAll(() => h.close());

const print = (who: BuiltMember, body: object) =>
  request(h.app).post('/api/label-runs').set(bearer(who)).send(body);

async function printed(who: BuiltMember, body: object): Promise<LabelRunRecord> {
  const res = await print(who, body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return labelRunRecordSchema.parse(res.body);
}

/** Reads the run until its PDF is made (or failed). */
async function finished(id: string) {
  return vi.waitFor(
    async () => {
      const res = await request(h.app).get(`/api/label-runs/${id}`).set(bearer(w.members.viewer));
      const run = labelRunRecordSchema.parse(res.body);
      if (run.status === 'rendering') throw new Error('still rendering');
      return run;
    },
    { timeout: 30_000, interval: 50 },
  );
}

const refusal = (body: unknown) => errorEnvelopeSchema.parse(body).error;

describe('POST /api/label-runs: who prints', () => {
  it('owner and formulator print a released version: 201 with the run, rendering or done', async () => {
    const formulaId = await releasedFormula(h, w);
    for (const who of [w.members.owner, w.members.formulator]) {
      const run = await printed(who, aLabelRun(formulaId, { copies: 3 }));
      expect(run).toMatchObject({
        formulaId,
        version: 1,
        markets: ['US'],
        copies: 3,
        labelCount: 3,
        lotCode: 'RF-0412',
        outOfDate: false,
        overrideReason: null,
        createdBy: { id: who.id, name: who.name },
      });
      expect(run.publicPage!.path).toMatch(/^\/p\/[A-Za-z0-9_-]{43}$/);
    }
  });

  it('a product without a GTIN prints too: its lot barcode is then an internal code', async () => {
    const formulaId = await releasedFormula(h, w, { gtin: null });
    const run = await printed(
      w.members.owner,
      aLabelRun(formulaId, { markets: ['US', 'EU'], expiresOn: '2027-06-30' }),
    );
    expect((await finished(run.id)).status).toBe('ready');
  });

  it('production prints from a batch only: 403 without one, and a batch that matches nothing is 404', async () => {
    const formulaId = await releasedFormula(h, w);
    const res = await print(w.members.production, aLabelRun(formulaId));
    expect(res.status).toBe(403);
    expect(refusal(res.body).message).toMatch(/batch/i);
    const batch = await print(
      w.members.production,
      aLabelRun(formulaId, { batchId: crypto.randomUUID() }),
    );
    expect(batch.status).toBe(404);
  });

  it('viewer and assessor may not print, but read the runs, one run and its PDF', async () => {
    const formulaId = await releasedFormula(h, w);
    const run = await printed(w.members.owner, aLabelRun(formulaId));
    await finished(run.id);
    for (const who of [w.members.viewer, w.members.assessor, w.members.production]) {
      if (who.role !== 'production')
        expect((await print(who, aLabelRun(formulaId))).status).toBe(403);
      const list = await request(h.app)
        .get(`/api/label-runs?formulaId=${formulaId}`)
        .set(bearer(who));
      expect(list.status).toBe(200);
      expect(labelRunListSchema.parse(list.body).items.map((r) => r.id)).toEqual([run.id]);
      const one = await request(h.app).get(`/api/label-runs/${run.id}`).set(bearer(who));
      expect(one.status).toBe(200);
      const pdf = await request(h.app).get(`/api/label-runs/${run.id}/pdf`).set(bearer(who));
      expect(pdf.status).toBe(200);
    }
  });

  it('an Idempotency-Key retried records one run', async () => {
    const formulaId = await releasedFormula(h, w);
    const send = () =>
      print(w.members.owner, aLabelRun(formulaId)).set('Idempotency-Key', crypto.randomUUID());
    const key = crypto.randomUUID();
    const first = await print(w.members.owner, aLabelRun(formulaId)).set('Idempotency-Key', key);
    const again = await print(w.members.owner, aLabelRun(formulaId)).set('Idempotency-Key', key);
    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body.id).toBe(first.body.id);
    expect((await send()).body.id).not.toBe(first.body.id);
    const list = await request(h.app)
      .get(`/api/label-runs?formulaId=${formulaId}`)
      .set(bearer(w.members.owner));
    expect(list.body.items).toHaveLength(2);
  });
});

describe('POST /api/label-runs: what is refused', () => {
  it('a draft version is refused with 409: labels print from the released version', async () => {
    const material = await buildMaterial(h.handle.db, w.id);
    const created = await request(h.app)
      .post('/api/formulas')
      .set(bearer(w.members.owner))
      .send(aFormula([{ materialId: material.id, grams: 100 }]));
    const res = await print(w.members.owner, aLabelRun(created.body.id));
    expect(res.status).toBe(409);
    expect(refusal(res.body).message).toMatch(/released/);
  });

  it('409 label_incomplete lists what each market lacks, by field path', async () => {
    const formulaId = await releasedFormula(h, w, {
      usAdverseEventContact: { address: null, phone: null, website: null },
      euResponsiblePerson: { name: null, address: null },
    });
    const res = await print(w.members.formulator, aLabelRun(formulaId, { markets: ['US', 'EU'] }));
    expect(res.status).toBe(409);
    const error = refusal(res.body);
    expect(error.code).toBe('label_incomplete');
    const paths = error.missing!.map((m) => `${m.market} ${m.field}`);
    // FD&C Act §609(a) (MoCRA): a US address, phone number or web address for adverse events
    expect(paths).toContain('US identity.usAdverseEventContact');
    // Regulation (EC) No 1223/2009, Art. 19(1)(a): the responsible person's name and address
    expect(paths).toContain('EU identity.euResponsiblePerson.name');
    expect(paths).toContain('EU identity.euResponsiblePerson.address');
    expect(error.missing!.every((m) => m.source.length > 0 && m.item.length > 0)).toBe(true);
  });

  it('names the missing business address and the product identity', async () => {
    const bare = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const formulaId = await releasedFormula(h, bare);
    const res = await print(bare.members.owner, aLabelRun(formulaId));
    expect(res.status).toBe(409);
    expect(refusal(res.body).missing!.map((m) => m.field)).toContain('workshop.address');

    const noIdentity = await releasedFormula(h, w, null);
    const none = await print(
      w.members.owner,
      aLabelRun(noIdentity, { overrideReason: 'Printing a test sheet' }),
    );
    expect(none.status).toBe(409);
    expect(refusal(none.body).missing).toEqual([expect.objectContaining({ field: 'identity' })]);
  });

  it("the owner's override is recorded with what was missing; a formulator's is refused", async () => {
    const formulaId = await releasedFormula(h, w, {
      usAdverseEventContact: { address: null, phone: null, website: null },
    });
    const body = aLabelRun(formulaId, { overrideReason: 'Samples for the market stall only' });
    const refused = await print(w.members.formulator, body);
    expect(refused.status).toBe(403);

    const run = await printed(w.members.owner, body);
    expect(run.overrideReason).toBe('Samples for the market stall only');
    expect(run.overriddenMissing.map((m) => m.field)).toEqual(['identity.usAdverseEventContact']);
    const [event] = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, w.id), eq(auditEvents.subjectId, run.id)));
    expect(event).toMatchObject({
      action: 'label-run.printed-with-override',
      actorId: w.members.owner.id,
      detail: expect.objectContaining({ overrideReason: 'Samples for the market stall only' }),
    });
  });

  it('422 label_does_not_fit names the field and the label when text cannot fit at its minimum size', async () => {
    const formulaId = await releasedFormula(h, w);
    const stock = await request(h.app)
      .post('/api/label-stocks')
      .set(bearer(w.members.owner))
      .send(aRollLabelStock({ labelWidthMm: 12, labelHeightMm: 8 }));
    expect(stock.status).toBe(201);
    const res = await print(w.members.owner, aLabelRun(formulaId, { stockId: stock.body.id }));
    expect(res.status).toBe(422);
    const error = refusal(res.body);
    expect(error.code).toBe('label_does_not_fit');
    expect(error.fitProblems!.length).toBeGreaterThan(0);
    expect(error.fitProblems![0]).toMatchObject({ market: 'US' });
    expect(error.fitProblems![0]!.minimumMm).toBeGreaterThan(0);
  });

  it('a start position beyond the sheet is a field error; an unknown stock too', async () => {
    const formulaId = await releasedFormula(h, w);
    const beyond = await print(w.members.owner, aLabelRun(formulaId, { startPosition: 7 }));
    expect(beyond.status).toBe(400);
    expect(refusal(beyond.body).fieldErrors!['startPosition']![0]).toMatch(/6 labels/);
    const unknown = await print(w.members.owner, aLabelRun(formulaId, { stockId: 'no-such' }));
    expect(unknown.status).toBe(400);
    expect(refusal(unknown.body).fieldErrors).toHaveProperty('stockId');
  });
});

describe('label runs across workshops', () => {
  it("another workshop's formula, run, PDF and withdrawal are all 404", async () => {
    const formulaId = await releasedFormula(h, w);
    const run = await printed(w.members.owner, aLabelRun(formulaId));
    const them = bearer(other.members.owner);
    expect((await print(other.members.owner, aLabelRun(formulaId))).status).toBe(404);
    expect((await request(h.app).get(`/api/label-runs/${run.id}`).set(them)).status).toBe(404);
    expect((await request(h.app).get(`/api/label-runs/${run.id}/pdf`).set(them)).status).toBe(404);
    expect((await request(h.app).post(`/api/label-runs/${run.id}/withdraw`).set(them)).status).toBe(
      404,
    );
    expect(
      (await request(h.app).get(`/api/label-runs?formulaId=${formulaId}`).set(them)).status,
    ).toBe(404);
    const theirs = await request(h.app).get('/api/label-runs').set(them);
    expect(theirs.body.items).toEqual([]);
  });
});

describe('the PDF, out-of-date runs and withdrawal', () => {
  it('serves the finished PDF inline as application/pdf', async () => {
    const formulaId = await releasedFormula(h, w);
    const run = await printed(w.members.formulator, aLabelRun(formulaId, { copies: 4 }));
    const done = await finished(run.id);
    expect(done.status).toBe('ready');
    expect(done.progress).toEqual({ done: 4, total: 4 });
    const res = await asBytes(
      request(h.app).get(`/api/label-runs/${run.id}/pdf`).set(bearer(w.members.viewer)),
    );
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(
      /^inline; filename="[^"]+\.pdf"; filename\*=UTF-8''/,
    );
    expect((res.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('older runs show as out of date once a newer version is released, and on the home page', async () => {
    const formulaId = await releasedFormula(h, w);
    const old = await printed(w.members.owner, aLabelRun(formulaId));
    const owner = bearer(w.members.owner);
    const home = async () =>
      attentionSchema
        .parse((await request(h.app).get('/api/attention').set(owner)).body)
        .items.filter((i) => i.kind === 'labels-out-of-date' && i.formulaId === formulaId);
    expect(await home()).toEqual([]);

    expect(
      (await request(h.app).post(`/api/formulas/${formulaId}/versions`).set(owner).send({})).status,
    ).toBe(201);
    expect(
      (
        await request(h.app)
          .post(`/api/formulas/${formulaId}/versions/2/release`)
          .set(owner)
          .send({})
      ).status,
    ).toBe(200);
    const list = labelRunListSchema.parse(
      (await request(h.app).get(`/api/label-runs?formulaId=${formulaId}`).set(owner)).body,
    );
    expect(list.items.map((r) => [r.id, r.outOfDate])).toEqual([[old.id, true]]);
    expect(await home()).toEqual([
      expect.objectContaining({ printedVersion: 1, releasedVersion: 2, runCount: 1 }),
    ]);
    // The superseded version no longer prints.
    expect((await print(w.members.owner, aLabelRun(formulaId))).status).toBe(409);

    const fresh = await printed(w.members.owner, aLabelRun(formulaId, { version: 2 }));
    expect(fresh.outOfDate).toBe(false);
    const after = labelRunListSchema.parse(
      (await request(h.app).get(`/api/label-runs?formulaId=${formulaId}`).set(owner)).body,
    );
    expect(after.items.map((r) => r.id)).toEqual([fresh.id, old.id]);
    expect(await home()).toEqual([]);
  });

  it('the owner withdraws the public page, once, and it is logged; a formulator may not', async () => {
    const formulaId = await releasedFormula(h, w);
    const run = await printed(w.members.owner, aLabelRun(formulaId));
    const url = `/api/label-runs/${run.id}/withdraw`;
    expect((await request(h.app).post(url).set(bearer(w.members.formulator))).status).toBe(403);
    const res = await request(h.app).post(url).set(bearer(w.members.owner));
    expect(res.status).toBe(200);
    expect(res.body.publicPage.withdrawnAt).toEqual(expect.any(String));
    await request(h.app).post(url).set(bearer(w.members.owner));
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.subjectId, run.id),
          eq(auditEvents.action, 'label-run.public-page-withdrawn'),
        ),
      );
    expect(events).toHaveLength(1);
  });
});
