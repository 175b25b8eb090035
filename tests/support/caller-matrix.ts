import request from 'supertest';
import { expect } from 'vitest';
import { ROLES, type Role } from '@batchproof/shared';
import type { ApiHarness } from './api-harness';
import type { BuiltWorkshop } from './workshop-builder';

/** Who calls a route in a role matrix: each role of workshop A, B's owner, or nobody. */
export type Caller = Role | 'other-workshop' | 'anonymous';
export const CALLERS: readonly Caller[] = [...ROLES, 'other-workshop', 'anonymous'];

/**
 * The statuses a route answers: `okStatus` for the roles allowed, 403 for the others,
 * `otherWorkshop` for workshop B's owner (404 for a record of A) and 401 for no token.
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
  anonymous: 401,
});

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
        : workshops.a.members[caller];
  if (member) req = req.set('Authorization', `Bearer ${member.token}`);
  if (csv !== undefined) req = req.attach('file', Buffer.from(csv), 'deliveries.csv');
  const res = await (body ? req.send(body) : req);
  expect(res.status, `${caller} → ${res.status} ${JSON.stringify(res.body)}`).toBe(status);
  if (status >= 400) expect(res.body.error.code).toEqual(expect.any(String));
  return res;
}
