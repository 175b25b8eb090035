import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import {
  assessmentListSchema,
  ROLE_SETS,
  ROLES,
  sessionSchema,
  shareListSchema,
  type Role,
} from '@batchproof/shared';
import { aFormula } from '../../fixtures/builders/formula-builder';
import { TEST_JWT_SECRET } from '../support/api-harness';
import { aSignableUpdate, assessmentWorkspaceForFile } from '../support/assessment-workspace';
import { bearer } from '../support/auth-header';
import { buildMaterial } from '../support/row-builders';
import {
  addMember,
  addMembership,
  buildWorkshop,
  type BuiltMember,
  type BuiltWorkshop,
} from '../support/workshop-builder';

const ws = assessmentWorkspaceForFile();

/**
 * Who calls: each role of workshop A; B's owner; nobody; and one person who is an assessor in A
 * and in a third workshop C, calling with A active (nothing in the prepared records is shared
 * with them) and with C active.
 */
type Caller = Role | 'other-workshop' | 'anonymous' | 'two-workshops-here' | 'two-workshops-there';
const CALLERS: Caller[] = [
  ...ROLES,
  'other-workshop',
  'anonymous',
  'two-workshops-here',
  'two-workshops-there',
];

/** The person in two workshops, as A's member and as C's, and workshop C. */
let dual: { here: BuiltMember; there: BuiltMember };
let elsewhere: BuiltWorkshop;

beforeAll(async () => {
  const db = ws.h.handle.db;
  elsewhere = await buildWorkshop(db, TEST_JWT_SECRET, { roles: ['owner'] });
  const here = await addMember(db, TEST_JWT_SECRET, ws.w.id, 'assessor', 'Dana Twoshops');
  const there = await addMembership(db, TEST_JWT_SECRET, here, elsewhere.id, 'assessor');
  dual = { here, there };
});

const tokenOf = (caller: Caller) => {
  switch (caller) {
    case 'anonymous':
      return undefined;
    case 'other-workshop':
      return ws.other.members.owner.token;
    case 'two-workshops-here':
      return dual.here.token;
    case 'two-workshops-there':
      return dual.there.token;
    default:
      return ws.w.members[caller].token;
  }
};

/**
 * The allowed roles get `ok`, the others 403, anonymous 401; `other` for B's owner and for the
 * two-workshop person with C active, `here` for them with A active (an assessor of A).
 */
const expect$ = (
  allowed: readonly Role[],
  ok: number,
  other: { other: number; here: number; there: number },
): Record<Caller, number> => ({
  ...(Object.fromEntries(ROLES.map((r) => [r, allowed.includes(r) ? ok : 403])) as Record<
    Role,
    number
  >),
  'other-workshop': other.other,
  anonymous: 401,
  'two-workshops-here': other.here,
  'two-workshops-there': other.there,
});

/** A draft assessment of the workshop's assessor, filled in and ready to sign. */
async function readyAssessment() {
  const { assessment, formulaId } = await ws.startedAssessment();
  expect((await ws.put(assessment.id, aSignableUpdate())).status).toBe(200);
  return { id: assessment.id, formulaId, hash: (await ws.detail(assessment.id)).contentHash };
}

interface RouteCase {
  route: string;
  prepare: () => Promise<{
    method: 'get' | 'post' | 'put' | 'delete';
    path: string;
    body?: object;
  }>;
  expected: Record<Caller, number>;
}

const assessors: readonly Role[] = ['assessor'];
const cases: RouteCase[] = [
  {
    route: 'GET /api/assessment-shares',
    prepare: async () => ({ method: 'get', path: '/api/assessment-shares' }),
    expected: expect$(ROLE_SETS.assessments, 200, { other: 200, here: 200, there: 200 }),
  },
  {
    route: 'POST /api/assessment-shares',
    prepare: async () => ({
      method: 'post',
      path: '/api/assessment-shares',
      body: {
        versionId: (await ws.releasedVersion()).versionId,
        assessorId: ws.w.members.assessor.id,
      },
    }),
    // B's owner names a version and an assessor of A: both are field errors in B.
    expected: expect$(ROLE_SETS.ownerOnly, 201, { other: 400, here: 403, there: 403 }),
  },
  {
    route: 'DELETE /api/assessment-shares/:id',
    prepare: async () => ({
      method: 'delete',
      path: `/api/assessment-shares/${(await ws.shared((await ws.releasedVersion()).versionId)).id}`,
    }),
    expected: expect$(ROLE_SETS.ownerOnly, 204, { other: 404, here: 403, there: 403 }),
  },
  {
    route: 'GET /api/assessments',
    prepare: async () => ({ method: 'get', path: '/api/assessments' }),
    expected: expect$(ROLE_SETS.assessments, 200, { other: 200, here: 200, there: 200 }),
  },
  {
    route: 'POST /api/assessments',
    prepare: async () => ({
      method: 'post',
      path: '/api/assessments',
      body: { shareId: (await ws.shared((await ws.releasedVersion()).versionId)).id },
    }),
    expected: expect$(assessors, 201, { other: 403, here: 404, there: 404 }),
  },
  {
    route: 'GET /api/assessments/:id',
    prepare: async () => ({
      method: 'get',
      path: `/api/assessments/${(await ws.startedAssessment()).assessment.id}`,
    }),
    expected: expect$(ROLE_SETS.assessments, 200, { other: 404, here: 404, there: 404 }),
  },
  {
    route: 'PUT /api/assessments/:id',
    prepare: async () => ({
      method: 'put',
      path: `/api/assessments/${(await ws.startedAssessment()).assessment.id}`,
      body: aSignableUpdate(),
    }),
    expected: expect$(assessors, 200, { other: 403, here: 404, there: 404 }),
  },
  {
    route: 'POST /api/assessments/:id/sign',
    prepare: async () => {
      const { id, hash } = await readyAssessment();
      return {
        method: 'post',
        path: `/api/assessments/${id}/sign`,
        body: { contentHash: hash, confirm: true },
      };
    },
    expected: expect$(assessors, 200, { other: 403, here: 404, there: 404 }),
  },
  {
    route: 'GET /api/assessments/:id/packet.pdf',
    prepare: async () => ({
      method: 'get',
      path: `/api/assessments/${(await ws.startedAssessment()).assessment.id}/packet.pdf`,
    }),
    expected: expect$(ROLE_SETS.assessments, 200, { other: 404, here: 404, there: 404 }),
  },
  {
    route: 'GET /api/formulas/:id/versions/:n/safety-notes',
    prepare: async () => ({
      method: 'get',
      path: `/api/formulas/${(await ws.startedAssessment()).formulaId}/versions/1/safety-notes`,
    }),
    expected: expect$(ROLE_SETS.everyone, 200, { other: 404, here: 404, there: 404 }),
  },
  {
    route: 'PUT /api/formulas/:id/versions/:n/safety-notes',
    prepare: async () => ({
      method: 'put',
      path: `/api/formulas/${(await ws.startedAssessment()).formulaId}/versions/1/safety-notes`,
      body: { stability: 'Stable for 12 weeks at 40 °C' },
    }),
    expected: expect$(ROLE_SETS.writers, 200, { other: 404, here: 403, there: 403 }),
  },
];

describe('assessments: access by role, workshop, sign-in and a person in two workshops', () => {
  for (const c of cases) {
    describe(c.route, () => {
      it.each(CALLERS)('as %s', async (caller) => {
        const { method, path, body } = await c.prepare();
        let req = request(ws.h.app)[method](path);
        const token = tokenOf(caller);
        if (token) req = req.set('Authorization', `Bearer ${token}`);
        const res = body ? await req.send(body) : await req;
        expect(res.status, JSON.stringify(res.body)).toBe(c.expected[caller]);
        if (res.status >= 400) expect(res.body.error.code).toEqual(expect.any(String));
      });
    });
  }

  it('malformed ids are 404, never 400 or 500', async () => {
    const owner = bearer(ws.w.members.owner);
    const assessor = bearer(ws.w.members.assessor);
    const answers = await Promise.all([
      request(ws.h.app).get('/api/assessments/nope').set(owner),
      request(ws.h.app).get('/api/assessments/nope/packet.pdf').set(owner),
      request(ws.h.app).put('/api/assessments/nope').set(assessor).send(aSignableUpdate()),
      request(ws.h.app).post('/api/assessments/nope/sign').set(assessor).send({}),
      request(ws.h.app).delete('/api/assessment-shares/nope').set(owner),
      request(ws.h.app).get('/api/formulas/nope/versions/1/safety-notes').set(owner),
      request(ws.h.app).get(`/api/formulas/${ws.w.id}/versions/x/safety-notes`).set(owner),
    ]);
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404, 404]);
  });
});

describe('an assessor sees only what is shared with them', () => {
  const as = (member: Pick<BuiltMember, 'token'>) => bearer(member);
  const listOf = async (member: Pick<BuiltMember, 'token'>) =>
    assessmentListSchema.parse(
      (await request(ws.h.app).get('/api/assessments').set(as(member))).body,
    );
  const sharesOf = async (member: Pick<BuiltMember, 'token'>) =>
    shareListSchema.parse(
      (await request(ws.h.app).get('/api/assessment-shares').set(as(member))).body,
    );
  const status = async (member: Pick<BuiltMember, 'token'>, path: string) =>
    (await request(ws.h.app).get(path).set(as(member))).status;

  it("another assessor's version and assessment stay hidden; a never-shared version too", async () => {
    const { w } = ws;
    const colleague = await addMember(ws.h.handle.db, TEST_JWT_SECRET, w.id, 'assessor');
    const v = await ws.releasedVersion();
    const share = await ws.shared(v.versionId, colleague.id);
    const theirs = await ws.accepted(share.id, colleague);
    const notes = `/api/formulas/${v.formulaId}/versions/1/safety-notes`;
    const me = w.members.assessor;
    expect(await status(me, `/api/assessments/${theirs.id}`)).toBe(404);
    expect(await status(me, `/api/assessments/${theirs.id}/packet.pdf`)).toBe(404);
    expect(await status(me, notes)).toBe(404);
    expect((await listOf(me)).items.map((a) => a.id)).not.toContain(theirs.id);
    expect((await sharesOf(me)).items.map((s) => s.id)).not.toContain(share.id);
    // Only the assessor who owns it may change or sign it.
    expect((await ws.put(theirs.id, aSignableUpdate(), me)).status).toBe(404);
    expect((await ws.sign(theirs.id, theirs.contentHash, me)).status).toBe(404);
    const accept = await request(ws.h.app)
      .post('/api/assessments')
      .set(as(me))
      .send({ shareId: share.id });
    expect(accept.status).toBe(404);
    // Everyone else in the workshop sees both.
    expect(await status(w.members.viewer, `/api/assessments/${theirs.id}`)).toBe(200);
    const never = await ws.releasedVersion();
    expect(await status(me, `/api/formulas/${never.formulaId}/versions/1/safety-notes`)).toBe(404);
    expect(
      await status(
        w.members.production,
        `/api/formulas/${never.formulaId}/versions/1/safety-notes`,
      ),
    ).toBe(200);
  });

  it('after unsharing, the assessment and its notes are hidden again and the lists are empty', async () => {
    const { w } = ws;
    const solo = await addMember(ws.h.handle.db, TEST_JWT_SECRET, w.id, 'assessor');
    const v = await ws.releasedVersion();
    const share = await ws.shared(v.versionId, solo.id);
    expect((await listOf(solo)).waiting.map((s) => s.id)).toEqual([share.id]);
    const mine = await ws.accepted(share.id, solo);
    const notes = `/api/formulas/${v.formulaId}/versions/1/safety-notes`;
    expect(await status(solo, `/api/assessments/${mine.id}`)).toBe(200);
    expect(await status(solo, notes)).toBe(200);
    const del = await request(ws.h.app)
      .delete(`/api/assessment-shares/${share.id}`)
      .set(bearer(w.members.owner));
    expect(del.status).toBe(204);
    expect(await status(solo, `/api/assessments/${mine.id}`)).toBe(404);
    expect(await status(solo, `/api/assessments/${mine.id}/packet.pdf`)).toBe(404);
    expect(await status(solo, notes)).toBe(404);
    expect(await listOf(solo)).toEqual({ items: [], waiting: [] });
    expect(await sharesOf(solo)).toEqual({ items: [] });
    expect((await ws.put(mine.id, aSignableUpdate(), solo)).status).toBe(404);
    // Shared again, the same assessment comes back.
    await ws.shared(v.versionId, solo.id);
    expect((await listOf(solo)).items.map((a) => a.id)).toEqual([mine.id]);
  });

  it('never reaches formulas, materials, documents or lots', async () => {
    const { w, m } = ws;
    const { formulaId } = await ws.startedAssessment();
    const me = w.members.assessor;
    const paths = [
      '/api/formulas',
      `/api/formulas/${formulaId}`,
      `/api/formulas/${formulaId}/versions/1`,
      `/api/formulas/${formulaId}/identity`,
      '/api/materials',
      `/api/materials/${m.citric}`,
      '/api/documents',
      '/api/lots',
    ];
    for (const path of paths) expect(await status(me, path), path).toBe(403);
    const write = await request(ws.h.app)
      .post('/api/formulas')
      .set(as(me))
      .send(aFormula(ws.base()));
    expect(write.status).toBe(403);
  });
});

describe('a person who assesses for two workshops', () => {
  /** A released version of workshop C, made by C's owner through the API. */
  async function elsewhereVersion() {
    const material = await buildMaterial(ws.h.handle.db, elsewhere.id);
    const owner = bearer(elsewhere.members.owner);
    const created = await request(ws.h.app)
      .post('/api/formulas')
      .set(owner)
      .send(aFormula([{ materialId: material.id, grams: 100 }]));
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const formulaId = created.body.id as string;
    const released = await request(ws.h.app)
      .post(`/api/formulas/${formulaId}/versions/1/release`)
      .set(owner)
      .send({});
    expect(released.status).toBe(200);
    const version = await request(ws.h.app).get(`/api/formulas/${formulaId}/versions/1`).set(owner);
    return { formulaId, versionId: version.body.id as string };
  }

  /** Switches the active workshop with `POST /api/auth/workshop` and answers the new token. */
  async function switchTo(token: string, workshopId: string) {
    const res = await request(ws.h.app)
      .post('/api/auth/workshop')
      .set('Authorization', `Bearer ${token}`)
      .send({ workshopId });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const session = sessionSchema.parse(res.body);
    expect(session.user.workshop.id).toBe(workshopId);
    return { token: session.accessToken };
  }

  it('sees each workshop’s shares only while that workshop is active', async () => {
    const { w } = ws;
    const a = await ws.releasedVersion();
    const aShare = await ws.shared(a.versionId, dual.here.id);
    const c = await elsewhereVersion();
    const cShare = await request(ws.h.app)
      .post('/api/assessment-shares')
      .set(bearer(elsewhere.members.owner))
      .send({ versionId: c.versionId, assessorId: dual.there.id });
    expect(cShare.status, JSON.stringify(cShare.body)).toBe(201);

    // In A: A's share only; accept it.
    let me = { token: dual.here.token };
    const inA = await request(ws.h.app).get('/api/assessments').set(bearer(me));
    expect(inA.body.waiting.map((s: { id: string }) => s.id)).toEqual([aShare.id]);
    const aAssessment = await ws.accepted(aShare.id, me);
    const wrongPlace = await request(ws.h.app)
      .post('/api/assessments')
      .set(bearer(me))
      .send({ shareId: cShare.body.id });
    expect(wrongPlace.status).toBe(404);

    // Switch to C: A's assessment, notes and share are gone; C's share is there.
    me = await switchTo(me.token, elsewhere.id);
    const inC = assessmentListSchema.parse(
      (await request(ws.h.app).get('/api/assessments').set(bearer(me))).body,
    );
    expect(inC.items).toEqual([]);
    expect(inC.waiting.map((s) => s.id)).toEqual([cShare.body.id]);
    expect(
      (await request(ws.h.app).get(`/api/assessments/${aAssessment.id}`).set(bearer(me))).status,
    ).toBe(404);
    expect(
      (
        await request(ws.h.app)
          .get(`/api/formulas/${a.formulaId}/versions/1/safety-notes`)
          .set(bearer(me))
      ).status,
    ).toBe(404);
    expect((await ws.put(aAssessment.id, aSignableUpdate(), me)).status).toBe(404);
    const cAssessment = await ws.accepted(cShare.body.id, me);
    expect(cAssessment.versionId).toBe(c.versionId);

    // And back to A: A's assessment again, none of C's.
    me = await switchTo(me.token, w.id);
    const backInA = assessmentListSchema.parse(
      (await request(ws.h.app).get('/api/assessments').set(bearer(me))).body,
    );
    expect(backInA.items.map((x) => x.id)).toEqual([aAssessment.id]);
    expect(
      (await request(ws.h.app).get(`/api/assessments/${cAssessment.id}`).set(bearer(me))).status,
    ).toBe(404);
    expect((await ws.detail(aAssessment.id, me)).id).toBe(aAssessment.id);
  });

  it('cannot switch into a workshop they are not a member of', async () => {
    const res = await request(ws.h.app)
      .post('/api/auth/workshop')
      .set(bearer(dual.here))
      .send({ workshopId: ws.other.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors).toHaveProperty('workshopId');
  });
});
