import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLE_SETS, ROLES, type Role } from '@batchproof/shared';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildFinishedLot } from '../support/finished-lot-builder';
import { buildRecallScenario, type RecallScenario } from '../support/recall-scenario';
import { buildLot, buildMaterial } from '../support/row-builders';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
let a: BuiltWorkshop;
let b: BuiltWorkshop;
let s: RecallScenario;
beforeAll(async () => {
  h = await startApiHarness();
  a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  s = await buildRecallScenario(h.handle.db, a.id);
});
afterAll(() => h.close());

type Caller = Role | 'other-workshop' | 'anonymous';
const CALLERS: readonly Caller[] = [...ROLES, 'other-workshop', 'anonymous'];

function send(caller: Caller, method: 'get' | 'post', path: string, body?: object) {
  const req = request(h.app)[method](path);
  const member =
    caller === 'anonymous'
      ? undefined
      : caller === 'other-workshop'
        ? b.members.owner
        : a.members[caller];
  const authed = member ? req.set(bearer(member)) : req;
  return body ? authed.send(body) : authed;
}

const openBody = (drill = true) => ({
  scope: { kind: 'finished-lots', finishedLotIds: [s.f1.id] },
  reason: 'Access check',
  severity: 'minor-harm',
  drill,
});

async function openAsOwner(drill = true) {
  const res = await send('owner', 'post', '/api/recalls', openBody(drill));
  expect(res.status).toBe(201);
  return res.body.id as string;
}

/** The status each caller gets: `ok` for the roles allowed, 403, `other` for B's owner, 401. */
function expected(allowed: readonly Role[], ok: number, other: number): Record<Caller, number> {
  return {
    ...(Object.fromEntries(ROLES.map((r) => [r, allowed.includes(r) ? ok : 403])) as Record<
      Role,
      number
    >),
    'other-workshop': other,
    anonymous: 401,
  };
}

describe('recall routes answer each role, another workshop and an anonymous caller', () => {
  const cases: {
    route: string;
    method: 'get' | 'post';
    path: (id: string) => string;
    body?: () => object;
    statuses: Record<Caller, number>;
  }[] = [
    {
      route: 'GET /api/recalls',
      method: 'get',
      path: () => '/api/recalls',
      // Another workshop's owner reads their own (empty) list.
      statuses: expected(ROLE_SETS.members, 200, 200),
    },
    {
      route: 'POST /api/recalls',
      method: 'post',
      path: () => '/api/recalls',
      body: () => openBody(),
      // A's finished lot is not one of B's: a field error, never B's recall of A's lot.
      statuses: expected(ROLE_SETS.ownerOnly, 201, 400),
    },
    {
      route: 'POST /api/recalls/preview',
      method: 'post',
      path: () => '/api/recalls/preview',
      body: () => ({ scope: openBody().scope }),
      statuses: expected(ROLE_SETS.ownerOnly, 200, 400),
    },
    {
      route: 'GET /api/recalls/:id',
      method: 'get',
      path: (id) => `/api/recalls/${id}`,
      statuses: expected(ROLE_SETS.members, 200, 404),
    },
    {
      route: 'GET /api/recalls/:id/summary.pdf',
      method: 'get',
      path: (id) => `/api/recalls/${id}/summary.pdf`,
      statuses: expected(ROLE_SETS.members, 200, 404),
    },
    {
      route: 'POST /api/recalls/:id/notices',
      method: 'post',
      path: (id) => `/api/recalls/${id}/notices`,
      body: () => ({}),
      statuses: expected(ROLE_SETS.ownerOnly, 200, 404),
    },
    {
      route: 'POST /api/recalls/:id/replies',
      method: 'post',
      path: (id) => `/api/recalls/${id}/replies`,
      body: () => ({
        customerId: s.harbour.id,
        repliedOn: '2026-03-01',
        unitsOnHand: 1,
        unitsReturned: 0,
      }),
      statuses: expected(ROLE_SETS.ownerOnly, 201, 404),
    },
    {
      route: 'POST /api/recalls/:id/close',
      method: 'post',
      path: (id) => `/api/recalls/${id}/close`,
      body: () => ({ summary: 'Closed in the access check' }),
      statuses: expected(ROLE_SETS.ownerOnly, 200, 404),
    },
  ];

  for (const c of cases) {
    it(c.route, async () => {
      const id = await openAsOwner();
      // The allowed caller goes last, so a close does not stop the others' checks early.
      const order = [...CALLERS].sort((x, y) => Number(x === 'owner') - Number(y === 'owner'));
      for (const caller of order) {
        const res = await send(caller, c.method, c.path(id), c.body?.());
        expect(res.status, `${caller}: ${JSON.stringify(res.body)}`).toBe(c.statuses[caller]);
        if (res.status >= 400) expect(res.body.error.code).toEqual(expect.any(String));
      }
    });
  }

  it('a malformed recall id is not found, not a 400 or 500', async () => {
    const res = await send('owner', 'get', '/api/recalls/not-an-id');
    expect(res.status).toBe(404);
  });
});

describe('bad input answers 400 with a message per field', () => {
  const post = (path: string, body: object) => send('owner', 'post', path, body);

  it('POST /api/recalls with nothing names scope, reason and severity', async () => {
    const res = await post('/api/recalls', {});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['reason', 'scope', 'severity']);
  });

  it('POST /api/recalls with a supplier lot no released batch used says there is nothing to recall', async () => {
    const unused = await buildLot(h.handle.db, a.id, (await buildMaterial(h.handle.db, a.id)).id);
    const res = await post('/api/recalls', {
      ...openBody(),
      scope: { kind: 'supplier-lot', supplierLotId: unused.id },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['scope.supplierLotId']).toEqual([
      'No released batch used this supplier lot, so there is nothing to recall',
    ]);
  });

  it('POST /api/recalls naming a draft batch refuses the finished lots', async () => {
    const draft = await buildFinishedLot(h.handle.db, a.id, {
      formulaId: s.formula.formulaId,
      versionId: s.formula.versionId,
      batchCode: `DRAFT-${s.f1.batchCode}`,
      unitsMade: null,
      state: 'draft',
    });
    const res = await post('/api/recalls', {
      ...openBody(),
      scope: { kind: 'finished-lots', finishedLotIds: [s.f1.id, draft.id] },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors['scope.finishedLotIds']).toHaveLength(1);
  });

  it('POST /api/recalls/:id/replies with a future day and negative units names each field', async () => {
    const id = await openAsOwner(false);
    const res = await post(`/api/recalls/${id}/replies`, {
      customerId: s.harbour.id,
      repliedOn: '2999-01-01',
      unitsOnHand: -1,
      unitsReturned: 1.5,
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([
      'repliedOn',
      'unitsOnHand',
      'unitsReturned',
    ]);
  });

  it('POST /api/recalls/:id/close without a summary, and notices with an overlong whatToDo', async () => {
    const id = await openAsOwner();
    const close = await post(`/api/recalls/${id}/close`, { summary: '  ' });
    expect(close.status).toBe(400);
    expect(close.body.error.fieldErrors.summary).toEqual(['Summary is required']);
    const notices = await post(`/api/recalls/${id}/notices`, { whatToDo: 'x'.repeat(2001) });
    expect(notices.status).toBe(400);
    expect(notices.body.error.fieldErrors.whatToDo).toHaveLength(1);
  });

  it('GET /api/recalls with an unknown sort names the sort keys', async () => {
    const res = await send('viewer', 'get', '/api/recalls?sort=colour');
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.sort).toHaveLength(1);
  });
});
