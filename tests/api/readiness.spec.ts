import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
  addDays,
  errorEnvelopeSchema,
  labelRunRecordSchema,
  marketRecordSchema,
  readinessListSchema,
  ROLE_SETS,
  todayIso,
  type ComplianceMarket,
  type MarketRecordInput,
} from '@batchproof/shared';
import { assessments, auditEvents } from '../../apps/api/src/db/schema';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { aLabelRun } from '../../fixtures/builders/label-run-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { CALLERS, expectStatusAs, onlyRoles } from '../support/caller-matrix';
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

const today = todayIso();

/** The caller's readiness list, checked against the contract. */
async function readiness(who: BuiltMember = w.members.viewer) {
  const res = await request(h.app).get('/api/readiness').set(bearer(who));
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return readinessListSchema.parse(res.body).items;
}

/** One product's readiness for one market, with its items by key. */
async function marketOf(formulaId: string, market: ComplianceMarket) {
  const product = (await readiness()).find((p) => p.formulaId === formulaId);
  expect(product, 'the product is listed').toBeDefined();
  const m = product!.markets.find((x) => x.market === market);
  expect(m, `${market} is listed`).toBeDefined();
  return { ...m!, item: (key: string) => m!.items.find((i) => i.key === key)! };
}

const save = (who: BuiltMember, formulaId: string, kind: string, body: unknown) =>
  request(h.app).put(`/api/readiness/${formulaId}/records/${kind}`).set(bearer(who)).send(body!);

async function saved(formulaId: string, kind: string, body: MarketRecordInput) {
  const res = await save(w.members.formulator, formulaId, kind, body);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return marketRecordSchema.parse(res.body);
}

async function versionId(formulaId: string, n: number) {
  const res = await request(h.app)
    .get(`/api/formulas/${formulaId}/versions/${n}`)
    .set(bearer(w.members.owner));
  expect(res.status).toBe(200);
  return res.body.id as string;
}

/**
 * A signed assessment of a version, inserted as signed (the assessments routes are tested on
 * their own; a signed row cannot be changed afterwards, so it is written signed at once).
 */
async function signedAssessment(workshopId: string, version: string) {
  const [row] = await h.handle.db
    .insert(assessments)
    .values({
      workshopId,
      versionId: version,
      assessorName: 'Test Assessor',
      status: 'signed',
      partB: {
        conclusion: 'Safe for the intended use.',
        labelWarnings: '',
        reasoning: 'Margins of safety above 100.',
        credentials: 'Test credentials',
      },
      signedAt: new Date(),
      signedByName: 'Test Assessor',
      contentHash: 'a'.repeat(64),
    })
    .returning({ id: assessments.id });
  return row!.id;
}

/** Prints labels of version 1 for the markets and waits until their PDF is made. */
async function printedFor(formulaId: string, markets: ComplianceMarket[]) {
  const res = await request(h.app)
    .post('/api/label-runs')
    .set(bearer(w.members.owner))
    .send(aLabelRun(formulaId, { markets, expiresOn: '2027-06-30' }));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const id = labelRunRecordSchema.parse(res.body).id;
  await vi.waitFor(
    async () => {
      const run = await request(h.app).get(`/api/label-runs/${id}`).set(bearer(w.members.owner));
      expect(labelRunRecordSchema.parse(run.body).status).toBe('ready');
    },
    { timeout: 30_000, interval: 50 },
  );
}

describe('GET /api/readiness', () => {
  it('EU: incomplete until the version is assessed, its labels printed and its notification recorded', async () => {
    const formulaId = await releasedFormula(h, w);
    const before = await marketOf(formulaId, 'EU');
    expect(before.complete).toBe(false);
    expect(before.items.map((i) => i.key)).toEqual([
      'assessment',
      'labels',
      'notification',
      'responsible-person',
    ]);
    expect(before.item('assessment')).toMatchObject({
      done: false,
      link: `/formulas/${formulaId}`,
    });
    expect(before.item('assessment').source).toMatch(/^Regulation \(EC\) No 1223\/2009, Art\. 10/);
    expect(before.item('assessment').detail).toMatch(/Version 1 has no signed safety assessment/);
    expect(before.item('labels')).toMatchObject({ done: false, link: '/labels' });
    expect(before.item('notification')).toMatchObject({ done: false, link: '/readiness' });
    // The product identity names the EU responsible person already.
    expect(before.item('responsible-person')).toMatchObject({ done: true, detail: null });

    const assessmentId = await signedAssessment(w.id, await versionId(formulaId, 1));
    const signed = await marketOf(formulaId, 'EU');
    expect(signed.item('assessment')).toMatchObject({
      done: true,
      detail: null,
      link: `/assessments/${assessmentId}`,
    });
    expect(signed.complete).toBe(false);

    await printedFor(formulaId, ['EU']);
    const printed = await marketOf(formulaId, 'EU');
    expect(printed.item('labels').done).toBe(true);
    expect(printed.item('notification').done).toBe(false);
    expect(printed.complete).toBe(false);
    // Labels printed for the EU only: the UK's are still missing.
    expect((await marketOf(formulaId, 'UK')).item('labels').done).toBe(false);

    const record = await saved(formulaId, 'eu-notification', {
      reference: 'CPNP-4471203',
      recordedOn: '2026-11-30',
    });
    expect(record).toMatchObject({
      kind: 'eu-notification',
      reference: 'CPNP-4471203',
      recordedOn: '2026-11-30',
      firstSaleOn: null,
      smallBusinessExempt: null,
    });
    const complete = await marketOf(formulaId, 'EU');
    expect(complete.complete).toBe(true);
    expect(complete.items.every((i) => i.done && i.detail === null)).toBe(true);
    const product = (await readiness()).find((p) => p.formulaId === formulaId)!;
    expect(product).toMatchObject({ versionNumber: 1, productType: 'fizzer' });
    expect(product.records.map((r) => r.kind)).toEqual(['eu-notification']);
    // The signed assessment is the US safety substantiation too.
    expect((await marketOf(formulaId, 'US')).item('substantiation').done).toBe(true);
  });

  it('a missing responsible person is listed with a link to the product identity', async () => {
    const formulaId = await releasedFormula(h, w, {
      euResponsiblePerson: { name: null, address: null },
    });
    const eu = await marketOf(formulaId, 'EU');
    expect(eu.item('responsible-person')).toMatchObject({
      done: false,
      link: `/formulas/${formulaId}/identity`,
    });
    expect(eu.item('responsible-person').detail).toMatch(/EU responsible person's name/);
    const withoutIdentity = await releasedFormula(h, w, null);
    expect((await marketOf(withoutIdentity, 'UK')).item('responsible-person').detail).toMatch(
      /product identity/i,
    );
  });

  it('Canada: the notification is due 10 days after the first sale, then overdue, until its reference is recorded', async () => {
    const formulaId = await releasedFormula(h, w);
    const untimed = (await marketOf(formulaId, 'CA')).item('notification');
    expect(untimed.done).toBe(false);
    expect(untimed.source).toMatch(/^Cosmetic Regulations \(C\.R\.C\., c\. 869\), s\. 30\(1\)/);

    const soldOn = addDays(today, -3);
    await saved(formulaId, 'ca-notification', { firstSaleOn: soldOn });
    const due = (await marketOf(formulaId, 'CA')).item('notification');
    expect(due.done).toBe(false);
    expect(due.detail).toBe(
      `Due by ${addDays(soldOn, 10)}: 10 days after the first sale on ${soldOn}`,
    );

    const longAgo = addDays(today, -20);
    await saved(formulaId, 'ca-notification', { firstSaleOn: longAgo });
    const overdue = (await marketOf(formulaId, 'CA')).item('notification');
    expect(overdue.detail).toMatch(/^Overdue: /);
    expect(overdue.detail).toContain(
      `due by ${addDays(longAgo, 10)}, 10 days after the first sale on ${longAgo}`,
    );

    await saved(formulaId, 'ca-notification', { firstSaleOn: longAgo, reference: 'CNF-88213' });
    const sent = (await marketOf(formulaId, 'CA')).item('notification');
    expect(sent).toMatchObject({ done: true, detail: null });
    // The workshop's name and address are on the label (giveAddress).
    expect((await marketOf(formulaId, 'CA')).item('name-address').done).toBe(true);
  });

  it('US: a small business exempt from listing satisfies the listing item; "no" does not', async () => {
    const formulaId = await releasedFormula(h, w);
    expect((await marketOf(formulaId, 'US')).item('listing').done).toBe(false);
    await saved(formulaId, 'us-listing', { smallBusinessExempt: false });
    const notExempt = (await marketOf(formulaId, 'US')).item('listing');
    expect(notExempt.done).toBe(false);
    expect(notExempt.detail).toMatch(/listing number/);
    await saved(formulaId, 'us-listing', { smallBusinessExempt: true });
    const exempt = (await marketOf(formulaId, 'US')).item('listing');
    expect(exempt).toMatchObject({ done: true, detail: null });
    // Without an assessment, a substantiation record on file satisfies substantiation.
    expect((await marketOf(formulaId, 'US')).item('substantiation').done).toBe(false);
    await saved(formulaId, 'us-substantiation', { reference: 'Safety file SF-2026-04' });
    expect((await marketOf(formulaId, 'US')).item('substantiation').done).toBe(true);
  });

  it('leaves out archived formulas and formulas with no released version', async () => {
    const archived = await releasedFormula(h, w);
    const res = await request(h.app)
      .post(`/api/formulas/${archived}/archive`)
      .set(bearer(w.members.owner))
      .send({});
    expect(res.status).toBe(200);
    const material = await buildMaterial(h.handle.db, w.id);
    const draftOnly = await request(h.app)
      .post('/api/formulas')
      .set(bearer(w.members.owner))
      .send(aFormula([{ materialId: material.id, grams: 100 }]));
    expect(draftOnly.status).toBe(201);
    const ids = (await readiness()).map((p) => p.formulaId);
    expect(ids).not.toContain(archived);
    expect(ids).not.toContain(draftOnly.body.id);
    expect(ids.length).toBeGreaterThan(0);
  });
});

describe('PUT /api/readiness/:formulaId/records/:kind', () => {
  it('replaces the record of that kind and logs who saved it', async () => {
    const formulaId = await releasedFormula(h, w);
    await saved(formulaId, 'uk-notification', { reference: 'SCPN-1', notes: 'first' });
    const second = await saved(formulaId, 'uk-notification', { reference: 'SCPN-2' });
    expect(second).toMatchObject({ reference: 'SCPN-2', notes: null });
    const product = (await readiness()).find((p) => p.formulaId === formulaId)!;
    expect(product.records).toEqual([expect.objectContaining({ reference: 'SCPN-2' })]);
    const events = await h.handle.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, w.id), eq(auditEvents.action, 'market_record.saved')));
    const mine = events.filter((e) => (e.detail as { formulaId?: string }).formulaId === formulaId);
    expect(mine).toHaveLength(2);
    expect(mine.every((e) => e.actorId === w.members.formulator.id)).toBe(true);
    expect(mine.every((e) => e.subjectType === 'market_record')).toBe(true);
  });

  it('refuses bad input with 400 and field paths, never a 5xx', async () => {
    const formulaId = await releasedFormula(h, w);
    const fields = async (kind: string, body: unknown) => {
      const res = await save(w.members.owner, formulaId, kind, body);
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      return errorEnvelopeSchema.parse(res.body).error.fieldErrors ?? {};
    };
    expect(Object.keys(await fields('eu-notifcation', { reference: 'X' }))).toEqual(['kind']);
    expect(await fields('eu-notification', { reference: 'x'.repeat(201) })).toHaveProperty(
      'reference',
    );
    expect(await fields('eu-notification', { recordedOn: 'last week' })).toHaveProperty(
      'recordedOn',
    );
    expect(await fields('ca-notification', { firstSaleOn: '2026-02-30' })).toHaveProperty(
      'firstSaleOn',
    );
    expect(await fields('us-listing', { smallBusinessExempt: 'yes' })).toHaveProperty(
      'smallBusinessExempt',
    );
    expect(await fields('us-listing', { notes: 42 })).toHaveProperty('notes');
  });

  it('answers 404 for a formula that is not the workshop’s, or no formula at all', async () => {
    const formulaId = await releasedFormula(h, w);
    const theirs = await save(other.members.owner, formulaId, 'eu-notification', {
      reference: 'X',
    });
    expect(theirs.status).toBe(404);
    const unknown = await save(w.members.owner, crypto.randomUUID(), 'eu-notification', {});
    expect(unknown.status).toBe(404);
    const malformed = await save(w.members.owner, 'not-an-id', 'eu-notification', {});
    expect(malformed.status).toBe(404);
    expect(
      (await readiness(other.members.owner)).find((p) => p.formulaId === formulaId),
    ).toBeUndefined();
  });
});

describe('who reads and who records', () => {
  let formulaId: string;
  beforeAll(async () => {
    formulaId = await releasedFormula(h, w);
  });

  it.each(CALLERS)('GET /api/readiness as %s', async (caller) => {
    // Another workshop's owner reads their own (empty) list.
    const statuses = onlyRoles(ROLE_SETS.members, 200, 200);
    await expectStatusAs(
      h,
      { a: w, b: other },
      caller,
      { method: 'get', path: '/api/readiness' },
      statuses[caller],
    );
  });

  it.each(CALLERS)('PUT a record as %s', async (caller) => {
    await expectStatusAs(
      h,
      { a: w, b: other },
      caller,
      {
        method: 'put',
        path: `/api/readiness/${formulaId}/records/us-listing`,
        body: { reference: 'FEI-1' },
      },
      onlyRoles(ROLE_SETS.writers, 200)[caller],
    );
  });
});
