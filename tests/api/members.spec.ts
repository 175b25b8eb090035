import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberListSchema } from '@batchproof/shared';
import { addMember, buildWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

describe('GET /api/members', () => {
  it('sorts on the server by the requested column and direction', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
    const auth = { Authorization: `Bearer ${w.members.owner.token}` };
    const asc = memberListSchema.parse(
      (await request(h.app).get('/api/members?sort=role&dir=asc').set(auth)).body,
    );
    const desc = memberListSchema.parse(
      (await request(h.app).get('/api/members?sort=role&dir=desc').set(auth)).body,
    );
    const roles = asc.items.map((m) => m.role);
    expect(roles).toHaveLength(5);
    expect(desc.items.map((m) => m.role)).toEqual([...roles].reverse());
  });

  it('with an unknown sort column responds 400 with fieldErrors.sort', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const res = await request(h.app)
      .get('/api/members?sort=password')
      .set('Authorization', `Bearer ${w.members.owner.token}`);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.sort).toBeDefined();
  });
});

describe('the last owner', () => {
  it('cannot be demoted: 409 with fieldErrors.role, and the role stays owner', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const auth = { Authorization: `Bearer ${w.members.owner.token}` };
    const res = await request(h.app)
      .patch(`/api/members/${w.members.owner.id}`)
      .set(auth)
      .send({ role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.role).toBeDefined();
    const me = await request(h.app).get('/api/me').set(auth);
    expect(me.body.role).toBe('owner');
  });

  it('cannot be removed, but can once a second owner exists', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const auth = { Authorization: `Bearer ${w.members.owner.token}` };
    expect(
      (await request(h.app).delete(`/api/members/${w.members.owner.id}`).set(auth)).status,
    ).toBe(409);
    const second = await addMember(h.handle.db, TEST_JWT_SECRET, w.id, 'owner');
    expect(
      (await request(h.app).delete(`/api/members/${w.members.owner.id}`).set(auth)).status,
    ).toBe(204);
    const list = await request(h.app)
      .get('/api/members')
      .set('Authorization', `Bearer ${second.token}`);
    expect(list.body.items.map((m: { id: string }) => m.id)).toEqual([second.id]);
  });

  it('a removed member is refused at once, even with a token that has not expired', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'production'] });
    await request(h.app)
      .delete(`/api/members/${w.members.production.id}`)
      .set('Authorization', `Bearer ${w.members.owner.token}`);
    const res = await request(h.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${w.members.production.token}`);
    expect(res.status).toBe(401);
  });
});

describe('PATCH /api/members/:id', () => {
  it('changes a role, which takes effect on the next request', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const res = await request(h.app)
      .patch(`/api/members/${w.members.viewer.id}`)
      .set('Authorization', `Bearer ${w.members.owner.token}`)
      .send({ role: 'formulator' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('formulator');
    const me = await request(h.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${w.members.viewer.token}`);
    expect(me.body.role).toBe('formulator');
  });

  it('with a malformed id responds 404, and with a bad role 400 with fieldErrors.role', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const auth = { Authorization: `Bearer ${w.members.owner.token}` };
    expect(
      (await request(h.app).patch('/api/members/not-a-uuid').set(auth).send({ role: 'viewer' }))
        .status,
    ).toBe(404);
    const bad = await request(h.app)
      .patch(`/api/members/${w.members.viewer.id}`)
      .set(auth)
      .send({ role: 'chief' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.role).toBeDefined();
  });
});
