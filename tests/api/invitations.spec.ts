import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitationListSchema, invitationSchema } from '@batchproof/shared';
import { invitations } from '../../apps/api/src/db/schema';
import { firstLink } from '../support/mail-catcher';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { buildWorkshop, uniqueEmail, type BuiltWorkshop } from '../support/workshop-builder';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

/** Invites `email` and returns the token from the link of the mail this invitation sent. */
async function invite(w: BuiltWorkshop, email: string, role = 'viewer') {
  const to = email.toLowerCase();
  const before = h.mail.received.filter((m) => m.to.includes(to)).length;
  const res = await request(h.app)
    .post('/api/members/invitations')
    .set(bearer(w.members.owner))
    .send({ email, role });
  expect(res.status).toBe(201);
  // The mail is sent before the answer; wait for it all the same, then take the newest.
  await h.mail.waitFor(to);
  const mails = h.mail.received.filter((m) => m.to.includes(to));
  expect(mails.length).toBe(before + 1);
  const token = decodeURIComponent(firstLink(mails.at(-1)!).split('/accept-invite/')[1]!);
  return { token, body: invitationSchema.parse(res.body) };
}

const preview = (token: string) =>
  request(h.app).get(`/api/auth/invitations/${encodeURIComponent(token)}`);
const accept = (token: string) =>
  request(h.app)
    .post('/api/auth/invitations/accept')
    .send({ token, name: 'Wren Halloway', password: 'invited-password' });

describe('POST /api/members/invitations for an address with a pending invitation', () => {
  it('replaces it: one invitation stays pending, with the new role, and the older link stops working', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const email = uniqueEmail('twice');
    const first = await invite(w, email, 'viewer');
    const second = await invite(w, email.toUpperCase(), 'production');
    expect(first.body.replaced).toBe(0);
    expect(second.body.replaced).toBe(1);

    const list = await request(h.app).get('/api/members/invitations').set(bearer(w.members.owner));
    const pending = invitationListSchema.parse(list.body).items.filter((i) => i.email === email);
    expect(pending.map((i) => i.role)).toEqual(['production']);

    const old = await preview(first.token);
    expect(old.status).toBe(404);
    expect(old.body.error.code).toBe('invitation_unknown');
    expect((await accept(first.token)).body.error.code).toBe('invitation_unknown');

    const current = await accept(second.token);
    expect(current.status).toBe(201);
    expect(current.body.user).toMatchObject({ email, role: 'production' });
  });

  it('leaves a pending invitation to the same address in another workshop alone', async () => {
    const a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const email = uniqueEmail('sought-after');
    const fromA = await invite(a, email);
    const fromB = await invite(b, email);
    expect(fromB.body.replaced).toBe(0);
    expect((await preview(fromA.token)).status).toBe(200);
    expect((await preview(fromB.token)).status).toBe(200);
  });
});

describe('an invitation link that cannot be used says why', () => {
  it('a used link answers 410 invitation_used, on the preview and on accepting again', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const { token } = await invite(w, uniqueEmail('used'));
    expect((await accept(token)).status).toBe(201);

    for (const res of [await preview(token), await accept(token)]) {
      expect(res.status).toBe(410);
      expect(res.body.error.code).toBe('invitation_used');
      expect(res.body.error.message).toMatch(/already been used/);
    }
  });

  it('an expired link answers 410 invitation_expired, on the preview and on accepting', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const email = uniqueEmail('late');
    const { token } = await invite(w, email);
    await h.handle.db
      .update(invitations)
      .set({ expiresAt: new Date(Date.now() - 60_000) })
      .where(eq(invitations.email, email));

    for (const res of [await preview(token), await accept(token)]) {
      expect(res.status).toBe(410);
      expect(res.body.error.code).toBe('invitation_expired');
      expect(res.body.error.message).toMatch(/expired/);
    }
  });

  it('an unknown or revoked link answers 404 invitation_unknown', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const { token, body } = await invite(w, uniqueEmail('revoked'));
    const revoked = await request(h.app)
      .delete(`/api/members/invitations/${body.id}`)
      .set(bearer(w.members.owner));
    expect(revoked.status).toBe(204);

    for (const res of [await preview(token), await accept('u'.repeat(43))]) {
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('invitation_unknown');
      expect(res.body.error.message).toMatch(/not valid/);
    }
  });
});
