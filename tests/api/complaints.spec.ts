import request from 'supertest';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addYears,
  complaintPageSchema,
  complaintSchema,
  ROLES,
  todayIso,
  type ComplaintCreate,
  type Role,
} from '@batchproof/shared';
import { aBathProfile, aDraft, aFormula } from '../../fixtures/builders/formula-builder';
import { getComplaint } from '../../apps/api/src/complaints/complaints-domain';
import { auditEvents, workshops } from '../../apps/api/src/db/schema';
import { buildBatchRow } from '../support/complaint-rows';
import { buildWorkshop, type BuiltMember, type BuiltWorkshop } from '../support/workshop-builder';
import { TEST_JWT_SECRET } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { startFormulaWorkspace, type FormulaWorkspace } from '../support/formula-workspace';

let f$: FormulaWorkspace;
let w: BuiltWorkshop;
let other: BuiltWorkshop;
/** A product sold in the US (and the EU, UK and Canada). */
let usProduct: string;
/** A product sold in the EU only. */
let euProduct: string;
let usBatch: string;
let euBatch: string;

beforeAll(async () => {
  f$ = await startFormulaWorkspace();
  w = f$.w;
  other = await buildWorkshop(f$.h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  usProduct = (await f$.createFormula()).id;
  const eu = await request(f$.h.app)
    .post('/api/formulas')
    .set(bearer(w.members.formulator))
    .send(
      aFormula(f$.base(), {
        draft: aDraft(f$.base(), { profile: aBathProfile({ markets: ['EU'] }) }),
      }),
    );
  expect(eu.status).toBe(201);
  euProduct = eu.body.id;
  usBatch = (await buildBatchRow(f$.h.handle.db, w.id, usProduct)).id;
  euBatch = (await buildBatchRow(f$.h.handle.db, w.id, euProduct)).id;
});
afterAll(() => f$.h.close());

const today = todayIso();

const aComplaint = (overrides: Partial<ComplaintCreate> = {}): ComplaintCreate => ({
  formulaId: usProduct,
  batchId: usBatch,
  receivedOn: '2026-11-20',
  reporterName: 'Ada Tillbrook',
  whatHappened: 'Red, itchy patches on both forearms the morning after a bath with the fizzer.',
  bodyArea: 'Arms',
  serious: true,
  ...overrides,
});

function post(who: BuiltMember, body: object) {
  return request(f$.h.app).post('/api/complaints').set(bearer(who)).send(body);
}

async function created(body: object = aComplaint(), who = w.members.production) {
  const res = await post(who, body);
  expect(res.status).toBe(201);
  return complaintSchema.parse(res.body);
}

type Caller = Role | 'other-workshop' | 'anonymous';
const CALLERS: Caller[] = [...ROLES, 'other-workshop', 'anonymous'];
const callerHeaders = (c: Caller): Record<string, string> =>
  c === 'anonymous' ? {} : bearer(c === 'other-workshop' ? other.members.owner : w.members[c]);
const expectation = (allowed: readonly Role[], ok: number, otherWorkshop: number) => (c: Caller) =>
  c === 'anonymous' ? 401 : c === 'other-workshop' ? otherWorkshop : allowed.includes(c) ? ok : 403;

const MEMBERS: Role[] = ['owner', 'formulator', 'production', 'viewer'];
const GOODS_IN: Role[] = ['owner', 'formulator', 'production'];

describe('/api/complaints by role, another workshop and anonymous', () => {
  let id: string;
  beforeAll(async () => {
    id = (await created()).id;
  });

  it.each(CALLERS)('GET /api/complaints as %s', async (c) => {
    const res = await request(f$.h.app).get('/api/complaints').set(callerHeaders(c));
    expect(res.status).toBe(expectation(MEMBERS, 200, 200)(c));
    if (c === 'other-workshop') expect(res.body.items).toEqual([]);
  });

  it.each(CALLERS)('GET /api/complaints/:id as %s', async (c) => {
    const res = await request(f$.h.app).get(`/api/complaints/${id}`).set(callerHeaders(c));
    expect(res.status).toBe(expectation(MEMBERS, 200, 404)(c));
  });

  it.each(CALLERS)('POST /api/complaints as %s', async (c) => {
    const res = await request(f$.h.app)
      .post('/api/complaints')
      .set(callerHeaders(c))
      .send(aComplaint());
    // Another workshop's owner names a product that is not theirs: a field error, not a leak.
    expect(res.status).toBe(expectation(GOODS_IN, 201, 400)(c));
  });

  it.each(CALLERS)('PUT /api/complaints/:id as %s', async (c) => {
    const res = await request(f$.h.app)
      .put(`/api/complaints/${id}`)
      .set(callerHeaders(c))
      .send(aComplaint({ followUpNotes: `Called back (${c})` }));
    expect(res.status).toBe(expectation(GOODS_IN, 200, 404)(c));
  });

  it('offers no delete: the record is kept for the retention period', async () => {
    const res = await request(f$.h.app)
      .delete(`/api/complaints/${id}`)
      .set(bearer(w.members.owner));
    expect(res.status).toBe(404);
    const still = await request(f$.h.app).get(`/api/complaints/${id}`).set(bearer(w.members.owner));
    expect(still.status).toBe(200);
  });
});

describe('the US reporting clock', () => {
  it('is due Monday 14 December 2026 for a serious event received Friday 20 November 2026', async () => {
    // FD&C Act §605(b)(1): 15 business days. US federal holidays per 5 U.S.C. 6103: Thanksgiving,
    // Thu 26 Nov 2026, is skipped. Mon 23 (1), Tue 24 (2), Wed 25 (3), Fri 27 (4), Mon 30 (5),
    // Tue 1 Dec (6) … Fri 4 (9), Mon 7 (10) … Fri 11 (14), Mon 14 (15).
    const complaint = await created();
    expect(complaint.usReportingClock?.dueOn).toBe('2026-12-14');
    expect(complaint.usReportingClock?.source).toBe('FD&C Act §605(b)(1), 21 U.S.C. 364a(b)(1)');
  });

  it('counts the business days left from an injected today, and overdue the day after', async () => {
    const { id } = await created();
    const on = (day: string) => getComplaint(f$.h.handle.db, w.members.viewer, id, day);
    // Wed 2 Dec → Mon 14 Dec: Thu 3, Fri 4, Mon 7 … Fri 11, Mon 14 = 8 business days.
    expect((await on('2026-12-02')).usReportingClock).toMatchObject({
      businessDaysLeft: 8,
      state: 'running',
      overdue: false,
    });
    expect((await on('2026-12-14')).usReportingClock).toMatchObject({
      businessDaysLeft: 0,
      state: 'running',
    });
    expect((await on('2026-12-15')).usReportingClock).toMatchObject({
      businessDaysLeft: -1,
      state: 'overdue',
      overdue: true,
    });
  });

  it('stops when the report to FDA is recorded, and says when it was late', async () => {
    // Received Fri 21 Nov 2025; Thanksgiving Thu 27 Nov 2025 skipped (5 U.S.C. 6103): Mon 24 (1),
    // Tue 25 (2), Wed 26 (3), Fri 28 (4), Mon 1 Dec (5) … Fri 5 (9), Mon 8 (10) … Fri 12 (14),
    // Mon 15 Dec (15).
    const received = { receivedOn: '2025-11-21' };
    const onTime = await created(aComplaint({ ...received, reportedToFdaOn: '2025-12-15' }));
    expect(onTime.usReportingClock).toMatchObject({
      dueOn: '2025-12-15',
      state: 'reported',
      businessDaysLeft: null,
    });
    const late = await created(aComplaint({ ...received, reportedToFdaOn: '2025-12-16' }));
    expect(late.usReportingClock?.state).toBe('reported-late');
  });

  it('has no clock when the event is not serious, nor for a product not sold in the US', async () => {
    expect((await created(aComplaint({ serious: false }))).usReportingClock).toBeNull();
    const eu = await created(aComplaint({ formulaId: euProduct, batchId: euBatch }));
    expect(eu.usReportingClock).toBeNull();
    expect(eu.retention).toBeNull();
  });
});

describe('retention', () => {
  it('keeps a US product’s record 6 years from its latest entry, 3 for a small business', async () => {
    // FD&C Act §605(e)(1): 6 years; 3 years for a small business (§612).
    const fresh = await buildWorkshop(f$.h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const res = await request(f$.h.app)
      .post('/api/formulas')
      .set(bearer(fresh.members.owner))
      .send(aFormula([]));
    expect(res.status).toBe(201);
    const body = aComplaint({ formulaId: res.body.id, batchId: null, serious: false });
    const big = await created(body, fresh.members.owner);
    expect(big.retention).toEqual({
      keepUntil: addYears(today, 6),
      years: 6,
      source: 'FD&C Act §605(e)(1), 21 U.S.C. 364a(e)(1)',
    });
    await f$.h.handle.db
      .update(workshops)
      .set({ smallBusiness: true })
      .where(eq(workshops.id, fresh.id));
    const small = await request(f$.h.app)
      .get(`/api/complaints/${big.id}`)
      .set(bearer(fresh.members.owner));
    expect(complaintSchema.parse(small.body).retention).toMatchObject({
      keepUntil: addYears(today, 3),
      years: 3,
    });
  });
});

describe('bad input', () => {
  it('refuses a missing description and serious flag with field errors', async () => {
    const res = await post(
      w.members.production,
      aComplaint({ whatHappened: ' ', serious: undefined }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toEqual({
      whatHappened: ['What happened is required'],
      serious: ['Say whether it is a serious adverse event'],
    });
  });

  it('refuses a batch of another product, and another workshop’s product', async () => {
    const wrongBatch = await post(w.members.production, aComplaint({ batchId: euBatch }));
    expect(wrongBatch.status).toBe(400);
    expect(wrongBatch.body.error.fieldErrors).toEqual({
      batchId: ['Choose a batch of this product'],
    });
    const foreign = await post(other.members.owner, aComplaint({ batchId: null }));
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fieldErrors).toEqual({
      formulaId: ['Choose one of this workshop’s products'],
    });
  });

  it('refuses a report before receipt, a bad list query, and answers 404 for a malformed id', async () => {
    const early = await post(w.members.owner, aComplaint({ reportedToFdaOn: '2026-11-19' }));
    expect(early.status).toBe(400);
    expect(early.body.error.fieldErrors.reportedToFdaOn).toEqual([
      'It cannot have been reported before it was received',
    ]);
    const list = await request(f$.h.app)
      .get('/api/complaints?sort=dueOn&serious=maybe')
      .set(bearer(w.members.viewer));
    expect(list.status).toBe(400);
    expect(Object.keys(list.body.error.fieldErrors).sort()).toEqual(['serious', 'sort']);
    const bad = await request(f$.h.app).get('/api/complaints/nope').set(bearer(w.members.viewer));
    expect(bad.status).toBe(404);
  });
});

describe('GET /api/complaints lists, filters and sorts', () => {
  it('filters by serious and text, and sorts by product name', async () => {
    const fresh = await buildWorkshop(f$.h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const make = async (name: string) => {
      const res = await request(f$.h.app)
        .post('/api/formulas')
        .set(bearer(fresh.members.owner))
        .send(aFormula([], { name }));
      return res.body.id as string;
    };
    const zest = await make('Zest Fizzer');
    const aloe = await make('Aloe Melt');
    const one = { batchId: null, reporterName: null };
    await created(
      aComplaint({ ...one, formulaId: zest, serious: true, whatHappened: 'Burning eyes' }),
      fresh.members.owner,
    );
    await created(
      aComplaint({ ...one, formulaId: aloe, serious: false, whatHappened: 'Crumbled in the box' }),
      fresh.members.owner,
    );
    const get = async (query: string) => {
      const res = await request(f$.h.app)
        .get(`/api/complaints?${query}`)
        .set(bearer(fresh.members.owner));
      expect(res.status).toBe(200);
      return complaintPageSchema.parse(res.body);
    };
    expect((await get('sort=productName')).items.map((c) => c.productName)).toEqual([
      'Aloe Melt',
      'Zest Fizzer',
    ]);
    expect((await get('serious=true')).items.map((c) => c.productName)).toEqual(['Zest Fizzer']);
    const byText = await get('q=crumbled');
    expect([byText.total, byText.items[0]?.productName]).toEqual([1, 'Aloe Melt']);
  });
});

describe('audit', () => {
  it('records the create and the update with who did it and what changed', async () => {
    const c = await created(aComplaint({ serious: false }));
    const put = await request(f$.h.app)
      .put(`/api/complaints/${c.id}`)
      .set(bearer(w.members.formulator))
      .send(aComplaint({ serious: true, followUpNotes: 'Doctor saw her' }));
    expect(put.status).toBe(200);
    const rows = await f$.h.handle.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.subjectId, c.id))
      .orderBy(auditEvents.createdAt);
    expect(rows.map((r) => [r.action, r.actorId])).toEqual([
      ['complaint.created', w.members.production.id],
      ['complaint.changed', w.members.formulator.id],
    ]);
    expect(rows[1]!.detail).toEqual({
      changed: ['serious', 'followUpNotes'],
      serious: { from: false, to: true },
    });
  });
});
