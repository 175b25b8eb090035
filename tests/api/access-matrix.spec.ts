import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '@batchproof/shared';
import {
  addMember,
  buildMemberActiveElsewhere,
  buildWorkshop,
  uniqueEmail,
  type BuiltMember,
  type BuiltWorkshop,
} from '../support/workshop-builder';
import { invitations } from '../../apps/api/src/db/schema';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { workspaceAccessCases, type WorkspaceRequest } from './workspace-access-cases';

/**
 * `member-of-two` is the owner of workshop A who is also a member of another workshop and works
 * there now (their token names it): they must meet exactly the answers B's owner meets.
 */
type Caller = Role | 'other-workshop' | 'member-of-two' | 'anonymous';
type ExpectedCaller = Exclude<Caller, 'member-of-two'>;
const CALLERS: Caller[] = [...ROLES, 'other-workshop', 'member-of-two', 'anonymous'];

interface RouteCase {
  route: string;
  /** Builds the request path (and body) afresh for each caller, so destructive calls don't collide. */
  prepare: () => Promise<WorkspaceRequest>;
  expected: Record<ExpectedCaller, number>;
}

let h: ApiHarness;
let a: BuiltWorkshop;
let b: BuiltWorkshop;
let memberOfTwo: BuiltMember;

const only = (
  allowed: readonly Role[],
  okStatus: number,
  otherWorkshop: number,
): Record<ExpectedCaller, number> => ({
  ...(Object.fromEntries(ROLES.map((r) => [r, allowed.includes(r) ? okStatus : 403])) as Record<
    Role,
    number
  >),
  'other-workshop': otherWorkshop,
  anonymous: 401,
});

async function freshInvitation(workshopId: string) {
  const [row] = await h.handle.db
    .insert(invitations)
    .values({
      workshopId,
      email: uniqueEmail('invitee'),
      role: 'viewer',
      tokenHash: `hash-${Math.random()}`,
      expiresAt: new Date(Date.now() + 86_400_000),
    })
    .returning();
  return row!.id;
}

const everyone = (status: number): Record<ExpectedCaller, number> =>
  Object.fromEntries(CALLERS.map((c) => [c, status])) as Record<ExpectedCaller, number>;

const cases: RouteCase[] = [
  {
    route: 'GET /api/health (public)',
    prepare: async () => ({ method: 'get', path: '/api/health' }),
    expected: everyone(200),
  },
  {
    route: 'POST /api/auth/refresh without a refresh cookie (public)',
    prepare: async () => ({ method: 'post', path: '/api/auth/refresh' }),
    expected: everyone(401),
  },
  {
    route: 'POST /api/auth/password-reset/request (public)',
    prepare: async () => ({
      method: 'post',
      path: '/api/auth/password-reset/request',
      body: { email: uniqueEmail('x') },
    }),
    expected: everyone(202),
  },
  {
    route: 'GET /api/auth/invitations/:token for an unknown token (public)',
    prepare: async () => ({ method: 'get', path: `/api/auth/invitations/${'u'.repeat(43)}` }),
    expected: everyone(404),
  },
  {
    route: 'POST /api/auth/sign-up with an empty body (public)',
    prepare: async () => ({ method: 'post', path: '/api/auth/sign-up', body: {} }),
    expected: everyone(400),
  },
  {
    route: 'GET /api/me',
    prepare: async () => ({ method: 'get', path: '/api/me' }),
    expected: only(ROLES, 200, 200),
  },
  {
    route: 'GET /api/reference',
    prepare: async () => ({ method: 'get', path: '/api/reference' }),
    expected: only(ROLES, 200, 200),
  },
  {
    route: 'GET /api/reference/:key',
    prepare: async () => ({ method: 'get', path: '/api/reference/eu-annex-iii-allergens' }),
    expected: only(ROLES, 200, 200),
  },
  {
    route: 'GET /api/members',
    prepare: async () => ({ method: 'get', path: '/api/members' }),
    expected: only(['owner', 'formulator', 'production', 'viewer'], 200, 200),
  },
  {
    route: 'GET /api/members/invitations',
    prepare: async () => ({ method: 'get', path: '/api/members/invitations' }),
    expected: only(['owner'], 200, 200),
  },
  {
    route: 'POST /api/members/invitations',
    prepare: async () => ({
      method: 'post',
      path: '/api/members/invitations',
      body: { email: uniqueEmail('new'), role: 'viewer' },
    }),
    expected: only(['owner'], 201, 201),
  },
  {
    route: 'DELETE /api/members/invitations/:id (of workshop A)',
    prepare: async () => ({
      method: 'delete',
      path: `/api/members/invitations/${await freshInvitation(a.id)}`,
    }),
    expected: only(['owner'], 204, 404),
  },
  {
    route: 'PATCH /api/members/:id (of workshop A)',
    prepare: async () => {
      const m = await addMember(h.handle.db, TEST_JWT_SECRET, a.id, 'viewer');
      return { method: 'patch', path: `/api/members/${m.id}`, body: { role: 'production' } };
    },
    expected: only(['owner'], 200, 404),
  },
  {
    route: 'DELETE /api/members/:id (of workshop A)',
    prepare: async () => {
      const m = await addMember(h.handle.db, TEST_JWT_SECRET, a.id, 'viewer');
      return { method: 'delete', path: `/api/members/${m.id}` };
    },
    expected: only(['owner'], 204, 404),
  },
  // The formulator's workspace: suppliers, materials, documents, lots, formulas.
  ...workspaceAccessCases(() => ({ h, a })),
];

beforeAll(async () => {
  h = await startApiHarness();
  a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  memberOfTwo = await buildMemberActiveElsewhere(h.handle.db, TEST_JWT_SECRET, a.id, 'owner');
});
afterAll(() => h.close());

const tokenOf = (caller: Caller) =>
  caller === 'anonymous'
    ? undefined
    : caller === 'other-workshop'
      ? b.members.owner.token
      : caller === 'member-of-two'
        ? memberOfTwo.token
        : a.members[caller].token;

/** What the caller must be answered: a member of two workshops, active in the other, as B's owner. */
const expectedFor = (c: RouteCase, caller: Caller) =>
  c.expected[caller === 'member-of-two' ? 'other-workshop' : caller];

describe('access to every signed-in route, by role and workshop', () => {
  for (const c of cases) {
    describe(c.route, () => {
      it.each(CALLERS)('as %s responds with the expected status', async (caller) => {
        const { method, path, body, type, upload } = await c.prepare();
        let req = request(h.app)[method](path);
        const token = tokenOf(caller);
        if (token) req = req.set('Authorization', `Bearer ${token}`);
        if (type) req = req.set('Content-Type', type);
        if (upload) {
          for (const [k, v] of Object.entries(upload.fields)) req = req.field(k, v);
          req = req.attach('file', upload.file, upload.filename);
        }
        const res = await (body ? req.send(body) : req);
        expect(res.status, `${caller} → ${res.status} ${JSON.stringify(res.body)}`).toBe(
          expectedFor(c, caller),
        );
        if (res.status >= 400) expect(res.body.error.code).toEqual(expect.any(String));
      });
    });
  }
});

describe('workshop isolation in lists', () => {
  it('a member of workshop B listing members sees none of workshop A', async () => {
    const res = await request(h.app)
      .get('/api/members')
      .set('Authorization', `Bearer ${b.members.owner.token}`);
    expect(res.status).toBe(200);
    const emails = res.body.items.map((m: { email: string }) => m.email);
    expect(emails).toEqual([b.members.owner.email]);
  });

  it("a member of A and another workshop, active in the other, lists that workshop's members and none of A's", async () => {
    const res = await request(h.app)
      .get('/api/members')
      .set('Authorization', `Bearer ${memberOfTwo.token}`);
    expect(res.status).toBe(200);
    const emails = res.body.items.map((m: { email: string }) => m.email);
    expect(emails).toEqual([memberOfTwo.email]);
    // ... while A's own list names them, as its owner.
    const inA = await request(h.app)
      .get('/api/members')
      .set('Authorization', `Bearer ${a.members.owner.token}`);
    expect(inA.body.items).toContainEqual(
      expect.objectContaining({ email: memberOfTwo.email, role: 'owner' }),
    );
  });

  it('a token whose workshop claim does not match the user is refused with 401', async () => {
    const { signAccessToken } = await import('../../apps/api/src/auth/access-tokens');
    const forged = signAccessToken(
      { sub: a.members.owner.id, wid: b.id, role: 'owner' },
      TEST_JWT_SECRET,
      60,
    );
    const res = await request(h.app).get('/api/me').set('Authorization', `Bearer ${forged}`);
    expect(res.status).toBe(401);
  });

  it('a token signed with another secret is refused with 401', async () => {
    const { signAccessToken } = await import('../../apps/api/src/auth/access-tokens');
    const forged = signAccessToken(
      { sub: a.members.owner.id, wid: a.id, role: 'owner' },
      'x'.repeat(40),
      60,
    );
    const res = await request(h.app).get('/api/me').set('Authorization', `Bearer ${forged}`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});
