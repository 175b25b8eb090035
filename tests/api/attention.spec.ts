import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addDays,
  ATTENTION_ROWS_PER_KIND,
  attentionSchema,
  documentStatusSchema,
  todayIso,
  type AttentionItem,
} from '@batchproof/shared';
import { pdfBytes } from '../../fixtures/builders/document-files';
import { aFragrance } from '../../fixtures/builders/material-builder';
import { buildLot, buildMaterial, consumeFromLot } from '../support/row-builders';
import {
  buildWorkshop,
  uniqueEmail,
  type BuiltMember,
  type BuiltWorkshop,
} from '../support/workshop-builder';
import { TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { startFormulaWorkspace } from '../support/formula-workspace';

let h: ApiHarness;
let w: BuiltWorkshop;
let f$: Awaited<ReturnType<typeof startFormulaWorkspace>>;
beforeAll(async () => {
  f$ = await startFormulaWorkspace();
  ({ h, w } = f$);
});
afterAll(() => h.close());

const today = todayIso();

async function attentionFor(who: BuiltMember) {
  const res = await request(h.app).get('/api/attention').set(bearer(who));
  expect(res.status).toBe(200);
  return attentionSchema.parse(res.body);
}

const itemsOf = <K extends AttentionItem['kind']>(
  items: AttentionItem[],
  kind: K,
): Extract<AttentionItem, { kind: K }>[] =>
  items.filter((i): i is Extract<AttentionItem, { kind: K }> => i.kind === kind);

function uploadSds(who: BuiltMember, materialId: string, issuedOn: string) {
  return request(h.app)
    .post('/api/documents')
    .set(bearer(who))
    .field('kind', 'sds')
    .field('title', 'Safety data sheet')
    .field('issuedOn', issuedOn)
    .field('materialId', materialId)
    .attach('file', pdfBytes(), { filename: 'sds.pdf', contentType: 'application/pdf' });
}

describe('GET /api/attention: formulas', () => {
  it('lists a released version with blocking findings (released over them by the owner)', async () => {
    const f = await f$.createFormula([...f$.base(), { materialId: f$.m.blue, grams: 2 }]);
    const released = await f$.release(f.id, 1, w.members.owner, {
      override: { reason: 'Sold outside the US only; assessor agreed in writing' },
    });
    expect(released.status).toBe(200);

    const blocked = itemsOf((await attentionFor(w.members.viewer)).items, 'formula-blocked');
    const row = blocked.find((i) => i.formulaId === f.id);
    expect(row).toMatchObject({ state: 'released', versionNumber: 1, formulaName: f.name });
    expect(row!.blockCount).toBeGreaterThan(0);
  });

  it('lists a draft with blocking findings and leaves out a formula whose checks pass', async () => {
    const blockedDraft = await f$.createFormula([
      ...f$.base(),
      { materialId: f$.m.blue, grams: 2 },
    ]);
    const clean = await f$.createFormula();

    const blocked = itemsOf((await attentionFor(w.members.production)).items, 'formula-blocked');
    expect(blocked.find((i) => i.formulaId === blockedDraft.id)?.state).toBe('draft');
    expect(blocked.some((i) => i.formulaId === clean.id)).toBe(false);
  });
});

describe('GET /api/attention: supplier documents', () => {
  it('lists an SDS dated in the future as not current, and leaves out a material whose SDS is current', async () => {
    const fresh = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['formulator'] });
    const me = fresh.members.formulator;
    const ahead = await buildMaterial(h.handle.db, fresh.id);
    const current = await buildMaterial(h.handle.db, fresh.id);
    expect((await uploadSds(me, ahead.id, addDays(today, 10))).status).toBe(201);
    expect((await uploadSds(me, current.id, addDays(today, -10))).status).toBe(201);

    const rows = itemsOf((await attentionFor(me)).items, 'material-documents');
    expect(rows.map((r) => [r.materialId, r.documents.map((d) => [d.kind, d.state])])).toEqual([
      [ahead.id, [['sds', 'future-dated']]],
    ]);
    const status = documentStatusSchema.parse(
      (await request(h.app).get(`/api/materials/${ahead.id}/document-status`).set(bearer(me))).body,
    );
    expect(status.entries.map((e) => e.state)).toEqual(['future-dated']);
    expect(status.complete).toBe(false);
  });

  it('counts every material that needs a document while listing at most the first rows', async () => {
    const fresh = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const howMany = ATTENTION_ROWS_PER_KIND + 2;
    for (let i = 0; i < howMany; i++) {
      await buildMaterial(h.handle.db, fresh.id, aFragrance({ tradeName: `Scent ${i}` }));
    }
    const answer = await attentionFor(fresh.members.owner);
    expect(answer.counts['material-documents']).toBe(howMany);
    const rows = itemsOf(answer.items, 'material-documents');
    expect(rows).toHaveLength(ATTENTION_ROWS_PER_KIND);
    expect(rows[0]!.documents.map((d) => [d.kind, d.state])).toEqual([
      ['sds', 'missing'],
      ['ifra-certificate', 'missing'],
      ['allergen-declaration', 'missing'],
    ]);
  });
});

describe('GET /api/attention: lots', () => {
  it('lists a lot expiring in 30 days that has stock, and not one whose stock is used up', async () => {
    const fresh = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const material = await buildMaterial(h.handle.db, fresh.id);
    const lot = (expiresOn: string) =>
      buildLot(h.handle.db, fresh.id, material.id, {
        receivedOn: addDays(today, -200),
        expiresOn,
        quantity: 5,
      });
    const soon = await lot(addDays(today, 30));
    const usedUp = await lot(addDays(today, 30));
    await consumeFromLot(h.handle.db, fresh.id, usedUp.id, 5);
    const expired = await lot(addDays(today, -3));
    const later = await lot(addDays(today, 90));

    const answer = await attentionFor(fresh.members.viewer);
    const rows = itemsOf(answer.items, 'lot-expiring');
    expect(rows.map((r) => [r.lotId, r.daysLeft, r.stockOnHand])).toEqual([
      [expired.id, -3, 5],
      [soon.id, 30, 5],
    ]);
    expect(rows.map((r) => r.lotId)).not.toContain(later.id);
    expect(answer.counts['lot-expiring']).toBe(2);
  });
});

describe('GET /api/attention: by role and workshop', () => {
  it('shows pending invitations to the owner only', async () => {
    const email = uniqueEmail('invited');
    const invited = await request(h.app)
      .post('/api/members/invitations')
      .set(bearer(w.members.owner))
      .send({ email, role: 'production' });
    expect(invited.status).toBe(201);

    const owner = await attentionFor(w.members.owner);
    expect(itemsOf(owner.items, 'invitation-pending').map((i) => i.email)).toContain(email);
    const viewer = await attentionFor(w.members.viewer);
    expect(itemsOf(viewer.items, 'invitation-pending')).toEqual([]);
    expect(viewer.counts).not.toHaveProperty('invitation-pending');
    expect(viewer.counts['formula-blocked']).toBeGreaterThan(0);
  });

  it('gives the assessor nothing it could not open, and no progress counts', async () => {
    const answer = await attentionFor(w.members.assessor);
    expect(answer).toEqual({ asOf: today, items: [], counts: {}, progress: null });
  });

  it('answers another workshop with its own records only, and its progress from zero', async () => {
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const answer = await attentionFor(other.members.owner);
    expect(answer.items).toEqual([]);
    expect(answer.progress).toEqual({ materials: 0, lots: 0, formulas: 0, members: 1 });
  });

  it('counts the workshop’s materials, lots, formulas and members for the first steps', async () => {
    const answer = await attentionFor(w.members.formulator);
    expect(answer.progress!.formulas).toBeGreaterThan(0);
    expect(answer.progress!.materials).toBeGreaterThanOrEqual(4);
    expect(answer.progress!.members).toBe(5);
  });
});
