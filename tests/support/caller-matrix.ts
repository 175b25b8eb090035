import request from 'supertest';
import { expect } from 'vitest';
import { ROLES, type Role } from '@batchproof/shared';
import { TEST_JWT_SECRET, type ApiHarness } from './api-harness';
import {
  buildMemberActiveElsewhere,
  type BuiltMember,
  type BuiltWorkshop,
} from './workshop-builder';

/**
 * Who calls a route in a role matrix: each role of workshop A, B's owner, A's owner who is also
 * a member of another workshop and works there now (`member-of-two`), or nobody.
 */
export type Caller = Role | 'other-workshop' | 'member-of-two' | 'anonymous';
export const CALLERS: readonly Caller[] = [
  ...ROLES,
  'other-workshop',
  'member-of-two',
  'anonymous',
];

/**
 * The statuses a route answers: `okStatus` for the roles allowed, 403 for the others,
 * `otherWorkshop` for workshop B's owner and for the member of two workshops active in the other
 * one (404 for a record of A), and 401 for no token.
 */
export const onlyRoles = (
  allowed: readonly Role[],
  okStatus: number,
  otherWorkshop = 404,
): Record<Caller, number> => ({
  ...(Object.fromEntries(ROLES.map((r) => [r, allowed.includes(r) ? okStatus : 403])) as Record<
    Role,
    number
  >),
  'other-workshop': otherWorkshop,
  'member-of-two': otherWorkshop,
  anonymous: 401,
});

/** One member of two workshops per workshop A, made when a matrix first calls as them. */
const activeElsewhere = new Map<string, Promise<BuiltMember>>();
const memberOfTwo = (h: ApiHarness, a: BuiltWorkshop) => {
  if (!activeElsewhere.has(a.id)) {
    activeElsewhere.set(a.id, buildMemberActiveElsewhere(h.handle.db, TEST_JWT_SECRET, a.id));
  }
  return activeElsewhere.get(a.id)!;
};

/** One request of a matrix. */
export interface MatrixRequest {
  method: 'get' | 'post' | 'put' | 'delete';
  path: string;
  body?: object;
  /** A CSV sent as a multipart file in the field `file`. */
  csv?: string;
}

/** Sends the request as the caller (A's member, B's owner or nobody) and checks the status. */
export async function expectStatusAs(
  h: ApiHarness,
  workshops: { a: BuiltWorkshop; b: BuiltWorkshop },
  caller: Caller,
  { method, path, body, csv }: MatrixRequest,
  status: number,
) {
  let req = request(h.app)[method](path);
  const member =
    caller === 'anonymous'
      ? undefined
      : caller === 'other-workshop'
        ? workshops.b.members.owner
        : caller === 'member-of-two'
          ? await memberOfTwo(h, workshops.a)
          : workshops.a.members[caller];
  if (member) req = req.set('Authorization', `Bearer ${member.token}`);
  if (csv !== undefined) req = req.attach('file', Buffer.from(csv), 'deliveries.csv');
  const res = await (body ? req.send(body) : req);
  expect(res.status, `${caller} → ${res.status} ${JSON.stringify(res.body)}`).toBe(status);
  if (status >= 400) expect(res.body.error.code).toEqual(expect.any(String));
  return res;
}
