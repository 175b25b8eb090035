import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { ROLE_SETS, ROLES, type Role } from '@batchproof/shared';
import { batchWorkspaceForFile } from '../support/batch-workspace';

const ws = batchWorkspaceForFile();

type Caller = Role | 'other-workshop' | 'anonymous';
const CALLERS: Caller[] = [...ROLES, 'other-workshop', 'anonymous'];

/** The allowed roles get `ok`, the others 403; another workshop `other`, anonymous 401. */
const only = (allowed: readonly Role[], ok: number, other: number): Record<Caller, number> => ({
  ...(Object.fromEntries(ROLES.map((r) => [r, allowed.includes(r) ? ok : 403])) as Record<
    Role,
    number
  >),
  'other-workshop': other,
  anonymous: 401,
});

let shared: { formulaId: string; lotId: string } | undefined;
/** One released formula and a lot for the whole file. */
async function fixtures() {
  if (!shared) {
    const { formulaId, materialIds } = await ws.releasedFormula([100], { productCode: 'ACC' });
    const lot = await ws.lot(materialIds[0]!, { quantity: 1_000_000 });
    shared = { formulaId, lotId: lot.id };
  }
  return shared;
}

/** A fresh draft of 10 g, recorded (weighed from the lot) so that it can be released. */
async function freshDraft() {
  const { formulaId, lotId } = await fixtures();
  const batch = await ws.started({ formulaId, version: 1, totalGrams: 10 }, ws.w.members.owner);
  const put = await ws.record(
    batch.id,
    { lines: [{ lineNumber: 1, lotPicks: [{ lotId, grams: 10 }], actualGrams: 10 }] },
    ws.w.members.owner,
  );
  expect(put.status).toBe(200);
  return batch.id;
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

const cases: RouteCase[] = [
  {
    route: 'GET /api/batches',
    prepare: async () => ({ method: 'get', path: '/api/batches' }),
    expected: only(ROLE_SETS.members, 200, 200),
  },
  {
    route: 'POST /api/batches',
    prepare: async () => ({
      method: 'post',
      path: '/api/batches',
      body: { formulaId: (await fixtures()).formulaId, version: 1, totalGrams: 10 },
    }),
    expected: only(ROLE_SETS.goodsIn, 201, 404),
  },
  {
    route: 'GET /api/batches/:id',
    prepare: async () => ({ method: 'get', path: `/api/batches/${await freshDraft()}` }),
    expected: only(ROLE_SETS.members, 200, 404),
  },
  {
    route: 'PUT /api/batches/:id',
    prepare: async () => ({
      method: 'put',
      path: `/api/batches/${await freshDraft()}`,
      body: { notes: 'Recorded' },
    }),
    expected: only(ROLE_SETS.goodsIn, 200, 404),
  },
  {
    route: 'DELETE /api/batches/:id',
    prepare: async () => ({ method: 'delete', path: `/api/batches/${await freshDraft()}` }),
    expected: only(ROLE_SETS.goodsIn, 204, 404),
  },
  {
    route: 'POST /api/batches/:id/release',
    prepare: async () => ({
      method: 'post',
      path: `/api/batches/${await freshDraft()}/release`,
      body: {},
    }),
    expected: only(ROLE_SETS.writers, 200, 404),
  },
];

const tokenOf = (caller: Caller) =>
  caller === 'anonymous'
    ? undefined
    : caller === 'other-workshop'
      ? ws.other.members.owner.token
      : ws.w.members[caller].token;

describe('batches: access by role, workshop and sign-in', () => {
  for (const c of cases) {
    describe(c.route, () => {
      it.each(CALLERS)('as %s', async (caller) => {
        const { method, path, body } = await c.prepare();
        let req = request(ws.h.app)[method](path);
        const token = tokenOf(caller);
        if (token) req = req.set('Authorization', `Bearer ${token}`);
        const res = body ? await req.send(body) : await req;
        expect(res.status, JSON.stringify(res.body)).toBe(c.expected[caller]);
      });
    });
  }

  it('a malformed id is 404, never a 400 or 500', async () => {
    const auth = `Bearer ${ws.w.members.owner.token}`;
    const get = await request(ws.h.app).get('/api/batches/nope').set('Authorization', auth);
    const release = await request(ws.h.app)
      .post('/api/batches/nope/release')
      .set('Authorization', auth);
    expect([get.status, release.status]).toEqual([404, 404]);
  });

  it('the assessor and the viewer change nothing: the draft is still there, unreleased', async () => {
    const id = await freshDraft();
    for (const who of [ws.w.members.viewer, ws.w.members.assessor]) {
      expect((await ws.record(id, { notes: 'x' }, who)).status).toBe(403);
      expect((await ws.releaseBatch(id, who)).status).toBe(403);
    }
    expect((await ws.releaseBatch(id, ws.w.members.production)).status).toBe(403);
    const batch = await ws.read(id);
    expect(batch).toMatchObject({ state: 'draft', notes: null });
  });
});
